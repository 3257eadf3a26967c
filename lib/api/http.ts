import { z } from "zod";
import { AppError } from "@/lib/errors";
import type { Actor } from "@/lib/auth/actor";
import { userForSessionCookie } from "@/lib/auth/request-session";
import { actorForToken, bearerFrom } from "@/lib/auth/tokens";

const DEFAULT_JSON_LIMIT_BYTES = 1_000_000;

export function json(data: unknown, status = 200): Response {
  return Response.json(data, { status });
}

export function errorBody(error: AppError) {
  return { error: { code: error.code, message: error.message, ...(error.details === undefined ? {} : { details: error.details }) } };
}

/** Turns any thrown value into the contract's error format; unexpected ones are logged, never shown. */
export function errorResponse(error: unknown): Response {
  if (error instanceof AppError) return json(errorBody(error), error.status);
  console.error("Unexpected error in an API route", error);
  return json({ error: { code: "internal_error", message: "Something went wrong on the server; it has been logged." } }, 500);
}

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

/** The media type of the body, without parameters, lower case. */
export function contentType(request: Request): string | undefined {
  return request.headers.get("content-type")?.split(";")[0]?.trim().toLowerCase();
}

function requireContentType(request: Request, expected: string) {
  if (contentType(request) !== expected) {
    throw new AppError("unsupported_media_type", `Send the body as ${expected} (Content-Type: ${expected}).`);
  }
}

/** The body's bytes as they arrive, refused with a 413 as soon as they grow past the limit. */
export async function* bodyChunks(request: Request, limitBytes: number): AsyncGenerator<Uint8Array> {
  const declared = Number(request.headers.get("content-length"));
  if (declared > limitBytes) throw tooLarge(limitBytes);
  if (!request.body) return;
  const reader = request.body.getReader();
  let received = 0;
  try {
    for (;;) {
      const { done, value } = await reader.read();
      if (done) return;
      received += value.byteLength;
      if (received > limitBytes) throw tooLarge(limitBytes);
      yield value;
    }
  } finally {
    await reader.cancel().catch(() => undefined);
  }
}

/** Reads the whole body, refusing it as soon as it grows past the limit. */
async function readBodyBytes(request: Request, limitBytes: number): Promise<Buffer<ArrayBuffer>> {
  const chunks: Uint8Array[] = [];
  for await (const chunk of bodyChunks(request, limitBytes)) chunks.push(chunk);
  return Buffer.concat(chunks);
}

export async function readBodyText(request: Request, limitBytes: number): Promise<string> {
  return (await readBodyBytes(request, limitBytes)).toString("utf8");
}

function tooLarge(limitBytes: number) {
  return new AppError("payload_too_large", `The body is over the limit of ${(limitBytes / 1_000_000).toFixed(0)} MB.`);
}

/** A JSON object body validated by `schema`. */
export async function readJson<S extends z.ZodType>(
  request: Request,
  schema: S,
  limitBytes = DEFAULT_JSON_LIMIT_BYTES,
): Promise<z.output<S>> {
  requireContentType(request, "application/json");
  const text = await readBodyText(request, limitBytes);
  let body: unknown;
  try {
    body = JSON.parse(text);
  } catch {
    throw new AppError("invalid_json", "The body is not valid JSON.");
  }
  if (typeof body !== "object" || body === null || Array.isArray(body)) {
    throw new AppError("bad_request", "The body must be a JSON object.");
  }
  return parseWith(schema, body);
}

/**
 * A multipart/form-data body. It is read within the limit before it is parsed, so an oversized
 * upload is refused as soon as it passes the limit, whether or not it declared its length.
 */
export async function readFormData(request: Request, limitBytes: number): Promise<FormData> {
  requireContentType(request, "multipart/form-data");
  const body = await readBodyBytes(request, limitBytes);
  try {
    return await new Response(body, { headers: { "content-type": request.headers.get("content-type")! } }).formData();
  } catch {
    throw new AppError("bad_request", "The body is not valid multipart/form-data; let the client set the Content-Type with its boundary.");
  }
}

type RouteContext<P> = { params: Promise<P> };
type ApiHandler<P> = (call: { request: Request; params: P; actor: Actor }) => Promise<Response>;

/** Who calls: a bearer token (loggers, scripts), or else the app's own pages with the browser's session. */
async function authenticate(request: Request): Promise<Actor> {
  const authorization = request.headers.get("authorization");
  if (!authorization) {
    const user = await userForSessionCookie(request);
    if (user) return user;
  }
  return actorForToken(bearerFrom(authorization));
}

/** Wraps an /api/v1 handler: authentication first, every error in the contract's format. */
export function apiRoute<P>(handler: ApiHandler<P>) {
  return async (request: Request, context: RouteContext<P>): Promise<Response> => {
    try {
      const actor = await authenticate(request);
      return await handler({ request, params: await context.params, actor });
    } catch (error) {
      return errorResponse(error);
    }
  };
}
