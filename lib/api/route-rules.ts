import type { Action } from "@/lib/auth/permissions";

/**
 * Who may call each route of /api/v1, decided before the body is read or anything is looked up:
 * an action of the permission matrix (lib/auth/permissions.ts), "signed-in" (any person, no
 * logger), or "public". Only routes whose action is `readings:ingest` take logger tokens.
 * Services check the same permission again with the structure in hand; this table is the door.
 * tests/security/authorization-matrix.test.ts fails for a route file missing here.
 */
export const ROUTE_RULES = {
  "/openapi.json": { GET: "public" },
  "/structures": { GET: "signed-in", POST: "structure:create" },
  "/structures/{code}": { GET: "structure:view" },
  "/structures/{code}/alerts": { GET: "structure:view" },
  "/structures/{code}/bursts": { POST: "readings:ingest" },
  "/structures/{code}/certificates": { GET: "structure:view", POST: "field-record:add" },
  "/structures/{code}/certificates/{id}/file": { GET: "structure:view" },
  "/structures/{code}/events/{id}": { GET: "structure:view", PATCH: "alert:acknowledge" },
  "/structures/{code}/drawings": { GET: "structure:view", POST: "gauge:register" },
  "/structures/{code}/gauges": { GET: "structure:view", POST: "gauge:register" },
  "/structures/{code}/gauges/{tag}": { GET: "structure:view", PATCH: "gauge:register", DELETE: "gauge:register" },
  "/structures/{code}/gauges/{tag}/events": { GET: "structure:view" },
  "/structures/{code}/gauges/{tag}/fatigue": { GET: "structure:view" },
  "/structures/{code}/gauges/{tag}/limits": { GET: "structure:view", PUT: "limits:edit" },
  "/structures/{code}/gauges/{tag}/limits/backtest": { POST: "structure:view" },
  "/structures/{code}/gauges/{tag}/photos": { GET: "structure:view", POST: "gauge:register" },
  "/structures/{code}/gauges/{tag}/placement": { PUT: "gauge:register" },
  "/structures/{code}/gauges/{tag}/readings": { GET: "structure:view" },
  "/structures/{code}/gauges/{tag}/series": { GET: "structure:view" },
  "/structures/{code}/gauges/{tag}/shunt-checks": { GET: "structure:view", POST: "shunt-check:record" },
  "/structures/{code}/gauges/{tag}/summaries": { GET: "structure:view" },
  "/structures/{code}/gauges/{tag}/thermal-model": { GET: "structure:view", PUT: "thermal-model:edit", DELETE: "thermal-model:edit" },
  "/structures/{code}/gauges/{tag}/thermal-model/fit": { POST: "structure:view" },
  "/structures/{code}/gauges/{tag}/zero": { POST: "zero:record" },
  "/structures/{code}/load-tests": { GET: "structure:view", POST: "load-test:record" },
  "/structures/{code}/load-tests/{id}": { GET: "structure:view" },
  "/structures/{code}/load-tests/{id}/results.csv": { GET: "structure:view" },
  "/structures/{code}/readings": { POST: "readings:ingest" },
  "/structures/{code}/report": { GET: "structure:view" },
  "/structures/{code}/site-visits": { GET: "structure:view", POST: "field-record:add" },
  "/structures/{code}/rosettes": { GET: "structure:view", POST: "gauge:register" },
  "/structures/{code}/rosettes/{tag}/limits": { GET: "structure:view", PUT: "limits:edit" },
  "/structures/{code}/rosettes/{tag}/limits/backtest": { POST: "structure:view" },
  "/structures/{code}/rosettes/{tag}/series": { GET: "structure:view" },
  "/structures/{code}/uploads": { POST: "readings:ingest" },
  "/alerts/{id}/acknowledge": { POST: "alert:acknowledge" },
  "/alerts/{id}/resolve": { POST: "alert:acknowledge" },
  "/files/{id}": { GET: "structure:view", DELETE: "gauge:register" },
} as const satisfies Record<string, Partial<Record<HttpMethod, RouteRule>>>;

export const HTTP_METHODS = ["GET", "POST", "PUT", "PATCH", "DELETE"] as const;
export type HttpMethod = (typeof HTTP_METHODS)[number];
export type RouteRule = Action | "signed-in" | "public";
export type RoutePattern = keyof typeof ROUTE_RULES;

const MATCHERS = (Object.keys(ROUTE_RULES) as RoutePattern[]).map((pattern) => ({
  pattern,
  regex: new RegExp(`^/api/v1${pattern.replace(/\{[^}]+\}/g, "[^/]+")}/?$`),
}));

/** The pattern of ROUTE_RULES that an /api/v1 path falls under, if any. */
export function routePatternOf(pathname: string): RoutePattern | undefined {
  return MATCHERS.find((m) => m.regex.test(pathname))?.pattern;
}

export function ruleFor(method: string, pathname: string): RouteRule | undefined {
  const pattern = routePatternOf(pathname);
  return pattern && (ROUTE_RULES[pattern] as Partial<Record<string, RouteRule>>)[method];
}

/** The methods a path answers to, for the Allow header of a 405. */
export function allowedMethods(pathname: string): HttpMethod[] {
  const pattern = routePatternOf(pathname);
  return pattern ? (Object.keys(ROUTE_RULES[pattern]) as HttpMethod[]) : [];
}
