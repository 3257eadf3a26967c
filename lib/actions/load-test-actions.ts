"use server";

import { redirect } from "next/navigation";
import type { ActionState } from "@/lib/actions/action-state";
import { objectAction } from "@/lib/actions/form-action";
import { loadTestInput } from "@/lib/load-tests";
import { createLoadTest } from "@/lib/services/load-tests";

/** Records a load test from the form's table and opens its results. */
export async function recordLoadTestAction(code: string, payload: unknown): Promise<ActionState> {
  let created: number | undefined;
  const state = await objectAction(
    loadTestInput,
    payload,
    async (input, user) => {
      created = (await createLoadTest(user, code, input)).id;
      return { message: "Load test recorded." };
    },
    `/structures/${encodeURIComponent(code)}/load-tests`,
  );
  if (state.status === "ok" && created !== undefined) redirect(`/structures/${encodeURIComponent(code)}/load-tests/${created}`);
  return state;
}
