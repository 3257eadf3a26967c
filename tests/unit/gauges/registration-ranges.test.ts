import { describe, expect, it } from "vitest";
import { gaugeInput } from "@/lib/gauges/schema";
import { validateLimits } from "@/lib/limits/validate-limits";
import { checkUpload } from "@/lib/storage/upload-rules";
import { pngImage } from "../../fixtures/images";

const foil = {
  tag: "G1",
  kind: "foil",
  input: "mV/V",
  bridge: "quarter",
  gaugeFactor: 2.1,
  material: { E: 210_000, nu: 0.3, alpha: 12, yield: 355 },
  zero: { value: 0.012, temperature: 14.5 },
};
// K = 4·L²·ρ·10⁹ / E of 150 mm of steel wire (taut-string physics): 3.5325 µε per f²/1000.
const wire = { tag: "VW1", kind: "vibrating-wire", input: "Hz", gaugeFactor: 3.5325, material: { E: 30_000, nu: 0.2, alpha: 10 }, zero: { value: 800, temperature: 12 } };

function fieldsWithErrors(body: unknown): string[] {
  const result = gaugeInput.safeParse(body);
  return result.success ? [] : result.error.issues.map((issue) => issue.path.join("."));
}

describe("plausible ranges at registration", () => {
  it("accepts ordinary gauges on steel and concrete", () => {
    expect(fieldsWithErrors(foil)).toEqual([]);
    expect(fieldsWithErrors(wire)).toEqual([]);
    expect(fieldsWithErrors({ ...foil, leadResistance: 0.9, gaugeResistance: 350 })).toEqual([]);
    expect(fieldsWithErrors({ ...foil, wiring: "3-wire", leadResistance: 0.45, gaugeResistance: 350, excitationVoltage: 2.5 })).toEqual([]);
  });

  it.each([
    // A foil gauge factor of 20 or 0.2 is a typing error: metallic foil is about 2 (from memory).
    [{ ...foil, gaugeFactor: 20 }, "gaugeFactor"],
    [{ ...foil, gaugeFactor: 0.21 }, "gaugeFactor"],
    [{ ...foil, input: "microstrain", bridge: null, loggerGaugeFactor: 200 }, "loggerGaugeFactor"],
    // A vibrating wire's constant of 3 304 µε per digit is 3.304 typed without the decimal point.
    [{ ...wire, gaugeFactor: 3304 }, "gaugeFactor"],
    // E typed in Pa (2.1e11) or in GPa (210) instead of MPa (steel about 210 000 MPa, EN 1993-1-1).
    [{ ...foil, material: { ...foil.material, E: 2.1e11 } }, "material.E"],
    [{ ...foil, material: { ...foil.material, E: 210 } }, "material.E"],
    // ν of 0.03 is 0.3 mistyped: no structural material is that low (handbook values, from memory).
    [{ ...foil, material: { ...foil.material, nu: 0.03 } }, "material.nu"],
    [{ ...foil, material: { ...foil.material, yield: 355_000 } }, "material.yield"],
    // Foil gauges are made at 60 to 5 000 Ω (common practice); 350 kΩ is a unit slip.
    [{ ...foil, gaugeResistance: 350_000 }, "gaugeResistance"],
    [{ ...foil, leadResistance: 5_000, gaugeResistance: 350 }, "leadResistance"],
    // Loggers excite strain-gauge bridges at about 0.5 to 10 V (common practice); 2 500 is millivolts typed as volts.
    [{ ...foil, excitationVoltage: 2_500 }, "excitationVoltage"],
    [{ ...foil, excitationVoltage: 0 }, "excitationVoltage"],
    [{ ...wire, excitationVoltage: 5 }, "excitationVoltage"],
    [{ ...foil, wiring: "4-wire" }, "wiring"],
    // 2-wire and 3-wire describe a single active gauge's leads: a half or full bridge has no such choice.
    [{ ...foil, bridge: "full-bending", wiring: "3-wire" }, "wiring"],
  ])("answers an absurd value on its field: %#", (body, field) => {
    expect(fieldsWithErrors(body)).toContain(field);
  });

  it("names the usual range in the message", () => {
    const result = gaugeInput.safeParse({ ...foil, material: { ...foil.material, E: 2.1e11 } });
    expect(result.success).toBe(false);
    expect(result.error!.issues[0]!.message).toMatch(/MPa.*200,000/);
  });

  it("refuses a persistence no alert could wait for", () => {
    const validation = validateLimits([{ quantity: "stress", level: "watch", upper: 100, persistence: 1_000_000 }]);
    expect(validation.ok).toBe(false);
    expect(JSON.stringify(validation)).toMatch(/persistence/);
  });

  it("refuses an image whose header claims more than 20 000 pixels a side", () => {
    const png = pngImage(2, 2);
    // IHDR width is the big-endian 32-bit field at byte 16 (PNG specification, ISO/IEC 15948).
    new DataView(png.buffer, png.byteOffset).setUint32(16, 60_000);
    expect(() => checkUpload(png, "drawing")).toThrow(/60000 × 2 pixels/);
  });
});
