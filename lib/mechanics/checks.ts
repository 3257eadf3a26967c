/** Configuration arrives from JSON and the database, so checks accept anything. */
export function isFiniteNumber(value: unknown): value is number {
  return typeof value === "number" && Number.isFinite(value);
}

export function isPositive(value: unknown): value is number {
  return isFiniteNumber(value) && value > 0;
}
