import "server-only";
import nodemailer, { type Transporter } from "nodemailer";

export const DEFAULT_LOCAL_SMTP_PORT = 2525;
const LOCAL_SMTP_HOST = "127.0.0.1";
const DEFAULT_MAIL_FROM = "Hookeline <alerts@hookeline.example>";

// Short enough that one stuck relay cannot hold a message past its lease (jobs/outbox-sender.ts).
const TIMEOUTS = { connectionTimeout: 10_000, greetingTimeout: 10_000, socketTimeout: 30_000 };

/** Where mail goes: the local catcher (demo and tests) or the relay in SMTP_URL. Never holds credentials. */
export type MailRoute = { kind: "local"; host: string; port: number } | { kind: "relay"; host: string; port: number | null };

export function localSmtpPort(): number {
  const port = Number(process.env.LOCAL_SMTP_PORT || DEFAULT_LOCAL_SMTP_PORT);
  if (!Number.isInteger(port) || port < 0 || port > 65_535) throw new Error(`LOCAL_SMTP_PORT must be a port number, not "${process.env.LOCAL_SMTP_PORT}".`);
  return port;
}

export function mailRoute(): MailRoute {
  const url = process.env.SMTP_URL;
  if (!url) return { kind: "local", host: LOCAL_SMTP_HOST, port: localSmtpPort() };
  const parsed = new URL(url);
  return { kind: "relay", host: parsed.hostname, port: parsed.port ? Number(parsed.port) : null };
}

export function mailFrom(): string {
  return process.env.MAIL_FROM || DEFAULT_MAIL_FROM;
}

/** A nodemailer transport for the current route; the local catcher speaks plain SMTP, so TLS is off for it. */
export function createMailTransport(): Transporter {
  const url = process.env.SMTP_URL;
  if (url) return nodemailer.createTransport({ url, ...TIMEOUTS });
  return nodemailer.createTransport({ host: LOCAL_SMTP_HOST, port: localSmtpPort(), secure: false, ignoreTLS: true, ...TIMEOUTS });
}
