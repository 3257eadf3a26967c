import "server-only";
import { and, asc, eq, inArray, lt, lte, or } from "drizzle-orm";
import type { Transporter } from "nodemailer";
import { getDb } from "@/db/client";
import { mailOutbox, type OutboxMessage } from "@/db/schema";
import { withAttempt } from "@/lib/mail/attempt-log";
import { appUrl } from "@/lib/mail/message";
import { createMailTransport, mailFrom } from "@/lib/mail/transport";

export const BATCH_SIZE = 20;
/** Attempts the relay may answer "try later" before the message is given up as failed. */
export const MAX_ATTEMPTS = 8;
/** Long enough for one delivery at the transport's worst-case timeouts (lib/mail/transport.ts). */
export const MESSAGE_LEASE_MS = 2 * 60_000;
const FIRST_RETRY_MS = 30_000;
const LONGEST_RETRY_MS = 60 * 60_000;

/** Wait after the n-th failed attempt: 30 s, 1 min, 2 min, … doubling, never more than an hour. */
export function retryDelayMs(failedAttempts: number): number {
  return Math.min(LONGEST_RETRY_MS, FIRST_RETRY_MS * 2 ** Math.max(0, failedAttempts - 1));
}

/**
 * What a failed send means, by the reply classes of RFC 5321 §4.2.1 (5yz permanent, 4yz transient):
 * - `refused`: the relay answered 5xx about this message or address, or nodemailer found the
 *   address unusable: sending again cannot help;
 * - `later`: the relay answered 4xx (greylisting, mailbox full): try again, up to MAX_ATTEMPTS;
 * - `relay`: no usable answer at all (connection refused, timeout, TLS, login): the relay is the
 *   problem, not this message, so it is retried without limit — an outage delays mail and loses none.
 */
export type SendFailure = { kind: "refused" | "later" | "relay"; answer: string };

export function classifySendFailure(error: unknown): SendFailure {
  const e = error as { responseCode?: number; response?: string; code?: string; message?: string };
  const answer = e.response || e.message || String(error);
  if (e.code === "EAUTH") return { kind: "relay", answer };
  if (typeof e.responseCode === "number") return { kind: e.responseCode >= 500 ? "refused" : "later", answer };
  if (e.code === "EENVELOPE") return { kind: "refused", answer };
  return { kind: "relay", answer };
}

/** How soon a message that met an unreachable relay is tried again; the messages behind it are tried at the next run. */
export const RELAY_RETRY_MS = 10_000;

/**
 * The row's next state after a failed attempt: back in the queue at a later time, or failed for
 * good. An unreachable relay says nothing about the message, so there is no growing back-off: the
 * message steps aside for a few seconds, each run probes the relay with the next message due, and
 * the queue moves on the moment the relay answers (a message that fails alone cannot block it).
 */
export function afterFailure(failure: SendFailure, attemptsBefore: number, now: Date) {
  const attempts = attemptsBefore + 1;
  if (failure.kind === "relay") return { state: "queued" as const, attempts, lastError: failure.answer, nextAttemptAt: new Date(now.getTime() + RELAY_RETRY_MS) };
  const givesUp = failure.kind === "refused" || (failure.kind === "later" && attempts >= MAX_ATTEMPTS);
  return givesUp
    ? { state: "failed" as const, attempts, lastError: failure.answer }
    : { state: "queued" as const, attempts, lastError: failure.answer, nextAttemptAt: new Date(now.getTime() + retryDelayMs(attempts)) };
}

export type SenderOptions = {
  /** Who claims the messages; two runs with different holders never send the same message. */
  holder: string;
  now?: Date;
  batchSize?: number;
  /** Stops between messages when the job's lease is lost. */
  signal?: AbortSignal;
};

export type SenderResult = { sent: number; retried: number; failed: number };

const released = { claimedBy: null, claimedUntil: null };

/**
 * Claims due messages in one statement, most urgent first (`priority`, then oldest): queued ones
 * whose time has come, and ones a sender took but never finished (it crashed) once their lease has
 * run out. SQLite runs the statement under its write lock, so two senders racing here get disjoint
 * sets. The (state, priority, next_attempt_at) index serves the order, so a critical e-mail is found
 * at once behind thousands of others.
 */
