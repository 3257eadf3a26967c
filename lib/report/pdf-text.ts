/**
 * PDF text through the standard Helvetica, whose WinAnsi encoding (Windows-1252) has no Greek and
 * few mathematical signs: ε, σ, Δ or ≥ would print as stray letters. Everything meant for the PDF
 * goes through `pdfText`, which spells such signs out and never lets an unencodable one through.
 */

/** The characters Windows-1252 adds to Latin-1 in 0x80–0x9F. */
const WIN_ANSI_EXTRAS = new Set("€‚ƒ„…†‡ˆ‰Š‹ŒŽ‘’“”•–—˜™š›œžŸ");

const SPELLED_OUT: [RegExp, string][] = [
  [/µε|με/g, "microstrain"],
  [/Δσ/g, "delta-sigma"],
  [/σ/g, "sigma"],
  [/ε/g, "epsilon"],
  [/Δ/g, "delta "],
  [/≥/g, ">="],
  [/≤/g, "<="],
  [/≈/g, "~"],
  [/→/g, "->"],
  [/−/g, "-"],
];

const SUPERSCRIPTS: Record<string, string> = { "⁻": "-", "⁰": "0", "¹": "1", "²": "2", "³": "3", "⁴": "4", "⁵": "5", "⁶": "6", "⁷": "7", "⁸": "8", "⁹": "9" };

export function isWinAnsi(char: string): boolean {
  const code = char.codePointAt(0)!;
  return char === "\n" || (code >= 0x20 && code <= 0x7e) || (code >= 0xa0 && code <= 0xff) || WIN_ANSI_EXTRAS.has(char);
}

/** `text` with only characters Helvetica can print: signs spelled out, accents kept where the encoding has them, else "?". */
export function pdfText(text: string): string {
  let result = text;
  for (const [pattern, words] of SPELLED_OUT) result = result.replace(pattern, words);
  // 10⁻⁵ as 10^-5; ² and ³ alone are in the encoding, but a mixed exponent must read as one.
  result = result.replace(/[⁻⁰¹²³⁴⁵⁶⁷⁸⁹]+/g, (run) => (/^[²³]$/.test(run) ? run : `^${[...run].map((c) => SUPERSCRIPTS[c]).join("")}`));
  return [...result]
    .map((char) => {
      if (isWinAnsi(char)) return char;
      const stripped = char.normalize("NFKD").replace(/\p{M}/gu, "");
      return [...stripped].every(isWinAnsi) && stripped.length > 0 ? stripped : "?";
    })
    .join("");
}
