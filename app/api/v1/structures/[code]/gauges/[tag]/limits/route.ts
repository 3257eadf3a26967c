import { apiRoute, json, readJson } from "@/lib/api/http";
import { limitsBody } from "@/lib/alerting/schema";
import { getLimits, replaceLimits } from "@/lib/services/limits";

type Params = { code: string; tag: string };

export const GET = apiRoute<Params>(async ({ actor, params }) => json({ limits: await getLimits(actor, params.code, params.tag) }));

export const PUT = apiRoute<Params>(async ({ request, actor, params }) => {
  const body = await readJson(request, limitsBody);
  return json({ limits: await replaceLimits(actor, params.code, params.tag, body.limits) });
});

export * from "@/lib/api/method-not-allowed";
