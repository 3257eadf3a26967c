import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import * as drawingsRoute from "@/app/api/v1/structures/[code]/drawings/route";
import * as photosRoute from "@/app/api/v1/structures/[code]/gauges/[tag]/photos/route";
import * as placementRoute from "@/app/api/v1/structures/[code]/gauges/[tag]/placement/route";
import * as fileRoute from "@/app/api/v1/files/[id]/route";
import { getClient, getDb } from "@/db/client";
import { auditLog, files } from "@/db/schema";
import type { UserActor } from "@/lib/auth/actor";
import { parseWith } from "@/lib/validation";
import { gaugeInput } from "@/lib/gauges/schema";
import { createGauge, gaugeAuditTrail, getGauge } from "@/lib/services/gauges";
import { sweepFileStore, uploadDrawing } from "@/lib/services/files";
import { UPLOAD_LIMIT_BYTES } from "@/lib/storage/upload-rules";
import { SVG_DRAWING, TEXT_FILE, jpegImage, pngImage } from "../fixtures/images";
import { foilGaugeBody } from "../fixtures/gauges";
import { apiRequest, makeStructure, makeTeam, params } from "./helpers";

const storage = fs.mkdtempSync(path.join(os.tmpdir(), "hookeline-files-"));
process.env.FILE_STORAGE_DIR = storage;
afterAll(() => fs.rmSync(storage, { recursive: true, force: true }));
/** The files stored under keys; bytes are written in the incoming folder first and renamed when whole. */
const storedFiles = () => fs.readdirSync(storage).filter((name) => name !== ".incoming");

let tokens: Record<"engineer" | "technician" | "owner", string>;
let engineer: UserActor;

beforeAll(async () => {
  const team = await makeTeam("BR");
  ({ tokens } = team);
  engineer = team.users.engineer;
  await makeStructure("OTHER", [engineer]);
  await createGauge(engineer, "BR", parseWith(gaugeInput, foilGaugeBody("G1")));
  await createGauge(engineer, "OTHER", parseWith(gaugeInput, foilGaugeBody("G9")));
});

type Part = { bytes: Uint8Array; name: string; type: string };

function multipart(path: string, token: string | undefined, file: Part | null, fields: Record<string, string> = {}) {
  const form = new FormData();
  if (file) form.set("file", new File([Buffer.from(file.bytes)], file.name, { type: file.type }));
  for (const [name, value] of Object.entries(fields)) form.set(name, value);
  return new Request(`http://localhost/api/v1${path}`, { method: "POST", body: form, headers: token ? { authorization: `Bearer ${token}` } : {} });
}

const png: Part = { bytes: pngImage(40, 30), name: "elevation.png", type: "image/png" };
const jpeg: Part = { bytes: jpegImage(16, 8), name: "IMG_0042.JPG", type: "image/jpeg" };

const postDrawing = (token: string | undefined, file: Part | null, fields: Record<string, string> = { title: "North elevation" }, code = "BR") =>
  drawingsRoute.POST(multipart(`/structures/${code}/drawings`, token, file, fields), params({ code }));
const postPhoto = (token: string | undefined, file: Part | null, tag = "G1") =>
  photosRoute.POST(multipart(`/structures/BR/gauges/${tag}/photos`, token, file), params({ code: "BR", tag }));
const getFile = (token: string, id: number) => fileRoute.GET(apiRequest(`/files/${id}`, { token }), params({ id: String(id) }));
const place = (token: string, body: unknown, tag = "G1") =>
  placementRoute.PUT(apiRequest(`/structures/BR/gauges/${tag}/placement`, { token, body, method: "PUT" }), params({ code: "BR", tag }));

async function errorOf(response: Response) {
  return (await response.json()).error as { code: string; message: string };
}

let drawingId: number;

