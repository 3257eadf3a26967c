import { apiRoute, json, readJson } from "@/lib/api/http";
import { rosetteLimitsBody } from "@/lib/alerting/schema";
import { getRosetteLimits, replaceRosetteLimits } from "@/lib/services/rosette-limits";

type Params = { code: string; tag: string };

export const GET = apiRoute<Params>(async ({ actor, params }) => json({ limits: await getRosetteLimits(actor, params.code, params.tag) }));

export const PUT = apiRoute<Params>(async ({ request, actor, params }) => {
  const body = await readJson(request, rosetteLimitsBody);
  return json({ limits: await replaceRosetteLimits(actor, params.code, params.tag, body.limits) });
});

export * from "@/lib/api/method-not-allowed";
