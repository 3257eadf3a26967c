import { asc, eq } from "drizzle-orm";
import { getDb, writeTransaction } from "@/db/client";
import { caughtMail, mailOutbox } from "@/db/schema";
import { queueMail, type QueuedMail } from "@/lib/mail/outbox";
import { startLocalSmtpServer, type LocalSmtpOptions, type LocalSmtpServer } from "@/lib/mail/local-smtp-server";

/** Starts the real SMTP catcher and points the app's transport at it, as the demo does. */
export async function startCatcher(options: Partial<LocalSmtpOptions> = {}): Promise<LocalSmtpServer> {
  const server = await startLocalSmtpServer({ port: 0, ...options });
  delete process.env.SMTP_URL;
  process.env.LOCAL_SMTP_PORT = String(server.port);
  return server;
}

export function queue(message: Partial<QueuedMail> & { to: string }) {
  return writeTransaction((tx) =>
    queueMail(tx, {
      kind: "alert",
      dedupeKey: `test:${message.to}:${Math.random()}`,
      subject: `Test for ${message.to}`,
      text: "plain text",
      html: "<p>html</p>",
      ...message,
    }),
  );
}

export async function outboxRow(to: string) {
  const [row] = await getDb().select().from(mailOutbox).where(eq(mailOutbox.toAddress, to));
  return row!;
}

/** How many times each address received mail at the catcher. */
export async function receivedCounts(): Promise<Record<string, number>> {
  const rows = await getDb().select({ to: caughtMail.envelopeTo }).from(caughtMail).orderBy(asc(caughtMail.id));
  const counts: Record<string, number> = {};
  for (const row of rows) for (const address of row.to) counts[address] = (counts[address] ?? 0) + 1;
  return counts;
}

export async function clearMail() {
  await getDb().delete(caughtMail);
  await getDb().delete(mailOutbox);
}

export { freePort } from "../free-port";
