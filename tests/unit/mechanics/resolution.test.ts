import { describe, expect, it } from "vitest";
import { decimalsForStep, derivedDecimals, writtenDecimals, type GaugeConfig } from "@/lib/mechanics";

const steel = { E: 210_000, nu: 0.3, alpha: 12 };

describe("decimals of a written number and of a step", () => {
  it("counts what the shortest form writes, exponents included", () => {
    expect([0.0135, 250, 250.5, 1e-7, -40.75, 1.5e3].map(writtenDecimals)).toEqual([4, 0, 1, 7, 2, 0]);
  });

  it("keeps the digit of a step's first significant figure and none finer", () => {
    expect([0.2, 0.05, 1, 2.5, 0.0528, 12].map(decimalsForStep)).toEqual([1, 2, 0, 0, 2, 0]);
  });
});

describe("decimals a gauge's strain and stress carry", () => {
  it("follows a microstrain logger's step through Hooke's law", () => {
    const gauge: GaugeConfig = { kind: "foil", input: "microstrain", gaugeFactor: 2, material: steel, zero: { value: 0, temperature: 20 } };
    // One raw step of 0.5 µε is 0.5 µε of strain; σ = E·ε (Hooke's law) makes it 210 000 × 0.5e-6 = 0.105 MPa.
    expect(derivedDecimals(gauge, 0.5)).toEqual({ strain: 1, stress: 1 });
    // A whole-µε step: 1 µε and 0.21 MPa.
    expect(derivedDecimals(gauge, 1)).toEqual({ strain: 0, stress: 1 });
  });

  it("follows a quarter bridge's mV/V step", () => {
    const gauge: GaugeConfig = { kind: "foil", input: "mV/V", bridge: "quarter", gaugeFactor: 2.1, material: steel, zero: { value: 0.012, temperature: 14.5 } };
    // Quarter bridge ε ≈ 4·Vr/GF for small Vr (Vishay Micro-Measurements Tech Note TN-507-1, from memory):
    // 0.001 mV/V is 4 × 1e-6 / 2.1 = 1.9 µε, and 210 000 MPa × 1.9e-6 = 0.40 MPa.
    expect(derivedDecimals(gauge, 0.001)).toEqual({ strain: 0, stress: 1 });
    // 0.0001 mV/V: 0.19 µε and 0.040 MPa.
    expect(derivedDecimals(gauge, 0.0001)).toEqual({ strain: 1, stress: 2 });
  });

  it("says nothing for a gauge that cannot convert", () => {
    const gauge: GaugeConfig = { kind: "foil", input: "microstrain", gaugeFactor: -1, material: steel, zero: { value: 0, temperature: 20 } };
    expect(derivedDecimals(gauge, 1)).toBeNull();
  });
});
