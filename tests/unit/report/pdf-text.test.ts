import { describe, expect, it } from "vitest";
import { isWinAnsi, pdfText } from "@/lib/report/pdf-text";

describe("text for the PDF's standard font", () => {
  it("spells out Greek and mathematical signs the WinAnsi encoding lacks", () => {
    expect(pdfText("1,234 µε")).toBe("1,234 microstrain");
    expect(pdfText("Δσ_C ≥ 71 MPa")).toBe("delta-sigma_C >= 71 MPa");
    expect(pdfText("3.2×10⁻⁵")).toBe("3.2×10^-5");
  });

  it("keeps what the encoding has: accents, degrees, dashes, curly quotes", () => {
    const kept = "Pont de l’Écluse – 12 °C ± 0.5 · 2×3 — “ok”";
    expect(pdfText(kept)).toBe(kept);
  });

  it("never lets an unencodable character through", () => {
    const out = pdfText("Brücke 橋 ő ✓ 🙂 ą");
    expect([...out].every(isWinAnsi)).toBe(true);
    expect(out).toBe("Brücke ? o ? ? a");
  });
});
