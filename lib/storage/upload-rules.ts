import type { FileKind } from "@/db/schema";
import { AppError } from "@/lib/errors";
import { IMAGE_TYPES, inspectImage, type ImageType } from "./image-type";
import { inspectPdf, PDF_TYPE } from "./pdf-type";

/**
 * Largest file accepted per kind: site photos straight from a phone, drawings exported at print
 * resolution, a calibration certificate scanned as a PDF of a few pages.
 */
export const UPLOAD_LIMIT_BYTES: Record<FileKind, number> = {
  photo: 10_000_000,
  "visit-photo": 10_000_000,
  drawing: 20_000_000,
  certificate: 20_000_000,
};

/** What the store keeps: the images, and PDFs for documents. */
export type StoredType = ImageType | typeof PDF_TYPE;
/** A checked upload: its type, and the pixel size of an image (null for a PDF). */
export type UploadInfo = { type: StoredType; width: number | null; height: number | null };

/** Kinds that take a PDF as well as an image. */
const TAKES_PDF: ReadonlySet<FileKind> = new Set<FileKind>(["certificate"]);

/**
 * An A0 sheet (841 × 1 189 mm, ISO 216) scanned at 300 dpi is about 9 900 × 14 000 pixels; a
 * header claiming more is a damaged file or one made to exhaust the memory of whoever draws it.
 */
export const MAX_IMAGE_SIDE_PX = 20_000;

const KIND_NAMES: Record<FileKind, string> = { photo: "Photos", "visit-photo": "Photos", drawing: "Drawings", certificate: "Certificates" };

const inWords = (names: string[]) => names.join(", ").replace(/, ([^,]+)$/, " or $1");

export const ACCEPTED_TYPE_NAMES = inWords(Object.values(IMAGE_TYPES).map((type) => type.name));

/** "PDF, PNG, JPEG or WebP file" for kinds that take a PDF, else "PNG, JPEG or WebP image". */
function acceptedInWords(kind: FileKind): string {
  return TAKES_PDF.has(kind) ? `${inWords(["PDF", ...Object.values(IMAGE_TYPES).map((type) => type.name)])} file` : `${ACCEPTED_TYPE_NAMES} image`;
}

/** For the file picker's `accept`: a hint to the browser only, the server checks the bytes. */
export function acceptAttribute(kind: FileKind): string {
  return [...(TAKES_PDF.has(kind) ? [PDF_TYPE] : []), ...Object.keys(IMAGE_TYPES)].join(",");
}

export const megabytes = (bytes: number) => `${Number((bytes / 1_000_000).toFixed(1))} MB`;

// Rounded up, so a file just over the limit never reads as equal to it.
const sizeOver = (bytes: number) => `${Math.ceil(bytes / 10_000) / 100} MB`;

/** One line for forms: what may be uploaded as this kind. */
export function uploadRule(kind: FileKind): string {
  return `${acceptedInWords(kind)}, at most ${megabytes(UPLOAD_LIMIT_BYTES[kind])}.`;
}

/** The file in `bytes`, or the reason it is refused, judged by its content and never by its name. */
export function checkUpload(bytes: Uint8Array, kind: FileKind): UploadInfo {
  const limit = UPLOAD_LIMIT_BYTES[kind];
  if (bytes.byteLength > limit) {
    throw new AppError("payload_too_large", `${KIND_NAMES[kind]} may be at most ${megabytes(limit)}; this file is ${sizeOver(bytes.byteLength)}.`, {
      field: "file",
      limitBytes: limit,
    });
  }
  if (bytes.byteLength === 0) throw new AppError("bad_request", "The file is empty; choose the image again.", { field: "file" });
  if (TAKES_PDF.has(kind)) {
    const pdf = inspectPdf(bytes);
    if (pdf === "pdf") return { type: PDF_TYPE, width: null, height: null };
    if (pdf === "cut-short") {
      throw new AppError("bad_request", "The file starts like a PDF but its end is missing (it was cut short); save or download it again.", { field: "file" });
    }
  }
  const inspection = inspectImage(bytes);
  if (inspection.kind === "unsupported") {
    const why = inspection.svg
      ? "SVG files are not accepted because they can carry scripts; export the drawing as PNG."
      : "This file is not one of them (its content was checked, not its name).";
    const accepted = TAKES_PDF.has(kind) ? `PDF files and ${ACCEPTED_TYPE_NAMES} images are` : `${ACCEPTED_TYPE_NAMES} images are`;
    throw new AppError("unsupported_media_type", `Only ${accepted} accepted. ${why}`, { field: "file" });
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
