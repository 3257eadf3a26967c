import { beforeAll, describe, expect, it } from "vitest";
import { HTTP_METHODS, ROUTE_RULES, type HttpMethod, type RouteRule } from "@/lib/api/route-rules";
import { isStructureScoped, roleAllows } from "@/lib/auth/permissions";
import { baseUrl, expectContractError, makeCallers, millIds, scanRouteFiles, storedFingerprint, type Caller } from "./helpers";

// Every route and method found in app/api/v1 against every kind of caller; what each may do comes
// from the route's rule and the role matrix (lib/auth/permissions.ts). The API contract: 401 without
// a valid token, 403 when authenticated and not allowed, 404 for a structure out of sight, a logger
// token only sends readings. Bodies are never valid (a JSON array), so nothing is stored.
const routes = scanRouteFiles();
let callers: Caller[];
let ids: Awaited<ReturnType<typeof millIds>>;
let calls = 0;

beforeAll(async () => {
  callers = await makeCallers("matrix");
  ids = await millIds();
});

/** A concrete path of MILL-FB for a pattern; DELETE aims at things that do not exist, so nothing is removed. */
function pathFor(pattern: string, method: HttpMethod): string {
  const destructive = method === "DELETE";
  return `/api/v1${pattern}`
    .replace("{code}", "MILL-FB")
    .replace("{tag}", destructive ? "NO-SUCH" : pattern.includes("rosettes") ? "R1" : "LC-M1")
    .replace("{id}", String(destructive ? 999_999 : pattern.startsWith("/alerts") ? ids.alert : pattern.includes("/load-tests/") ? ids.loadTest : pattern.includes("/certificates/") ? ids.certificate : ids.file));
}

// "out of sight": a 404, or for a route addressed by id a 400 about the body given before the id is
// looked up; the same either way for ids that exist and ids that do not.
type Expected = 200 | 401 | 403 | 404 | "out of sight" | "past the door";

function expected(caller: Caller, rule: RouteRule, pattern: string): Expected {
  if (rule === "public") return 200;
  if (!caller.role) return 401;
  if (caller.role === "logger") return rule === "readings:ingest" ? "past the door" : 403;
  if (rule !== "signed-in" && !roleAllows(caller.role, rule)) return 403;
  if (pattern.includes("{id}") && !caller.sees.includes("MILL-FB")) return "out of sight";
  const scoped = rule !== "signed-in" && isStructureScoped(rule);
  if (scoped && !caller.sees.includes("MILL-FB")) return 404;
  return "past the door";
}

async function call(caller: Caller, method: HttpMethod, path: string): Promise<Response> {
  calls++;
  const headers: Record<string, string> = { "content-type": "application/json" };
  if (caller.token) headers.authorization = `Bearer ${caller.token}`;
  return fetch(`${baseUrl()}${path}`, { method, headers, body: method === "GET" ? undefined : "[]" });
}

describe("authorization matrix", () => {
  it("every route file has a rule for each method it defines, and every rule a route file", () => {
    const fromFiles = Object.fromEntries(routes.map((r) => [r.pattern, [...r.methods].sort()]));
    const fromRules = Object.fromEntries(Object.entries(ROUTE_RULES).map(([p, rules]) => [p, Object.keys(rules).sort()]));
    expect(fromFiles).toEqual(fromRules);
  });

  it.each(routes.map((r) => [r.pattern, r] as const))("%s answers each caller as its rule says", async (pattern, route) => {
    const before = await storedFingerprint();
    const mismatches: string[] = [];
    for (const method of route.methods) {
      const rule = (ROUTE_RULES as Record<string, Partial<Record<HttpMethod, RouteRule>>>)[pattern]![method]!;
      const path = pathFor(pattern, method);
      for (const caller of callers) {
        const response = await call(caller, method, path);
        const want = expected(caller, rule, pattern);
        const label = `${method} ${path} as ${caller.name}`;
        if (response.status >= 500) mismatches.push(`${label}: ${response.status}`);
        if (want === "past the door") {
          const body = response.status >= 400 ? await expectContractError(response, label) : null;
          const stoppedAtDoor = [401, 403].includes(response.status) || (response.status === 404 && /^Structure /.test(body?.message ?? ""));
          if (stoppedAtDoor) mismatches.push(`${label}: expected past the door, got ${response.status} ${body?.message}`);
        } else if (want === "out of sight") {
          if (![400, 404].includes(response.status)) mismatches.push(`${label}: expected 404 or 400, got ${response.status}`);
          else await expectContractError(response, label);
        } else if (response.status !== want) {
          mismatches.push(`${label}: expected ${want}, got ${response.status} ${await response.text().catch(() => "")}`);
        } else if (want !== 200) {
          await expectContractError(response, label);
        } else {
          await response.body?.cancel();
        }
      }
    }
    expect(mismatches).toEqual([]);
    expect(await storedFingerprint()).toBe(before);
  });

  it("answers every other method on every known path with a 405 in the contract's shape", async () => {
    const problems: string[] = [];
    for (const route of routes) {
      for (const method of HTTP_METHODS.filter((m) => !route.methods.includes(m))) {
        const response = await call(callers[1]!, method, pathFor(route.pattern, method));
        if (response.status !== 405) problems.push(`${method} ${route.pattern}: ${response.status}`);
        else {
          const error = await expectContractError(response, `${method} ${route.pattern}`);
          expect(error.code).toBe("method_not_allowed");
          expect(response.headers.get("allow")?.split(", ").sort()).toEqual([...route.methods].sort());
        }
      }
    }
    expect(problems).toEqual([]);
    console.info(`authorization matrix: ${routes.length} routes, ${callers.length} kinds of caller, ${calls} calls`);
  });
});
