import "server-only";
import { and, asc, eq } from "drizzle-orm";
import { getDb, writeTransaction, type WriteTx } from "@/db/client";
import { files, gauges, structures, type FileKind, type Gauge, type StoredFile, type Structure } from "@/db/schema";
import type { Actor } from "@/lib/auth/actor";
import { may, requirePermission } from "@/lib/auth/authorize";
import { parseWith } from "@/lib/validation";
import { AppError } from "@/lib/errors";
import { drawingFields, photoFields, type PlacementInput } from "@/lib/files/schema";
import { deleteFile, readFile, saveFile, sweepStore } from "@/lib/storage/file-store";
import { checkUpload } from "@/lib/storage/upload-rules";
import { recordAudit } from "./audit";
import { gaugeKey, getGauge, resolveGauge, type GaugeView } from "./gauges";
import { getVisibleStructure } from "./structures";

/** An uploaded image as the API and the pages show it; the bytes are at `url`. */
export type FileView = {
  id: number;
  kind: FileKind;
  title: string;
  contentType: string;
  bytes: number;
  width: number | null;
  height: number | null;
  /** Tag of the gauge a photo shows; null for drawings. */
  gauge: string | null;
  url: string;
  createdAt: string;
};

/** What a route handler read from a multipart upload. */
export type UploadRequest = { bytes: Uint8Array; fields: Record<string, string> };


const fileUrl = (id: number) => `/api/v1/files/${id}`;

export function toFileView(row: StoredFile, gaugeTag: string | null): FileView {
  return {
    id: row.id,
    kind: row.kind,
    title: row.title,
    contentType: row.contentType,
    bytes: row.bytes,
    width: row.width,
    height: row.height,
    gauge: gaugeTag,
    url: fileUrl(row.id),
    createdAt: row.createdAt.toISOString(),
  };
}

export const auditedFile = (row: StoredFile) => ({ id: row.id, title: row.title, contentType: row.contentType, bytes: row.bytes, width: row.width, height: row.height });

/** A file to store: its kind, its title, its bytes and, for a gauge's photo, the gauge. */
export type NewUpload = { kind: FileKind; title: string; bytes: Uint8Array; gauge?: Gauge | null };

/**
 * Checks every file's content (all before any is stored, so a bad third photo stores nothing),
 * stores the bytes, then records the rows and whatever `write` adds (the record they belong to,
 * its audit entry) in one transaction. Nothing is left half-saved: a failed write leaves no row,
 * and a failed transaction removes the stored bytes.
 */
export async function storeUploads<T>(actor: Actor, structure: Structure, uploads: NewUpload[], write: (tx: WriteTx, rows: StoredFile[]) => Promise<T>): Promise<T> {
  const checked = uploads.map((upload) => ({ upload, info: checkUpload(upload.bytes, upload.kind) }));
  const keys: string[] = [];
  try {
    for (const { upload, info } of checked) keys.push(await saveFile(upload.bytes, info.type));
    return await writeTransaction(async (tx) => {
      const rows: StoredFile[] = [];
      for (const [i, { upload, info }] of checked.entries()) {
        const [row] = await tx
          .insert(files)
          .values({
            structureId: structure.id,
            gaugeId: upload.gauge?.id ?? null,
            kind: upload.kind,
            title: upload.title,
            storageKey: keys[i]!,
            contentType: info.type,
            bytes: upload.bytes.byteLength,
            width: info.width,
            height: info.height,
            uploadedById: actor.kind === "user" ? actor.id : null,
          })
          .returning();
        rows.push(row!);
      }
      return write(tx, rows);
    });
  } catch (error) {
    await Promise.all(keys.map((key) => deleteFile(key)));
    throw error;
  }
}

export async function uploadDrawing(actor: Actor, code: string, upload: UploadRequest): Promise<FileView> {
  const structure = await getVisibleStructure(actor, code);
  await requirePermission(actor, "gauge:register", structure);
  const { title } = parseWith(drawingFields, upload.fields);
  const row = await storeUploads(actor, structure, [{ kind: "drawing", title, bytes: upload.bytes }], async (tx, [row]) => {
    await recordAudit(tx, { actor, action: "structure.drawing.upload", entityType: "structure", entityKey: structure.code, structureId: structure.id, after: auditedFile(row!) });
    return row!;
  });
  return toFileView(row, null);
}

