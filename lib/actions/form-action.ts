import { revalidatePath } from "next/cache";
import type { z } from "zod";
import { issuesOf } from "@/lib/api/http";
import type { UserActor } from "@/lib/auth/actor";
import { currentUser } from "@/lib/auth/session";
import { AppError } from "@/lib/errors";
import type { ActionState } from "./action-state";

type Outcome = { message: string; secret?: string };
type Run<S extends z.ZodType> = (input: z.output<S>, user: UserActor) => Promise<Outcome>;

function fieldOf(details: unknown): string | undefined {
  return typeof details === "object" && details !== null && "field" in details ? String(details.field) : undefined;
}

type Issue = { path: string; message: string };

/** Field errors keyed by the dotted path of each field ("material.E"), as forms name their inputs. */
function fieldErrorsOf(issues: Issue[]): Record<string, string[]> {
  const errors: Record<string, string[]> = {};
  for (const issue of issues) (errors[issue.path || "form"] ??= []).push(issue.message);
  return errors;
}

function errorState(error: AppError): ActionState {
  const details = error.details as { issues?: Issue[] } | undefined;
  if (details?.issues) return { status: "error", message: error.message, fieldErrors: fieldErrorsOf(details.issues) };
  const field = fieldOf(error.details);
  return { status: "error", message: error.message, ...(field ? { fieldErrors: { [field]: [error.message] } } : {}) };
}

/**
 * The one wrapper for server actions: the signed-in user is re-checked, the input is validated
 * by `schema`, and errors come back as per-field messages instead of exceptions. Permissions are
 * decided inside `run` by the services (lib/auth/authorize).
 */
async function runAction<S extends z.ZodType>(schema: S, raw: unknown, run: Run<S>, revalidate: string): Promise<ActionState> {
  const user = await currentUser();
  if (!user) return { status: "error", message: "Your session has ended. Sign in again." };
  const parsed = schema.safeParse(raw);
  if (!parsed.success) return { status: "error", message: "Check the highlighted fields.", fieldErrors: fieldErrorsOf(issuesOf(parsed.error)) };
  try {
    const outcome = await run(parsed.data, user);
    revalidatePath(revalidate, "layout");
    return { status: "ok", ...outcome };
  } catch (error) {
    if (error instanceof AppError) return errorState(error);
    throw error;
  }
}

/** For forms posted as FormData (useActionState). */
export function formAction<S extends z.ZodType>(schema: S, run: Run<S>, revalidate: string) {
  return (_previous: ActionState, formData: FormData) => runAction(schema, Object.fromEntries(formData), run, revalidate);
}

/** For client components that build a structured value (nested fields) and send it as is. */
export function objectAction<S extends z.ZodType>(schema: S, raw: unknown, run: Run<S>, revalidate: string) {
  return runAction(schema, raw, run, revalidate);
}
