import { spawn, spawnSync, type ChildProcess } from "node:child_process";
import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import type { TestProject } from "vitest/node";
import { freePort } from "../free-port";

declare module "vitest" {
  export interface ProvidedContext {
    baseUrl: string;
    databaseUrl: string;
  }
}

export async function waitForServer(url: string, server: ChildProcess, log: () => string) {
  const deadline = Date.now() + 60_000;
  while (Date.now() < deadline) {
    if (server.exitCode !== null) throw new Error(`The app server exited early:\n${log()}`);
    try {
      if ((await fetch(`${url}/signin`)).ok) return;
    } catch {
      // not listening yet
    }
    await new Promise((resolve) => setTimeout(resolve, 250));
  }
  throw new Error(`The app server did not answer within 60 s:\n${log()}`);
}

/** Seeds a fresh database and starts the production build on a free port for the browser tests. */
export default async function setup(project: TestProject) {
  if (!fs.existsSync(path.join(".next", "BUILD_ID"))) {
    throw new Error("No production build: run `npx next build` first (`npm test` does it).");
  }
  const folder = fs.mkdtempSync(path.join(os.tmpdir(), "hookeline-e2e-"));
  const port = await freePort();
  const baseUrl = `http://127.0.0.1:${port}`;
  const env = {
    ...process.env,
    DATABASE_URL: `file:${path.join(folder, "e2e.db")}`,
    FILE_STORAGE_DIR: path.join(folder, "files"),
    NEXTAUTH_SECRET: "browser-test-secret",
    NEXTAUTH_URL: baseUrl,
    NEXT_TELEMETRY_DISABLED: "1",
    SMTP_URL: "",
    // The server's own mail catcher, on a port of its own so a demo running on 2525 is not disturbed.
    LOCAL_SMTP_PORT: String(await freePort()),
  };
  const seeded = spawnSync("npx", ["tsx", "--conditions=react-server", "scripts/seed.ts"], { env, encoding: "utf8" });
  if (seeded.status !== 0) throw new Error(`Seeding failed:\n${seeded.stdout}\n${seeded.stderr}`);

  let output = "";
  const server = spawn("npx", ["next", "start", "-p", String(port), "-H", "127.0.0.1"], { env, detached: true });
  server.stdout.on("data", (chunk) => (output += chunk));
  server.stderr.on("data", (chunk) => (output += chunk));
  await waitForServer(baseUrl, server, () => output);

  project.provide("baseUrl", baseUrl);
  project.provide("databaseUrl", env.DATABASE_URL);
  return () => {
    if (server.pid) process.kill(-server.pid, "SIGTERM");
    fs.rmSync(folder, { recursive: true, force: true });
  };
}
