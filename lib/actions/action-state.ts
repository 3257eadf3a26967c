/** What every server action answers, for useActionState to render beside the form. */
export type ActionState = {
  status: "idle" | "ok" | "error";
  message?: string;
  fieldErrors?: Record<string, string[] | undefined>;
  /** A value shown once, such as a new API token. */
  secret?: string;
};

export const IDLE: ActionState = { status: "idle" };
