import { apiRoute, json, readJson } from "@/lib/api/http";
import { loadTestInput } from "@/lib/load-tests";
import { createLoadTest, listLoadTests } from "@/lib/services/load-tests";

type Params = { code: string };

export const GET = apiRoute<Params>(async ({ actor, params }) => json({ loadTests: await listLoadTests(actor, params.code) }));

/** Records a load test (engineers and admins) and answers with its results as they stand. */
export const POST = apiRoute<Params>(async ({ request, actor, params }) => {
  const input = await readJson(request, loadTestInput);
  return json(await createLoadTest(actor, params.code, input), 201);
});

export * from "@/lib/api/method-not-allowed";
