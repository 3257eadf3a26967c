import { clearBand } from "./bounds";
import { byLevel, levelRank, type Limit, type LimitInput, type Quantity } from "./limit";

export type LimitField = "level" | "upper" | "lower" | "hysteresis" | "persistence";

export type LimitProblemCode =
  | "non-finite"
  | "no-bound"
  | "lower-not-below-upper"
  | "negative-hysteresis"
  | "hysteresis-too-wide"
  | "invalid-persistence"
  | "duplicate-level"
  | "levels-out-of-order"
  | "never-clears";

/** One refusal, addressed to a field of the limit at `index` in the proposed list. */
export interface LimitProblem {
  readonly index: number;
  readonly field: LimitField;
  readonly code: LimitProblemCode;
  readonly message: string;
}

export type LimitSetValidation<Q extends string = Quantity> =
  | { readonly ok: true; readonly limits: Limit<Q>[] }
  | { readonly ok: false; readonly problems: LimitProblem[] };

type FieldProblem = Omit<LimitProblem, "index">;

const NUMERIC_FIELDS = ["upper", "lower", "hysteresis", "persistence"] as const;

/**
 * Checks a gauge's proposed limit set as a whole. Relations between levels are checked only once
 * every limit is sound on its own, so that one mistake is not reported three times.
 */
export function validateLimits<Q extends string>(inputs: readonly LimitInput<Q>[]): LimitSetValidation<Q> {
  const problems: LimitProblem[] = [
    ...inputs.flatMap((input, index) => fieldProblems(input).map((problem) => ({ index, ...problem }))),
    ...duplicateLevelProblems(inputs),
  ];
  if (problems.length === 0) {
    const limits = inputs.map(withDefaults);
    problems.push(...levelOrderProblems(limits), ...neverClearsProblems(limits));
    if (problems.length === 0) return { ok: true, limits };
  }
  return { ok: false, problems };
}

function withDefaults<Q extends string>(input: LimitInput<Q>): Limit<Q> {
  return { ...input, hysteresis: input.hysteresis ?? 0, persistence: input.persistence ?? 1 };
}

function fieldProblems(input: LimitInput<string>): FieldProblem[] {
  const nonFinite = NUMERIC_FIELDS.filter((field) => input[field] !== undefined && !Number.isFinite(input[field]));
  if (nonFinite.length > 0) {
    return nonFinite.map((field) => ({ field, code: "non-finite", message: `The ${field} value must be a finite number.` }));
  }
  return [boundsProblem(input), hysteresisProblem(input), persistenceProblem(input)].filter(
    (problem): problem is FieldProblem => problem !== null,
  );
}

function boundsProblem({ upper, lower }: LimitInput<string>): FieldProblem | null {
  if (upper === undefined && lower === undefined) {
    return { field: "upper", code: "no-bound", message: "Give an upper bound, a lower bound, or both." };
  }
  if (upper !== undefined && lower !== undefined && lower >= upper) {
    return {
      field: "lower",
      code: "lower-not-below-upper",
      message: `The lower bound (${lower}) must be below the upper bound (${upper}).`,
    };
  }
  return null;
}

/**
 * Refusing only a dead band wider than the span is not enough: a value must sit hysteresis inside
 * *both* bounds to clear, so any dead band over half the span leaves an alert that can never clear.
 */
function hysteresisProblem({ upper, lower, hysteresis = 0 }: LimitInput<string>): FieldProblem | null {
  if (hysteresis < 0) {
    return { field: "hysteresis", code: "negative-hysteresis", message: "The hysteresis (dead band) cannot be negative; use 0 for none." };
  }
  if (upper !== undefined && lower !== undefined && lower < upper && 2 * hysteresis > upper - lower) {
    return {
      field: "hysteresis",
      code: "hysteresis-too-wide",
      message: `A hysteresis of ${hysteresis} leaves no value between the bounds at which an alert could clear; use at most half the span, ${(upper - lower) / 2}.`,
    };
  }
  return null;
}

/**
 * Persistence filters out a reading or two of noise (common practice: 1 to a few readings); a
 * thousand readings is a week at 10-minute intervals, past which an alert would come too late to act on.
 */
export const MAX_PERSISTENCE = 1_000;

function persistenceProblem({ persistence = 1 }: LimitInput<string>): FieldProblem | null {
  if (Number.isInteger(persistence) && persistence >= 1 && persistence <= MAX_PERSISTENCE) return null;
  return {
    field: "persistence",
    code: "invalid-persistence",
    message: `The persistence must be a whole number of readings from 1 to ${MAX_PERSISTENCE.toLocaleString("en-US")}.`,
  };
}

function duplicateLevelProblems(inputs: readonly LimitInput<string>[]): LimitProblem[] {
  const seen = new Set<string>();
  return inputs.flatMap((input, index) => {
    const key = `${input.quantity}/${input.level}`;
    if (!seen.has(key)) {
      seen.add(key);
      return [];
    }
    return [{ index, field: "level", code: "duplicate-level", message: `There is already a ${input.level} limit on ${input.quantity}; keep one.` }];
  });
}

/** Higher levels escalate outward: bounds at or beyond those of every milder level on the same side. */
function levelOrderProblems(limits: readonly Limit<string>[]): LimitProblem[] {
  const problems: LimitProblem[] = [];
  limits.forEach((higher, index) => {
    for (const milder of limits) {
      if (milder.quantity !== higher.quantity || levelRank(milder.level) >= levelRank(higher.level)) continue;
      if (higher.upper !== undefined && milder.upper !== undefined && higher.upper < milder.upper) {
        problems.push(outOfOrder(index, "upper", higher, milder, "at or above"));
      }
      if (higher.lower !== undefined && milder.lower !== undefined && higher.lower > milder.lower) {
        problems.push(outOfOrder(index, "lower", higher, milder, "at or below"));
      }
    }
  });
  return problems;
}

function outOfOrder(index: number, field: "upper" | "lower", higher: Limit<string>, milder: Limit<string>, relation: string): LimitProblem {
  return {
    index,
    field,
    code: "levels-out-of-order",
    message: `The ${higher.level} ${field} bound (${higher[field]}) must be ${relation} the ${milder.level} ${field} bound (${milder[field]}): levels escalate outward.`,
  };
}

/**
 * Bounds of different levels on opposite sides (say a watch upper of 100 and a warning lower of
 * 120) can leave no value at which the alert machine would clear; the machine's own clear band
 * decides, so validation and evaluation cannot disagree.
 */
function neverClearsProblems(limits: readonly Limit<string>[]): LimitProblem[] {
  const quantities = new Set(limits.map((limit) => limit.quantity));
  return [...quantities].flatMap((quantity) => {
    const ladder = byLevel(limits.filter((limit) => limit.quantity === quantity));
    const band = clearBand(ladder);
    if (band.lower <= band.upper) return [];
    const mildest = ladder[0]!;
    return [
      {
        index: limits.indexOf(mildest),
        field: "hysteresis",
        code: "never-clears",
        message: `With these ${quantity} limits a value would have to be at most ${band.upper} and at least ${band.lower} to clear an alert; widen the bounds or reduce the hysteresis.`,
      },
    ];
  });
}
