import { apiRoute } from "@/lib/api/http";
import { parseWith } from "@/lib/validation";
import { recordId } from "@/lib/field-records/record-id";
import { openCertificateFile } from "@/lib/services/certificates";

type Params = { code: string; id: string };

/**
 * The certificate's bytes as the type detected at upload. A PDF is offered as a download: the
 * sandbox this API's answers carry keeps browsers from drawing a PDF inline.
 */
export const GET = apiRoute<Params>(async ({ actor, params }) => {
  const file = await openCertificateFile(actor, params.code, parseWith(recordId("certificate"), params.id));
  const disposition = file.contentType === "application/pdf" ? "attachment" : "inline";
  return new Response(file.stream, {
    headers: {
      "content-type": file.contentType,
      "content-length": String(file.bytes),
      "content-disposition": `${disposition}; filename="${file.filename}"`,
      "x-content-type-options": "nosniff",
      "content-security-policy": "default-src 'none'; sandbox",
      "cache-control": "private, max-age=3600",
    },
  });
});

export * from "@/lib/api/method-not-allowed";
