import "server-only";
import { and, asc, desc, eq, inArray } from "drizzle-orm";
import { getDb, isUniqueViolation, writeTransaction, type WriteTx } from "@/db/client";
import { auditLog, gauges, readings, zeroReadings, type Gauge, type Structure } from "@/db/schema";
import { actorLabel, type Actor } from "@/lib/auth/actor";
import { requirePermission } from "@/lib/auth/authorize";
import type { Action } from "@/lib/auth/permissions";
import { AppError } from "@/lib/errors";
import { gaugeColumns, gaugeFieldsOf } from "@/lib/gauges/record";
import { gaugeInput, type GaugeFields, type GaugeInput, type ZeroRequest } from "@/lib/gauges/schema";
import { parseWith } from "@/lib/validation";
import { recordAudit } from "./audit";
import { restartGaugeEvaluation } from "./evaluation-control";
import { getVisibleStructure } from "./structures";

export type GaugeView = GaugeFields & {
  status: Gauge["status"];
  retiredAt: string | null;
  /** Tag of the failed gauge this one replaced at the same location. */
  replaces: string | null;
  /** Tag of the gauge that replaced this one. */
  replacedBy: string | null;
  drawing: { id: number; x: number; y: number } | null;
  createdAt: string;
};


function gaugeNotFound(structure: Structure, tag: string) {
  return new AppError("not_found", `Gauge "${tag}" was not found on structure ${structure.code}.`);
}

const duplicateTag = (structure: Structure, tag: string) =>
  new AppError("conflict", `Structure ${structure.code} already has a gauge tagged "${tag}".`, { field: "tag" });

function toGaugeView(row: Gauge, tagsById: Map<number, string>, replacedBy: Map<number, string>): GaugeView {
  return {
    ...gaugeFieldsOf(row),
    status: row.status,
    retiredAt: row.retiredAt?.toISOString() ?? null,
    replaces: row.replacesGaugeId ? (tagsById.get(row.replacesGaugeId) ?? null) : null,
    replacedBy: replacedBy.get(row.id) ?? null,
    drawing: row.drawingId != null && row.drawingX != null && row.drawingY != null ? { id: row.drawingId, x: row.drawingX, y: row.drawingY } : null,
    createdAt: row.createdAt.toISOString(),
  };
}

function viewsOf(rows: Gauge[]): GaugeView[] {
  const tagsById = new Map(rows.map((row) => [row.id, row.tag]));
  const replacedBy = new Map(rows.filter((row) => row.replacesGaugeId).map((row) => [row.replacesGaugeId!, row.tag]));
  return rows.map((row) => toGaugeView(row, tagsById, replacedBy));
}

/** The structure's gauges, or only those tagged in `tags`. */
export function gaugeRowsOf(structureId: number, tags?: readonly string[]): Promise<Gauge[]> {
  const ofStructure = eq(gauges.structureId, structureId);
  return getDb()
    .select()
    .from(gauges)
    .where(tags ? and(ofStructure, inArray(gauges.tag, [...tags])) : ofStructure)
    .orderBy(asc(gauges.tag));
}

/** The structure (visible to the actor, who must be allowed `action` on it) and one of its gauges. */
export async function resolveGauge(actor: Actor, code: string, tag: string, action: Action) {
  const structure = await getVisibleStructure(actor, code);
  await requirePermission(actor, action, structure);
  const [gauge] = await getDb()
    .select()
    .from(gauges)
    .where(and(eq(gauges.structureId, structure.id), eq(gauges.tag, tag)))
    .limit(1);
  if (!gauge) throw gaugeNotFound(structure, tag);
  return { structure, gauge };
}

export async function listGauges(actor: Actor, code: string): Promise<GaugeView[]> {
  const structure = await getVisibleStructure(actor, code);
  await requirePermission(actor, "structure:view", structure);
  return viewsOf(await gaugeRowsOf(structure.id));
}

export async function getGauge(actor: Actor, code: string, tag: string): Promise<GaugeView> {
  const { structure, gauge } = await resolveGauge(actor, code, tag, "structure:view");
  return viewsOf(await gaugeRowsOf(structure.id)).find((view) => view.tag === gauge.tag)!;
}

export const gaugeKey = (structure: Pick<Structure, "code">, tag: string) => `${structure.code}/${tag}`;

async function insertGauge(tx: WriteTx, actor: Actor, structure: Structure, input: GaugeInput, replaces: Gauge | null, reason: string) {
  const zeroTime = input.zero.time ? new Date(input.zero.time) : new Date();
  const [created] = await tx
    .insert(gauges)
    .values({
      structureId: structure.id,
      tag: input.tag,
      ...gaugeColumns(input),
      zeroValue: input.zero.value,
      zeroTemperature: input.zero.temperature,
      zeroTime,
      replacesGaugeId: replaces?.id ?? null,
      drawingId: replaces?.drawingId ?? null,
      drawingX: replaces?.drawingX ?? null,
      drawingY: replaces?.drawingY ?? null,
    })
    .returning();
  await insertZeroHistory(tx, actor, created!.id, { ...input.zero, time: zeroTime }, "typed", reason);
  await recordAudit(tx, {
    actor,
    action: replaces ? "gauge.replace" : "gauge.create",
    entityType: "gauge",
    entityKey: gaugeKey(structure, input.tag),
    structureId: structure.id,
    after: { ...input, ...(replaces ? { replaces: replaces.tag } : {}) },
  });
  return created!;
}

