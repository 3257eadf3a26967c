import "server-only";
import { and, asc, eq } from "drizzle-orm";
import { getDb, isUniqueViolation, writeTransaction } from "@/db/client";
import { rosettes, type Rosette } from "@/db/schema";
import type { Actor } from "@/lib/auth/actor";
import { requirePermission } from "@/lib/auth/authorize";
import type { Action } from "@/lib/auth/permissions";
import { AppError } from "@/lib/errors";
import type { z } from "zod";
import type { rosetteInput } from "@/lib/gauges/schema";
import { recordAudit } from "./audit";
import { gaugeRowsOf } from "./gauges";
import { getVisibleStructure } from "./structures";

export type RosetteView = { tag: string; layout: Rosette["layout"]; gauges: [string, string, string]; createdAt: string };

function viewOf(row: Rosette, tagOf: Map<number, string>): RosetteView {
  return {
    tag: row.tag,
    layout: row.layout,
    gauges: [tagOf.get(row.gaugeAId)!, tagOf.get(row.gaugeBId)!, tagOf.get(row.gaugeCId)!],
    createdAt: row.createdAt.toISOString(),
  };
}

/** The structure and the rosette tagged `tag` on it, once the actor may do `action` there. */
export async function resolveRosette(actor: Actor, code: string, tag: string, action: Action) {
  const structure = await getVisibleStructure(actor, code);
  await requirePermission(actor, action, structure);
  const [rosette] = await getDb()
    .select()
    .from(rosettes)
    .where(and(eq(rosettes.structureId, structure.id), eq(rosettes.tag, tag)))
    .limit(1);
  if (!rosette) throw new AppError("not_found", `Rosette "${tag}" was not found on structure ${structure.code}.`);
  return { structure, rosette };
}

export async function listRosettes(actor: Actor, code: string): Promise<RosetteView[]> {
  const structure = await getVisibleStructure(actor, code);
  const [rows, gaugeRows] = await Promise.all([
    getDb().select().from(rosettes).where(eq(rosettes.structureId, structure.id)).orderBy(asc(rosettes.tag)),
    gaugeRowsOf(structure.id),
  ]);
  const tagOf = new Map(gaugeRows.map((g) => [g.id, g.tag]));
  return rows.map((row) => viewOf(row, tagOf));
}

/** Three gauges of one structure read as one rosette; the material comes from gauge a. */
export async function createRosette(actor: Actor, code: string, input: z.output<typeof rosetteInput>): Promise<RosetteView> {
  const structure = await getVisibleStructure(actor, code);
  await requirePermission(actor, "gauge:register", structure);
  if (new Set(input.gauges).size !== 3) {
    throw new AppError("validation_failed", "A rosette needs three different gauges.", { field: "gauges" });
  }
  const gaugeRows = await gaugeRowsOf(structure.id);
  const [a, b, c] = input.gauges.map((tag) => {
    const gauge = gaugeRows.find((row) => row.tag === tag);
    if (!gauge) throw new AppError("validation_failed", `Structure ${code} has no gauge tagged "${tag}".`, { field: "gauges" });
    if (gauge.status === "retired") throw new AppError("validation_failed", `Gauge "${tag}" is retired.`, { field: "gauges" });
    return gauge;
  }) as [(typeof gaugeRows)[number], (typeof gaugeRows)[number], (typeof gaugeRows)[number]];
  const created = await writeTransaction(async (tx) => {
    const [row] = await tx
      .insert(rosettes)
      .values({ structureId: structure.id, tag: input.tag, layout: input.layout, gaugeAId: a.id, gaugeBId: b.id, gaugeCId: c.id })
      .returning();
    await recordAudit(tx, {
      actor,
      action: "rosette.create",
      entityType: "rosette",
      entityKey: `${code}/${input.tag}`,
      structureId: structure.id,
      after: input,
    });
    return row!;
  }).catch((error: unknown) => {
    if (isUniqueViolation(error)) throw new AppError("conflict", `Structure ${code} already has a rosette tagged "${input.tag}".`, { field: "tag" });
    throw error;
  });
  return viewOf(created, new Map(gaugeRows.map((g) => [g.id, g.tag])));
}
