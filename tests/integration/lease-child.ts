/**
 * Child process of mail-outbox.test.ts: holds a job lease with a run that lasts until it is told
 * to stop, so the parent can send it SIGTERM as a process manager would. Reads DATABASE_URL like the app.
 */
import { migrateDatabase } from "@/db/migrate";
import { releaseLeasesOnStop, withLease } from "@/jobs/lease";

await migrateDatabase();
releaseLeasesOnStop();
await withLease("long-job", 10 * 60_000, (signal) => {
  console.log("holding");
  // Busy, as a real job is: without something pending the process would simply end here.
  const working = setInterval(() => undefined, 1_000);
  return new Promise<string>((resolve) =>
    signal.addEventListener("abort", () => {
      clearInterval(working);
      resolve("stopped");
    }),
  );
});
