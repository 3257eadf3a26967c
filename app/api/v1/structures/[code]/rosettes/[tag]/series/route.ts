import { apiRoute, json } from "@/lib/api/http";
import { parseQuery, rosetteSeriesQuerySchema } from "@/lib/api/readings-schemas";
import { getRosetteSeries } from "@/lib/services/rosette-series";

export const GET = apiRoute<{ code: string; tag: string }>(async ({ request, actor, params }) =>
  json(await getRosetteSeries(actor, params.code, params.tag, parseQuery(request, rosetteSeriesQuerySchema))),
);

export * from "@/lib/api/method-not-allowed";
