import "server-only";
import { revalidatePath } from "next/cache";
import type { z } from "zod";
import { issuesOf } from "@/lib/validation";
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

/** Validates `raw` with `schema`, runs the work, and turns AppErrors into per-field messages. */
async function settle<S extends z.ZodType>(schema: S, raw: unknown, run: (input: z.output<S>) => Promise<Outcome>, revalidate?: string): Promise<ActionState> {
  const parsed = schema.safeParse(raw);
  if (!parsed.success) return { status: "error", message: "Check the highlighted fields.", fieldErrors: fieldErrorsOf(issuesOf(parsed.error)) };
  try {
    const outcome = await run(parsed.data);
    if (revalidate) revalidatePath(revalidate, "layout");
    return { status: "ok", ...outcome };
  } catch (error) {
    if (error instanceof AppError) return errorState(error);
    throw error;
  }
}

/**
 * The one wrapper for server actions: the signed-in user is re-checked, the input is validated
 * by `schema`, and errors come back as per-field messages instead of exceptions. Permissions are
 * decided inside `run` by the services (lib/auth/authorize).
 */
async function runAction<S extends z.ZodType>(schema: S, raw: unknown, run: Run<S>, revalidate: string): Promise<ActionState> {
  const user = await currentUser();
  if (!user) return { status: "error", message: "Your session has ended. Sign in again." };
  return settle(schema, raw, (input) => run(input, user), revalidate);
}

/** For forms posted as FormData (useActionState). */
export function formAction<S extends z.ZodType>(schema: S, run: Run<S>, revalidate: string) {
  return (_previous: ActionState, formData: FormData) => runAction(schema, Object.fromEntries(formData), run, revalidate);
}

/**
 * For the few forms people use signed out (asking for a password reset, choosing a password
 * from an e-mailed link): the same validation and error handling, with no user to check.
 */
export function publicFormAction<S extends z.ZodType>(schema: S, run: (input: z.output<S>) => Promise<Outcome>) {
  return (_previous: ActionState, formData: FormData) => settle(schema, Object.fromEntries(formData), run);
}

/** For client components that build a structured value (nested fields) and send it as is. */
export function objectAction<S extends z.ZodType>(schema: S, raw: unknown, run: Run<S>, revalidate: string) {
  return runAction(schema, raw, run, revalidate);
}
