import "server-only";
import { desc, eq } from "drizzle-orm";
import { getDb } from "@/db/client";
import { caughtMail, mailOutbox, type CaughtMail } from "@/db/schema";
import type { Actor } from "@/lib/auth/actor";
import { requirePermission } from "@/lib/auth/authorize";

const LIST_LIMIT = 100;

export type CaughtMailSummary = Pick<CaughtMail, "id" | "receivedAt" | "envelopeTo" | "subject">;

/** Newest first: what the local catcher received lately. */
export async function listCaughtMail(actor: Actor): Promise<CaughtMailSummary[]> {
  await requirePermission(actor, "mail:read");
  return getDb()
    .select({ id: caughtMail.id, receivedAt: caughtMail.receivedAt, envelopeTo: caughtMail.envelopeTo, subject: caughtMail.subject })
    .from(caughtMail)
    .orderBy(desc(caughtMail.receivedAt), desc(caughtMail.id))
    .limit(LIST_LIMIT);
}

export async function getCaughtMail(actor: Actor, id: number): Promise<CaughtMail | null> {
  await requirePermission(actor, "mail:read");
  const [row] = await getDb().select().from(caughtMail).where(eq(caughtMail.id, id)).limit(1);
  return row ?? null;
}

/** The outbox as an admin needs it to see what is stuck: no bodies, newest first. */
export async function listOutbox(actor: Actor) {
  await requirePermission(actor, "mail:read");
  return getDb()
    .select({
      id: mailOutbox.id,
      toAddress: mailOutbox.toAddress,
      kind: mailOutbox.kind,
      subject: mailOutbox.subject,
      state: mailOutbox.state,
      attempts: mailOutbox.attempts,
      nextAttemptAt: mailOutbox.nextAttemptAt,
      lastError: mailOutbox.lastError,
      attemptLog: mailOutbox.attemptLog,
      createdAt: mailOutbox.createdAt,
      sentAt: mailOutbox.sentAt,
    })
    .from(mailOutbox)
    .orderBy(desc(mailOutbox.createdAt), desc(mailOutbox.id))
    .limit(LIST_LIMIT);
}

export type OutboxSummary = Awaited<ReturnType<typeof listOutbox>>[number];
