import { alertListQuery } from "@/lib/api/alert-query";
import { apiRoute, json } from "@/lib/api/http";
import { parseWith } from "@/lib/validation";
import { listAlerts } from "@/lib/services/alerts";

export const GET = apiRoute<{ code: string }>(async ({ request, actor, params }) => {
  const query = parseWith(alertListQuery, Object.fromEntries(new URL(request.url).searchParams));
  return json(await listAlerts(actor, params.code, query));
});

export * from "@/lib/api/method-not-allowed";
