import { apiRoute, json, parseWith, readJson } from "@/lib/api/http";
import { alertIdParam, resolveFaultBody } from "@/lib/alerting/schema";
import { resolveSensorFault } from "@/lib/services/fault-resolution";

export const POST = apiRoute<{ id: string }>(async ({ request, actor, params }) => {
  const id = parseWith(alertIdParam, params.id);
  const { resolution, comment } = await readJson(request, resolveFaultBody);
  return json(await resolveSensorFault(actor, id, resolution, comment));
});
