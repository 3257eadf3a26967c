import "server-only";
import { z } from "zod";
import { AppError } from "@/lib/errors";
import { parseWith } from "@/lib/validation";
import type { Actor } from "@/lib/auth/actor";
import { requireRouteAccess } from "@/lib/auth/authorize";
import { userForSessionCookie } from "@/lib/auth/request-session";
import { actorForToken, bearerFrom } from "@/lib/auth/tokens";
import { ruleFor } from "./route-rules";

const DEFAULT_JSON_LIMIT_BYTES = 1_000_000;

/** Below this many characters gzip saves too little to be worth its set-up (the `compression` package's default threshold). */
const SMALLEST_COMPRESSED_BYTES = 1024;

/**
 * A JSON answer. Next drops a route's Content-Length and streams its body, so its gzip cannot see
 * the size and compressed even a 200-byte answer: a gzip stream set up per burst answer cost the
 * burst bench about 15 ms of server CPU per million samples. Short answers say `no-transform`,
 * which makes Next (and proxies) send them as they are; longer ones are still compressed.
 */
export function json(data: unknown, status = 200): Response {
  const body = JSON.stringify(data);
  const headers: Record<string, string> = { "content-type": "application/json" };
  if (body.length < SMALLEST_COMPRESSED_BYTES) headers["cache-control"] = "no-transform";
  return new Response(body, { status, headers });
}

export function errorBody(error: AppError) {
  return { error: { code: error.code, message: error.message, ...(error.details === undefined ? {} : { details: error.details }) } };
}

/**
 * Turns any thrown value into the contract's error format; unexpected ones are logged, never shown.
 * A refused request that came with a body closes the connection: the body may be unread (a 413 from
 * the declared length, a 401 before reading), and the next request on that socket must not wait
 * behind it.
 */
export function errorResponse(error: unknown, request?: Request): Response {
  const response =
    error instanceof AppError
      ? json(errorBody(error), error.status)
      : (console.error("Unexpected error in an API route", error),
        json({ error: { code: "internal_error", message: "Something went wrong on the server; it has been logged." } }, 500));
  if (request && hasBody(request)) response.headers.set("connection", "close");
  return response;
}

function hasBody(request: Request): boolean {
  return Number(request.headers.get("content-length")) > 0 || request.headers.has("transfer-encoding");
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
export async function readBodyBytes(request: Request, limitBytes: number): Promise<Buffer<ArrayBuffer>> {
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

const READ_METHODS = new Set(["GET", "HEAD", "OPTIONS"]);

/**
 * A browser sends its cookies along with a form or fetch another site makes it send: a write
 * authenticated by cookie must come from the app's own pages. Tokens are not sent by browsers
 * on their own, so bearer calls need no such check.
 */
function refuseForeignOrigin(request: Request) {
  if (READ_METHODS.has(request.method)) return;
  const origin = request.headers.get("origin");
  const own = new Set([new URL(request.url).origin, process.env.NEXTAUTH_URL && new URL(process.env.NEXTAUTH_URL).origin]);
  const host = request.headers.get("host");
  if (host) own.add(`${new URL(request.url).protocol}//${host}`);
  const foreign = origin ? !own.has(origin) : request.headers.get("sec-fetch-site") === "cross-site";
  if (foreign) throw new AppError("forbidden", "Requests from other sites may not change anything here; use an API token.");
}

/** Who calls: a bearer token (loggers, scripts), or else the app's own pages with the browser's session. */
async function authenticate(request: Request): Promise<Actor> {
  const authorization = request.headers.get("authorization");
  if (!authorization) {
    refuseForeignOrigin(request);
    const user = await userForSessionCookie(request);
    if (user) return user;
  }
  return actorForToken(bearerFrom(authorization));
}

/**
 * Wraps an /api/v1 handler: the route's rule (lib/api/route-rules.ts) and authentication first,
 * then the handler; every error in the contract's format.
 */
export function apiRoute<P>(handler: ApiHandler<P>) {
  return async (request: Request, context: RouteContext<P>): Promise<Response> => {
    try {
      const rule = ruleFor(request.method, new URL(request.url).pathname);
      if (!rule || rule === "public") throw new Error(`No rule in ROUTE_RULES for ${request.method} ${request.url}`);
      const actor = await authenticate(request);
      const params = await context.params;
      const code = (params as { code?: unknown } | undefined)?.code;
      await requireRouteAccess(actor, rule, typeof code === "string" ? code : undefined);
      return await handler({ request, params, actor });
    } catch (error) {
      return errorResponse(error, request);
    }
  };
}
