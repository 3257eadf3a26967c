import "server-only";
import { and, eq, inArray } from "drizzle-orm";
import { bulkSql, getClient, getDb, writeTransaction, type WriteTx } from "@/db/client";
import { gaugeLimits, thermalModels, type Gauge, type ThermalModelRow } from "@/db/schema";
import { actorLabel, type Actor } from "@/lib/auth/actor";
import { AppError } from "@/lib/errors";
import type { GaugeRows } from "@/lib/ingest/batch";
import { ROLLUP_RESOLUTIONS } from "@/lib/series";
import {
  fitThermalModel,
  MAX_AUTO_LAG_MINUTES,
  MAX_TEMPERATURE_GAP_MS,
  MINUTE_MS,
  temperatureAt,
  temperatureHistory,
  thermalResiduals,
  type ThermalModel,
  type ThermalSample,
} from "@/lib/thermal";
import type { ThermalModelInput } from "@/lib/thermal/schema";
import { recordAudit } from "./audit";
import { restartGaugeEvaluation } from "./evaluation-control";
import { resolveGauge } from "./gauges";

/** The pure model of a stored row. */
export function modelOfRow(row: ThermalModelRow): ThermalModel {
  return {
    intercept: row.intercept,
    slope: row.slope,
    lagMinutes: row.lagMinutes,
    drift: row.drift,
    driftOrigin: row.driftOrigin.getTime(),
    r2: row.r2,
    residualStd: row.residualStd,
    readings: row.readings,
  };
}

/** What the API answers for a model: the contract's fields, and the period, range and who fitted it. */
export function thermalModelView(row: ThermalModelRow) {
  return {
    intercept: row.intercept,
    slope: row.slope,
    lagMinutes: row.lagMinutes,
    ...(row.drift === null ? {} : { drift: row.drift }),
    r2: row.r2,
    residualStd: row.residualStd,
    readings: row.readings,
    from: row.periodFrom.toISOString(),
    to: row.periodTo.toISOString(),
    lagSearch: row.lagSearch,
    ...(row.maxLagMinutes === null ? {} : { maxLagMinutes: row.maxLagMinutes }),
    temperatureRange: { min: row.temperatureMin, max: row.temperatureMax },
    fittedBy: row.fittedByLabel,
    fittedAt: row.fittedAt.toISOString(),
  };
}

export type ThermalModelView = ReturnType<typeof thermalModelView>;

/** How far before a time the temperature history must reach for a model of this lag. */
const historyReach = (lagMinutes: number) => lagMinutes * MINUTE_MS + MAX_TEMPERATURE_GAP_MS;

/**
 * The reference period's readings as the fit takes them, with the temperatures before it that a
 * lag reaches back to. A reading sensor health set aside (`fault <> 0`) keeps its temperature in
 * the history, but its strain (NaN here) is not fitted: a stuck or jumped strain is no thermal response.
 */
async function referenceSamples(gaugeId: number, input: ThermalModelInput): Promise<ThermalSample[]> {
  const searched = input.lagMinutes === "auto" ? (input.maxLagMinutes ?? MAX_AUTO_LAG_MINUTES) : input.lagMinutes;
  const result = await getClient().execute({
    sql: "SELECT t, strain, temperature, fault FROM readings WHERE gauge_id = ? AND t >= ? AND t <= ? ORDER BY t",
    args: [gaugeId, input.from - historyReach(searched), input.to],
  });
  return result.rows.map((row) => ({
    time: row[0] as number,
    strain: (row[3] as number) === 0 ? (row[1] as number) : Number.NaN,
    temperature: row[2] as number | null,
  }));
}

/** At most this many points go to the scatter: enough to show the cloud, few enough for a phone. */
const MAX_SCATTER_POINTS = 2_000;

