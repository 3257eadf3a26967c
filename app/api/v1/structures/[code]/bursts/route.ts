import { apiRoute, contentType, json, readBodyBytes, readJson } from "@/lib/api/http";
import { binaryBurstQuery, ingestBurstsInput } from "@/lib/api/burst-schemas";
import { parseQuery } from "@/lib/api/readings-schemas";
import { AppError } from "@/lib/errors";
import { decodeBurstFields } from "@/lib/ingest/burst-input";
import { MAX_BURST_REQUEST_BYTES, binaryBurstValues, ingestBinaryBurst, ingestJsonBursts } from "@/lib/services/bursts";

type Params = { code: string };

/** Bursts of a dynamic gauge: JSON (several), or one as 32-bit little-endian floats with its fields in the query. */
export const POST = apiRoute<Params>(async ({ request, actor, params }) => {
  switch (contentType(request)) {
    case "application/json": {
      const { bursts } = await readJson(request, ingestBurstsInput, MAX_BURST_REQUEST_BYTES);
      return json(await ingestJsonBursts(actor, params.code, bursts));
    }
    case "application/octet-stream": {
      const query = parseQuery(request, binaryBurstQuery);
      const values = binaryBurstValues(await readBodyBytes(request, MAX_BURST_REQUEST_BYTES));
      const burst = decodeBurstFields(query.gauge, query.start, query.rateHz, query.temperature, values);
      return json(await ingestBinaryBurst(actor, params.code, burst));
    }
    default:
      throw new AppError("unsupported_media_type", "Send bursts as application/json, or one burst as application/octet-stream (32-bit little-endian floats).");
  }
});

export * from "@/lib/api/method-not-allowed";
