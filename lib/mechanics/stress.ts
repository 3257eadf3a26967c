/** Strains are carried in microstrain; Hooke's law wants them dimensionless. */
export const MICRO = 1e-6;

/** Hooke's law for a uniaxial member plus the dead-load stress present at zeroing, in MPa. */
export function uniaxialStress(modulus: number, microstrain: number, initialStress: number): number {
  return modulus * microstrain * MICRO + initialStress;
}

/** |σ| / yield, or null when the material's yield is unknown. */
export function utilisation(stress: number, yieldStrength: number | null): number | null {
  return yieldStrength === null ? null : Math.abs(stress) / yieldStrength;
}

export interface PrincipalStresses {
  sigma1: number;
  sigma2: number;
}

/** Plane-stress Hooke's law on principal strains (µε) → principal stresses (MPa). */
export function planeStressPrincipal(modulus: number, poisson: number, epsilon1: number, epsilon2: number): PrincipalStresses {
  const stiffness = (modulus * MICRO) / (1 - poisson * poisson);
  return {
    sigma1: stiffness * (epsilon1 + poisson * epsilon2),
    sigma2: stiffness * (epsilon2 + poisson * epsilon1),
  };
}

/** Von Mises equivalent stress of a plane stress state, from its principal stresses. */
export function vonMises(sigma1: number, sigma2: number): number {
  return Math.sqrt(sigma1 * sigma1 - sigma1 * sigma2 + sigma2 * sigma2);
}

/** In-plane maximum shear stress. */
export function inPlaneMaxShear(sigma1: number, sigma2: number): number {
  return (sigma1 - sigma2) / 2;
}
