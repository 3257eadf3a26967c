import { apiRoute, bodyChunks, contentType } from "@/lib/api/http";
import { ndjsonResponse } from "@/lib/api/ndjson";
import { parseQuery, timezoneQuerySchema } from "@/lib/api/readings-schemas";
import { AppError } from "@/lib/errors";
import { MAX_UPLOAD_BYTES, startCsvUpload } from "@/lib/services/ingest";

type Params = { code: string };

/**
 * A logger file of any length, streamed in and stored in batches, answered with NDJSON progress
 * lines and a final report. Kept out of proxy.ts's matcher (all of /api is), which would cut the body.
 */
export const POST = apiRoute<Params>(async ({ request, actor, params }) => {
  if (contentType(request) !== "text/csv") {
    throw new AppError("unsupported_media_type", "Upload the logger file as text/csv (Content-Type header).");
  }
  const { timezone } = parseQuery(request, timezoneQuerySchema);
  const upload = await startCsvUpload(actor, params.code, bodyChunks(request, MAX_UPLOAD_BYTES), timezone);
  return ndjsonResponse(async (send) => {
    send({ type: "start", timezone: upload.zone });
    const report = await upload.run((progress) => send({ type: "progress", ...progress }));
    send({ type: "done", ...report });
  });
});

export * from "@/lib/api/method-not-allowed";