function insertZeroHistory(
  tx: WriteTx,
  actor: Actor,
  gaugeId: number,
  zero: { value: number; temperature: number | null; time: Date },
  source: string,
  reason: string,
) {
  return tx.insert(zeroReadings).values({
    gaugeId,
    value: zero.value,
    temperature: zero.temperature,
    time: zero.time,
    source,
    reason,
    setById: actor.kind === "user" ? actor.id : null,
    setByLabel: actorLabel(actor),
  });
}

function rethrowDuplicate(structure: Structure, tag: string) {
  return (error: unknown): never => {
    if (isUniqueViolation(error)) throw duplicateTag(structure, tag);
    throw error;
  };
}

export async function createGauge(actor: Actor, code: string, input: GaugeInput): Promise<GaugeView> {
  const structure = await getVisibleStructure(actor, code);
  await requirePermission(actor, "gauge:register", structure);
  await writeTransaction((tx) => insertGauge(tx, actor, structure, input, null, "installation")).catch(
    rethrowDuplicate(structure, input.tag),
  );
  return getGauge(actor, code, input.tag);
}

export function refuseIfRetired(gauge: Gauge) {
  if (gauge.status === "retired") {
    throw new AppError("conflict", `Gauge "${gauge.tag}" is retired; its record is kept as it was.`);
  }
}

type GaugePatch = Partial<Omit<GaugeFields, "tag">> & { reason?: string };

/** Field-by-field old → new of what a change touches, for the audit trail. */
function changedFields(before: GaugeFields, after: GaugeFields) {
  const keys = (Object.keys(after) as (keyof GaugeFields)[]).filter((key) => JSON.stringify(before[key]) !== JSON.stringify(after[key]));
  return {
    before: Object.fromEntries(keys.map((key) => [key, before[key] ?? null])),
    after: Object.fromEntries(keys.map((key) => [key, after[key] ?? null])),
  };
}

export async function updateGauge(actor: Actor, code: string, tag: string, patch: GaugePatch): Promise<GaugeView> {
  const { structure, gauge } = await resolveGauge(actor, code, tag, "gauge:register");
  refuseIfRetired(gauge);
  const { reason, ...fields } = patch;
  const before = gaugeFieldsOf(gauge);
  const after = parseWith(gaugeInput, { ...before, ...fields, tag });
  const { before: old, after: changed } = changedFields(before, after);
  if (Object.keys(changed).length === 0) return getGauge(actor, code, tag);
  const zeroTime = after.zero.time ? new Date(after.zero.time) : new Date();
  await writeTransaction(async (tx) => {
    await tx
      .update(gauges)
      .set({ ...gaugeColumns(after), zeroValue: after.zero.value, zeroTemperature: after.zero.temperature, zeroTime, updatedAt: new Date() })
      .where(eq(gauges.id, gauge.id));
    if ("zero" in changed) {
      await insertZeroHistory(tx, actor, gauge.id, { ...after.zero, time: zeroTime }, "typed", reason ?? "edited with the gauge");
      await restartGaugeEvaluation(tx, gauge, { kind: "zero" }, actorLabel(actor));
    } else if ("material" in changed) {
      await restartGaugeEvaluation(tx, gauge, { kind: "material" }, actorLabel(actor));
    }
    await recordAudit(tx, { actor, action: "gauge.update", entityType: "gauge", entityKey: gaugeKey(structure, tag), structureId: structure.id, before: old, after: changed });
  });
  return getGauge(actor, code, tag);
}

export async function retireGauge(actor: Actor, code: string, tag: string, reason = "retired"): Promise<GaugeView> {
  const { structure, gauge } = await resolveGauge(actor, code, tag, "gauge:register");
  if (gauge.status !== "retired") {
    await writeTransaction(async (tx) => {
      await tx.update(gauges).set({ status: "retired", retiredAt: new Date(), updatedAt: new Date() }).where(eq(gauges.id, gauge.id));
      await recordAudit(tx, {
        actor,
        action: "gauge.retire",
        entityType: "gauge",
        entityKey: gaugeKey(structure, tag),
        structureId: structure.id,
        before: { status: "active" },
        after: { status: "retired", reason },
      });
    });
  }
  return getGauge(actor, code, tag);
}

/**
 * A failed gauge is retired and a new one takes its place at the same location (and on the
 * drawing), linked to it so the location's history reads as one record with the changeover marked.
 */
