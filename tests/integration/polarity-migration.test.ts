import fc from "fast-check";
import { eq } from "drizzle-orm";
import { beforeAll, describe, expect, it } from "vitest";
import { getDb } from "@/db/client";
import { gauges } from "@/db/schema";
import { gaugeConfigOf } from "@/lib/gauges/record";
import { BRIDGES, prepareGauge, type Bridge } from "@/lib/mechanics";
import { createGauge } from "@/lib/services/gauges";
import type { UserActor } from "@/lib/auth/actor";
import { microstrainGauge } from "../fixtures/gauges";
import { makeStructure, makeUser } from "./helpers";
import { rerunMigration } from "./migration-sql";

/**
 * The relations gauges were converted with before the tension-positive ones: the primary gauge in
 * the arm that lowers the output (compression positive), and polarity negating the strain after
 * the relation. Kept here alone, to prove the migration against.
 */
const FORMER_RELATIONS: Record<Bridge, (vr: number, gf: number, nu: number) => number> = {
  quarter: (vr, gf) => (-4 * vr) / (gf * (1 + 2 * vr)),
  "half-bending": (vr, gf) => (-2 * vr) / gf,
  "half-poisson": (vr, gf, nu) => (-4 * vr) / (gf * (1 + nu - 2 * vr * (nu - 1))),
  "full-bending": (vr, gf) => -vr / gf,
  "full-poisson": (vr, gf, nu) => (-2 * vr) / (gf * (nu + 1)),
  "full-axial-poisson": (vr, gf, nu) => (-2 * vr) / (gf * (nu + 1 - vr * (nu - 1))),
};
const LINEAR: readonly Bridge[] = ["half-bending", "full-bending", "full-poisson"];

function formerIndicatedStrain(bridge: Bridge, gf: number, nu: number, polarity: number, lead: number, mvPerV: number): number {
  return polarity * ((lead / 1e-6) * FORMER_RELATIONS[bridge](mvPerV / 1000, gf, nu));
}

const bridgeGauge = fc.record({
  bridge: fc.constantFrom(...BRIDGES),
  gaugeFactor: fc.double({ min: 1.8, max: 3.2, noNaN: true }),
  nu: fc.double({ min: 0.1, max: 0.45, noNaN: true }),
  polarity: fc.constantFrom<1 | -1>(1, -1),
  zero: fc.double({ min: -3, max: 3, noNaN: true }),
  leadResistance: fc.option(fc.double({ min: 0, max: 5, noNaN: true }), { nil: null }),
});
type BridgeGauge = typeof bridgeGauge extends fc.Arbitrary<infer T> ? T : never;
/** Output changes of up to ±4 mV/V: about ±8000 µε on a quarter bridge, past any gauge's range. */
const outputs = fc.array(fc.double({ min: -4, max: 4, noNaN: true }), { minLength: 5, maxLength: 5 });

let engineer: UserActor;
const stored: { tag: string; gauge: BridgeGauge; outputs: number[] }[] = [];

beforeAll(async () => {
  engineer = await makeUser("engineer");
  await makeStructure("MIG", [engineer]);
  const samples = fc.sample(fc.tuple(bridgeGauge, outputs), { numRuns: 120, seed: 16 });
  for (const [index, [gauge, changes]] of samples.entries()) {
    const tag = `B${index}`;
    await createGauge(engineer, "MIG", {
      ...microstrainGauge(tag),
      input: "mV/V",
      bridge: gauge.bridge,
      gaugeFactor: gauge.gaugeFactor,
      polarity: gauge.polarity,
      leadResistance: gauge.leadResistance,
      gaugeResistance: gauge.leadResistance === null ? null : 350,
      material: { E: 200_000, nu: gauge.nu, alpha: 12, yield: 355 },
      zero: { value: gauge.zero, temperature: 10 },
    });
    stored.push({ tag, gauge, outputs: changes.map((change) => gauge.zero + change) });
  }
  await createGauge(engineer, "MIG", microstrainGauge("LOGGER", { polarity: -1 }));
  await rerunMigration("flip_bridge_polarity_for_tension_positive_relations");
});

async function row(tag: string) {
  const [gauge] = await getDb().select().from(gauges).where(eq(gauges.tag, tag));
  return gauge!;
}

describe("migration to tension-positive bridge relations", () => {
  it("flips the polarity of gauges read in mV/V and leaves other inputs alone", async () => {
    for (const { tag, gauge } of stored) expect((await row(tag)).polarity).toBe(-gauge.polarity);
    expect((await row("LOGGER")).polarity).toBe(-1);
  });

  // The former relations equal the circuit's at the opposite output (both are Dally & Riley's
  // circuit with the primary gauge in R1 or R2), so the flipped polarity gives each reading the
  // strain it was stored with, to the last bit.
  it("converts every raw reading of a gauge with polarity 1, and of a linear bridge, exactly as before", async () => {
    let compared = 0;
    for (const { tag, gauge, outputs: values } of stored) {
      if (gauge.polarity === -1 && !LINEAR.includes(gauge.bridge)) continue;
      const converter = prepareGauge(gaugeConfigOf(await row(tag)));
      if (!converter.ok) throw new Error(converter.message);
      const lead = gauge.leadResistance === null || gauge.bridge !== "quarter" ? 1 : 1 + gauge.leadResistance / 350;
      for (const value of values) {
        const before = formerIndicatedStrain(gauge.bridge, gauge.gaugeFactor, gauge.nu, gauge.polarity, lead, value - gauge.zero);
        const after = converter.convert(value);
        expect(after.ok && after.indicatedStrain).toBe(before);
        compared++;
      }
    }
    expect(compared).toBeGreaterThan(300);
  });

  // A former polarity of −1 negated the strain after a non-linear relation, which is no circuit:
  // the migrated gauge now gives the circuit's strain with its leads swapped. The two differ by the
  // relation's second-order term only, |Δε| ≤ 4·|Vr|·|ε| / (1 − 2|Vr|) (quarter bridge, the largest).
  it("moves a reversed non-linear bridge only by the second-order term the former sign rule dropped", async () => {
    let compared = 0;
    for (const { tag, gauge, outputs: values } of stored) {
      if (gauge.polarity === 1 || LINEAR.includes(gauge.bridge)) continue;
      const converter = prepareGauge(gaugeConfigOf(await row(tag)));
      if (!converter.ok) throw new Error(converter.message);
      const lead = gauge.leadResistance === null || gauge.bridge !== "quarter" ? 1 : 1 + gauge.leadResistance / 350;
      for (const value of values) {
        const vr = Math.abs(value - gauge.zero) / 1000;
        const before = formerIndicatedStrain(gauge.bridge, gauge.gaugeFactor, gauge.nu, -1, lead, value - gauge.zero);
        const after = converter.convert(value);
        if (!after.ok) throw new Error(after.message);
        expect(Math.sign(after.indicatedStrain)).toBe(Math.sign(before));
        expect(Math.abs(after.indicatedStrain - before)).toBeLessThanOrEqual((4 * vr * Math.abs(before)) / (1 - 2 * vr) + 1e-9);
        compared++;
      }
    }
    expect(compared).toBeGreaterThan(50);
  });
});
