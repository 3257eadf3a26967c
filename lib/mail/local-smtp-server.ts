import "server-only";
import net, { type AddressInfo } from "node:net";
import { simpleParser } from "mailparser";
import { SMTPServer, type SMTPServerDataStream, type SMTPServerSession } from "smtp-server";
import { databaseUrl, getDb } from "@/db/client";
import { caughtMail } from "@/db/schema";
import { catcherBanner, databaseFingerprint, portHolder, portRefusal } from "./catcher-identity";
import { freePort } from "@/lib/net/free-port";
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
    banner: catcherBanner(databaseFingerprint(databaseUrl())),
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

/** The catcher's port belongs to someone this instance must not send its mail to. */
export class MailPortTaken extends Error {}

/** The first line whoever listens on the port sends, or "" when it says nothing within 3 s. */
function greetingOn(port: number): Promise<string> {
  return new Promise((resolve) => {
    const socket = net.connect({ host: "127.0.0.1", port });
    let received = "";
    const done = () => {
      socket.destroy();
      resolve(received.split("\r\n")[0] ?? "");
    };
    socket.setTimeout(3000, done);
    socket.on("data", (chunk) => {
      received += chunk.toString("utf8");
      if (received.includes("\r\n")) done();
    });
    socket.on("error", done);
    socket.on("end", done);
  });
}

/**
 * The catcher on `port`, or null when the catcher of another instance on the same database holds
 * it (that one catches for both). Anyone else on the port is refused with how to pick another,
 * since this instance's mail would end up where its "Mail" page never looks.
 */
export async function openMailCatcher(port: number): Promise<LocalSmtpServer | null> {
  try {
    const server = await startLocalSmtpServer({ port });
    console.log(`Mail is caught on 127.0.0.1:${server.port} and shown on the admin page "Mail".`);
    return server;
  } catch (error) {
    if ((error as NodeJS.ErrnoException).code !== "EADDRINUSE") throw error;
    const holder = portHolder(await greetingOn(port), databaseFingerprint(databaseUrl()));
    if (holder.kind !== "same-database") throw new MailPortTaken(portRefusal(port, holder, await freePort()));
    console.warn(`Port ${port} is taken by the mail catcher of another Hookeline instance on this database; it catches this one's mail too.`);
    return null;
  }
}

/** Started once per process with the server (or `npm run jobs`) when SMTP_URL is unset. */
export function startMailCatcher(): Promise<LocalSmtpServer | null> {
  globalForCatcher.hookelineMailCatcher ??= process.env.SMTP_URL ? Promise.resolve(null) : openMailCatcher(localSmtpPort());
  return globalForCatcher.hookelineMailCatcher;
}

/**
 * The catcher for a process that serves or sends mail (the server, `npm run jobs`): a port held by
 * another database's catcher or another program stops the process, saying which port to use
 * instead, since a process that runs while its mail goes astray is worse than one that does not start.
 */
export function startMailCatcherOrStop(): Promise<LocalSmtpServer | null> {
  return startMailCatcher().catch((error: unknown) => {
    if (!(error instanceof MailPortTaken)) throw error;
    console.error(`Hookeline does not start: ${error.message}`);
    process.exit(1);
  });
}
