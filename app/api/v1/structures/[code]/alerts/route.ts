import { z } from "zod";
import { apiRoute, json, parseWith } from "@/lib/api/http";
import { ALERT_STATES, listAlerts } from "@/lib/services/alerts";

const query = z.object({ state: z.enum(ALERT_STATES, { error: `state is one of ${ALERT_STATES.join(", ")}.` }).default("open") });

export const GET = apiRoute<{ code: string }>(async ({ request, actor, params }) => {
  const { state } = parseWith(query, Object.fromEntries(new URL(request.url).searchParams));
  return json({ alerts: await listAlerts(actor, params.code, state) });
});
