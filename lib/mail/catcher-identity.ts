import { createHash } from "node:crypto";
import path from "node:path";

/**
 * Two Hookeline instances may share a mail catcher only when they share a database: the catcher
 * stores what it receives in its own database, so mail sent to another database's catcher would
 * never appear on this instance's "Mail" page. The catcher names its database in its SMTP greeting.
 */

const BANNER_PREFIX = "Hookeline mail catcher for database";

/** A short fingerprint of where the data lives (a file's absolute path, or a server URL without credentials). */
export function databaseFingerprint(databaseUrl: string): string {
  const place = databaseUrl.startsWith("file:") ? path.resolve(databaseUrl.slice("file:".length)) : databaseUrl.replace(/[?#].*$/, "");
  return createHash("sha256").update(place).digest("hex").slice(0, 16);
}

export const catcherBanner = (fingerprint: string) => `${BANNER_PREFIX} ${fingerprint}`;

export type PortHolder = { kind: "same-database" } | { kind: "other-database"; fingerprint: string } | { kind: "other-program"; greeting: string };

/** Who answers on a taken port, judged from the first line it sends. */
export function portHolder(greeting: string, fingerprint: string): PortHolder {
  const named = new RegExp(`${BANNER_PREFIX} ([0-9a-f]{16})`).exec(greeting)?.[1];
  if (!named) return { kind: "other-program", greeting: greeting.trim().slice(0, 200) };
  return named === fingerprint ? { kind: "same-database" } : { kind: "other-database", fingerprint: named };
}

/** Why this instance will not use the port, and how to start it on another one. */
export function portRefusal(port: number, holder: Exclude<PortHolder, { kind: "same-database" }>, freePort: number): string {
  const who =
    holder.kind === "other-database"
      ? "a Hookeline instance with another database"
      : `another program${holder.greeting ? ` (it greets with "${holder.greeting}")` : ""}`;
  return (
    `Port ${port} is held by ${who}: mail sent there would not reach this instance's "Mail" page. ` +
    `Start with LOCAL_SMTP_PORT=${freePort} (free just now; any free port works), or stop the other instance.`
  );
}
