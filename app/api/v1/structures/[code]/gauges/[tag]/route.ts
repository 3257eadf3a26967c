import { apiRoute, json, readJson } from "@/lib/api/http";
import { gaugePatch } from "@/lib/gauges/schema";
import { getGauge, retireGauge, updateGauge } from "@/lib/services/gauges";

type Params = { code: string; tag: string };

export const GET = apiRoute<Params>(async ({ actor, params }) => json(await getGauge(actor, params.code, params.tag)));

export const PATCH = apiRoute<Params>(async ({ request, actor, params }) => {
  const patch = await readJson(request, gaugePatch);
  return json(await updateGauge(actor, params.code, params.tag, patch));
});

/** Retires the gauge: it accepts no more readings, and its history is kept. */
export const DELETE = apiRoute<Params>(async ({ actor, params }) => json(await retireGauge(actor, params.code, params.tag)));

export * from "@/lib/api/method-not-allowed";
