import fs from "node:fs";
import { describe, expect, it } from "vitest";
import { getClient } from "@/db/client";
import { loggerToken, makeUser } from "../integration/helpers";
import { makeIngestStructure, rollupMismatches, storedCount, strainReadings } from "../integration/readings-fixtures";
import { faultDatabase, quickCheck } from "./fault-database";

// The contract's largest request: the longest transaction, so the kill lands inside it.
const BATCH = 50_000;
const database = await faultDatabase("upload-kill");
await makeIngestStructure("KILL", [await makeUser("engineer")]);
const token = await loggerToken("KILL");
// A year after the gauges' zero and long past: stored, evaluated, mailed through the digest only.
const body = JSON.stringify({ readings: strainReadings(Date.UTC(2025, 0, 1), BATCH, 1_000, (i) => (i % 400) - 200) });

function upload(baseUrl: string) {
  return fetch(`${baseUrl}/api/v1/structures/KILL/readings`, {
    method: "POST",
    headers: { authorization: `Bearer ${token}`, "content-type": "application/json" },
    body,
  });
}

/**
 * SIGKILLs the server once the upload's transaction has written well past the few pages that
 * noting the token's use takes: its pages spill into the WAL file before the commit frame is
 * written. Answers whether the server had answered before it died.
 */
async function uploadAndKill(server: Awaited<ReturnType<typeof database.startServer>>): Promise<"answered" | "killed"> {
  const wal = `${database.file}-wal`;
  const walBefore = fs.statSync(wal).size;
  let answered = false;
  const request = upload(server.baseUrl).then(
    async (response) => {
      await response.text();
      answered = true;
    },
    () => undefined,
  );
  await new Promise<void>((resolve) => {
    const poll = setInterval(() => {
      if (answered || fs.statSync(wal).size > walBefore + 512 * 1024) {
        clearInterval(poll);
        resolve();
      }
    }, 2);
  });
  await server.stop("SIGKILL");
  await request;
  return answered ? "answered" : "killed";
}

describe("the app process killed in the middle of an upload", () => {
  it("stores the batch whole or not at all, and the logger's resend completes it without duplicates", async () => {
    const first = await database.startServer({ jobs: false });
    expect(await uploadAndKill(first)).toBe("killed");

    // What the next process finds on the file, before it serves anything.
    expect(await quickCheck()).toBe("ok");
    const survived = await storedCount("KILL");
    expect([0, BATCH]).toContain(survived);
    console.log(`Killed during the upload: ${survived === 0 ? "none" : "all"} of the ${BATCH} readings on the file after the kill.`);
    expect(await rollupMismatches(getClient())).toEqual([]);

    const second = await database.startServer({ jobs: false });
    const resend = await upload(second.baseUrl);
    expect(resend.status, second.output()).toBe(200);
    const answer = (await resend.json()) as { accepted: number; duplicates: number; rejected: unknown[] };
    expect(answer).toMatchObject({ accepted: BATCH - survived, duplicates: survived, rejected: [] });
    expect(await storedCount("KILL")).toBe(BATCH);
    expect(await rollupMismatches(getClient())).toEqual([]);
    expect(await quickCheck()).toBe("ok");
  }, 120_000);
});
