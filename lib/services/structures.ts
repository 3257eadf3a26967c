import "server-only";
import { asc, eq, inArray } from "drizzle-orm";
import { getDb, isUniqueViolation, writeTransaction } from "@/db/client";
import { structureMembers, structures, type Structure } from "@/db/schema";
import type { Actor } from "@/lib/auth/actor";
import { canSeeStructure, requirePermission } from "@/lib/auth/authorize";
import { seesAllStructures } from "@/lib/auth/permissions";
import { AppError } from "@/lib/errors";
import type { CreateStructureInput } from "@/lib/validation";
import { recordAudit } from "./audit";

/** A structure as the API and the pages show it. */
export type StructureView = {
  code: string;
  name: string;
  location: string | null;
  timezone: string;
  description: string | null;
  createdAt: string;
};

export function toStructureView(row: Structure): StructureView {
  return {
    code: row.code,
    name: row.name,
    location: row.location,
    timezone: row.timezone,
    description: row.description,
    createdAt: row.createdAt.toISOString(),
  };
}

export async function listStructuresFor(actor: Actor): Promise<Structure[]> {
  const db = getDb();
  if (actor.kind === "logger") {
    return db.select().from(structures).where(eq(structures.id, actor.structureId));
  }
  if (seesAllStructures(actor.role)) return db.select().from(structures).orderBy(asc(structures.name));
  const memberOf = db
    .select({ id: structureMembers.structureId })
    .from(structureMembers)
    .where(eq(structureMembers.userId, actor.id));
  return db.select().from(structures).where(inArray(structures.id, memberOf)).orderBy(asc(structures.name));
}

export async function findStructureByCode(code: string): Promise<Structure | undefined> {
  const [row] = await getDb().select().from(structures).where(eq(structures.code, code)).limit(1);
  return row;
}

/** The structure, if the actor may see it; otherwise the same 404 as for one that does not exist. */
export async function getVisibleStructure(actor: Actor, code: string): Promise<Structure> {
  const row = await findStructureByCode(code);
  if (!row || !(await canSeeStructure(actor, row))) {
    throw new AppError("not_found", `Structure "${code}" was not found.`);
  }
  return row;
}

export async function createStructure(actor: Actor | null, input: CreateStructureInput): Promise<Structure> {
  if (actor) await requirePermission(actor, "structure:create");
  return writeTransaction(async (tx) => {
    const [created] = await tx.insert(structures).values(input).returning();
    // The engineer who creates a structure works on it: make them a member so they keep seeing it.
    if (actor?.kind === "user" && !seesAllStructures(actor.role)) {
      await tx.insert(structureMembers).values({ structureId: created!.id, userId: actor.id });
    }
    await recordAudit(tx, {
      actor,
      action: "structure.create",
      entityType: "structure",
      entityKey: input.code,
      structureId: created!.id,
      after: input,
    });
    return created!;
  }).catch((error: unknown) => {
    if (isUniqueViolation(error)) {
      throw new AppError("conflict", `A structure with code "${input.code}" already exists.`, { field: "code" });
    }
    throw error;
  });
}
