import { describe, expect, it } from "vitest";
import { getClient } from "@/db/client";
import { UPLOAD_BATCH_ROWS } from "@/lib/services/ingest";
import { loggerToken, makeUser } from "../integration/helpers";
import { makeIngestStructure, rollupMismatches, storedCount, strainReadings } from "../integration/readings-fixtures";
import { faultDatabase, quickCheck } from "./fault-database";

// Twelve of the upload's batches: enough that a kill after the second report lands inside the file.
const ROWS = 12 * UPLOAD_BATCH_ROWS;
const database = await faultDatabase("csv-upload-kill");
await makeIngestStructure("FILE", [await makeUser("engineer")]);
const token = await loggerToken("FILE");
const file =
  "gauge,time,value,temperature\n" +
  strainReadings(Date.UTC(2025, 0, 1), ROWS, 1_000, (i) => (i % 400) - 200)
    .map((reading) => `${reading.gauge},${reading.time},${reading.value},20`)
    .join("\n") +
  "\n";

type Line = { type: string; accepted?: number; duplicates?: number; rows?: number };

function upload(baseUrl: string) {
  return fetch(`${baseUrl}/api/v1/structures/FILE/uploads?timezone=UTC`, {
    method: "POST",
    headers: { authorization: `Bearer ${token}`, "content-type": "text/csv" },
    body: file,
  });
}

/** The NDJSON lines of an upload's answer, handed over as they arrive. */
async function* answerLines(response: Response): AsyncGenerator<Line> {
  const decoder = new TextDecoder();
  let pending = "";
  const reader = response.body!.getReader();
  for (let chunk = await reader.read(); !chunk.done; chunk = await reader.read()) {
    pending += decoder.decode(chunk.value, { stream: true });
    const lines = pending.split("\n");
    pending = lines.pop()!;
    for (const line of lines) if (line.trim()) yield JSON.parse(line) as Line;
  }
}

describe("the app process killed in the middle of a logger-file upload", () => {
  it("keeps every batch it reported whole, none half, and sending the file again completes it without duplicates", async () => {
    const first = await database.startServer({ jobs: false });
    const response = await upload(first.baseUrl);
    expect(response.status, first.output()).toBe(200);
    let reported = 0;
    try {
      for await (const line of answerLines(response)) {
        expect(line.type, JSON.stringify(line)).not.toBe("error");
        if (line.type !== "progress") continue;
        reported = line.accepted!;
        if (reported >= 2 * UPLOAD_BATCH_ROWS) break;
      }
    } finally {
      await first.stop("SIGKILL");
    }
    expect(reported, "the server reported two batches before it was killed").toBeGreaterThanOrEqual(2 * UPLOAD_BATCH_ROWS);

    expect(await quickCheck()).toBe("ok");
    const survived = await storedCount("FILE");
    console.log(`Killed during a ${ROWS}-row file upload after ${reported} readings were reported stored: ${survived} on the file.`);
    // Each batch is one transaction: what survives is whole batches, at least those already reported.
    expect(survived % UPLOAD_BATCH_ROWS).toBe(0);
    expect(survived).toBeGreaterThanOrEqual(reported);
    expect(survived).toBeLessThan(ROWS);
    expect(await rollupMismatches(getClient())).toEqual([]);

    const second = await database.startServer({ jobs: false });
    const resend = await upload(second.baseUrl);
    expect(resend.status, second.output()).toBe(200);
    const lines: Line[] = [];
    for await (const line of answerLines(resend)) lines.push(line);
    expect(lines.at(-1)).toMatchObject({ type: "done", rows: ROWS, accepted: ROWS - survived, duplicates: survived, rejected: 0 });
    expect(await storedCount("FILE")).toBe(ROWS);
    expect(await rollupMismatches(getClient())).toEqual([]);
    expect(await quickCheck()).toBe("ok");
  }, 120_000);
});