export async function uploadGaugePhoto(actor: Actor, code: string, tag: string, upload: UploadRequest): Promise<FileView> {
  const { structure, gauge } = await resolveGauge(actor, code, tag, "gauge:register");
  const title = parseWith(photoFields, upload.fields).title ?? `Installation photo of ${gauge.tag}`;
  const row = await storeUploads(actor, structure, [{ kind: "photo", title, bytes: upload.bytes, gauge }], async (tx, [row]) => {
    await recordAudit(tx, { actor, action: "gauge.photo.upload", entityType: "gauge", entityKey: gaugeKey(structure, gauge.tag), structureId: structure.id, after: auditedFile(row!) });
    return row!;
  });
  return toFileView(row, gauge.tag);
}

export async function listDrawings(actor: Actor, code: string): Promise<FileView[]> {
  const structure = await getVisibleStructure(actor, code);
  await requirePermission(actor, "structure:view", structure);
  const rows = await getDb()
    .select()
    .from(files)
    .where(and(eq(files.structureId, structure.id), eq(files.kind, "drawing")))
    .orderBy(asc(files.createdAt), asc(files.id));
  return rows.map((row) => toFileView(row, null));
}

/** A gauge's installation photos, oldest first; pages may call it to hand GaugePhotos its first list. */
export async function listGaugePhotos(actor: Actor, code: string, tag: string): Promise<FileView[]> {
  const { gauge } = await resolveGauge(actor, code, tag, "structure:view");
  const rows = await getDb()
    .select()
    .from(files)
    .where(and(eq(files.gaugeId, gauge.id), eq(files.kind, "photo")))
    .orderBy(asc(files.createdAt), asc(files.id));
  return rows.map((row) => toFileView(row, gauge.tag));
}

const fileNotFound = (id: number) => new AppError("not_found", `File ${id} was not found.`);

/** The file and its structure, if the actor may see that structure; otherwise the same 404 as a missing file. */
async function visibleFile(actor: Actor, id: number) {
  const [found] = await getDb()
    .select({ file: files, structure: structures, gaugeTag: gauges.tag })
    .from(files)
    .innerJoin(structures, eq(structures.id, files.structureId))
    .leftJoin(gauges, eq(gauges.id, files.gaugeId))
    .where(eq(files.id, id))
    .limit(1);
  if (!found || !(await may(actor, "structure:view", found.structure))) throw fileNotFound(id);
  return found;
}

/** One drawing of the structure, for the drawing page. */
export async function getDrawing(actor: Actor, code: string, id: number): Promise<FileView> {
  const { file, structure } = await visibleFile(actor, id);
  if (file.kind !== "drawing" || structure.code !== code) throw fileNotFound(id);
  return toFileView(file, null);
}

/** The stored bytes of a file the actor may see, with what to serve them as. */
export async function openFile(actor: Actor, id: number) {
  const { file } = await visibleFile(actor, id);
  return openStored(file);
}

/** The bytes of a stored file row the caller has already been allowed to read. */
export async function openStored(file: StoredFile) {
  const stream = await readFile(file.storageKey);
  if (!stream) throw new AppError("not_found", `The bytes of file ${file.id} are missing from storage; upload it again.`);
  return { contentType: file.contentType, bytes: file.bytes, stream };
}

type Placement = { id: number; x: number; y: number } | null;

const placementOf = (gauge: Gauge): Placement =>
  gauge.drawingId != null && gauge.drawingX != null && gauge.drawingY != null ? { id: gauge.drawingId, x: gauge.drawingX, y: gauge.drawingY } : null;

