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
  // A dash, never "NaN µε" or "Infinity % of yield", for a value that is not a finite number.
  if (!Number.isFinite(value)) return "—";
  const decimals = scale.unit === "ksi" ? 2 : scale.unit === "µε" || scale.unit === "% of yield" ? 0 : 1;
  const shown = scale.toDisplay(value).toLocaleString("en-US", { minimumFractionDigits: decimals, maximumFractionDigits: decimals, signDisplay: "negative" });
  return `${shown} ${scale.unit}`;
}

/** The unit the API stores each limit quantity in; a rosette's quantities are stresses. */
export const STORED_QUANTITY_UNIT: Readonly<Record<string, string>> = {
  stress: "MPa",
  strain: "µε",
  residual: "µε",
  utilisation: "fraction of yield",
  sigma1: "MPa",
  sigma2: "MPa",
  vonMises: "MPa",
};

export function quantityScale(quantity: string, system: UnitSystem = "si"): LimitScale {
  return limitScale(STORED_QUANTITY_UNIT[quantity] ?? "", system);
}

/** A stored value of a limit quantity as a person reads it: "167.1 MPa", "2,598 µε", "81 % of yield". */
export function formatQuantity(quantity: string, value: number, system: UnitSystem = "si"): string {
  return formatLimitValue(value, quantityScale(quantity, system));
}
