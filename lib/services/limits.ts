import "server-only";
import { and, asc, eq, gte, lt } from "drizzle-orm";
import type { z } from "zod";
import { getDb, writeTransaction } from "@/db/client";
import { gaugeLimits, readings, type Gauge } from "@/db/schema";
import { actorLabel, type Actor } from "@/lib/auth/actor";
import { episodesOf, type AlertEpisode } from "@/lib/alerting/episodes";
import { evaluateGauge, gaugeAlertSetup, initialGaugeEvaluationState, type EvaluatedReading } from "@/lib/alerting/evaluate-gauge";
import type { limitsBody } from "@/lib/alerting/schema";
import { AppError } from "@/lib/errors";
import { validateLimits, type Limit, type LimitInput as ProposedLimit, type LimitSetValidation, type Quantity } from "@/lib/limits";
import { recordAudit } from "./audit";
import { restartGaugeEvaluation } from "./evaluation-control";
import { resolveGauge } from "./gauges";
import { hasThermalModel } from "./thermal";

type LimitInput = z.output<typeof limitsBody>["limits"][number];

/** A stored limit row as the machine takes it: an absent bound is left out rather than null. */
export function limitOfRow<Q extends string>({ upper, lower, ...rest }: Omit<Limit<Q>, "upper" | "lower"> & { upper: number | null; lower: number | null }): Limit<Q> {
  return { ...rest, ...(upper === null ? {} : { upper }), ...(lower === null ? {} : { lower }) };
}

export function limitsOfGauge(gaugeId: number): Promise<Limit[]> {
  return getDb()
    .select({
      quantity: gaugeLimits.quantity,
      level: gaugeLimits.level,
      upper: gaugeLimits.upper,
      lower: gaugeLimits.lower,
      hysteresis: gaugeLimits.hysteresis,
      persistence: gaugeLimits.persistence,
    })
    .from(gaugeLimits)
    .where(eq(gaugeLimits.gaugeId, gaugeId))
    .orderBy(asc(gaugeLimits.quantity), asc(gaugeLimits.id))
    .then((rows) => rows.map(limitOfRow));
}

/** Validates a proposed set of a gauge's or a rosette's limits, answering per limit and field what to fix. */
export function validLimitsOrRefuse<Q extends string>(inputs: readonly ProposedLimit<Q>[]): Limit<Q>[] {
  const checked: LimitSetValidation<Q> = validateLimits(inputs);
  if (!checked.ok) {
    const issues = checked.problems.map((problem) => ({ path: `limits.${problem.index}.${problem.field}`, message: problem.message }));
    throw new AppError("validation_failed", issues[0]!.message, { issues });
  }
  return checked.limits;
}

/** A gauge's limits also need a yield when one bounds utilisation, and a thermal model when one bounds the residual. */
async function checkedLimits(gauge: Gauge, inputs: LimitInput[]): Promise<Limit[]> {
  const limits = validLimitsOrRefuse(inputs);
  const utilisationIndex = limits.findIndex((limit) => limit.quantity === "utilisation");
  if (utilisationIndex >= 0 && !gauge.material.yield) {
    throw new AppError("validation_failed", "Utilisation limits need the material's yield; give the gauge's material a yield first.", {
      issues: [{ path: `limits.${utilisationIndex}.quantity`, message: "This gauge's material has no yield." }],
    });
  }
  const residualIndex = limits.findIndex((limit) => limit.quantity === "residual");
  if (residualIndex >= 0 && !(await hasThermalModel(gauge))) {
    throw new AppError("validation_failed", "Residual limits need the gauge's thermal model; fit and save one over a reference period first.", {
      issues: [{ path: `limits.${residualIndex}.quantity`, message: "This gauge has no thermal model." }],
    });
  }
  return limits;
}

export async function getLimits(actor: Actor, code: string, tag: string): Promise<Limit[]> {
  const { gauge } = await resolveGauge(actor, code, tag, "structure:view");
  return limitsOfGauge(gauge.id);
}

/** Of the quantities limited before or after, those whose limits went, and those whose limits changed. */
export function limitChanges<Q extends string>(before: readonly Limit<Q>[], after: readonly Limit<Q>[]): { removed: Q[]; changed: Q[] } {
  const setOf = (limits: readonly Limit<Q>[], quantity: Q) =>
    JSON.stringify(
      limits
        .filter((limit) => limit.quantity === quantity)
        .map((limit) => [limit.level, limit.upper ?? null, limit.lower ?? null, limit.hysteresis, limit.persistence])
        .sort(),
    );
  const removed: Q[] = [];
  const changed: Q[] = [];
  for (const quantity of new Set(before.map((limit) => limit.quantity))) {
    if (!after.some((limit) => limit.quantity === quantity)) removed.push(quantity);
    else if (setOf(before, quantity) !== setOf(after, quantity)) changed.push(quantity);
  }
  return { removed, changed };
}

/**
 * Replaces the gauge's whole limit set. A quantity whose limits went or changed starts its
 * evaluation again and its open alert closes, saying why; unchanged quantities go on as they were.
 */
export async function replaceLimits(actor: Actor, code: string, tag: string, inputs: LimitInput[]): Promise<Limit[]> {
  const { structure, gauge } = await resolveGauge(actor, code, tag, "limits:edit");
  const limits = await checkedLimits(gauge, inputs);
  const before = await limitsOfGauge(gauge.id);
  await writeTransaction(async (tx) => {
    await restartGaugeEvaluation(tx, gauge, { kind: "limits", ...limitChanges(before, limits) }, actorLabel(actor));
    await tx.delete(gaugeLimits).where(eq(gaugeLimits.gaugeId, gauge.id));
    if (limits.length > 0) {
      await tx.insert(gaugeLimits).values(limits.map((limit) => ({ gaugeId: gauge.id, upper: null, lower: null, ...limit })));
    }
    await recordAudit(tx, {
      actor,
      action: "limits.replace",
      entityType: "gauge",
      entityKey: `${structure.code}/${gauge.tag}`,
      structureId: structure.id,
      before: { limits: before },
      after: { limits },
    });
  });
  return limitsOfGauge(gauge.id);
}

/** For a rosette, `readingsChecked` counts the instants at which all three gauges have a reading. */
export type BacktestResult<Q extends string = Quantity> = { from: number; to: number; readingsChecked: number; episodes: AlertEpisode<Q>[] };

/** A gauge's stored readings in [from, to), in time order, as its evaluation takes them. */
export function storedReadingsBetween(gaugeId: number, from: number, to: number): Promise<EvaluatedReading[]> {
  return getDb()
    .select({ time: readings.time, raw: readings.value, strain: readings.strain, stress: readings.stress, flags: readings.flags, residual: readings.residual })
    .from(readings)
    .where(and(eq(readings.gaugeId, gaugeId), gte(readings.time, from), lt(readings.time, to)))
    .orderBy(asc(readings.time));
}

/** What the proposed limits would have raised over a past period, by the same code as live ingestion. */
export async function backtestLimits(actor: Actor, code: string, tag: string, inputs: LimitInput[], from: number, to: number): Promise<BacktestResult> {
  const { gauge } = await resolveGauge(actor, code, tag, "structure:view");
  const limits = await checkedLimits(gauge, inputs);
  const history = await storedReadingsBetween(gauge.id, from, to);
  const { events } = evaluateGauge(gaugeAlertSetup(gauge, limits), initialGaugeEvaluationState(), history);
  return { from, to, readingsChecked: history.length, episodes: episodesOf(events) };
}
