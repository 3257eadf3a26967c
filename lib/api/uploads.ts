import type { FileKind } from "@/db/schema";
import { AppError } from "@/lib/errors";
import { UPLOAD_LIMIT_BYTES } from "@/lib/storage/upload-rules";
import { MAX_VISIT_PHOTOS } from "@/lib/field-records/site-visits";
import { contentType, readFormData, readJson } from "./http";
import { z } from "zod";

// Room for the multipart boundaries, part headers and the title around the file itself.
const MULTIPART_ALLOWANCE_BYTES = 64_000;

export type Upload = { bytes: Uint8Array; fields: Record<string, string> };

/** The `file` part of a multipart upload and its text fields; the file's content is checked by the service. */
export async function readUpload(request: Request, kind: FileKind): Promise<Upload> {
  const form = await readFormData(request, UPLOAD_LIMIT_BYTES[kind] + MULTIPART_ALLOWANCE_BYTES);
  const file = form.get("file");
  if (!(file instanceof Blob)) {
    throw new AppError("bad_request", `Attach the ${kind === "certificate" ? "certificate (PDF or image)" : "image"} as the form field "file".`, { field: "file" });
  }
  const fields = Object.fromEntries([...form.entries()].filter((entry): entry is [string, string] => typeof entry[1] === "string"));
  return { bytes: new Uint8Array(await file.arrayBuffer()), fields };
}

/** A site visit sent as JSON (no photos), or as multipart/form-data with its `photos` and `gauges` repeated. */
export async function readSiteVisit(request: Request): Promise<{ fields: unknown; photos: Uint8Array[] }> {
  if (contentType(request) !== "multipart/form-data") return { fields: await readJson(request, z.record(z.string(), z.unknown())), photos: [] };
  const form = await readFormData(request, MAX_VISIT_PHOTOS * UPLOAD_LIMIT_BYTES["visit-photo"] + MULTIPART_ALLOWANCE_BYTES);
  const text = (name: string) => {
    const value = form.get(name);
    return typeof value === "string" ? value : undefined;
  };
  const photos = form.getAll("photos").filter((part): part is File => part instanceof Blob && part.size > 0);
  return {
    fields: { visitedAt: text("visitedAt"), visitor: text("visitor"), work: text("work"), gauges: form.getAll("gauges").filter((tag) => typeof tag === "string" && tag !== "") },
    photos: await Promise.all(photos.map(async (photo) => new Uint8Array(await photo.arrayBuffer()))),
  };
}
