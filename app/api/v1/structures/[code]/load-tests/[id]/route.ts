import { apiRoute, json } from "@/lib/api/http";
import { loadTestId } from "@/lib/api/load-test-schemas";
import { getLoadTestResults } from "@/lib/services/load-tests";
import { parseWith } from "@/lib/validation";

type Params = { code: string; id: string };

export const GET = apiRoute<Params>(async ({ actor, params }) => json(await getLoadTestResults(actor, params.code, parseWith(loadTestId, params.id))));

export * from "@/lib/api/method-not-allowed";
