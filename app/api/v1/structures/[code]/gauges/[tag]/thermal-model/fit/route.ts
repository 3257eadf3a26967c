import { apiRoute, json, readJson } from "@/lib/api/http";
import { previewThermalModel } from "@/lib/services/thermal";
import { thermalModelInput } from "@/lib/thermal/schema";

/** The fit over a reference period with its scatter, for the editor to show before saving; nothing is stored. */
export const POST = apiRoute<{ code: string; tag: string }>(async ({ request, actor, params }) => {
  const body = await readJson(request, thermalModelInput);
  return json(await previewThermalModel(actor, params.code, params.tag, body));
});

export * from "@/lib/api/method-not-allowed";
