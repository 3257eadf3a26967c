import "server-only";
import { and, eq } from "drizzle-orm";
import { getDb } from "@/db/client";
import { structureMembers, structures } from "@/db/schema";
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
    if (action !== "readings:ingest") throw forbidden(LOGGER_ONLY_SENDS);
    return;
  }
  if (!roleAllows(actor.role, action)) throw forbidden(`The ${actor.role} role may not do this.`);
}

const LOGGER_ONLY_SENDS = "A logger token may only send readings.";

/**
 * The door of an API route, before its body is read or anything it names is looked up beyond
 * the structure: loggers only where readings are sent, people only with a role that allows the
 * route's action, and a structure the caller may not see answers as one that does not exist.
 */
export async function requireRouteAccess(actor: Actor, rule: Action | "signed-in", structureCode?: string): Promise<void> {
  if (actor.kind === "logger") {
    if (rule !== "readings:ingest") throw forbidden(LOGGER_ONLY_SENDS);
  } else if (rule !== "signed-in" && !roleAllows(actor.role, rule)) {
    throw forbidden(`The ${actor.role} role may not do this.`);
  }
  if (rule === "signed-in" || !isStructureScoped(rule) || structureCode === undefined) return;
  const [structure] = await getDb()
    .select({ id: structures.id, code: structures.code })
    .from(structures)
    .where(eq(structures.code, structureCode))
    .limit(1);
  if (!structure || !(await canSeeStructure(actor, structure))) throw structureNotVisible({ id: 0, code: structureCode });
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
