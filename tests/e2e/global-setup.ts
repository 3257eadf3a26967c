import { spawnSync } from "node:child_process";
import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import type { TestProject } from "vitest/node";
import { freePort } from "../free-port";
import { startAppServer } from "./app-server";

declare module "vitest" {
  export interface ProvidedContext {
    baseUrl: string;
    databaseUrl: string;
  }
}

/** Seeds a fresh database and starts the production build on a free port for the browser tests. */
export default async function setup(project: TestProject) {
  if (!fs.existsSync(path.join(".next", "BUILD_ID"))) {
    throw new Error("No production build: run `npx next build` first (`npm test` does it).");
  }
  const folder = fs.mkdtempSync(path.join(os.tmpdir(), "hookeline-e2e-"));
  const env = {
    ...process.env,
    DATABASE_URL: `file:${path.join(folder, "e2e.db")}`,
    FILE_STORAGE_DIR: path.join(folder, "files"),
    NEXTAUTH_SECRET: "browser-test-secret",
    SMTP_URL: "",
    // The server's own mail catcher, on a port of its own so a demo running on 2525 is not disturbed.
    LOCAL_SMTP_PORT: String(await freePort()),
  };
  const seeded = spawnSync("npx", ["tsx", "--conditions=react-server", "scripts/seed.ts"], { env, encoding: "utf8" });
  if (seeded.status !== 0) throw new Error(`Seeding failed:\n${seeded.stdout}\n${seeded.stderr}`);

  const server = await startAppServer(env);

  project.provide("baseUrl", server.baseUrl);
  project.provide("databaseUrl", env.DATABASE_URL);
  return async () => {
    await server.stop("SIGTERM");
    fs.rmSync(folder, { recursive: true, force: true });
  };
}
