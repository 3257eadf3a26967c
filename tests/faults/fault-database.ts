import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { afterAll } from "vitest";
import { closeDb, getClient } from "@/db/client";
import { migrateDatabase } from "@/db/migrate";
import { startAppServer, type AppServer } from "../e2e/app-server";
import { freePort } from "../free-port";

/**
 * A database file of the test file's own, migrated, that this process (fixtures, the SMTP catcher,
 * checks) and the app servers it starts share. Servers still running at the end are killed.
 */
export async function faultDatabase(name: string) {
  const folder = fs.mkdtempSync(path.join(os.tmpdir(), `hookeline-${name}-`));
  const file = path.join(folder, `${name}.db`);
  process.env.DATABASE_URL = `file:${file}`;
  closeDb();
  await migrateDatabase();
  const servers: AppServer[] = [];
  afterAll(async () => {
    await Promise.all(servers.map((server) => server.stop("SIGKILL")));
    closeDb();
    fs.rmSync(folder, { recursive: true, force: true });
  });
  return {
    file,
    /** The production build on this database; `jobs: false` sets JOBS=off. */
    async startServer(env: { jobs: boolean; smtpUrl?: string }): Promise<AppServer> {
      const server = await startAppServer({
        ...process.env,
        DATABASE_URL: `file:${file}`,
        FILE_STORAGE_DIR: path.join(folder, "files"),
        NEXTAUTH_SECRET: "fault-test-secret",
        JOBS: env.jobs ? "on" : "off",
        SMTP_URL: env.smtpUrl ?? "",
        LOCAL_SMTP_PORT: String(await freePort()),
      });
      servers.push(server);
      return server;
    },
  };
}

/** Checks `check` every 250 ms until it answers true; generous because CI is a loaded two-core machine. */
export async function waitUntil(what: string, check: () => Promise<boolean>, timeoutMs = 45_000): Promise<void> {
  const deadline = Date.now() + timeoutMs;
  while (Date.now() < deadline) {
    if (await check()) return;
    await new Promise((resolve) => setTimeout(resolve, 250));
  }
  throw new Error(`Waited ${timeoutMs / 1000} s for ${what}.`);
}

/** SQLite's own consistency check of the file: "ok" when pages, indexes and free lists agree. */
export async function quickCheck(): Promise<string> {
  const { rows } = await getClient().execute("PRAGMA quick_check");
  return rows.map((row) => String(row[0])).join("; ");
}
