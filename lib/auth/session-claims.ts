import "server-only";
import { eq, lt } from "drizzle-orm";
import { getDb, writeTransaction } from "@/db/client";
import { endedSessions } from "@/db/schema";
import { getUserById } from "@/lib/services/users";
import type { UserActor } from "./actor";

/**
 * The shape of the claims this release writes into session cookies. Raise it whenever a release
 * adds, removes or changes the meaning of a claim: cookies written by an earlier release then stop
 * counting and their holders are asked to sign in again, instead of the code guessing at claims
 * that were never written. 2: subject, role, session version and session id (1 had no version or id).
 */
export const SESSION_FORMAT = 2;

/** What the session cookie says about its holder (the JWT's claims). */
export type SessionClaims = { sub?: string; sessionFormat?: number; sessionVersion?: number; sessionId?: string };

/**
 * The user a session belongs to as the database knows them now, or null when the session no
 * longer counts: an earlier release wrote it (another SESSION_FORMAT), the account is gone or
 * deactivated, its sessions were ended since (password, role, "sign out everywhere"), or this
 * session was signed out and its cookie copied.
 */
export async function userForSession(claims: SessionClaims | null | undefined): Promise<UserActor | null> {
  const id = Number(claims?.sub);
  if (!claims || claims.sessionFormat !== SESSION_FORMAT || !Number.isInteger(id) || !claims.sessionId) return null;
  const user = await getUserById(id);
  if (!user || !user.active || user.sessionVersion !== claims.sessionVersion) return null;
  const [ended] = await getDb()
    .select({ sessionId: endedSessions.sessionId })
    .from(endedSessions)
    .where(eq(endedSessions.sessionId, claims.sessionId))
    .limit(1);
  if (ended) return null;
  return { kind: "user", id: user.id, email: user.email, name: user.name, role: user.role };
}

/** Signing out: the session stays refused until its cookie would have expired anyway. */
export async function endSession(sessionId: string, expiresAt: Date, now = new Date()): Promise<void> {
  await writeTransaction(async (tx) => {
    await tx.delete(endedSessions).where(lt(endedSessions.expiresAt, now));
    await tx.insert(endedSessions).values({ sessionId, expiresAt }).onConflictDoNothing();
  });
}
