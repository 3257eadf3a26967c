import { apiRoute, json, readJson } from "@/lib/api/http";
import { parseWith } from "@/lib/validation";
import { alertIdParam, resolveFaultBody } from "@/lib/alerting/schema";
import { resolveSensorFault } from "@/lib/services/fault-resolution";

export const POST = apiRoute<{ id: string }>(async ({ request, actor, params }) => {
  const id = parseWith(alertIdParam, params.id);
  const { resolution, comment } = await readJson(request, resolveFaultBody);
  return json(await resolveSensorFault(actor, id, resolution, comment));
});

export * from "@/lib/api/method-not-allowed";
