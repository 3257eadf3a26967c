import { and, eq } from "drizzle-orm";
import { getDb } from "@/db/client";
import { structureMembers } from "@/db/schema";
import { AppError, forbidden } from "@/lib/errors";
import type { Actor } from "./actor";
import { isStructureScoped, roleAllows, seesAllStructures, type Action } from "./permissions";

/** Enough of a structure to decide on it. */
export type StructureRef = { id: number; code: string };

export async function isMember(userId: number, structureId: number): Promise<boolean> {
  const rows = await getDb()
    .select({ userId: structureMembers.userId })
    .from(structureMembers)
    .where(and(eq(structureMembers.userId, userId), eq(structureMembers.structureId, structureId)))
    .limit(1);
  return rows.length > 0;
}

export async function canSeeStructure(actor: Actor, structure: StructureRef): Promise<boolean> {
  if (actor.kind === "logger") return actor.structureId === structure.id;
  return seesAllStructures(actor.role) || isMember(actor.id, structure.id);
}

function structureNotVisible(structure: StructureRef) {
  // A structure the caller may not see answers exactly like one that does not exist.
  return new AppError("not_found", `Structure "${structure.code}" was not found.`);
}

/**
 * The one place that decides who may do what. Pages, server actions and API handlers
 * all call it; it throws an AppError (404 for structures out of sight, 403 otherwise).
 */
export async function requirePermission(actor: Actor, action: Action, structure?: StructureRef): Promise<void> {
  if (isStructureScoped(action) && !structure) {
    throw new Error(`Permission "${action}" needs the structure it applies to.`);
  }
  if (structure && !(await canSeeStructure(actor, structure))) throw structureNotVisible(structure);
  if (actor.kind === "logger") {
    if (action !== "readings:ingest") throw forbidden("A logger token may only send readings.");
    return;
  }
  if (!roleAllows(actor.role, action)) throw forbidden(`The ${actor.role} role may not do this.`);
}

/** The same decision as requirePermission, as a yes/no for showing or hiding controls. */
export async function may(actor: Actor, action: Action, structure?: StructureRef): Promise<boolean> {
  try {
    await requirePermission(actor, action, structure);
    return true;
  } catch (error) {
    if (error instanceof AppError) return false;
    throw error;
  }
}