export async function replaceGauge(actor: Actor, code: string, oldTag: string, input: GaugeInput, reason: string): Promise<GaugeView> {
  const { structure, gauge: old } = await resolveGauge(actor, code, oldTag, "gauge:register");
  refuseIfRetired(old);
  await writeTransaction(async (tx) => {
    await tx.update(gauges).set({ status: "retired", retiredAt: new Date(), updatedAt: new Date() }).where(eq(gauges.id, old.id));
    await recordAudit(tx, {
      actor,
      action: "gauge.retire",
      entityType: "gauge",
      entityKey: gaugeKey(structure, oldTag),
      structureId: structure.id,
      before: { status: "active" },
      after: { status: "retired", reason, replacedBy: input.tag },
    });
    await insertGauge(tx, actor, structure, input, old, reason);
  }).catch(rethrowDuplicate(structure, input.tag));
  return getGauge(actor, code, input.tag);
}

async function averageOfLastReadings(gauge: Gauge, count: number) {
  const rows = await getDb()
    .select({ time: readings.time, value: readings.value, temperature: readings.temperature })
    .from(readings)
    .where(eq(readings.gaugeId, gauge.id))
    .orderBy(desc(readings.time))
    .limit(count);
  if (rows.length < count) {
    throw new AppError("bad_request", `Gauge "${gauge.tag}" has only ${rows.length} stored readings; ask for at most that many.`, {
      field: "fromReadings",
    });
  }
  const temperatures = rows.map((row) => row.temperature).filter((t): t is number => t !== null);
  return {
    value: rows.reduce((sum, row) => sum + row.value, 0) / rows.length,
    temperature: temperatures.length === rows.length ? temperatures.reduce((a, b) => a + b, 0) / rows.length : null,
    time: new Date(rows[0]!.time),
  };
}

/** Sets a new reference reading; the previous one stays in the history and stored results are not rewritten. */
export async function recordZero(actor: Actor, code: string, tag: string, request: ZeroRequest): Promise<GaugeView> {
  const { structure, gauge } = await resolveGauge(actor, code, tag, "zero:record");
  refuseIfRetired(gauge);
  const fromReadings = "fromReadings" in request;
  const zero = fromReadings
    ? await averageOfLastReadings(gauge, request.fromReadings)
    : { value: request.value, temperature: request.temperature, time: request.time ? new Date(request.time) : new Date() };
  // The new zero must still give a gauge the mechanics core can convert with (e.g. a temperature where needed).
  parseWith(gaugeInput, { ...gaugeFieldsOf(gauge), zero: { ...zero, time: zero.time.toISOString() } });
  const source = fromReadings ? `average of the last ${request.fromReadings} readings` : "typed";
  const reason = request.reason ?? "re-zeroed";
  await writeTransaction(async (tx) => {
    await tx
      .update(gauges)
      .set({ zeroValue: zero.value, zeroTemperature: zero.temperature, zeroTime: zero.time, updatedAt: new Date() })
      .where(eq(gauges.id, gauge.id));
    await insertZeroHistory(tx, actor, gauge.id, zero, source, reason);
    await restartGaugeEvaluation(tx, gauge, { kind: "zero" }, actorLabel(actor));
    await recordAudit(tx, {
      actor,
      action: "gauge.zero",
      entityType: "gauge",
      entityKey: gaugeKey(structure, tag),
      structureId: structure.id,
      before: { zero: { value: gauge.zeroValue, temperature: gauge.zeroTemperature, time: gauge.zeroTime.toISOString() } },
      after: { zero: { value: zero.value, temperature: zero.temperature, time: zero.time.toISOString() }, source, reason },
    });
  });
  return getGauge(actor, code, tag);
}

export async function zeroHistory(actor: Actor, code: string, tag: string) {
  const { gauge } = await resolveGauge(actor, code, tag, "structure:view");
  return getDb().select().from(zeroReadings).where(eq(zeroReadings.gaugeId, gauge.id)).orderBy(desc(zeroReadings.setAt), desc(zeroReadings.id));
}

/** Every configuration change of a gauge and of the gauges it replaced, newest first. */
export async function gaugeAuditTrail(actor: Actor, code: string, tag: string) {
  const { structure, gauge } = await resolveGauge(actor, code, tag, "audit:view");
  const lineage = [gauge.tag];
  const all = await gaugeRowsOf(structure.id);
  for (let current = gauge; current.replacesGaugeId; ) {
    const previous = all.find((row) => row.id === current.replacesGaugeId);
    if (!previous) break;
    lineage.push(previous.tag);
    current = previous;
  }
  return getDb()
    .select()
    .from(auditLog)
    .where(and(eq(auditLog.entityType, "gauge"), inArray(auditLog.entityKey, lineage.map((t) => gaugeKey(structure, t)))))
    .orderBy(desc(auditLog.at), desc(auditLog.id));
}
