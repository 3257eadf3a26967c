import { isFiniteNumber } from "./checks";
import type { Material } from "./gauge-config";
import { materialProblem, type MaterialErrorCode } from "./materials";
import { failure, type Result } from "./result";
import { inPlaneMaxShear, planeStressPrincipal, vonMises } from "./stress";

/**
 * Gauge a lies along the reference direction; b and c follow counter-clockwise at 45° and 90°
 * (rectangular) or 60° and 120° (delta), as the API lists them.
 */
export const ROSETTE_LAYOUTS = ["rectangular", "delta"] as const;
export type RosetteLayout = (typeof ROSETTE_LAYOUTS)[number];

/** Plane strain state in µε in the rosette's frame (x along gauge a); shear is engineering γxy. */
export interface PlaneStrain {
  x: number;
  y: number;
  shear: number;
}

export interface PrincipalStrains {
  epsilon1: number;
  epsilon2: number;
  /** Degrees counter-clockwise from gauge a to the direction of ε₁, in (−90, 90]. */
  theta: number;
}

export interface RosetteAnalysis extends PrincipalStrains {
  /** MPa, plane stress. */
  sigma1: number;
  sigma2: number;
  vonMises: number;
  tauMax: number;
}

export type RosetteErrorCode = "unknown-layout" | "non-finite-strain" | MaterialErrorCode;

const SQRT3 = Math.sqrt(3);
const DEGREES_PER_RADIAN = 180 / Math.PI;

/**
 * Inverts the strain transformation ε(θ) = (εx+εy)/2 + (εx−εy)/2·cos 2θ + γxy/2·sin 2θ at the
 * three gauge angles (Dally & Riley, Experimental Stress Analysis, strain-gauge rosette chapter).
 * Rectangular: εx = εa, εy = εc, γxy = 2εb − εa − εc.
 * Delta: εx = εa, εy = (2εb + 2εc − εa)/3, γxy = 2(εb − εc)/√3. With these, tan 2θp =
 * √3(εb − εc)/(2εa − εb − εc). Texts that number the delta gauges 0°/120°/240° write
 * √3(εc − εb) in the numerator: the same relation with b and c exchanged. Using it with the API's
 * 0°/60°/120° order would mirror the principal direction.
 */
export function rosetteStrainState(layout: RosetteLayout, a: number, b: number, c: number): PlaneStrain {
  return layout === "rectangular"
    ? { x: a, y: c, shear: 2 * b - a - c }
    : { x: a, y: (2 * b + 2 * c - a) / 3, shear: (2 * (b - c)) / SQRT3 };
}

/** Centre and radius of Mohr's circle of strain; θp = ½·atan2(γxy, εx − εy). */
export function principalStrains({ x, y, shear }: PlaneStrain): PrincipalStrains {
  const centre = (x + y) / 2;
  const radius = Math.hypot((x - y) / 2, shear / 2);
  return {
    epsilon1: centre + radius,
    epsilon2: centre - radius,
    theta: (Math.atan2(shear, x - y) / 2) * DEGREES_PER_RADIAN,
  };
}

/** Principal strains and plane-stress quantities from the three mechanical strains (µε) a, b, c. */
export function analyseRosette(
  layout: string,
  strains: readonly [number, number, number],
  material: Material,
): Result<RosetteAnalysis, RosetteErrorCode> {
  if (layout !== "rectangular" && layout !== "delta") {
    return failure("unknown-layout", `Unknown rosette layout "${layout}"; use rectangular or delta.`);
  }
  if (!strains.every(isFiniteNumber)) {
    return failure("non-finite-strain", "Each of the rosette's three strains must be a finite number.");
  }
  const problem = materialProblem(material);
  if (problem) return problem;
  const principal = principalStrains(rosetteStrainState(layout, ...strains));
  const { sigma1, sigma2 } = planeStressPrincipal(material.E, material.nu, principal.epsilon1, principal.epsilon2);
  return {
    ok: true,
    ...principal,
    sigma1,
    sigma2,
    vonMises: vonMises(sigma1, sigma2),
    tauMax: inPlaneMaxShear(sigma1, sigma2),
  };
}