describe("uploading", () => {
  it("lets a technician upload a PNG drawing, lists it and serves its bytes as PNG with nosniff", async () => {
    const response = await postDrawing(tokens.technician, png);
    expect(response.status).toBe(201);
    const drawing = await response.json();
    expect(drawing).toMatchObject({ kind: "drawing", title: "North elevation", contentType: "image/png", width: 40, height: 30, bytes: png.bytes.length });
    drawingId = drawing.id;

    const list = await (await drawingsRoute.GET(apiRequest("/structures/BR/drawings", { token: tokens.owner }), params({ code: "BR" }))).json();
    expect(list.drawings.map((d: { id: number }) => d.id)).toEqual([drawingId]);

    const served = await getFile(tokens.owner, drawingId);
    expect(served.status).toBe(200);
    expect(served.headers.get("content-type")).toBe("image/png");
    expect(served.headers.get("x-content-type-options")).toBe("nosniff");
    expect(new Uint8Array(await served.arrayBuffer())).toEqual(png.bytes);
  });

  it("lets a technician upload a JPEG installation photo of a gauge, recorded in the gauge's audit trail", async () => {
    const response = await postPhoto(tokens.technician, jpeg);
    expect(response.status).toBe(201);
    expect(await response.json()).toMatchObject({ kind: "photo", gauge: "G1", contentType: "image/jpeg", width: 16, height: 8, title: "Installation photo of G1" });
    const list = await (await photosRoute.GET(apiRequest("/structures/BR/gauges/G1/photos", { token: tokens.owner }), params({ code: "BR", tag: "G1" }))).json();
    expect(list.photos).toHaveLength(1);
    const [latest] = await gaugeAuditTrail(engineer, "BR", "G1");
    expect(latest).toMatchObject({ action: "gauge.photo.upload", actorLabel: "technician@test.example", after: { contentType: "image/jpeg", width: 16, height: 8 } });
  });

  it("keeps the stored name out of the user's hands: the key is made by the server", async () => {
    const rows = await getDb().select({ key: files.storageKey }).from(files);
    expect(rows.map((r) => r.key).sort()).toEqual(storedFiles().sort());
    for (const { key } of rows) expect(key).toMatch(/^[0-9a-f]{32}\.(png|jpg)$/);
    // Every upload's bytes were renamed into place whole: nothing waits in the incoming folder.
    expect(fs.readdirSync(path.join(storage, ".incoming"))).toEqual([]);
  });

  it.each([
    ["a text file named .png", { bytes: TEXT_FILE, name: "drawing.png", type: "image/png" }, /Only PNG, JPEG or WebP images are accepted/],
    ["an SVG", { bytes: SVG_DRAWING, name: "plan.svg", type: "image/svg+xml" }, /SVG files are not accepted because they can carry scripts/],
  ])("refuses %s with 415 and the reason", async (_what, file, reason) => {
    const before = storedFiles().length;
    const response = await postDrawing(tokens.technician, file);
    expect(response.status).toBe(415);
    expect(await errorOf(response)).toMatchObject({ code: "unsupported_media_type", message: expect.stringMatching(reason) });
    expect(storedFiles()).toHaveLength(before);
  });

  it("refuses a photo over 10 MB with 413 naming the limit, by the body and by the file", async () => {
    const padded = (size: number): Part => {
      const bytes = new Uint8Array(size);
      bytes.set(png.bytes);
      return { bytes, name: "big.png", type: "image/png" };
    };
    const justOver = await postPhoto(tokens.technician, padded(UPLOAD_LIMIT_BYTES.photo + 1));
    expect(justOver.status).toBe(413);
    expect((await errorOf(justOver)).message).toBe("Photos may be at most 10 MB; this file is 10.01 MB.");
    const farOver = await postPhoto(tokens.technician, padded(11_000_000));
    expect(farOver.status).toBe(413);
    expect((await errorOf(farOver)).message).toContain("10 MB");
  });

  it("explains a missing title, a missing file and a body that is not multipart", async () => {
    const untitled = await postDrawing(tokens.technician, png, { title: "  " });
    expect(untitled.status).toBe(400);
    expect((await errorOf(untitled)).message).toContain("Give the drawing a title");
    const noFile = await postDrawing(tokens.technician, null);
    expect(noFile.status).toBe(400);
    expect((await errorOf(noFile)).message).toContain('form field "file"');
    const asJson = await drawingsRoute.POST(apiRequest("/structures/BR/drawings", { token: tokens.technician, body: { title: "x" } }), params({ code: "BR" }));
    expect(asJson.status).toBe(415);
  });

  it("refuses an owner (403), hides another structure (404) and its files (404)", async () => {
    expect((await postDrawing(tokens.owner, png)).status).toBe(403);
    expect((await postPhoto(tokens.owner, jpeg)).status).toBe(403);
    expect((await postDrawing(tokens.technician, png, undefined, "OTHER")).status).toBe(404);
    const hidden = await uploadDrawing(engineer, "OTHER", { bytes: png.bytes, fields: { title: "Plan" } });
    const response = await getFile(tokens.technician, hidden.id);
    expect(response.status).toBe(404);
    expect((await errorOf(response)).message).toBe(`File ${hidden.id} was not found.`);
    expect((await getFile(tokens.engineer, hidden.id)).status).toBe(200);
  });
});

