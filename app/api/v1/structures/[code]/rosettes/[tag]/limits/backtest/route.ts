import { apiRoute, json, readJson } from "@/lib/api/http";
import { rosetteBacktestBody } from "@/lib/alerting/schema";
import { backtestRosetteLimits } from "@/lib/services/rosette-limits";

/** What proposed rosette limits would have raised over a past period; nothing is stored. */
export const POST = apiRoute<{ code: string; tag: string }>(async ({ request, actor, params }) => {
  const body = await readJson(request, rosetteBacktestBody);
  return json(await backtestRosetteLimits(actor, params.code, params.tag, body.limits, Date.parse(body.from), Date.parse(body.to)));
});

export * from "@/lib/api/method-not-allowed";
