import { spawn } from "node:child_process";
import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { createClient } from "@libsql/client";
import { afterAll, describe, expect, it } from "vitest";
import { rollupMismatches } from "./readings-fixtures";

const CRASH_BATCH = 300_000;
const folder = fs.mkdtempSync(path.join(os.tmpdir(), "hookeline-crash-"));
afterAll(() => fs.rmSync(folder, { recursive: true, force: true }));

/** Starts the child and SIGKILLs it once its transaction has written into the WAL file, before it commits. */
function ingestAndKill(file: string): Promise<{ output: string; signal: NodeJS.Signals | null }> {
  return new Promise((resolve, reject) => {
    const child = spawn(process.execPath, ["--conditions=react-server", "--import", "tsx", "tests/integration/crash-child.ts"], { env: { ...process.env, DATABASE_URL: `file:${file}`, CRASH_BATCH: String(CRASH_BATCH) } });
    let output = "";
    let poll: NodeJS.Timeout | undefined;
    child.stdout.on("data", (chunk) => {
      output += chunk;
      if (!poll && output.includes("ingesting")) {
        const walBefore = fs.statSync(`${file}-wal`).size;
        // Pages spill to the WAL while the transaction runs; a commit would also print "stored".
        poll = setInterval(() => {
          if (fs.statSync(`${file}-wal`).size > walBefore + 1_000_000) child.kill("SIGKILL");
        }, 2);
      }
    });
    child.stderr.on("data", (chunk) => (output += chunk));
    child.on("error", reject);
    child.on("exit", (_code, signal) => {
      clearInterval(poll);
      resolve({ output, signal });
    });
  });
}

describe("crash safety", () => {
  it("a process killed in the middle of a batch leaves all of it or none of it, with roll-ups that agree", async () => {
    const file = path.join(folder, "crash.db");
    const { output, signal } = await ingestAndKill(file);
    expect(signal).toBe("SIGKILL");
    expect(output).not.toContain("stored");
    const client = createClient({ url: `file:${file}` });
    const count = Number((await client.execute("SELECT count(*) FROM readings")).rows[0]![0]);
    expect([0, CRASH_BATCH]).toContain(count);
    expect(await rollupMismatches(client)).toEqual([]);
    const rollupRows = Number((await client.execute("SELECT count(*) FROM rollups")).rows[0]![0]);
    expect(rollupRows === 0).toBe(count === 0);
    client.close();
  }, 60_000);
});
