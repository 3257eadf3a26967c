import { spawn, spawnSync } from "node:child_process";
import { randomBytes } from "node:crypto";
import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { buildDecision, currentBuildId, readStamp, writeStamp, type BuildStamp } from "./build-stamp";
import { sourceFingerprint } from "./source-fingerprint";

/**
 * `npm run demo`: the embedded database with demo data, a production build, and the
 * server on http://localhost:3000 (PORT to change it). Secrets for sign-in are made once
 * and kept under data/, so sessions survive a restart of the demo. The build is made again
 * only when the sources it reads have changed since the last one (`.next/hookeline-build.json`).
 */
const port = process.env.PORT ?? "3000";
const secretFile = path.join("data", "demo-auth-secret");
const buildFolder = ".next";

function demoSecret(): string {
  if (process.env.NEXTAUTH_SECRET) return process.env.NEXTAUTH_SECRET;
  fs.mkdirSync("data", { recursive: true });
  if (!fs.existsSync(secretFile)) fs.writeFileSync(secretFile, randomBytes(32).toString("base64url"), { mode: 0o600 });
  return fs.readFileSync(secretFile, "utf8").trim();
}

const env = {
  ...process.env,
  NEXTAUTH_SECRET: demoSecret(),
  NEXTAUTH_URL: process.env.NEXTAUTH_URL ?? `http://localhost:${port}`,
  NEXT_TELEMETRY_DISABLED: "1",
  PORT: port,
  // The demo logger job sends the demo gauges' readings as time passes, so the demo never goes stale.
  DEMO_LOGGER: "on",
};

const seconds = (since: number) => Math.round((performance.now() - since) / 1000);
const duration = (s: number) => (s < 90 ? `${s} s` : `${Math.floor(s / 60)} min ${s % 60} s`);

function step(label: string, command: string, args: string[]) {
  console.log(`\n▸ ${label}`);
  const started = performance.now();
  const result = spawnSync(command, args, { stdio: "inherit", env });
  if (result.status !== 0) process.exit(result.status ?? 1);
  const took = seconds(started);
  console.log(`  done in ${duration(took)}`);
  return took;
}

/** How long a build may take here, from the last one or from what a 2-core machine takes, and the load now. */
function buildEstimate(last: BuildStamp | null): string {
  const [load] = os.loadavg();
  const cores = os.availableParallelism();
  const busy = load! > cores ? `; the machine is busy now (load ${load!.toFixed(1)} on ${cores} cores), so expect longer` : "";
  const usual = last ? `the last one here took ${duration(last.seconds)}` : "about 1 to 4 minutes on a quiet 2-core machine";
  return `${usual}${busy}`;
}

function ensureBuild() {
  const fingerprint = sourceFingerprint();
  const stamp = readStamp(buildFolder);
  const decision = buildDecision(fingerprint, stamp, currentBuildId(buildFolder));
  if (!decision.build) {
    console.log("\n▸ Production build: reusing the one in .next (no source changed since it was made)");
    return;
  }
  const took = step(`Production build (${decision.why}): ${buildEstimate(stamp)}`, "npx", ["next", "build"]);
  if (fingerprint) writeStamp(buildFolder, fingerprint, took);
}

step("Database and demo data (the first run stores the demo readings)", "npx", ["tsx", "--conditions=react-server", "scripts/seed.ts"]);
ensureBuild();
console.log(`\n▸ Hookeline on ${env.NEXTAUTH_URL} — sign-ins are listed in README.md`);
const server = spawn("npx", ["next", "start", "-p", port], { stdio: "inherit", env });
server.on("exit", (code) => process.exit(code ?? 0));
for (const signal of ["SIGINT", "SIGTERM"] as const) process.on(signal, () => server.kill(signal));
