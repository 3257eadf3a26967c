/**
 * Recognises the image formats the product accepts from their first bytes and reads their
 * pixel size from the header, without decoding any pixels. Pure functions, no framework imports.
 * Layouts: PNG (W3C PNG specification / ISO/IEC 15948), JPEG (ITU-T T.81), WebP (Google's
 * RIFF container specification and its VP8, VP8L and VP8X chunks).
 */

export const IMAGE_TYPES = {
  "image/png": { name: "PNG", extension: "png" },
  "image/jpeg": { name: "JPEG", extension: "jpg" },
  "image/webp": { name: "WebP", extension: "webp" },
} as const;

export type ImageType = keyof typeof IMAGE_TYPES;

export type ImageInfo = { type: ImageType; width: number; height: number };

const PNG_SIGNATURE = [0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a];

function startsWith(bytes: Uint8Array, expected: readonly number[], offset = 0): boolean {
  return bytes.length >= offset + expected.length && expected.every((byte, i) => bytes[offset + i] === byte);
}

function ascii(bytes: Uint8Array, offset: number, length: number): string {
  return String.fromCharCode(...bytes.subarray(offset, offset + length));
}

const u16be = (b: Uint8Array, at: number) => (b[at]! << 8) | b[at + 1]!;
const u16le = (b: Uint8Array, at: number) => b[at]! | (b[at + 1]! << 8);
const u24le = (b: Uint8Array, at: number) => b[at]! | (b[at + 1]! << 8) | (b[at + 2]! << 16);
const u32be = (b: Uint8Array, at: number) => ((b[at]! << 24) >>> 0) + (b[at + 1]! << 16) + (b[at + 2]! << 8) + b[at + 3]!;

/** The format named by the file's magic number, whatever its name or declared type says. */
export function detectImageType(bytes: Uint8Array): ImageType | null {
  if (startsWith(bytes, PNG_SIGNATURE)) return "image/png";
  if (startsWith(bytes, [0xff, 0xd8, 0xff])) return "image/jpeg";
  if (bytes.length >= 12 && ascii(bytes, 0, 4) === "RIFF" && ascii(bytes, 8, 4) === "WEBP") return "image/webp";
  return null;
}

/** True for text that opens like an SVG or other XML document, so the refusal can say why. */
export function looksLikeSvg(bytes: Uint8Array): boolean {
  const head = new TextDecoder().decode(bytes.subarray(0, 512)).trimStart().toLowerCase();
  return head.startsWith("<svg") || (head.startsWith("<?xml") && head.includes("<svg")) || head.startsWith("<!doctype svg");
}

type Size = { width: number; height: number };

/** PNG: the IHDR chunk must come first; width and height are its first two 4-byte big-endian fields. */
export function pngSize(bytes: Uint8Array): Size | null {
  if (bytes.length < 24 || ascii(bytes, 12, 4) !== "IHDR") return null;
  return { width: u32be(bytes, 16), height: u32be(bytes, 20) };
}

// Start-of-frame markers C0–CF, except C4 (DHT), C8 (reserved) and CC (DAC), which share the range.
const isStartOfFrame = (marker: number) => marker >= 0xc0 && marker <= 0xcf && ![0xc4, 0xc8, 0xcc].includes(marker);
// Markers without a length field: TEM and the restart markers RST0–RST7.
const isStandalone = (marker: number) => marker === 0x01 || (marker >= 0xd0 && marker <= 0xd7);
const START_OF_SCAN = 0xda;

/** JPEG: walks the marker segments to the first start-of-frame, which holds the height, then the width. */
export function jpegSize(bytes: Uint8Array): Size | null {
  let at = 2;
  while (at + 4 <= bytes.length) {
    if (bytes[at] !== 0xff) return null;
    const marker = bytes[at + 1]!;
    if (marker === 0xff) {
      at += 1; // fill byte before a marker
      continue;
    }
    if (isStandalone(marker)) {
      at += 2;
      continue;
    }
    if (marker === START_OF_SCAN) return null;
    if (isStartOfFrame(marker)) {
      if (at + 9 > bytes.length) return null;
      return { height: u16be(bytes, at + 5), width: u16be(bytes, at + 7) };
    }
    at += 2 + u16be(bytes, at + 2);
  }
  return null;
}

/** WebP: the first chunk after the RIFF header is VP8 (lossy), VP8L (lossless) or VP8X (extended). */
export function webpSize(bytes: Uint8Array): Size | null {
  if (bytes.length < 30) return null;
  const chunk = ascii(bytes, 12, 4);
  const data = 20;
  if (chunk === "VP8 ") {
    // 3-byte frame tag, then the key frame's start code 9D 01 2A and two 14-bit sizes.
    if (!startsWith(bytes, [0x9d, 0x01, 0x2a], data + 3)) return null;
    return { width: u16le(bytes, data + 6) & 0x3fff, height: u16le(bytes, data + 8) & 0x3fff };
  }
  if (chunk === "VP8L") {
    // Signature 0x2F, then width − 1 and height − 1 as consecutive 14-bit little-endian fields.
    if (bytes[data] !== 0x2f) return null;
    const b1 = bytes[data + 1]!, b2 = bytes[data + 2]!, b3 = bytes[data + 3]!, b4 = bytes[data + 4]!;
    return { width: 1 + (((b2 & 0x3f) << 8) | b1), height: 1 + (((b4 & 0x0f) << 10) | (b3 << 2) | (b2 >> 6)) };
  }
  if (chunk === "VP8X") {
    // Flags and 3 reserved bytes, then canvas width − 1 and height − 1 as 24-bit little-endian fields.
    return { width: 1 + u24le(bytes, data + 4), height: 1 + u24le(bytes, data + 7) };
  }
  return null;
}

const SIZE_READERS: Record<ImageType, (bytes: Uint8Array) => Size | null> = {
  "image/png": pngSize,
  "image/jpeg": jpegSize,
  "image/webp": webpSize,
};

export type ImageInspection =
  | { kind: "image"; image: ImageInfo }
  | { kind: "unsupported"; svg: boolean }
  | { kind: "damaged"; type: ImageType };

/** What the bytes are: an accepted image with its size, another kind of file, or an accepted type whose header is broken. */
export function inspectImage(bytes: Uint8Array): ImageInspection {
  const type = detectImageType(bytes);
  if (!type) return { kind: "unsupported", svg: looksLikeSvg(bytes) };
  const size = SIZE_READERS[type](bytes);
  if (!size || size.width < 1 || size.height < 1) return { kind: "damaged", type };
  return { kind: "image", image: { type, ...size } };
}