function fitOf(samples: readonly ThermalSample[], input: ThermalModelInput) {
  const model = fitThermalModel(samples, input);
  const history = temperatureHistory(samples);
  const lagMs = model.lagMinutes * MINUTE_MS;
  const points: { temperature: number; strain: number }[] = [];
  for (const sample of samples) {
    if (sample.time < input.from || sample.time > input.to || !Number.isFinite(sample.strain)) continue;
    const temperature = temperatureAt(history, sample.time - lagMs);
    if (temperature !== null) points.push({ temperature, strain: sample.strain });
  }
  const temperatures = points.map((point) => point.temperature);
  const every = Math.ceil(points.length / MAX_SCATTER_POINTS);
  return {
    model,
    temperatureRange: { min: Math.min(...temperatures), max: Math.max(...temperatures) },
    scatter: points.filter((_, i) => i % every === 0),
  };
}

/**
 * Fits the model over the reference period without storing anything: what the editor shows before
 * the engineer saves, with the scatter of stress-producing strain against lagged temperature.
 */
export async function previewThermalModel(actor: Actor, code: string, tag: string, input: ThermalModelInput) {
  const { gauge } = await resolveGauge(actor, code, tag, "structure:view");
  const { model, temperatureRange, scatter } = fitOf(await referenceSamples(gauge.id, input), input);
  return { ...contractFields(model), temperatureRange, scatter };
}

const contractFields = (model: ThermalModel) => ({
  intercept: model.intercept,
  slope: model.slope,
  lagMinutes: model.lagMinutes,
  ...(model.drift === null ? {} : { drift: model.drift }),
  r2: model.r2,
  residualStd: model.residualStd,
  readings: model.readings,
});

const notFound = (tag: string) => new AppError("not_found", `Gauge ${tag} has no thermal model; fit one over a reference period first.`);

export async function getThermalModel(actor: Actor, code: string, tag: string): Promise<ThermalModelView> {
  const { gauge } = await resolveGauge(actor, code, tag, "structure:view");
  const row = await storedModel(gauge.id);
  if (!row) throw notFound(gauge.tag);
  return thermalModelView(row);
}

/** The model in force, or null: for pages that show the editor either way. */
export async function findThermalModel(actor: Actor, code: string, tag: string): Promise<ThermalModelView | null> {
  const { gauge } = await resolveGauge(actor, code, tag, "structure:view");
  const row = await storedModel(gauge.id);
  return row ? thermalModelView(row) : null;
}

async function storedModel(gaugeId: number): Promise<ThermalModelRow | undefined> {
  const [row] = await getDb().select().from(thermalModels).where(eq(thermalModels.gaugeId, gaugeId));
  return row;
}

/**
 * Fits and stores the gauge's model, replacing the one in force, and recomputes the residual of
 * every stored reading of the gauge, before the reference period as well as after: the model is the
 * gauge's thermal response, and the contract asks for the readings already stored. One
 * transaction: the model, the residuals, their roll-ups, the audit row and the restart of residual
 * limits commit together or not at all.
 */
export async function saveThermalModel(actor: Actor, code: string, tag: string, input: ThermalModelInput): Promise<ThermalModelView> {
  const { structure, gauge } = await resolveGauge(actor, code, tag, "thermal-model:edit");
  const { model, temperatureRange } = fitOf(await referenceSamples(gauge.id, input), input);
  const values = {
    gaugeId: gauge.id,
    periodFrom: new Date(input.from),
    periodTo: new Date(input.to),
    lagSearch: input.lagMinutes === "auto" ? ("auto" as const) : ("fixed" as const),
    maxLagMinutes: input.lagMinutes === "auto" ? (input.maxLagMinutes ?? null) : null,
    intercept: model.intercept,
    slope: model.slope,
    lagMinutes: model.lagMinutes,
    drift: model.drift,
    driftOrigin: new Date(model.driftOrigin),
    r2: model.r2,
    residualStd: model.residualStd,
    readings: model.readings,
    temperatureMin: temperatureRange.min,
    temperatureMax: temperatureRange.max,
    fittedById: actor.kind === "user" ? actor.id : null,
    fittedByLabel: actorLabel(actor),
    fittedAt: new Date(),
  };
  const saved = await writeTransaction(async (tx) => {
    const [before] = await tx.select().from(thermalModels).where(eq(thermalModels.gaugeId, gauge.id));
    const [row] = await tx.insert(thermalModels).values(values).onConflictDoUpdate({ target: thermalModels.gaugeId, set: values }).returning();
    await restartGaugeEvaluation(tx, gauge, { kind: "thermal-model" }, actorLabel(actor));
    await recomputeResiduals(tx, gauge.id, model);
    await recordAudit(tx, {
      actor,
      action: before ? "thermal-model.replace" : "thermal-model.create",
      entityType: "gauge",
      entityKey: `${structure.code}/${gauge.tag}`,
      structureId: structure.id,
      before: before ? { thermalModel: thermalModelView(before) } : null,
      after: { thermalModel: thermalModelView(row!) },
    });
    return row!;
  });
  return thermalModelView(saved);
}

