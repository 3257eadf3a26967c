import { revalidatePath } from "next/cache";
import { z } from "zod";
import type { UserActor } from "@/lib/auth/actor";
import { currentUser } from "@/lib/auth/session";
import { AppError } from "@/lib/errors";
import type { ActionState } from "./action-state";

type Outcome = { message: string; secret?: string };

function fieldOf(details: unknown): string | undefined {
  return typeof details === "object" && details !== null && "field" in details ? String(details.field) : undefined;
}

/**
 * The one wrapper for form actions: the signed-in user is re-checked, the form data is
 * validated by `schema`, and errors come back as per-field messages instead of exceptions.
 * Permissions are decided inside `run` by the services (lib/auth/authorize).
 */
export function formAction<S extends z.ZodType>(
  schema: S,
  run: (input: z.output<S>, user: UserActor) => Promise<Outcome>,
  revalidate: string,
) {
  return async (_previous: ActionState, formData: FormData): Promise<ActionState> => {
    const user = await currentUser();
    if (!user) return { status: "error", message: "Your session has ended. Sign in again." };
    const parsed = schema.safeParse(Object.fromEntries(formData));
    if (!parsed.success) {
      return {
        status: "error",
        message: "Check the highlighted fields.",
        fieldErrors: z.flattenError(parsed.error).fieldErrors as Record<string, string[]>,
      };
    }
    try {
      const outcome = await run(parsed.data, user);
      revalidatePath(revalidate);
      return { status: "ok", ...outcome };
    } catch (error) {
      if (!(error instanceof AppError)) throw error;
      const field = fieldOf(error.details);
      return { status: "error", message: error.message, ...(field ? { fieldErrors: { [field]: [error.message] } } : {}) };
    }
  };
}
