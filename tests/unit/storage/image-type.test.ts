import { describe, expect, it } from "vitest";
import { detectImageType, inspectImage, jpegSize, looksLikeSvg, pngSize, webpSize } from "@/lib/storage/image-type";
import { checkUpload, UPLOAD_LIMIT_BYTES } from "@/lib/storage/upload-rules";
import { isStorageKey } from "@/lib/storage/file-store";
import { SVG_DRAWING, TEXT_FILE, jpegImage, pngImage, webpHeaders } from "../../fixtures/images";

describe("magic numbers", () => {
  it("recognises PNG by its 8-byte signature 89 50 4E 47 0D 0A 1A 0A (PNG specification, 5.2)", () => {
    expect(detectImageType(pngImage(1, 1))).toBe("image/png");
    expect(detectImageType(Uint8Array.from([0x89, 0x50, 0x4e, 0x47]))).toBeNull();
  });

  it("recognises JPEG by SOI FF D8 followed by a marker FF (ITU-T T.81, B.1.1.2)", () => {
    expect(detectImageType(jpegImage(8, 8))).toBe("image/jpeg");
    expect(detectImageType(Uint8Array.from([0xff, 0xd8, 0x00]))).toBeNull();
  });

  it("recognises WebP by RIFF....WEBP (WebP container specification)", () => {
    expect(detectImageType(webpHeaders.lossy(4, 4))).toBe("image/webp");
    const wave = Uint8Array.from([...Buffer.from("RIFF"), 0, 0, 0, 0, ...Buffer.from("WAVE")]);
    expect(detectImageType(wave)).toBeNull();
  });

  it("does not take text, SVG or an empty file for an image, and tells SVG apart", () => {
    expect(detectImageType(TEXT_FILE)).toBeNull();
    expect(detectImageType(SVG_DRAWING)).toBeNull();
    expect(detectImageType(new Uint8Array())).toBeNull();
    expect(looksLikeSvg(SVG_DRAWING)).toBe(true);
    expect(looksLikeSvg(Buffer.from("  <svg viewBox='0 0 1 1'/>"))).toBe(true);
    expect(looksLikeSvg(TEXT_FILE)).toBe(false);
  });
});

describe("pixel size from the header", () => {
  it("reads PNG width and height from IHDR, big-endian (PNG specification, 11.2.2)", () => {
    expect(pngSize(pngImage(3, 2))).toEqual({ width: 3, height: 2 });
    // Only the signature and IHDR's first bytes matter: 300 × 70 000 without building the pixels.
    const header = Uint8Array.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, 0, 0, 0, 13, ...Buffer.from("IHDR"), 0, 0, 0x01, 0x2c, 0, 0x01, 0x11, 0x70]);
    expect(pngSize(header)).toEqual({ width: 300, height: 70_000 });
  });

  it("reads JPEG height then width from the start-of-frame segment, after skipping others (ITU-T T.81, B.2.2)", () => {
    expect(jpegSize(jpegImage(17, 9))).toEqual({ width: 17, height: 9 });
  });

  it("finds a progressive SOF2 and skips fill bytes; stops at a scan with no frame before it (ITU-T T.81, B.1.1.2)", () => {
    const progressive = Uint8Array.from([0xff, 0xd8, 0xff, 0xff, 0xc2, 0, 11, 8, 0x02, 0x58, 0x03, 0x20, 1, 1, 0x11, 0]);
    expect(jpegSize(progressive)).toEqual({ width: 800, height: 600 });
    expect(jpegSize(Uint8Array.from([0xff, 0xd8, 0xff, 0xda, 0, 8, 1, 1, 0, 0, 63, 0]))).toBeNull();
  });

  it("does not mistake DHT (C4) for a frame header", () => {
    const dhtFirst = Uint8Array.from([0xff, 0xd8, 0xff, 0xc4, 0, 4, 0, 0, 0xff, 0xc0, 0, 11, 8, 0, 5, 0, 7, 1, 1, 0x11, 0]);
    expect(jpegSize(dhtFirst)).toEqual({ width: 7, height: 5 });
  });

  it("reads WebP sizes from VP8 (14-bit LE), VP8L (14-bit fields minus one) and VP8X (24-bit fields minus one)", () => {
    expect(webpSize(webpHeaders.lossy(640, 480))).toEqual({ width: 640, height: 480 });
    expect(webpSize(webpHeaders.lossless(1000, 16_384))).toEqual({ width: 1000, height: 16_384 });
    expect(webpSize(webpHeaders.extended(5000, 3))).toEqual({ width: 5000, height: 3 });
  });

  it("calls a recognised type with a cut-short header damaged", () => {
    expect(inspectImage(pngImage(2, 2).subarray(0, 20))).toEqual({ kind: "damaged", type: "image/png" });
    expect(inspectImage(jpegImage(8, 8).subarray(0, 30))).toEqual({ kind: "damaged", type: "image/jpeg" });
    expect(inspectImage(SVG_DRAWING)).toEqual({ kind: "unsupported", svg: true });
  });
});

describe("upload rules", () => {
  it("accepts a real image and returns its type and size", () => {
    expect(checkUpload(pngImage(4, 3), "photo")).toEqual({ type: "image/png", width: 4, height: 3 });
  });

  it("refuses other content with 415 naming the accepted types, and SVG with the reason", () => {
    expect(() => checkUpload(TEXT_FILE, "drawing")).toThrow(/Only PNG, JPEG or WebP images are accepted/);
    expect(() => checkUpload(SVG_DRAWING, "drawing")).toThrow(/SVG files are not accepted because they can carry scripts/);
  });

  it("refuses a file one byte over the limit with 413 naming the limit", () => {
    const tooBig = new Uint8Array(UPLOAD_LIMIT_BYTES.photo + 1);
    expect(() => checkUpload(tooBig, "photo")).toThrow("Photos may be at most 10 MB; this file is 10.01 MB.");
  });
});

describe("storage keys", () => {
  it("accepts only the shape the server makes: 32 hex digits and a known extension", () => {
    expect(isStorageKey("0123456789abcdef0123456789abcdef.png")).toBe(true);
    for (const key of ["../../etc/passwd", "0123456789abcdef0123456789abcdef.svg", "0123456789ABCDEF0123456789abcdef.png", "a/0123456789abcdef0123456789abcdef.png", "0123456789abcdef0123456789abcdef.png\n"]) {
      expect(isStorageKey(key)).toBe(false);
    }
  });
});
