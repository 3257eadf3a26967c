import type { FileKind } from "@/db/schema";
import { AppError } from "@/lib/errors";
import { IMAGE_TYPES, inspectImage, type ImageInfo } from "./image-type";

/** Largest file accepted per kind: site photos straight from a phone, drawings exported at print resolution. */
export const UPLOAD_LIMIT_BYTES: Record<FileKind, number> = {
  photo: 10_000_000,
  drawing: 20_000_000,
};

/**
 * An A0 sheet (841 × 1 189 mm, ISO 216) scanned at 300 dpi is about 9 900 × 14 000 pixels; a
 * header claiming more is a damaged file or one made to exhaust the memory of whoever draws it.
 */
export const MAX_IMAGE_SIDE_PX = 20_000;

const KIND_NAMES: Record<FileKind, string> = { photo: "Photos", drawing: "Drawings" };

export const ACCEPTED_TYPE_NAMES = Object.values(IMAGE_TYPES)
  .map((type) => type.name)
  .join(", ")
  .replace(/, ([^,]+)$/, " or $1");

/** For the file picker's `accept`: a hint to the browser only, the server checks the bytes. */
export const ACCEPT_ATTRIBUTE = Object.keys(IMAGE_TYPES).join(",");

export const megabytes = (bytes: number) => `${Number((bytes / 1_000_000).toFixed(1))} MB`;

// Rounded up, so a file just over the limit never reads as equal to it.
const sizeOver = (bytes: number) => `${Math.ceil(bytes / 10_000) / 100} MB`;

/** One line for forms: what may be uploaded as this kind. */
export function uploadRule(kind: FileKind): string {
  return `${ACCEPTED_TYPE_NAMES} image, at most ${megabytes(UPLOAD_LIMIT_BYTES[kind])}.`;
}

/** The image in `bytes`, or the reason it is refused, judged by its content and never by its name. */
export function checkUpload(bytes: Uint8Array, kind: FileKind): ImageInfo {
  const limit = UPLOAD_LIMIT_BYTES[kind];
  if (bytes.byteLength > limit) {
    throw new AppError("payload_too_large", `${KIND_NAMES[kind]} may be at most ${megabytes(limit)}; this file is ${sizeOver(bytes.byteLength)}.`, {
      field: "file",
      limitBytes: limit,
    });
  }
  if (bytes.byteLength === 0) throw new AppError("bad_request", "The file is empty; choose the image again.", { field: "file" });
  const inspection = inspectImage(bytes);
  if (inspection.kind === "unsupported") {
    const why = inspection.svg
      ? "SVG files are not accepted because they can carry scripts; export the drawing as PNG."
      : "This file is not one of them (its content was checked, not its name).";
    throw new AppError("unsupported_media_type", `Only ${ACCEPTED_TYPE_NAMES} images are accepted. ${why}`, { field: "file" });
  }
  if (inspection.kind === "damaged") {
    throw new AppError("bad_request", `The file starts like a ${IMAGE_TYPES[inspection.type].name} image but its header is damaged or cut short.`, {
      field: "file",
    });
  }
  const { width, height } = inspection.image;
  if (width > MAX_IMAGE_SIDE_PX || height > MAX_IMAGE_SIDE_PX) {
    throw new AppError(
      "bad_request",
      `The image is ${width} × ${height} pixels; at most ${MAX_IMAGE_SIDE_PX.toLocaleString("en-US")} pixels a side are accepted. Export it at a lower resolution.`,
      { field: "file" },
    );
  }
  return inspection.image;
}
