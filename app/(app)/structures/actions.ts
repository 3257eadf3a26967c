"use server";

import { redirect } from "next/navigation";
import { formAction } from "@/lib/actions/form-action";
import { createStructure } from "@/lib/services/structures";
import { createStructureInput } from "@/lib/validation";
import type { ActionState } from "@/lib/actions/action-state";

const create = formAction(
  createStructureInput,
  async (input, user) => {
    await createStructure(user, input);
    return { message: `Structure ${input.code} created.` };
  },
  "/",
);

export async function createStructureAction(previous: ActionState, formData: FormData): Promise<ActionState> {
  const state = await create(previous, formData);
  if (state.status === "ok") redirect(`/structures/${String(formData.get("code"))}`);
  return state;
}
