import { apiRoute, bodyChunks, contentType, json, readJson } from "@/lib/api/http";
import { ingestReadingsInput, parseQuery, timezoneQuerySchema } from "@/lib/api/readings-schemas";
import { AppError } from "@/lib/errors";
import { ingestCsv, ingestJson, MAX_REQUEST_BYTES } from "@/lib/services/ingest";

type Params = { code: string };

/** Readings from a logger, script or person: JSON, or CSV with `?timezone=` for times without an offset. */
export const POST = apiRoute<Params>(async ({ request, actor, params }) => {
  switch (contentType(request)) {
    case "application/json": {
      const { readings } = await readJson(request, ingestReadingsInput, MAX_REQUEST_BYTES);
      return json(await ingestJson(actor, params.code, readings));
    }
    case "text/csv": {
      const { timezone } = parseQuery(request, timezoneQuerySchema);
      return json(await ingestCsv(actor, params.code, bodyChunks(request, MAX_REQUEST_BYTES), timezone));
    }
    default:
      throw new AppError("unsupported_media_type", "Send readings as application/json or text/csv (Content-Type header).");
  }
});

export * from "@/lib/api/method-not-allowed";
