import { apiRoute, json, readJson } from "@/lib/api/http";
import { shuntCheckInput } from "@/lib/gauges/schema";
import { listShuntChecks, recordShuntCheck } from "@/lib/services/shunt-checks";

type Params = { code: string; tag: string };

export const GET = apiRoute<Params>(async ({ actor, params }) => json({ shuntChecks: await listShuntChecks(actor, params.code, params.tag) }));

export const POST = apiRoute<Params>(async ({ request, actor, params }) => {
  const input = await readJson(request, shuntCheckInput);
  return json(await recordShuntCheck(actor, params.code, params.tag, input), 201);
});

export * from "@/lib/api/method-not-allowed";