/**
 * Removes the model; residuals go back to null. Refused while residual limits stand, since they
 * would then never be checked again without anyone noticing.
 */
export async function deleteThermalModel(actor: Actor, code: string, tag: string): Promise<void> {
  const { structure, gauge } = await resolveGauge(actor, code, tag, "thermal-model:edit");
  await writeTransaction(async (tx) => {
    const [before] = await tx.select().from(thermalModels).where(eq(thermalModels.gaugeId, gauge.id));
    if (!before) throw notFound(gauge.tag);
    const limits = await tx
      .select({ id: gaugeLimits.id })
      .from(gaugeLimits)
      .where(and(eq(gaugeLimits.gaugeId, gauge.id), eq(gaugeLimits.quantity, "residual")));
    if (limits.length > 0) {
      throw new AppError("conflict", `Gauge ${gauge.tag} has limits on its thermal residual; remove those limits before removing the thermal model.`);
    }
    await tx.delete(thermalModels).where(eq(thermalModels.gaugeId, gauge.id));
    await restartGaugeEvaluation(tx, gauge, { kind: "thermal-model" }, actorLabel(actor));
    await recomputeResiduals(tx, gauge.id, null);
    await recordAudit(tx, {
      actor,
      action: "thermal-model.delete",
      entityType: "gauge",
      entityKey: `${structure.code}/${gauge.tag}`,
      structureId: structure.id,
      before: { thermalModel: thermalModelView(before) },
      after: null,
    });
  });
}

/** Readings per chunk of a recomputation: bounded memory whatever the gauge's history. */
export const RESIDUAL_CHUNK = 5_000;

/**
 * Inside the caller's transaction: every stored reading's residual under `model` (null: none),
 * chunk by chunk in time order, then the residual columns of the gauge's roll-ups from the healthy
 * readings, as ingestion rolls them up.
 */
