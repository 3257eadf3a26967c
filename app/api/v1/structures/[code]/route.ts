import { apiRoute, json } from "@/lib/api/http";
import { getVisibleStructure, toStructureView } from "@/lib/services/structures";

export const GET = apiRoute<{ code: string }>(async ({ actor, params }) => {
  const structure = await getVisibleStructure(actor, params.code);
  return json({ ...toStructureView(structure), gauges: [], openAlerts: 0 });
});
