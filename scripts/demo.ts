import { spawn, spawnSync } from "node:child_process";
import { randomBytes } from "node:crypto";
import fs from "node:fs";
import path from "node:path";

/**
 * `npm run demo`: the embedded database with demo data, a production build, and the
 * server on http://localhost:3000 (PORT to change it). Secrets for sign-in are made once
 * and kept under data/, so sessions survive a restart of the demo.
 */
const port = process.env.PORT ?? "3000";
const secretFile = path.join("data", "demo-auth-secret");

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
  PORT: port,
  // The demo logger job sends the demo gauges' readings as time passes, so the demo never goes stale.
  DEMO_LOGGER: "on",
};

function step(label: string, command: string, args: string[]) {
  console.log(`\n▸ ${label}`);
  const result = spawnSync(command, args, { stdio: "inherit", env });
  if (result.status !== 0) process.exit(result.status ?? 1);
}

step("Database and demo data", "npx", ["tsx", "--conditions=react-server", "scripts/seed.ts"]);
step("Production build", "npx", ["next", "build"]);
console.log(`\n▸ Hookeline on ${env.NEXTAUTH_URL} — sign-ins are listed in README.md`);
const server = spawn("npx", ["next", "start", "-p", port], { stdio: "inherit", env });
server.on("exit", (code) => process.exit(code ?? 0));
for (const signal of ["SIGINT", "SIGTERM"] as const) process.on(signal, () => server.kill(signal));
