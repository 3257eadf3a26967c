import fs from "node:fs";
import path from "node:path";
import { eq } from "drizzle-orm";
import { describe, expect, it } from "vitest";
import { getDb } from "@/db/client";
import { auditLog, files } from "@/db/schema";
import { createGauge } from "@/lib/services/gauges";
import { FILE_SWEEP_GRACE_MS } from "@/lib/services/files";
import { pngImage } from "../fixtures/images";
import { microstrainGauge } from "../fixtures/gauges";
import { makeStructure, makeUser, userToken } from "../integration/helpers";
import { faultDatabase, quickCheck } from "./fault-database";

const database = await faultDatabase("photo-upload-kill");
const store = path.join(path.dirname(database.file), "files");
const incoming = path.join(store, ".incoming");
const engineer = await makeUser("engineer");
await makeStructure("SNAP", [engineer]);
await createGauge(engineer, "SNAP", microstrainGauge("G1"));
const token = await userToken(engineer.email);

// About 8 MB of incompressible pixels (a linear congruential sequence), under the 10 MB photo limit:
// receiving, checking and writing it keeps the server busy long enough for a kill to land inside.
let seed = 7;
const noise = () => (seed = (seed * 1_103_515_245 + 12_345) % 2_147_483_648) >> 23;
const photo = pngImage(1_650, 1_650, () => [noise(), noise(), noise()]);

function upload(baseUrl: string) {
  const form = new FormData();
  form.set("file", new File([Buffer.from(photo)], "IMG_2041.PNG", { type: "image/png" }));
  return fetch(`${baseUrl}/api/v1/structures/SNAP/gauges/G1/photos`, { method: "POST", headers: { authorization: `Bearer ${token}` }, body: form });
}

const keysInStore = () => (fs.existsSync(store) ? fs.readdirSync(store).filter((name) => name !== ".incoming") : []);
const partsIncoming = () => (fs.existsSync(incoming) ? fs.readdirSync(incoming) : []);

type Moment = "as the request is sent" | "while its bytes are written" | "once its bytes are in place";

/** The moment's sign on disk; polled every millisecond, since the steps take a few milliseconds each. */
const reached: Record<Moment, () => boolean> = {
  "as the request is sent": () => true,
  "while its bytes are written": () => partsIncoming().length > 0,
  "once its bytes are in place": () => keysInStore().length > storedRowsBefore,
};
let storedRowsBefore = 0;

/** SIGKILLs the server at `moment` of an upload (or once it answered, if it got there first). */
async function uploadAndKill(server: Awaited<ReturnType<typeof database.startServer>>, moment: Moment): Promise<"answered" | "killed"> {
  let answered = false;
  const request = upload(server.baseUrl).then(
    async (response) => {
      await response.arrayBuffer();
      answered = true;
    },
    () => undefined,
  );
  await new Promise<void>((resolve) => {
    const poll = setInterval(() => {
      if (answered || reached[moment]()) {
        clearInterval(poll);
        resolve();
      }
    }, 1);
  });
  await server.stop("SIGKILL");
  await request;
  return answered ? "answered" : "killed";
}

const photoRows = () => getDb().select().from(files).where(eq(files.kind, "photo"));

/** Every row's bytes are the photo, whole, and every row has its audit entry: the row and its file exist together. */
async function checkRowsWhole() {
  const rows = await photoRows();
  for (const row of rows) {
    const stored = fs.readFileSync(path.join(store, row.storageKey));
    expect(stored.equals(Buffer.from(photo)), `row ${row.id}'s bytes`).toBe(true);
    expect(row.bytes).toBe(photo.byteLength);
  }
  const audits = await getDb().select().from(auditLog).where(eq(auditLog.action, "gauge.photo.upload"));
  expect(audits).toHaveLength(rows.length);
  return rows;
}

/** The next start comes later than any upload takes: what the killed process left is older than the sweep's grace. */
function ageStore() {
  const past = new Date(Date.now() - 2 * FILE_SWEEP_GRACE_MS);
  for (const name of keysInStore()) fs.utimesSync(path.join(store, name), past, past);
  for (const name of partsIncoming()) fs.utimesSync(path.join(incoming, name), past, past);
}

describe("the app process killed in the middle of a photo upload", () => {
  it("stores the photo whole with its row or not at all, and the next start leaves the file store agreeing with the database", async () => {
    const moments: Moment[] = ["as the request is sent", "while its bytes are written", "once its bytes are in place"];
    let server = await database.startServer({ jobs: false });
    const outcomes: string[] = [];
    for (const moment of moments) {
      storedRowsBefore = (await photoRows()).length;
      const outcome = await uploadAndKill(server, moment);
      // What the next process finds on disk before it starts.
      expect(await quickCheck()).toBe("ok");
      const rows = await checkRowsWhole();
      expect([storedRowsBefore, storedRowsBefore + 1]).toContain(rows.length);
      const orphans = keysInStore().filter((key) => !rows.some((row) => row.storageKey === key));
      outcomes.push(`${moment}: ${outcome}, ${rows.length - storedRowsBefore} row stored, ${orphans.length} file without a row, ${partsIncoming().length} part left`);

      ageStore();
      server = await database.startServer({ jobs: false });
      expect(server.output()).toMatch(/File store: \d+ stored files referenced, \d+ leftovers removed/);
      expect(keysInStore().sort()).toEqual(rows.map((row) => row.storageKey).sort());
      expect(partsIncoming()).toEqual([]);
    }
    console.log(`Killed during photo uploads:\n  ${outcomes.join("\n  ")}`);
    // Sent before anything could be stored, the first upload cannot have been answered.
    expect(outcomes[0]).toMatch(/: killed, 0 row stored/);

    // The photographer sends it again: stored once more, whole, and served.
    const before = (await photoRows()).length;
    const resend = await upload(server.baseUrl);
    expect(resend.status, server.output()).toBe(201);
    const { id } = (await resend.json()) as { id: number };
    const rows = await checkRowsWhole();
    expect(rows).toHaveLength(before + 1);
    expect(keysInStore().sort()).toEqual(rows.map((row) => row.storageKey).sort());
    const served = await fetch(`${server.baseUrl}/api/v1/files/${id}`, { headers: { authorization: `Bearer ${token}` } });
    expect(served.status).toBe(200);
    expect(Buffer.from(await served.arrayBuffer()).equals(Buffer.from(photo))).toBe(true);
    expect(await quickCheck()).toBe("ok");
  }, 180_000);
});
