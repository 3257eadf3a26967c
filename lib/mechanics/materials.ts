import type { Material } from "./gauge-config";
import { isPositive } from "./checks";
import { failure, type Failure } from "./result";

export type MaterialErrorCode = "invalid-material";

/** Strength classes of EN 1992-1-1 Table 3.1 offered as presets: characteristic cylinder / cube strength, MPa. */
export const EN_CONCRETE_CLASSES = ["C25/30", "C30/37", "C35/45", "C40/50", "C45/55", "C50/60"] as const;
export type ConcreteClass = (typeof EN_CONCRETE_CLASSES)[number];

/**
 * EN 1992-1-1 Table 3.1: mean strength f_cm = f_ck + 8 MPa and secant modulus
 * E_cm = 22·(f_cm/10)^0.3 GPa (quartzite aggregate), returned in MPa.
 */
export function concreteMeanModulus(characteristicStrength: number): number {
  return 22_000 * ((characteristicStrength + 8) / 10) ** 0.3;
}

/**
 * A concrete of an EN 1992-1-1 class: E_cm from its f_ck; ν = 0.2 uncracked (§3.1.3(4)) and
 * α = 10 µε/°C (§3.1.3(5)), from memory. Rated against f_ck in compression, with no yield.
 */
export function concreteOfClass(grade: ConcreteClass): Material & { name: string; compressiveStrength: number } {
  const characteristicStrength = Number(grade.slice(1, grade.indexOf("/")));
  return {
    name: `Concrete ${grade} (EN 1992-1-1, f_ck = ${characteristicStrength} MPa)`,
    E: concreteMeanModulus(characteristicStrength),
    nu: 0.2,
    alpha: 10,
    compressiveStrength: characteristicStrength,
  };
}

/**
 * Starting points for the gauge form; the engineer overrides them with the project's values.
 * All figures are nominal handbook values quoted from memory — check them against the project's
 * specification before relying on them.
 */
export const MATERIALS = {
  // AISC 360 (E = 29 000 ksi, ν = 0.3), AISC Steel Construction Manual (α = 6.5×10⁻⁶/°F),
  // ASTM A992 (Fy = 50 ksi); from memory.
  "structural-steel-us": { name: "Structural steel ASTM A992 (E = 200 GPa)", E: 200_000, nu: 0.3, alpha: 11.7, yield: 345 },
  // EN 1993-1-1 §3.2.6 (E = 210 000 N/mm², ν = 0.3, α = 12×10⁻⁶/K) and Table 3.1 (S355, t ≤ 40 mm);
  // from memory.
  "structural-steel-eu": { name: "Structural steel S355 (E = 210 GPa)", E: 210_000, nu: 0.3, alpha: 12, yield: 355 },
  // ASTM A588 (Fy = 50 ksi); elastic constants as for other structural steel (AISC 360); from memory.
  "weathering-steel": { name: "Weathering steel ASTM A588", E: 200_000, nu: 0.3, alpha: 11.7, yield: 345 },
  // ASM Handbook vol. 2 (E = 68.9 GPa, ν = 0.33, α = 23.6 µm/m·°C); yield is the Aluminum Design
  // Manual minimum Fty = 35 ksi (typical values are near 276 MPa); from memory.
  "aluminium-6061-t6": { name: "Aluminium 6061-T6", E: 68_900, nu: 0.33, alpha: 23.6, yield: 241 },
  // ASM Handbook vol. 1 (E = 193 GPa, ν = 0.29, α = 17.3 µm/m·°C over 0–100 °C); yield is the
  // ASTM A240 minimum of 30 ksi; from memory.
  "stainless-steel-304": { name: "Stainless steel 304", E: 193_000, nu: 0.29, alpha: 17.3, yield: 205 },
  // EN 1992-1-1 §3.2.7(4) (E_s = 200 GPa) and Annex C (f_yk 400–600 MPa; 500 is the common grade);
  // α as for other carbon steel, EN 1993-1-1 §3.2.6; from memory.
  "reinforcing-steel-b500": { name: "Reinforcing steel B500 (f_yk = 500 MPa)", E: 200_000, nu: 0.3, alpha: 12, yield: 500 },
  // EN 1992-1-1 §3.3.6(3) (E_p = 195 GPa for strand); f_p0.1k ≈ 0.88·f_pk of a 1 860 MPa seven-wire
  // strand as EN 10138-3 drafts list it; from memory. A strand gauge sees the change from its zero:
  // the prestress at zeroing is its initial stress.
  "prestressing-strand-1860": { name: "Prestressing strand, f_pk = 1 860 MPa (f_p0.1k = 1 640 MPa)", E: 195_000, nu: 0.3, alpha: 12, yield: 1_640 },
  "normal-weight-concrete-30": normalWeightConcrete(30),
  "concrete-c25-30": concreteOfClass("C25/30"),
  "concrete-c30-37": concreteOfClass("C30/37"),
  "concrete-c35-45": concreteOfClass("C35/45"),
  "concrete-c40-50": concreteOfClass("C40/50"),
  "concrete-c45-55": concreteOfClass("C45/55"),
  "concrete-c50-60": concreteOfClass("C50/60"),
} as const satisfies Record<string, Material & { name: string }>;

export type MaterialId = keyof typeof MATERIALS;

/** ACI 318-19 §19.2.2.1: E_c = 4700·√f'c in MPa for normal-weight concrete. */
export function concreteModulus(compressiveStrength: number): number {
  return 4700 * Math.sqrt(compressiveStrength);
}

/**
 * Concrete has no yield point; its linear range is usually taken up to about 0.45·f'c in
 * compression (the secant that defines E_c in ACI 318), so no yield is given: it is rated against
 * f'c in compression, and stress from strain is valid only while creep and shrinkage are negligible. ν = 0.2 and α = 10 µε/°C are
 * common practice (from memory).
 */
export function normalWeightConcrete(compressiveStrength: number): Material & { name: string; compressiveStrength: number } {
  return {
    name: `Normal-weight concrete, f'c = ${compressiveStrength} MPa`,
    E: concreteModulus(compressiveStrength),
    nu: 0.2,
    alpha: 10,
    compressiveStrength,
  };
}

/** Null when the material can carry the conversion; otherwise what to fix. */
export function materialProblem(material: Material | null | undefined): Failure<MaterialErrorCode> | null {
  if (!material || !isPositive(material.E)) return failure("invalid-material", "The material needs a positive modulus E in MPa.");
  // Isotropic elasticity bounds Poisson's ratio to (−1, 0.5].
  if (!Number.isFinite(material.nu) || material.nu <= -1 || material.nu > 0.5) {
    return failure("invalid-material", "The material's Poisson's ratio nu must lie between -1 and 0.5.");
  }
  if (!Number.isFinite(material.alpha)) {
    return failure("invalid-material", "The material needs its expansion coefficient alpha in µε/°C.");
  }
  if (material.yield != null && !isPositive(material.yield)) {
    return failure("invalid-material", "The material's yield, when given, must be a positive stress in MPa.");
  }
  if (material.compressiveStrength != null && !isPositive(material.compressiveStrength)) {
    return failure("invalid-material", "The concrete's compressive strength, when given, must be a positive stress in MPa.");
  }
  return null;
}
