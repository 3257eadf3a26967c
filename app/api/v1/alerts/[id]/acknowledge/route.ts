import { apiRoute, json, readJson } from "@/lib/api/http";
import { parseWith } from "@/lib/validation";
import { acknowledgeBody, alertIdParam } from "@/lib/alerting/schema";
import { handleAlert } from "@/lib/services/alerts";

export const POST = apiRoute<{ id: string }>(async ({ request, actor, params }) => {
  const id = parseWith(alertIdParam, params.id);
  const { comment } = await readJson(request, acknowledgeBody);
  return json(await handleAlert(actor, id, "acknowledged", comment));
});

export * from "@/lib/api/method-not-allowed";
