/** "-0.5005 mV/V", "-952.4 µε": a shunt check's output in the gauge's input unit. */
export function formatShuntOutput(value: number, unit: string): string {
  const digits = unit === "mV/V" ? 4 : 1;
  return `${value.toLocaleString("en-US", { minimumFractionDigits: digits, maximumFractionDigits: digits })} ${unit}`;
}

/** "+0.5 %", "-3.0 %". */
export function formatDifference(percent: number): string {
  return `${percent > 0 ? "+" : ""}${percent.toLocaleString("en-US", { minimumFractionDigits: 1, maximumFractionDigits: 1 })} %`;
}
