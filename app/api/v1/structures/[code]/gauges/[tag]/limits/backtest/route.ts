import { apiRoute, json, readJson } from "@/lib/api/http";
import { backtestBody } from "@/lib/alerting/schema";
import { backtestLimits } from "@/lib/services/limits";

/** What proposed limits would have raised over a past period; nothing is stored. */
export const POST = apiRoute<{ code: string; tag: string }>(async ({ request, actor, params }) => {
  const body = await readJson(request, backtestBody);
  return json(await backtestLimits(actor, params.code, params.tag, body.limits, Date.parse(body.from), Date.parse(body.to)));
});

export * from "@/lib/api/method-not-allowed";
