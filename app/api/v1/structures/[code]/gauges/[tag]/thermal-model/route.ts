import { apiRoute, json, readJson } from "@/lib/api/http";
import { deleteThermalModel, getThermalModel, saveThermalModel } from "@/lib/services/thermal";
import { thermalModelInput } from "@/lib/thermal/schema";

type Params = { code: string; tag: string };

export const GET = apiRoute<Params>(async ({ actor, params }) => json(await getThermalModel(actor, params.code, params.tag)));

export const PUT = apiRoute<Params>(async ({ request, actor, params }) => {
  const body = await readJson(request, thermalModelInput);
  return json(await saveThermalModel(actor, params.code, params.tag, body));
});

export const DELETE = apiRoute<Params>(async ({ actor, params }) => {
  await deleteThermalModel(actor, params.code, params.tag);
  return new Response(null, { status: 204 });
});

export * from "@/lib/api/method-not-allowed";