describe("nothing half-saved", () => {
  it("removes the stored bytes when the database refuses the row", async () => {
    const client = getClient();
    await client.execute("CREATE TRIGGER refuse_files BEFORE INSERT ON files BEGIN SELECT RAISE(ABORT, 'refused by test'); END");
    const before = storedFiles();
    try {
      await expect(uploadDrawing(engineer, "BR", { bytes: png.bytes, fields: { title: "Plan" } })).rejects.toThrow();
    } finally {
      await client.execute("DROP TRIGGER refuse_files");
    }
    expect(storedFiles()).toEqual(before);
  });

  it("writes no row when the bytes cannot be stored", async () => {
    const blocker = path.join(storage, "not-a-folder");
    fs.writeFileSync(blocker, "");
    process.env.FILE_STORAGE_DIR = blocker;
    const rowsBefore = (await getDb().select({ id: files.id }).from(files)).length;
    try {
      await expect(uploadDrawing(engineer, "BR", { bytes: png.bytes, fields: { title: "Plan" } })).rejects.toThrow();
    } finally {
      process.env.FILE_STORAGE_DIR = storage;
      fs.rmSync(blocker);
    }
    expect(await getDb().select({ id: files.id }).from(files)).toHaveLength(rowsBefore);
  });
});

describe("what an interrupted upload leaves", () => {
  it("is swept once older than any upload takes; stored files, young leftovers and files not of the store's shape stay", async () => {
    const kept = await uploadDrawing(engineer, "BR", { bytes: png.bytes, fields: { title: "Kept plan" } });
    const [row] = await getDb().select({ storageKey: files.storageKey }).from(files).where(eq(files.id, kept.id));
    const now = Date.now();
    const plant = (name: string, ageMs: number) => {
      const file = path.join(storage, name);
      fs.mkdirSync(path.dirname(file), { recursive: true });
      fs.writeFileSync(file, "left behind");
      fs.utimesSync(file, new Date(now - ageMs), new Date(now - ageMs));
    };
    // As a process killed between storing the bytes and committing the row leaves them, an hour ago and just now.
    plant(`${"a".repeat(32)}.png`, 60 * 60_000);
    plant(`${"b".repeat(32)}.jpg`, 1_000);
    // Half an upload's bytes in the incoming folder, an hour ago; and something the store never wrote.
    plant(`.incoming/${"c".repeat(32)}.webp`, 60 * 60_000);
    plant("README.txt", 60 * 60_000);
    fs.utimesSync(path.join(storage, row!.storageKey), new Date(now - 60 * 60_000), new Date(now - 60 * 60_000));

    expect(await sweepFileStore(now)).toMatch(/, 2 leftovers removed$/);
    const left = storedFiles();
    expect(left).toContain(row!.storageKey);
    expect(left).toContain(`${"b".repeat(32)}.jpg`);
    expect(left).toContain("README.txt");
    expect(left).not.toContain(`${"a".repeat(32)}.png`);
    expect(fs.readdirSync(path.join(storage, ".incoming"))).toEqual([]);
    expect(await (await getFile(tokens.engineer, kept.id)).arrayBuffer()).toEqual(Buffer.from(png.bytes).buffer.slice(0));
    fs.rmSync(path.join(storage, `${"b".repeat(32)}.jpg`));
    fs.rmSync(path.join(storage, "README.txt"));
  });
});