async function writePlacement(tx: WriteTx, actor: Actor, structure: Pick<Structure, "id" | "code">, gauge: Gauge, after: Placement, reason?: string) {
  await tx
    .update(gauges)
    .set({ drawingId: after?.id ?? null, drawingX: after?.x ?? null, drawingY: after?.y ?? null, updatedAt: new Date() })
    .where(eq(gauges.id, gauge.id));
  await recordAudit(tx, {
    actor,
    action: "gauge.place",
    entityType: "gauge",
    entityKey: gaugeKey(structure, gauge.tag),
    structureId: structure.id,
    before: { drawing: placementOf(gauge) },
    after: { drawing: after, ...(reason ? { reason } : {}) },
  });
}

/** Deletes a photo or a drawing; gauges placed on a deleted drawing come off it, each with its own audit entry. */
export async function removeFile(actor: Actor, id: number): Promise<void> {
  const { file, structure, gaugeTag } = await visibleFile(actor, id);
  await requirePermission(actor, "gauge:register", structure);
  if (file.kind === "certificate" || file.kind === "visit-photo") {
    // A field record is evidence of what was done on site: its files stay with it.
    throw new AppError("conflict", `File ${id} belongs to a ${file.kind === "certificate" ? "calibration certificate" : "site visit"} and is kept with that record; it cannot be deleted on its own.`);
  }
  await writeTransaction(async (tx) => {
    await tx.delete(files).where(eq(files.id, file.id));
    if (file.kind === "drawing") {
      const placed = await tx.select().from(gauges).where(eq(gauges.drawingId, file.id));
      for (const gauge of placed) await writePlacement(tx, actor, structure, gauge, null, `drawing "${file.title}" deleted`);
    }
    const subject = gaugeTag
      ? { action: "gauge.photo.delete", entityType: "gauge", entityKey: gaugeKey(structure, gaugeTag) }
      : { action: "structure.drawing.delete", entityType: "structure", entityKey: structure.code };
    await recordAudit(tx, { actor, ...subject, structureId: structure.id, before: auditedFile(file) });
  });
  // The row is gone first, so no reader can be sent to missing bytes; a leftover file is harmless.
  await deleteFile(file.storageKey).catch((error: unknown) => console.error(`Could not remove stored file ${file.storageKey}`, error));
}

/** Puts a gauge on one of its structure's drawings at fractions of the drawing's width and height, or takes it off. */
export async function placeGauge(actor: Actor, code: string, tag: string, input: PlacementInput): Promise<GaugeView> {
  const { structure, gauge } = await resolveGauge(actor, code, tag, "gauge:register");
  const after: Placement = input.drawingId === null ? null : { id: input.drawingId, x: input.x, y: input.y };
  if (JSON.stringify(after) === JSON.stringify(placementOf(gauge))) return getGauge(actor, code, tag);
  await writeTransaction(async (tx) => {
    if (after) {
      // Checked inside the transaction so a drawing deleted meanwhile cannot be pointed at.
      const [drawing] = await tx
        .select({ id: files.id })
        .from(files)
        .where(and(eq(files.id, after.id), eq(files.structureId, structure.id), eq(files.kind, "drawing")))
        .limit(1);
      if (!drawing) {
        throw new AppError("validation_failed", `Structure ${structure.code} has no drawing ${after.id}; choose one of its own drawings.`, {
          field: "drawingId",
          issues: [{ path: "drawingId", message: `Structure ${structure.code} has no drawing ${after.id}.` }],
        });
      }
    }
    await writePlacement(tx, actor, structure, gauge, after);
  });
  return getGauge(actor, code, tag);
}

/** Far longer than any upload takes between storing its bytes and committing its row. */
export const FILE_SWEEP_GRACE_MS = 10 * 60_000;

/**
 * Makes the file store agree with the files table again: bytes that no row refers to (a process
 * killed between storing an upload and committing its row, or between deleting a row and its
 * bytes) and parts of interrupted writes go, once older than the grace. A system task, no actor.
 */
export async function sweepFileStore(now = Date.now()): Promise<string> {
  const rows = await getDb().select({ storageKey: files.storageKey }).from(files);
  const removed = await sweepStore(new Set(rows.map((row) => row.storageKey)), now - FILE_SWEEP_GRACE_MS);
  return `${rows.length} stored files referenced, ${removed.length} leftovers removed`;
}
