import { z } from "zod";
import { MIN_PASSWORD_LENGTH, ROLES } from "@/lib/auth/roles";
import { AppError } from "@/lib/errors";
import { isTimeZone } from "@/lib/time-format";

/** Zod's issues as the per-field list the API and forms report. */
export function issuesOf(error: z.ZodError) {
  return error.issues.map((issue) => ({ path: issue.path.join("."), message: issue.message }));
}

export function validationError(error: z.ZodError): AppError {
  const issues = issuesOf(error);
  const first = issues[0];
  const summary = first ? `${first.path ? `${first.path}: ` : ""}${first.message}` : "The request is invalid.";
  return new AppError("validation_failed", summary, { issues });
}

export function parseWith<S extends z.ZodType>(schema: S, value: unknown): z.output<S> {
  const result = schema.safeParse(value);
  if (!result.success) throw validationError(result.error);
  return result.data;
}

/** Schemas shared by server actions, the API and the command line. */

// Say what to fix when a field is missing or of the wrong type, instead of zod's generic wording.
z.config({
  customError: (issue) => {
    if (issue.code !== "invalid_type") return undefined;
    return issue.input === undefined ? "This field is required." : `Expected ${issue.expected}.`;
  },
});

export { isTimeZone };

/**
 * Line breaks and tabs (become a space), other C0 and C1 control characters, and the bidirectional
 * embedding, override and isolate marks (U+202A–U+202E, U+2066–U+2069): none belongs in a name or a
 * note, and each can forge a line of an e-mail header or a log, or make text read backwards.
 */
const LINE_BREAKS = /[\t\n\r\v\f\u0085\u2028\u2029]+/g;
const INVISIBLE_CONTROLS = /[\u0000-\u001f\u007f-\u009f\u202a-\u202e\u2066-\u2069]/g;

export function stripControlCharacters(text: string): string {
  return text.replace(LINE_BREAKS, " ").replace(INVISIBLE_CONTROLS, "");
}

/** Every name and free-text field starts here, so control characters never reach storage; `.trim()` and length checks follow. */
export const plainText = (params?: Parameters<typeof z.string>[0]) => z.string(params).overwrite(stripControlCharacters);

export const optionalText = (max: number) =>
  plainText()
    .trim()
    .max(max, `Keep it under ${max} characters.`)
    .transform((value) => value || undefined)
    .optional();

export const structureCode = z
  .string()
  .regex(/^[A-Za-z0-9_-]{2,32}$/, "Use 2 to 32 letters, digits, '-' or '_' (no spaces).");

export const timeZone = z
  .string()
  .trim()
  .refine(isTimeZone, "Use an IANA time zone name such as Europe/Paris or America/Chicago.");

export const createStructureInput = z.object({
  code: structureCode.meta({ description: "Short unique code, 2–32 of A-Z a-z 0-9 - _", example: "FB-01" }),
  name: plainText().trim().min(1, "Give the structure a name.").max(200, "Keep the name under 200 characters."),
  location: optionalText(200),
  timezone: timeZone.optional().default("UTC").meta({ description: "IANA time zone, default UTC" }),
  description: optionalText(2000),
}).meta({ id: "StructureInput" });
export type CreateStructureInput = z.infer<typeof createStructureInput>;

export const email = z.string().trim().toLowerCase().pipe(z.email("Enter a valid e-mail address."));

export const role = z.enum(ROLES, { error: `Choose one of: ${ROLES.join(", ")}.` });

export const password = z
  .string()
  .min(MIN_PASSWORD_LENGTH, `Use at least ${MIN_PASSWORD_LENGTH} characters.`)
  .max(200, "Keep the password under 200 characters.");

export const createUserInput = z.object({
  email,
  name: plainText().trim().min(1, "Enter the person's name.").max(200),
  role,
  password,
});
export type CreateUserInput = z.infer<typeof createUserInput>;

export const tokenName = plainText().trim().min(1, "Name the token after what will use it.").max(100);

export const inviteUserInput = createUserInput.omit({ password: true });
export type InviteUserInput = z.infer<typeof inviteUserInput>;
