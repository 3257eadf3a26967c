import { apiRoute, json, readJson } from "@/lib/api/http";
import { limitsBody } from "@/lib/alerting/schema";
import { isoTime } from "@/lib/gauges/schema";
import { backtestLimits } from "@/lib/services/limits";

const MAX_PERIOD_MS = 366 * 86_400_000;

const backtestBody = limitsBody
  .extend({ from: isoTime, to: isoTime })
  .refine((body) => Date.parse(body.from) < Date.parse(body.to), { path: ["to"], message: "`to` must be after `from`." })
  .refine((body) => Date.parse(body.to) - Date.parse(body.from) <= MAX_PERIOD_MS, { path: ["from"], message: "Backtest at most a year at a time." });

/** What proposed limits would have raised over a past period; nothing is stored. */
export const POST = apiRoute<{ code: string; tag: string }>(async ({ request, actor, params }) => {
  const body = await readJson(request, backtestBody);
  return json(await backtestLimits(actor, params.code, params.tag, body.limits, Date.parse(body.from), Date.parse(body.to)));
});