async function claimDue(holder: string, now: Date, limit: number): Promise<OutboxMessage[]> {
  const db = getDb();
  const due = or(
    and(eq(mailOutbox.state, "queued"), lte(mailOutbox.nextAttemptAt, now)),
    and(eq(mailOutbox.state, "sending"), lt(mailOutbox.claimedUntil, now)),
  );
  const ids = db.select({ id: mailOutbox.id }).from(mailOutbox).where(due).orderBy(asc(mailOutbox.priority), asc(mailOutbox.nextAttemptAt), asc(mailOutbox.id)).limit(limit);
  const claimed = await db
    .update(mailOutbox)
    .set({ state: "sending", claimedBy: holder, claimedUntil: new Date(now.getTime() + MESSAGE_LEASE_MS) })
    .where(and(inArray(mailOutbox.id, ids), due))
    .returning();
  // RETURNING gives rows in storage order, not the order they were chosen in: most urgent first again.
  return claimed.sort((a, b) => a.priority - b.priority || a.nextAttemptAt.getTime() - b.nextAttemptAt.getTime() || a.id - b.id);
}

/** Extends our claim on one message right before sending it; false when it is no longer ours. */
async function stillOurs(id: number, holder: string): Promise<boolean> {
  const rows = await getDb()
    .update(mailOutbox)
    .set({ claimedUntil: new Date(Date.now() + MESSAGE_LEASE_MS) })
    .where(and(eq(mailOutbox.id, id), eq(mailOutbox.claimedBy, holder), eq(mailOutbox.state, "sending")))
    .returning({ id: mailOutbox.id });
  return rows.length > 0;
}

function finish(id: number, holder: string, change: Partial<typeof mailOutbox.$inferInsert>) {
  return getDb()
    .update(mailOutbox)
    .set({ ...change, ...released })
    .where(and(eq(mailOutbox.id, id), eq(mailOutbox.claimedBy, holder)));
}

function deliver(transport: Transporter, message: OutboxMessage) {
  return transport.sendMail({
    from: mailFrom(),
    to: message.toAddress,
    subject: message.subject,
    text: message.text,
    html: message.html,
    attachments: message.attachments?.map((a) => ({ filename: a.filename, contentType: a.contentType, content: a.contentBase64, encoding: "base64" })),
    // The same id on every attempt, so a copy sent twice after a crash at the wrong moment can be recognised.
    messageId: `<outbox-${message.id}@${new URL(appUrl()).hostname}>`,
    // RFC 3834: tells auto-responders not to answer.
    headers: { "Auto-Submitted": "auto-generated" },
  });
}

/**
 * One run of the outbox sender: claims up to `batchSize` due messages and sends each through
 * SMTP. A refused address fails its own message only; when the relay cannot be reached, the
 * rest of the batch goes back to the queue with the same answer instead of each waiting out
 * the timeouts in turn.
 */
export async function runOutboxSender(options: SenderOptions): Promise<SenderResult> {
  const { holder, signal } = options;
  const now = options.now ?? new Date();
  const claimed = await claimDue(holder, now, options.batchSize ?? BATCH_SIZE);
  const result: SenderResult = { sent: 0, retried: 0, failed: 0 };
  if (claimed.length === 0) return result;
  const transport = createMailTransport();
  let relayDown: SendFailure | null = null;
  try {
    for (const message of claimed) {
      if (signal?.aborted) break;
      if (relayDown) {
        // Not tried: it keeps its place and its count for the next run.
        await finish(message.id, holder, { state: "queued", lastError: relayDown.answer });
        result.retried++;
        continue;
      }
      if (!(await stillOurs(message.id, holder))) continue;
      let failure: SendFailure;
      try {
        await deliver(transport, message);
        const sentAt = new Date();
        const attemptLog = withAttempt(message.attemptLog, { at: sentAt.toISOString(), outcome: "sent" });
        await finish(message.id, holder, { state: "sent", sentAt, attempts: message.attempts + 1, attemptLog });
        result.sent++;
        continue;
      } catch (error) {
        failure = classifySendFailure(error);
        if (failure.kind === "relay") relayDown = failure;
      }
      const next = afterFailure(failure, message.attempts, now);
      const attemptLog = withAttempt(message.attemptLog, { at: new Date().toISOString(), outcome: failure.kind, answer: failure.answer });
      await finish(message.id, holder, { ...next, attemptLog });
      if (next.state === "failed") result.failed++;
      else result.retried++;
    }
  } finally {
    transport.close();
  }
  // Whatever an abort left claimed returns to the queue now rather than when its lease runs out.
  await getDb()
    .update(mailOutbox)
    .set({ state: "queued", ...released })
    .where(and(eq(mailOutbox.claimedBy, holder), eq(mailOutbox.state, "sending"), inArray(mailOutbox.id, claimed.map((m) => m.id))));
  return result;
}

export function describeSenderResult(result: SenderResult): string {
  return `${result.sent} sent, ${result.retried} to retry, ${result.failed} failed`;
}
