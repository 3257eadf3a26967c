import "server-only";
import { migrateDatabase } from "@/db/migrate";
import { startMailCatcherOrStop } from "@/lib/mail/local-smtp-server";
import { sweepFileStore } from "@/lib/services/files";
import { startJobs } from "./registry";

const globalForStart = globalThis as unknown as { hookelineStarted?: Promise<void> };

async function start() {
  await migrateDatabase();
  // Leftovers of a process killed mid-upload go before anything is served; a failure here is no reason not to start.
  await sweepFileStore().then(
    (summary) => console.log(`File store: ${summary}.`),
    (error: unknown) => console.error("Sweeping the file store:", error),
  );
  await startMailCatcherOrStop();
  startJobs();
}

/**
 * Runs once per server process: brings the database schema up to date before the first request,
 * clears the file store of what interrupted uploads left, then starts the local mail catcher (when SMTP_URL is unset) and the background jobs.
 */
export function startServerServices(): Promise<void> {
  globalForStart.hookelineStarted ??= start();
  return globalForStart.hookelineStarted;
}
