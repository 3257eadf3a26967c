import { asc, eq } from "drizzle-orm";
import type { z } from "zod";
import { getDb, writeTransaction } from "@/db/client";
import { rosetteLimits } from "@/db/schema";
import type { Actor } from "@/lib/auth/actor";
import type { rosetteLimitsBody } from "@/lib/alerting/schema";
import type { Limit, RosetteLimitQuantity } from "@/lib/limits";
import { recordAudit } from "./audit";
import { limitOfRow, validLimitsOrRefuse } from "./limits";
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
 * Replaces the rosette's whole limit set; an open alert stays open and clears against the new
 * bounds. The stresses need no yield, so validation is the gauge's without the utilisation check.
 */
export async function replaceRosetteLimits(actor: Actor, code: string, tag: string, inputs: RosetteLimitInput[]): Promise<RosetteLimit[]> {
  const { structure, rosette } = await resolveRosette(actor, code, tag, "limits:edit");
  const limits = validLimitsOrRefuse(inputs);
  const before = await limitsOfRosette(rosette.id);
  await writeTransaction(async (tx) => {
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