async function recomputeResiduals(tx: WriteTx, gaugeId: number, model: ThermalModel | null) {
  const raw = bulkSql(tx);
  if (model === null) {
    await raw.rows("UPDATE readings SET residual = NULL WHERE gauge_id = ? AND residual IS NOT NULL RETURNING 1", [gaugeId]);
  } else {
    const reach = historyReach(model.lagMinutes);
    let after = -Number.MAX_SAFE_INTEGER;
    for (;;) {
      const chunk = await raw.rows("SELECT t, strain FROM readings WHERE gauge_id = ? AND t > ? ORDER BY t LIMIT ?", [gaugeId, after, RESIDUAL_CHUNK]);
      if (chunk.length === 0) break;
      const first = chunk[0]![0] as number;
      const last = chunk.at(-1)![0] as number;
      const history = await raw.rows("SELECT t, temperature FROM readings WHERE gauge_id = ? AND t >= ? AND t <= ? AND temperature IS NOT NULL ORDER BY t", [
        gaugeId,
        first - reach,
        last + MAX_TEMPERATURE_GAP_MS,
      ]);
      const samples = chunk.map((row) => ({ time: row[0] as number, strain: row[1] as number, temperature: null }));
      const residuals = thermalResiduals(
        model,
        samples,
        history.map((row) => ({ time: row[0] as number, temperature: row[1] as number })),
      );
      const pairs = samples.map((sample, i) => [sample.time, finiteOrNull(residuals[i] ?? null)]);
      await raw.rows(
        // Materialized, the pairs become a table SQLite indexes for the join; read straight from
        // json_each, every reading of the chunk would scan all the pairs.
        "WITH x AS MATERIALIZED (SELECT json_extract(value, '$[0]') AS t, json_extract(value, '$[1]') AS r FROM json_each(?)) " +
          "UPDATE readings SET residual = x.r FROM x WHERE readings.gauge_id = ? AND readings.t = x.t RETURNING 1",
        [JSON.stringify(pairs), gaugeId],
      );
      after = last;
    }
  }
  await raw.rows("UPDATE rollups SET residual_count = 0, residual_min = NULL, residual_max = NULL, residual_sum = NULL WHERE gauge_id = ? RETURNING 1", [gaugeId]);
  if (model === null) return;
  for (const resolution of Object.values(ROLLUP_RESOLUTIONS)) {
    await raw.rows(
      "UPDATE rollups SET residual_count = x.c, residual_min = x.mn, residual_max = x.mx, residual_sum = x.s FROM (" +
        "SELECT (t / ?) * ? AS bucket, count(residual) AS c, min(residual) AS mn, max(residual) AS mx, sum(residual) AS s " +
        "FROM readings WHERE gauge_id = ? AND fault = 0 AND residual IS NOT NULL GROUP BY t / ?) AS x " +
        "WHERE rollups.gauge_id = ? AND rollups.resolution = ? AND rollups.bucket = x.bucket RETURNING 1",
      // As BigInt, or SQLite divides t by a REAL and every reading is a bucket of its own.
      [BigInt(resolution), BigInt(resolution), gaugeId, BigInt(resolution), gaugeId, resolution],
    );
  }
}

const finiteOrNull = (value: number | null) => (value !== null && Number.isFinite(value) ? value : null);

/**
 * Inside the ingestion transaction, before the readings are stored: the residual of each new
 * reading of a gauge with a thermal model, from the temperatures stored around it and those of the
 * batch. A late reading's temperature does not revise the residuals already stored near it; saving
 * the model again recomputes them all.
 */
export async function withResiduals(tx: WriteTx, gauges: readonly GaugeRows[]): Promise<GaugeRows[]> {
  const withReadings = gauges.filter((rows) => rows.time.length > 0);
  if (withReadings.length === 0) return [...gauges];
  const rows = await tx
    .select()
    .from(thermalModels)
    .where(inArray(thermalModels.gaugeId, withReadings.map((entry) => entry.gaugeId)));
  if (rows.length === 0) return [...gauges];
  const models = new Map(rows.map((row) => [row.gaugeId, modelOfRow(row)]));
  const raw = bulkSql(tx);
  const out: GaugeRows[] = [];
  for (const batch of gauges) {
    const model = models.get(batch.gaugeId);
    if (!model || batch.time.length === 0) {
      out.push(batch);
      continue;
    }
    const stored = await raw.rows("SELECT t, temperature FROM readings WHERE gauge_id = ? AND t >= ? AND t <= ? AND temperature IS NOT NULL", [
      batch.gaugeId,
      batch.time[0]! - historyReach(model.lagMinutes),
      batch.time.at(-1)! + MAX_TEMPERATURE_GAP_MS,
    ]);
    const history = temperatureHistory([
      ...stored.map((row) => ({ time: row[0] as number, strain: 0, temperature: row[1] as number })),
      ...batch.time.map((time, i) => ({ time, strain: 0, temperature: batch.temperature[i] ?? null })),
    ]);
    const residuals = thermalResiduals(
      model,
      batch.time.map((time, i) => ({ time, strain: batch.strain[i]!, temperature: batch.temperature[i] ?? null })),
      history,
    );
    out.push({ ...batch, residual: residuals.map(finiteOrNull) });
  }
  return out;
}

/** Whether the gauge has a model in force: residual limits need one. */
export async function hasThermalModel(gauge: Pick<Gauge, "id">): Promise<boolean> {
  return (await storedModel(gauge.id)) !== undefined;
}
