import type { FileKind } from "@/db/schema";
import { AppError } from "@/lib/errors";
import { UPLOAD_LIMIT_BYTES } from "@/lib/storage/upload-rules";
import { readFormData } from "./http";

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
