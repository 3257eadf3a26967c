import { describe, expect, it } from "vitest";
import { inspectPdf } from "@/lib/storage/pdf-type";
import { checkUpload } from "@/lib/storage/upload-rules";
import { pdfDocument } from "../../fixtures/documents";
import { pngImage, TEXT_FILE } from "../../fixtures/images";

// ISO 32000-1 §7.5.2 (the header "%PDF-1.n") and §7.5.5 (the last line is "%%EOF"), checked on a
// file written by pdfkit, a well-known PDF library.
describe("PDF recognised by content", () => {
  it("takes a whole PDF and refuses one cut short or something else named .pdf", async () => {
    const pdf = await pdfDocument("Calibration certificate 123");
    expect(inspectPdf(pdf)).toBe("pdf");
    expect(inspectPdf(pdf.subarray(0, Math.floor(pdf.length / 2)))).toBe("cut-short");
    expect(inspectPdf(TEXT_FILE)).toBe("not-pdf");
    expect(inspectPdf(new TextEncoder().encode("%PDF"))).toBe("not-pdf");
  });

  it("accepts a PDF only where the kind takes documents", async () => {
    const pdf = await pdfDocument("Calibration certificate 123");
    expect(checkUpload(pdf, "certificate")).toEqual({ type: "application/pdf", width: null, height: null });
    expect(checkUpload(pngImage(4, 3), "certificate")).toEqual({ type: "image/png", width: 4, height: 3 });
    expect(() => checkUpload(pdf, "photo")).toThrow(/Only PNG, JPEG or WebP images are accepted/);
    expect(() => checkUpload(TEXT_FILE, "certificate")).toThrow(/Only PDF files and PNG, JPEG or WebP images are accepted/);
  });
});
