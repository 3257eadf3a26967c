import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { analyseRosette, type RosetteAnalysis, type RosetteLayout } from "@/lib/mechanics";
import { CHECK_STEEL, expectClose } from "./fixtures";

interface StrainState {
  x: number;
  y: number;
  shear: number;
}

/** Strain transformation: ε(θ) = (εx+εy)/2 + (εx−εy)/2·cos 2θ + γxy/2·sin 2θ (Dally & Riley, strain chapter). */
function strainAt({ x, y, shear }: StrainState, degrees: number): number {
  const twoTheta = (2 * degrees * Math.PI) / 180;
  return (x + y) / 2 + ((x - y) / 2) * Math.cos(twoTheta) + (shear / 2) * Math.sin(twoTheta);
}

const GAUGE_ANGLES: Record<RosetteLayout, readonly [number, number, number]> = {
  rectangular: [0, 45, 90],
  delta: [0, 60, 120],
};

/** What a rosette of the layout, its gauge a turned `rotation` degrees from x, would read. */
function measure(state: StrainState, layout: RosetteLayout, rotation: number): [number, number, number] {
  const [a, b, c] = GAUGE_ANGLES[layout];
  return [strainAt(state, rotation + a), strainAt(state, rotation + b), strainAt(state, rotation + c)];
}

function analysed(layout: RosetteLayout, strains: [number, number, number]): RosetteAnalysis {
  const result = analyseRosette(layout, strains, CHECK_STEEL);
  if (!result.ok) throw new Error(result.message);
  return result;
}

const strainState = fc.record({
  x: fc.double({ min: -3000, max: 3000, noNaN: true }),
  y: fc.double({ min: -3000, max: 3000, noNaN: true }),
  shear: fc.double({ min: -3000, max: 3000, noNaN: true }),
});
const layout = fc.constantFrom<RosetteLayout>("rectangular", "delta");

describe("rectangular rosette", () => {
  it("matches the published principal strains and angle", () => {
    // εa 500, εb 300, εc −100: (εa+εc)/2 = 200, ½·√(600² + 200²) = 316.2278,
    // θp = ½·atan2(200, 600) = 9.2175° (Dally & Riley, rosette chapter)
    const result = analysed("rectangular", [500, 300, -100]);
    expectClose(result.epsilon1, 516.2277660168, 1e-10);
    expectClose(result.epsilon2, -116.2277660168, 1e-10);
    expectClose(result.theta, 9.2174744115, 1e-9);
    // plane stress, E 200 GPa, ν 0.3: E/(1−ν²) = 219 780.22 MPa;
    // σ1 = 219 780.22 × (516.2278 − 0.3 × 116.2278)×10⁻⁶ = 105.7933 MPa, σ2 = 8.4924 MPa,
    // σ_vm = √(σ1² − σ1σ2 + σ2²) = 101.8131 MPa, τmax = (σ1 − σ2)/2 = 48.6504 MPa
    expectClose(result.sigma1, 105.7932826839, 1e-9);
    expectClose(result.sigma2, 8.4924316018, 1e-9);
    expectClose(result.vonMises, 101.8130533793, 1e-9);
    expectClose(result.tauMax, 48.650425541, 1e-9);
  });

  it("keeps εa + εc = ε1 + ε2 (strain invariant: the trace does not depend on the axes)", () => {
    const strain = fc.double({ min: -3000, max: 3000, noNaN: true });
    fc.assert(
      fc.property(strain, strain, strain, (a, b, c) => {
        const result = analysed("rectangular", [a, b, c]);
        expectClose(result.epsilon1 + result.epsilon2, a + c);
      }),
    );
  });
});

describe("delta rosette", () => {
  it("matches the closed form ε₁,₂ = (εa+εb+εc)/3 ± (√2/3)·√((εa−εb)²+(εb−εc)²+(εc−εa)²) (Dally & Riley, rosette chapter)", () => {
    const strain = fc.double({ min: -3000, max: 3000, noNaN: true });
    fc.assert(
      fc.property(strain, strain, strain, (a, b, c) => {
        const mean = (a + b + c) / 3;
        const radius = (Math.SQRT2 / 3) * Math.sqrt((a - b) ** 2 + (b - c) ** 2 + (c - a) ** 2);
        const result = analysed("delta", [a, b, c]);
        expectClose(result.epsilon1, mean + radius);
        expectClose(result.epsilon2, mean - radius);
      }),
    );
  });

  it("puts ε1 along gauge b when only gauge b is stretched", () => {
    // εa = εc = 0, εb = 1000: ε1 = 333.33 + 666.67 = 1000 at 60° (gauge b), ε2 = −333.33 at 150°.
    // The 0°/120°/240° form tan 2θ = √3(εc − εb)/(2εa − εb − εc) would answer 120° (gauge c) here.
    const result = analysed("delta", [0, 1000, 0]);
    expectClose(result.epsilon1, 1000, 1e-12);
    expectClose(result.epsilon2, -1000 / 3, 1e-12);
    expectClose(result.theta, 60, 1e-12);
  });
});

describe("either layout", () => {
  it("finds the same principal strains however the rosette is turned, and points θ at ε1", () => {
    fc.assert(
      fc.property(strainState, layout, fc.double({ min: 0, max: 180, noNaN: true }), (state, kind, rotation) => {
        const mean = (state.x + state.y) / 2;
        const radius = Math.hypot((state.x - state.y) / 2, state.shear / 2);
        const result = analysed(kind, measure(state, kind, rotation));
        expectClose(result.epsilon1, mean + radius);
        expectClose(result.epsilon2, mean - radius);
        // θ is measured from gauge a, which lies at `rotation` from x
        expectClose(strainAt(state, rotation + result.theta), result.epsilon1);
      }),
    );
  });

  it("gives von Mises = |σ| and τmax = |σ|/2 under uniaxial stress (common practice)", () => {
    // uniaxial σ = 100 MPa along x: εx = σ/E = 500 µε, εy = −ν·εx = −150 µε, γxy = 0
    const state = { x: 500, y: -150, shear: 0 };
    for (const kind of ["rectangular", "delta"] as const) {
      const result = analysed(kind, measure(state, kind, 25));
      expectClose(result.sigma1, 100, 1e-9);
      expectClose(result.sigma2, 0, 0, 1e-9);
      expectClose(result.vonMises, 100, 1e-9);
      expectClose(result.tauMax, 50, 1e-9);
      expectClose(result.theta, -25, 1e-9);
    }
  });

  it("gives von Mises = √3·τ under pure shear (common practice)", () => {
    // τ = 50 MPa: G = E/(2(1+ν)) = 76 923.08 MPa, γ = τ/G = 650 µε
    const result = analysed("rectangular", measure({ x: 0, y: 0, shear: 650 }, "rectangular", 0));
    expectClose(result.sigma1, 50, 1e-9);
    expectClose(result.sigma2, -50, 1e-9);
    expectClose(result.vonMises, 50 * Math.sqrt(3), 1e-9);
    expectClose(result.tauMax, 50, 1e-9);
    expectClose(result.theta, 45, 1e-9);
  });

  it("refuses an unknown layout, a non-finite strain and a material without modulus", () => {
    expect(analyseRosette("star", [1, 2, 3], CHECK_STEEL)).toMatchObject({ ok: false, code: "unknown-layout" });
    expect(analyseRosette("delta", [1, Number.NaN, 3], CHECK_STEEL)).toMatchObject({ ok: false, code: "non-finite-strain" });
    expect(analyseRosette("delta", [1, 2, 3], { ...CHECK_STEEL, E: 0 })).toMatchObject({ ok: false, code: "invalid-material" });
  });
});
