import * as ingest from "@/app/api/v1/structures/[code]/readings/route";
import type { Client } from "@libsql/client";
import { getClient } from "@/db/client";
import type { UserActor } from "@/lib/auth/actor";
import { parseWith } from "@/lib/validation";
import { gaugeInput } from "@/lib/gauges/schema";
import { createGauge, retireGauge } from "@/lib/services/gauges";
import { createStructure } from "@/lib/services/structures";
import { addMember } from "@/lib/services/memberships";
import { apiRequest, params } from "./helpers";

/**
 * Gauges for the ingestion tests. `S1` reads microstrain with the logger's gauge factor equal to
 * its own and no compensation, so its strain is value − zero and its stress 0.2 MPa per µε
 * (E = 200 000 MPa: 200 000 × 1e-6), which keeps expected values computable by hand.
 */
export const STRAIN_GAUGE = {
  tag: "S1",
  kind: "foil",
  input: "microstrain",
  gaugeFactor: 2,
  material: { E: 200000, nu: 0.3, alpha: 12 },
  zero: { value: 0, temperature: 20, time: "2024-01-01T00:00:00Z" },
} as const;

/** Vibrating wire in Hz: compensation by the wire's expansion coefficient needs a temperature per reading. */
export const WIRE_GAUGE = {
  tag: "VW",
  kind: "vibrating-wire",
  input: "Hz",
  gaugeFactor: 3.304,
  thermal: { method: "cte", gaugeCte: 12.2 },
  material: { E: 30000, nu: 0.2, alpha: 10 },
  zero: { value: 800, temperature: 12, time: "2024-01-01T00:00:00Z" },
} as const;

/** Creates a structure with S1, VW and a retired gauge OLD, and the given members. */
export async function makeIngestStructure(code: string, members: UserActor[], timezone = "UTC") {
  await createStructure(null, { code, name: `Structure ${code}`, timezone });
  for (const member of members) await addMember(null, member.email, code);
  const installer = members.find((m) => m.role === "engineer") ?? members[0]!;
  for (const gauge of [STRAIN_GAUGE, WIRE_GAUGE, { ...STRAIN_GAUGE, tag: "OLD" }]) {
    await createGauge(installer, code, parseWith(gaugeInput, gauge));
  }
  await retireGauge(installer, code, "OLD");
}

export type Reading = { gauge: string; time: string; value: unknown; temperature?: unknown };

export function postReadings(code: string, token: string | undefined, body: unknown, headers: Record<string, string> = {}, query = "") {
  return ingest.POST(apiRequest(`/structures/${code}/readings${query}`, { method: "POST", token, body, headers }), params({ code }));
}

/** A reading of S1 every `stepMs` from `start`, valued by `valueAt`. */
export function strainReadings(start: number, count: number, stepMs: number, valueAt: (i: number) => number): Reading[] {
  return Array.from({ length: count }, (_, i) => ({
    gauge: "S1",
    time: new Date(start + i * stepMs).toISOString(),
    value: valueAt(i),
    temperature: 20,
  }));
}

export async function storedCount(code: string, tag = "S1"): Promise<number> {
  const result = await getClient().execute({
    sql: "SELECT count(*) FROM readings r JOIN gauges g ON g.id = r.gauge_id JOIN structures s ON s.id = g.structure_id WHERE s.code = ? AND g.tag = ?",
    args: [code, tag],
  });
  return Number(result.rows[0]![0]);
}

/**
 * Roll-up rows that disagree with an aggregate computed directly over the readings table
 * (GROUP BY hour or day), for every gauge: empty when the roll-ups are right.
 */
export async function rollupMismatches(client: Client = getClient()): Promise<unknown[]> {
  const result = await client.execute(`
    WITH direct AS (
      SELECT gauge_id, res.resolution, (t / res.resolution) * res.resolution AS bucket, count(*) AS count,
             min(strain) AS strain_min, max(strain) AS strain_max, sum(strain) AS strain_sum,
             min(stress) AS stress_min, max(stress) AS stress_max, sum(stress) AS stress_sum,
             count(temperature) AS temperature_count, min(temperature) AS temperature_min, max(temperature) AS temperature_max
      FROM readings, (SELECT 3600000 AS resolution UNION ALL SELECT 86400000) AS res
      GROUP BY gauge_id, res.resolution, bucket
    )
    SELECT d.gauge_id, d.resolution, d.bucket, d.count, r.count AS stored_count
    FROM direct d LEFT JOIN rollups r USING (gauge_id, resolution, bucket)
    WHERE r.count IS NOT d.count OR r.strain_min IS NOT d.strain_min OR r.strain_max IS NOT d.strain_max
       OR abs(r.strain_sum - d.strain_sum) > 1e-6 * max(1, abs(d.strain_sum))
       OR r.stress_min IS NOT d.stress_min OR r.stress_max IS NOT d.stress_max
       OR abs(r.stress_sum - d.stress_sum) > 1e-6 * max(1, abs(d.stress_sum))
       OR r.temperature_count IS NOT d.temperature_count OR r.temperature_min IS NOT d.temperature_min
       OR r.temperature_max IS NOT d.temperature_max
    UNION ALL
    SELECT r.gauge_id, r.resolution, r.bucket, NULL, r.count FROM rollups r
    WHERE NOT EXISTS (SELECT 1 FROM readings x WHERE x.gauge_id = r.gauge_id AND x.t >= r.bucket AND x.t < r.bucket + r.resolution)
  `);
  return result.rows.map((row) => ({ ...row }));
}
