import { spawn, type ChildProcess } from "node:child_process";
import { freePort } from "../free-port";

export type AppServer = {
  baseUrl: string;
  /** What the server printed so far, for failure messages. */
  output(): string;
  /** Signals the whole process group (npx, next start and its workers) and waits until it is gone. */
  stop(signal: NodeJS.Signals): Promise<void>;
};

export async function waitForServer(baseUrl: string, server: ChildProcess, log: () => string) {
  const deadline = Date.now() + 60_000;
  while (Date.now() < deadline) {
    if (server.exitCode !== null || server.signalCode !== null) throw new Error(`The app server exited early:\n${log()}`);
    try {
      if ((await fetch(`${baseUrl}/signin`)).ok) return;
    } catch {
      // not listening yet
    }
    await new Promise((resolve) => setTimeout(resolve, 250));
  }
  throw new Error(`The app server did not answer within 60 s:\n${log()}`);
}

/** Starts the production build (`next start`) with `env` on a free port and waits until it answers. */
export async function startAppServer(env: NodeJS.ProcessEnv): Promise<AppServer> {
  const port = await freePort();
  const baseUrl = `http://127.0.0.1:${port}`;
  let output = "";
  const server = spawn("npx", ["next", "start", "-p", String(port), "-H", "127.0.0.1"], {
    env: { NEXT_TELEMETRY_DISABLED: "1", NEXTAUTH_URL: baseUrl, ...env },
    detached: true,
  });
  server.stdout.on("data", (chunk) => (output += chunk));
  server.stderr.on("data", (chunk) => (output += chunk));
  const gone = new Promise<void>((resolve) => server.on("exit", () => resolve()));
  await waitForServer(baseUrl, server, () => output);
  return {
    baseUrl,
    output: () => output,
    async stop(signal) {
      if (server.exitCode !== null || server.signalCode !== null || !server.pid) return;
      process.kill(-server.pid, signal);
      await gone;
    },
  };
}
