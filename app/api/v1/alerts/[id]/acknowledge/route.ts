import { z } from "zod";
import { apiRoute, json, readJson } from "@/lib/api/http";
import { parseWith } from "@/lib/validation";
import { acknowledgeBody } from "@/lib/alerting/schema";
import { handleAlert } from "@/lib/services/alerts";

const alertId = z.coerce.number({ error: "The alert id is a number." }).int().positive();

export const POST = apiRoute<{ id: string }>(async ({ request, actor, params }) => {
  const id = parseWith(alertId, params.id);
  const { comment } = await readJson(request, acknowledgeBody);
  return json(await handleAlert(actor, id, "acknowledged", comment));
});

export * from "@/lib/api/method-not-allowed";
