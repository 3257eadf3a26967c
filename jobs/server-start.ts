import { migrateDatabase } from "@/db/migrate";

const globalForStart = globalThis as unknown as { hookelineStarted?: Promise<void> };

/** Runs once per server process: brings the database schema up to date before the first request. */
export function startServerServices(): Promise<void> {
  globalForStart.hookelineStarted ??= migrateDatabase();
  return globalForStart.hookelineStarted;
}
