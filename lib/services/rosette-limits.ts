import "server-only";
import { asc, eq, inArray } from "drizzle-orm";
import type { z } from "zod";
import { getClient, getDb, writeTransaction } from "@/db/client";
import { gauges, rosetteLimits, type Gauge } from "@/db/schema";
import { actorLabel, type Actor } from "@/lib/auth/actor";
import { episodesOf } from "@/lib/alerting/episodes";
import { evaluateGauge, gaugeAlertSetup, initialGaugeEvaluationState } from "@/lib/alerting/evaluate-gauge";
import { evaluateRosette, initialRosetteEvaluationState, type FaultTimesOfGauges } from "@/lib/alerting/evaluate-rosette";
import type { rosetteLimitsBody } from "@/lib/alerting/schema";
import type { Limit, RosetteLimitQuantity } from "@/lib/limits";
import { recordAudit } from "./audit";
import { restartRosetteEvaluation } from "./evaluation-control";
import { limitChanges, limitOfRow, storedReadingsBetween, validLimitsOrRefuse, type BacktestResult } from "./limits";
import { MATCHED_STRAINS, matchedInstantOf, matchedStrainsArgs } from "./rosette-series";
import { resolveRosette } from "./rosettes";

type RosetteLimitInput = z.output<typeof rosetteLimitsBody>["limits"][number];

export type RosetteLimit = Limit<RosetteLimitQuantity>;

export function limitsOfRosette(rosetteId: number): Promise<RosetteLimit[]> {
  return getDb()
    .select({
      quantity: rosetteLimits.quantity,
      level: rosetteLimits.level,
      upper: rosetteLimits.upper,
      lower: rosetteLimits.lower,
      hysteresis: rosetteLimits.hysteresis,
      persistence: rosetteLimits.persistence,
    })
    .from(rosetteLimits)
    .where(eq(rosetteLimits.rosetteId, rosetteId))
    .orderBy(asc(rosetteLimits.quantity), asc(rosetteLimits.id))
    .then((rows) => rows.map(limitOfRow));
}

export async function getRosetteLimits(actor: Actor, code: string, tag: string): Promise<RosetteLimit[]> {
  const { rosette } = await resolveRosette(actor, code, tag, "structure:view");
  return limitsOfRosette(rosette.id);
}

/**
 * Replaces the rosette's whole limit set. A quantity whose limits went or changed starts its
 * evaluation again and its open alert closes, saying why, as a gauge's does. The stresses need no
 * yield, so validation is the gauge's without the utilisation check.
 */
export async function replaceRosetteLimits(actor: Actor, code: string, tag: string, inputs: RosetteLimitInput[]): Promise<RosetteLimit[]> {
  const { structure, rosette } = await resolveRosette(actor, code, tag, "limits:edit");
  const limits = validLimitsOrRefuse(inputs);
  const before = await limitsOfRosette(rosette.id);
  await writeTransaction(async (tx) => {
    const [gaugeA] = await tx.select().from(gauges).where(eq(gauges.id, rosette.gaugeAId));
    await restartRosetteEvaluation(tx, { gauge: gaugeA!, rosette }, limitChanges(before, limits), actorLabel(actor));
    await tx.delete(rosetteLimits).where(eq(rosetteLimits.rosetteId, rosette.id));
    if (limits.length > 0) {
      await tx.insert(rosetteLimits).values(limits.map((limit) => ({ rosetteId: rosette.id, upper: null, lower: null, ...limit })));
    }
    await recordAudit(tx, {
      actor,
      action: "limits.replace",
      entityType: "rosette",
      entityKey: `${structure.code}/${rosette.tag}`,
      structureId: structure.id,
      before: { limits: before },
      after: { limits },
    });
  });
  return limitsOfRosette(rosette.id);
}

/**
 * What the proposed limits would have raised over a past period, by the same code as live
 * ingestion: each gauge's sensor health over its stored readings (faults do not depend on limits,
 * so none are given), then the rosette's evaluation of the matched instants with those faults.
 */
export async function backtestRosetteLimits(
  actor: Actor,
  code: string,
  tag: string,
  inputs: RosetteLimitInput[],
  from: number,
  to: number,
): Promise<BacktestResult<RosetteLimitQuantity>> {
  const { rosette } = await resolveRosette(actor, code, tag, "structure:view");
  const limits = validLimitsOrRefuse(inputs);
  const rows = await getDb().select().from(gauges).where(inArray(gauges.id, [rosette.gaugeAId, rosette.gaugeBId, rosette.gaugeCId]));
  const gaugeOf = (id: number) => rows.find((gauge) => gauge.id === id)!;
  const sensorFaults = async (gauge: Gauge) => {
    const history = await storedReadingsBetween(gauge.id, from, to);
    return new Set(evaluateGauge(gaugeAlertSetup(gauge, []), initialGaugeEvaluationState(), history).faultTimes);
  };
  const gaugeA = gaugeOf(rosette.gaugeAId);
  const faultTimes: FaultTimesOfGauges = [await sensorFaults(gaugeA), await sensorFaults(gaugeOf(rosette.gaugeBId)), await sensorFaults(gaugeOf(rosette.gaugeCId))];
  const matched = await getClient().execute({ sql: MATCHED_STRAINS, args: matchedStrainsArgs(rosette, from, to) });
  const instants = matched.rows.map(matchedInstantOf);
  const setup = { layout: rosette.layout, material: gaugeA.material, limits };
  const { events } = evaluateRosette(setup, initialRosetteEvaluationState(), instants, faultTimes);
  return { from, to, readingsChecked: instants.length, episodes: episodesOf(events) };
}
