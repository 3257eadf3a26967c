const SUPERSCRIPT: Record<string, string> = { "-": "⁻", "0": "⁰", "1": "¹", "2": "²", "3": "³", "4": "⁴", "5": "⁵", "6": "⁶", "7": "⁷", "8": "⁸", "9": "⁹" };

/**
 * A damage sum or rate as engineers write it: 3.2×10⁻⁵ for small values, where a decimal fraction
 * would hide the order of magnitude among zeros; plain digits from 0.01 up. Two significant digits
 * by default, as the S-N curve is not known any better.
 */
export function formatScientific(value: number, significantDigits = 2): string {
  if (value === 0 || !Number.isFinite(value)) return String(value);
  const [mantissa, exponent] = value.toExponential(significantDigits - 1).split("e") as [string, string];
  if (Number(exponent) >= -2) return String(Number(value.toPrecision(significantDigits)));
  return `${mantissa}×10${[...String(Number(exponent))].map((c) => SUPERSCRIPT[c]).join("")}`;
}
