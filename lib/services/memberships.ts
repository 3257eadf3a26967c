import "server-only";
import { and, asc, eq } from "drizzle-orm";
import { getDb, isUniqueViolation, writeTransaction } from "@/db/client";
import { structureMembers, structures, users, type AlertMailMode } from "@/db/schema";
import type { Actor, UserActor } from "@/lib/auth/actor";
import { requirePermission } from "@/lib/auth/authorize";
import { AppError, notFound } from "@/lib/errors";
import { sensorMailOf } from "./alert-mail";
import { recordAudit } from "./audit";
import { findStructureByCode, getVisibleStructure } from "./structures";
import { findUserByEmail } from "./users";

export type MembershipView = {
  structureCode: string;
  structureName: string;
  userId: number;
  email: string;
  name: string;
  role: string;
};

export function listMemberships(): Promise<MembershipView[]> {
  return getDb()
    .select({
      structureCode: structures.code,
      structureName: structures.name,
      userId: users.id,
      email: users.email,
      name: users.name,
      role: users.role,
    })
    .from(structureMembers)
    .innerJoin(structures, eq(structures.id, structureMembers.structureId))
    .innerJoin(users, eq(users.id, structureMembers.userId))
    .orderBy(asc(structures.code), asc(users.name));
}

async function resolveMembership(email: string, structureCode: string) {
  const user = await findUserByEmail(email);
  if (!user) throw notFound(`User ${email}`);
  const structure = await findStructureByCode(structureCode);
  if (!structure) throw notFound(`Structure "${structureCode}"`);
  return { user, structure };
}

export async function addMember(actor: Actor | null, email: string, structureCode: string): Promise<void> {
  if (actor) await requirePermission(actor, "members:manage");
  const { user, structure } = await resolveMembership(email, structureCode);
  await writeTransaction(async (tx) => {
    await tx.insert(structureMembers).values({ structureId: structure.id, userId: user.id });
    await recordAudit(tx, {
      actor,
      action: "member.add",
      entityType: "membership",
      entityKey: `${structure.code}/${user.email}`,
      structureId: structure.id,
      after: { email: user.email, structure: structure.code },
    });
  }).catch((error: unknown) => {
    if (isUniqueViolation(error)) {
      throw new AppError("conflict", `${user.email} is already a member of ${structure.code}.`);
    }
    throw error;
  });
}

export async function removeMember(actor: Actor, email: string, structureCode: string): Promise<void> {
  await requirePermission(actor, "members:manage");
  const { user, structure } = await resolveMembership(email, structureCode);
  await writeTransaction(async (tx) => {
    await tx
      .delete(structureMembers)
      .where(and(eq(structureMembers.structureId, structure.id), eq(structureMembers.userId, user.id)));
    await recordAudit(tx, {
      actor,
      action: "member.remove",
      entityType: "membership",
      entityKey: `${structure.code}/${user.email}`,
      structureId: structure.id,
      before: { email: user.email, structure: structure.code },
    });
  });
}

/**
 * A member's own choice: each alert e-mail as it happens, or one daily digest; for `sensor` faults
 * apart (by default owners get those in the digest, lib/services/alert-mail's sensorMailOf).
 */
export async function setAlertMailMode(actor: UserActor, structureCode: string, mode: "immediate" | "digest", which: "alerts" | "sensor" = "alerts"): Promise<void> {
  const structure = await getVisibleStructure(actor, structureCode);
  const updated = await getDb()
    .update(structureMembers)
    .set(which === "alerts" ? { alertMail: mode } : { sensorMail: mode })
    .where(and(eq(structureMembers.structureId, structure.id), eq(structureMembers.userId, actor.id)))
    .returning({ userId: structureMembers.userId });
  if (updated.length === 0) throw new AppError("bad_request", `You are not a member of ${structure.code}, so you receive no alert e-mails for it.`);
}

/** A member's e-mail choices for a structure, the sensor one as it applies when not chosen (sensorMailOf); null when not a member. */
export async function alertMailModeOf(userId: number, structureId: number): Promise<{ alerts: AlertMailMode; sensor: AlertMailMode } | null> {
  const [row] = await getDb()
    .select({ alertMail: structureMembers.alertMail, sensorMail: structureMembers.sensorMail, role: users.role })
    .from(structureMembers)
    .innerJoin(users, eq(users.id, structureMembers.userId))
    .where(and(eq(structureMembers.structureId, structureId), eq(structureMembers.userId, userId)))
    .limit(1);
  return row ? { alerts: row.alertMail, sensor: sensorMailOf(row) } : null;
}
