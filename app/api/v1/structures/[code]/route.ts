import { apiRoute, json } from "@/lib/api/http";
import { countOpenAlerts } from "@/lib/services/alerts";
import { listGaugesWithConditions } from "@/lib/services/status";
import { toStructureView } from "@/lib/services/structures";

export const GET = apiRoute<{ code: string }>(async ({ actor, params }) => {
  const { structure, gauges } = await listGaugesWithConditions(actor, params.code);
  return json({ ...toStructureView(structure), gauges, openAlerts: await countOpenAlerts(structure.id) });
});

export * from "@/lib/api/method-not-allowed";
