import { ksiToMpa, mpaToKsi, type UnitSystem } from "@/lib/units";

/**
 * How a limit's bound is typed and read: stresses in the person's MPa or ksi, utilisation in % of
 * yield, strain in µε. The API stores SI and utilisation as a fraction; the conversion happens at
 * the form's edge only.
 */
export interface LimitScale {
  readonly unit: string;
  toDisplay(stored: number): number;
  fromDisplay(shown: number): number;
}

const same = (unit: string): LimitScale => ({ unit, toDisplay: (v) => v, fromDisplay: (v) => v });

/** `storedUnit` is the quantity's unit as the API stores it: "MPa", "µε" or "fraction of yield". */
export function limitScale(storedUnit: string, system: UnitSystem): LimitScale {
  if (storedUnit === "MPa" && system === "us") return { unit: "ksi", toDisplay: mpaToKsi, fromDisplay: ksiToMpa };
  if (storedUnit === "fraction of yield") return { unit: "% of yield", toDisplay: (v) => v * 100, fromDisplay: (v) => v / 100 };
  return same(storedUnit);
}

/** A bound as the form shows it: enough decimals for the unit, no float noise ("36.259", "80"). */
export function boundText(value: number, scale: LimitScale): string {
  return String(Number(scale.toDisplay(value).toFixed(scale.unit === "ksi" ? 3 : 4)));
}

/** A value with its unit, rounded as it is read ("167.1 MPa", "24.24 ksi", "81 % of yield"). */
export function formatLimitValue(value: number, scale: LimitScale): string {
  const decimals = scale.unit === "ksi" ? 2 : scale.unit === "µε" || scale.unit === "% of yield" ? 0 : 1;
  const shown = scale.toDisplay(value).toLocaleString("en-US", { minimumFractionDigits: decimals, maximumFractionDigits: decimals, signDisplay: "negative" });
  return `${shown} ${scale.unit}`;
}
