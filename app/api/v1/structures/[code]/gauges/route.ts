import { apiRoute, json, readJson } from "@/lib/api/http";
import { gaugeInput } from "@/lib/gauges/schema";
import { createGauge, listGauges } from "@/lib/services/gauges";

type Params = { code: string };

export const GET = apiRoute<Params>(async ({ actor, params }) => json({ gauges: await listGauges(actor, params.code) }));

export const POST = apiRoute<Params>(async ({ request, actor, params }) => {
  const input = await readJson(request, gaugeInput);
  return json(await createGauge(actor, params.code, input), 201);
});

export * from "@/lib/api/method-not-allowed";
