import "server-only";
import { eq } from "drizzle-orm";
import { getClient, getDb } from "@/db/client";
import { gauges, type Rosette } from "@/db/schema";
import type { MatchedInstant } from "@/lib/alerting/evaluate-rosette";
import type { Actor } from "@/lib/auth/actor";
import type { RosetteQuantity } from "@/lib/api/readings-schemas";
import { analyseRosette, type RosetteAnalysis } from "@/lib/mechanics";
import { bucketGrid, createBucketAccumulator } from "@/lib/series";
import { resolveRosette } from "./rosettes";

const FIELD: Record<RosetteQuantity, keyof RosetteAnalysis> = {
  sigma1: "sigma1",
  sigma2: "sigma2",
  vonMises: "vonMises",
  tauMax: "tauMax",
  theta: "theta",
};

/**
 * Readings of the three gauges taken at the same instant, in time order: only those make a plane
 * strain state. The flags follow the strains for limit evaluation (`matchedInstantOf`).
 */
export const MATCHED_STRAINS = `
  SELECT a.t, a.strain, b.strain, c.strain, a.flags, b.flags, c.flags FROM readings a
  JOIN readings b ON b.gauge_id = :b AND b.t = a.t
  JOIN readings c ON c.gauge_id = :c AND c.t = a.t
  WHERE a.gauge_id = :a AND a.t >= :start AND a.t < :end
  ORDER BY a.t`;

export const matchedStrainsArgs = (rosette: Rosette, start: number, end: number) => ({ a: rosette.gaugeAId, b: rosette.gaugeBId, c: rosette.gaugeCId, start, end });

export function matchedInstantOf(row: ArrayLike<unknown>): MatchedInstant {
  return {
    time: row[0] as number,
    strains: [row[1] as number, row[2] as number, row[3] as number],
    flags: [row[4] as number, row[5] as number, row[6] as number],
  };
}

/**
 * A rosette's principal stresses, von Mises, in-plane maximum shear or principal angle over a
 * range, bucketed like a gauge's series (min and max of each bucket kept). Computed on request
 * from the three gauges' stress-producing strains; the material is gauge a's.
 */
export async function getRosetteSeries(actor: Actor, code: string, tag: string, query: { from: number; to: number; points: number; quantity: RosetteQuantity }) {
  const { rosette } = await resolveRosette(actor, code, tag, "structure:view");
  const [gaugeA] = await getDb().select().from(gauges).where(eq(gauges.id, rosette.gaugeAId));
  const grid = bucketGrid(query.from, query.to, query.points);
  const result = await getClient().execute({
    sql: MATCHED_STRAINS,
    args: matchedStrainsArgs(rosette, grid.start, grid.end),
  });
  const buckets = createBucketAccumulator(grid);
  const field = FIELD[query.quantity];
  for (const row of result.rows) {
    const analysis = analyseRosette(rosette.layout, [row[1] as number, row[2] as number, row[3] as number], gaugeA!.material);
    if (analysis.ok) buckets.addValue(row[0] as number, analysis[field] as number);
  }
  return {
    rosette: tag,
    quantity: query.quantity,
    unit: query.quantity === "theta" ? "°" : "MPa",
    from: new Date(query.from).toISOString(),
    to: new Date(query.to).toISOString(),
    bucketWidth: grid.width,
    ...buckets.result(),
  };
}
