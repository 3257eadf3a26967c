import { apiRoute, json } from "@/lib/api/http";
import { parseQuery, timeRange } from "@/lib/api/readings-schemas";
import { gaugeEvents } from "@/lib/services/dynamic-data";

type Params = { code: string; tag: string };

export const GET = apiRoute<Params>(async ({ request, actor, params }) =>
  json(await gaugeEvents(actor, params.code, params.tag, parseQuery(request, timeRange))),
);

export * from "@/lib/api/method-not-allowed";
