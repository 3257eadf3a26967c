import { isTimeZone } from "@/lib/time-format";

/** One IANA zone from the environment, UTC when unset; a misspelt name stops the process with what to fix. */
function zoneFromEnv(name: string): string {
  const value = process.env[name]?.trim();
  if (!value) return "UTC";
  if (!isTimeZone(value)) throw new Error(`${name} must be an IANA time zone name such as Europe/Paris or UTC, not "${value}".`);
  return value;
}

/** The zone of pages about no one structure (admin, mail log, account): DEFAULT_TIMEZONE, UTC when unset. */
export function defaultTimeZone(): string {
  return zoneFromEnv("DEFAULT_TIMEZONE");
}

/** The zone whose 06:00 starts the daily digest and whose day it covers: DIGEST_TIMEZONE, UTC when unset. */
export function digestTimeZone(): string {
  return zoneFromEnv("DIGEST_TIMEZONE");
}
