import { apiRoute, json } from "@/lib/api/http";
import { countOpenAlerts } from "@/lib/services/alerts";
import { listGauges } from "@/lib/services/gauges";
import { getVisibleStructure, toStructureView } from "@/lib/services/structures";

export const GET = apiRoute<{ code: string }>(async ({ actor, params }) => {
  const structure = await getVisibleStructure(actor, params.code);
  return json({ ...toStructureView(structure), gauges: await listGauges(actor, params.code), openAlerts: await countOpenAlerts(structure.id) });
});