describe("placing gauges on drawings", () => {
  it("places a gauge, records old → new, and takes it off again", async () => {
    const response = await place(tokens.technician, { drawingId, x: 0.25, y: 0.75 });
    expect(response.status).toBe(200);
    expect((await response.json()).drawing).toEqual({ id: drawingId, x: 0.25, y: 0.75 });
    await place(tokens.technician, { drawingId, x: 0.5, y: 0.5 });
    const [moved] = await gaugeAuditTrail(engineer, "BR", "G1");
    expect(moved).toMatchObject({ action: "gauge.place", entityKey: "BR/G1", before: { drawing: { id: drawingId, x: 0.25, y: 0.75 } }, after: { drawing: { id: drawingId, x: 0.5, y: 0.5 } } });

    const removed = await place(tokens.technician, { drawingId: null });
    expect((await removed.json()).drawing).toBeNull();
  });

  it.each([
    [{ drawingId: 1, x: 1.2, y: 0.5 }, "x is a fraction of the drawing's width: use 0 to 1."],
    [{ drawingId: 1, x: 0.2, y: -0.1 }, "y is a fraction of the drawing's height: use 0 to 1."],
    [{ x: 0.2, y: 0.1 }, "Send { drawingId, x, y }"],
  ])("refuses a bad placement with 400 saying what to fix: %#", async (body, message) => {
    const response = await place(tokens.technician, body);
    expect(response.status).toBe(400);
    expect((await errorOf(response)).message).toContain(message);
  });

  it("refuses a drawing of another structure with 400, without saying whether it exists", async () => {
    const [other] = await getDb().select({ id: files.id }).from(files).where(eq(files.title, "Plan"));
    const response = await place(tokens.engineer, { drawingId: other!.id, x: 0.5, y: 0.5 });
    expect(response.status).toBe(400);
    expect((await errorOf(response)).message).toBe(`Structure BR has no drawing ${other!.id}; choose one of its own drawings.`);
  });

  it("refuses an owner with 403", async () => {
    expect((await place(tokens.owner, { drawingId, x: 0.5, y: 0.5 })).status).toBe(403);
  });
});

describe("deleting", () => {
  it("refuses an owner, then deletes a drawing: its bytes go and gauges placed on it come off, with audit rows", async () => {
    await place(tokens.technician, { drawingId, x: 0.1, y: 0.2 });
    const del = (token: string) => fileRoute.DELETE(apiRequest(`/files/${drawingId}`, { token, method: "DELETE" }), params({ id: String(drawingId) }));
    expect((await del(tokens.owner)).status).toBe(403);
    const storedBefore = storedFiles().length;
    expect((await del(tokens.technician)).status).toBe(204);
    expect(storedFiles()).toHaveLength(storedBefore - 1);
    expect((await getFile(tokens.technician, drawingId)).status).toBe(404);
    expect((await getGauge(engineer, "BR", "G1")).drawing).toBeNull();

    const actions = (await getDb().select({ action: auditLog.action }).from(auditLog)).map((row) => row.action);
    expect(actions).toEqual(expect.arrayContaining(["structure.drawing.upload", "structure.drawing.delete", "gauge.photo.upload", "gauge.place"]));
    const [unplaced] = await gaugeAuditTrail(engineer, "BR", "G1");
    expect(unplaced).toMatchObject({ action: "gauge.place", after: { drawing: null, reason: 'drawing "North elevation" deleted' } });
  });

  it("answers 400 for a file id that is not a number", async () => {
    const response = await fileRoute.GET(apiRequest("/files/abc", { token: tokens.owner }), params({ id: "abc" }));
    expect(response.status).toBe(400);
  });
});
