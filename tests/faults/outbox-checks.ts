import { eq } from "drizzle-orm";
import { getDb } from "@/db/client";
import { caughtMail, jobLeases, mailOutbox } from "@/db/schema";
import { queue } from "../integration/mail-helpers";
import { waitUntil } from "./fault-database";

/** Queues one message to each of `count` addresses, as the app does inside its transactions. */
export async function queueMessages(prefix: string, count: number): Promise<string[]> {
  const addresses = Array.from({ length: count }, (_, i) => `${prefix}-${i}@hookeline.example`);
  for (const to of addresses) await queue({ to });
  return addresses;
}

export async function outboxRows() {
  return getDb().select().from(mailOutbox);
}

/** How many copies of each outbox message (by its Message-ID, the same on every attempt) the catcher holds. */
export async function copiesByMessageId(): Promise<Record<string, number>> {
  const copies: Record<string, number> = {};
  for (const { messageId } of await getDb().select({ messageId: caughtMail.messageId }).from(caughtMail)) {
    copies[String(messageId)] = (copies[String(messageId)] ?? 0) + 1;
  }
  return copies;
}

/**
 * Waits for a run of the outbox job that started after `since` and finished: whatever it could
 * have sent twice, it has sent by then.
 */
export async function outboxRunAfter(since: Date): Promise<void> {
  await waitUntil("another run of the outbox job", async () => {
    const [lease] = await getDb().select().from(jobLeases).where(eq(jobLeases.name, "mail-outbox"));
    return !!lease?.lastStartedAt && !!lease.lastFinishedAt && lease.lastStartedAt > since && lease.lastFinishedAt >= lease.lastStartedAt;
  });
}
