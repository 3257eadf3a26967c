import { describe, expect, it } from "vitest";
import { acknowledgeBody } from "@/lib/alerting/schema";
import { drawingFields, photoFields } from "@/lib/files/schema";
import { gaugePatch } from "@/lib/gauges/schema";
import { createStructureInput, createUserInput, stripControlCharacters, tokenName } from "@/lib/validation";

// U+202E RIGHT-TO-LEFT OVERRIDE and U+2066 LEFT-TO-RIGHT ISOLATE (Unicode bidirectional algorithm, UAX #9).
const RLO = "\u202e";
const LRI = "\u2066";

describe("control characters in names and free text", () => {
  it("turns line breaks into a space and drops other C0/C1 controls and bidirectional marks", () => {
    expect(stripControlCharacters("North\r\nBcc: someone@example.com")).toBe("North Bcc: someone@example.com");
    expect(stripControlCharacters(`invoice${RLO}fdp.exe`)).toBe("invoicefdp.exe");
    expect(stripControlCharacters(`a\u0000b\u0007c\u001bd\u0085e\u009bf${LRI}g\u2069h`)).toBe("abcd efgh");
    // Ordinary letters, accents and symbols stay: é, µ, °, Δ, the en dash.
    expect(stripControlCharacters("Pont-Neuf: 12 µε at 5 °C — Δσ")).toBe("Pont-Neuf: 12 µε at 5 °C — Δσ");
  });

  it("strips them from every kind of text field before it is stored", () => {
    const structure = createStructureInput.parse({ code: "FB-1", name: "Foot\r\nbridge", description: `Span ${RLO}A${LRI}`, location: "\tQuay\n" });
    expect(structure).toMatchObject({ name: "Foot bridge", description: "Span A", location: "Quay" });
    expect(createUserInput.parse({ email: "a@b.example", name: "Ann\nLee", role: "owner", password: "long enough pass" }).name).toBe("Ann Lee");
    expect(tokenName.parse(`logger${RLO}`)).toBe("logger");
    expect(gaugePatch.parse({ label: "Chord\u0000 A", member: "M\r1", reason: `fix${LRI}` })).toMatchObject({ label: "Chord A", member: "M 1", reason: "fix" });
    expect(acknowledgeBody.parse({ comment: "Checked.\r\nAll fine." }).comment).toBe("Checked. All fine.");
    expect(drawingFields.parse({ title: "North\televation" }).title).toBe("North elevation");
    expect(photoFields.parse({ title: `\u0007${RLO}` }).title).toBeUndefined();
  });

  it("still asks for a name that is nothing but control characters", () => {
    expect(createStructureInput.safeParse({ code: "FB-1", name: "\r\n\u202e" }).success).toBe(false);
  });
});
