import "server-only";
import type { AddressInfo } from "node:net";
import { simpleParser } from "mailparser";
import { SMTPServer, type SMTPServerDataStream, type SMTPServerSession } from "smtp-server";
import { getDb } from "@/db/client";
import { caughtMail } from "@/db/schema";
import { localSmtpPort } from "./transport";

export type LocalSmtpServer = { port: number; close(): Promise<void> };

export type LocalSmtpOptions = {
  /** 0 picks a free port (tests). */
  port: number;
  /** For tests of per-address failures: a reason to refuse this recipient with 550, or null to accept. */
  refuseRecipient?: (address: string) => string | null;
};

async function readAll(stream: SMTPServerDataStream): Promise<Buffer> {
  const chunks: Buffer[] = [];
  for await (const chunk of stream) chunks.push(chunk as Buffer);
  return Buffer.concat(chunks);
}

const envelopeAddress = (from: SMTPServerSession["envelope"]["mailFrom"]) => (from ? from.address : null);

async function catchMessage(stream: SMTPServerDataStream, session: SMTPServerSession) {
  const raw = await readAll(stream);
  const parsed = await simpleParser(raw);
  await getDb()
    .insert(caughtMail)
    .values({
      envelopeFrom: envelopeAddress(session.envelope.mailFrom),
      envelopeTo: session.envelope.rcptTo.map((r) => r.address),
      messageId: parsed.messageId ?? null,
      subject: parsed.subject ?? null,
      text: parsed.text ?? null,
      html: parsed.html || null,
      rawSize: raw.length,
      attachments: parsed.attachments.map((a) => ({ filename: a.filename ?? null, contentType: a.contentType, size: a.size })),
    });
}

/**
 * The mail catcher: an SMTP server on 127.0.0.1 that keeps every message it receives in
 * caught_mail for the admin page "Mail". STARTTLS is off because smtp-server's built-in
 * certificate has expired; nothing leaves the machine, so plain SMTP is fine here.
 */
export function startLocalSmtpServer(options: LocalSmtpOptions): Promise<LocalSmtpServer> {
  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ["STARTTLS"],
    logger: false,
    onRcptTo(address, _session, callback) {
      const refusal = options.refuseRecipient?.(address.address);
      if (!refusal) return callback();
      const error = Object.assign(new Error(refusal), { responseCode: 550 });
      callback(error);
    },
    onData(stream, session, callback) {
      catchMessage(stream, session).then(() => callback(), callback);
    },
  });
  return new Promise((resolve, reject) => {
    server.once("error", reject);
    server.listen(options.port, "127.0.0.1", () => {
      server.off("error", reject);
      server.on("error", (error) => console.error("Local mail catcher:", error));
      const { port } = server.server.address() as AddressInfo;
      resolve({ port, close: () => new Promise<void>((done) => server.close(() => done())) });
    });
  });
}

const globalForCatcher = globalThis as unknown as { hookelineMailCatcher?: Promise<LocalSmtpServer | null> };

/**
 * Started with the server when SMTP_URL is unset. If the port is taken (another instance on this
 * machine already catches), say so and go on: that instance's catcher writes to the same database.
 */
export function startMailCatcher(): Promise<LocalSmtpServer | null> {
  globalForCatcher.hookelineMailCatcher ??= (async () => {
    if (process.env.SMTP_URL) return null;
    const port = localSmtpPort();
    try {
      const server = await startLocalSmtpServer({ port });
      console.log(`Mail is caught on 127.0.0.1:${server.port} and shown on the admin page "Mail".`);
      return server;
    } catch (error) {
      if ((error as NodeJS.ErrnoException).code !== "EADDRINUSE") throw error;
      console.warn(`Port ${port} is taken: another Hookeline instance is probably catching mail there; this one does not.`);
      return null;
    }
  })();
  return globalForCatcher.hookelineMailCatcher;
}
