import { apiRoute, json, readJson } from "@/lib/api/http";
import { createStructure, listStructuresFor, toStructureView } from "@/lib/services/structures";
import { createStructureInput } from "@/lib/validation";

export const GET = apiRoute(async ({ actor }) => {
  const rows = await listStructuresFor(actor);
  return json({ structures: rows.map(toStructureView) });
});

export const POST = apiRoute(async ({ request, actor }) => {
  const input = await readJson(request, createStructureInput);
  const created = await createStructure(actor, input);
  return json(toStructureView(created), 201);
});

export * from "@/lib/api/method-not-allowed";
