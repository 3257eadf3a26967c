import { apiRoute, json, readJson } from "@/lib/api/http";
import { zeroRequest } from "@/lib/gauges/schema";
import { recordZero } from "@/lib/services/gauges";

export const POST = apiRoute<{ code: string; tag: string }>(async ({ request, actor, params }) => {
  const zero = await readJson(request, zeroRequest);
  return json(await recordZero(actor, params.code, params.tag, zero));
});

export * from "@/lib/api/method-not-allowed";
