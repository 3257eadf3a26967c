import { validateLimits, type Limit, type LimitInput, type Reading } from "@/lib/limits";

/** Validated limits with defaults applied; a fixture that does not validate is a broken test. */
export function limitSet(...inputs: Omit<LimitInput, "quantity">[]): Limit[] {
  const result = validateLimits(inputs.map((input) => ({ quantity: "stress" as const, ...input })));
  if (!result.ok) throw new Error(`invalid fixture: ${result.problems.map((problem) => problem.message).join(" ")}`);
  return result.limits;
}

export const MINUTE = 60_000;

/** Readings one minute apart starting at `start`; null stands for a sensor-fault reading. */
export function series(values: readonly (number | null)[], start = 0): Reading[] {
  return values.map((value, index) => ({ time: start + index * MINUTE, value: value ?? 0, fault: value === null }));
}
