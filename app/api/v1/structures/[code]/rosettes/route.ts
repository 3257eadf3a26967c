import { apiRoute, json, readJson } from "@/lib/api/http";
import { rosetteInput } from "@/lib/gauges/schema";
import { createRosette, listRosettes } from "@/lib/services/rosettes";

type Params = { code: string };

export const GET = apiRoute<Params>(async ({ actor, params }) => json({ rosettes: await listRosettes(actor, params.code) }));

export const POST = apiRoute<Params>(async ({ request, actor, params }) => {
  const input = await readJson(request, rosetteInput);
  return json(await createRosette(actor, params.code, input), 201);
});

export * from "@/lib/api/method-not-allowed";
