import { apiRoute, json } from "@/lib/api/http";
import { parseQuery, seriesQuerySchema } from "@/lib/api/readings-schemas";
import { getSeries } from "@/lib/services/readings";

type Params = { code: string; tag: string };

export const GET = apiRoute<Params>(async ({ request, actor, params }) =>
  json(await getSeries(actor, params.code, params.tag, parseQuery(request, seriesQuerySchema))),
);

export * from "@/lib/api/method-not-allowed";
