import { createHash } from "node:crypto";
import fs from "node:fs";
import path from "node:path";
import { createClient, type Client } from "@libsql/client";
import { expect, inject } from "vitest";
import { HTTP_METHODS, type HttpMethod } from "@/lib/api/route-rules";

export const baseUrl = () => inject("baseUrl");

let client: Client | undefined;
/** The server's database, read beside it (WAL lets both in). */
export function serverDb(): Client {
  client ??= createClient({ url: inject("databaseUrl") });
  return client;
}

/** Every route file under app/api/v1 and the methods it defines itself, as "/structures/{code}" patterns. */
export function scanRouteFiles(root = "app/api/v1"): { pattern: string; methods: HttpMethod[] }[] {
  const found: { pattern: string; methods: HttpMethod[] }[] = [];
  const walk = (folder: string) => {
    for (const entry of fs.readdirSync(folder, { withFileTypes: true })) {
      const full = path.join(folder, entry.name);
      if (entry.isDirectory()) walk(full);
      else if (entry.name === "route.ts" && !full.includes("[...")) {
        const source = fs.readFileSync(full, "utf8");
        const methods = HTTP_METHODS.filter((m) => new RegExp(`export (const|async function|function) ${m}\\b`).test(source));
        const pattern = path
          .relative(root, path.dirname(full))
          .split(path.sep)
          .map((segment) => segment.replace(/^\[(\w+)\]$/, "{$1}"))
          .join("/");
        found.push({ pattern: `/${pattern}`, methods });
      }
    }
  };
  walk(root);
  return found.sort((a, b) => a.pattern.localeCompare(b.pattern));
}

/** The contract's error body: `{ error: { code, message, details? } }`, a readable message, no stack. */
export async function expectContractError(response: Response, label: string): Promise<{ code: string; message: string }> {
  const text = await response.text();
  let body: { error?: { code?: unknown; message?: unknown } };
  try {
    body = JSON.parse(text) as typeof body;
  } catch {
    throw new Error(`${label}: ${response.status} with a body that is not JSON: ${text.slice(0, 200)}`);
  }
  expect(typeof body.error?.code, `${label}: ${text.slice(0, 200)}`).toBe("string");
  expect(String(body.error?.message).length, label).toBeGreaterThan(10);
  expect(text, label).not.toMatch(/at \w+ \(|node_modules|SQLITE_|drizzle/);
  return body.error as { code: string; message: string };
}

/**
 * A fingerprint of what people and loggers stored: the content of the configuration tables and the
 * row counts of the time series. Tables the background jobs write on their own (alerts raised by
 * the stale watch, the outbox, leases, roll-ups, token last-use) are left out.
 */
const CONTENT_TABLES = ["users", "structures", "structure_members", "gauges", "zero_readings", "rosettes", "files", "gauge_limits", "rosette_limits", "load_tests", "load_test_predictions", "thermal_models", "shunt_checks", "calibration_certificates", "site_visits", "site_visit_gauges", "site_visit_photos"];
const COUNTED_TABLES = ["readings", "audit_log", "api_tokens"];

export async function storedFingerprint(): Promise<string> {
  const hash = createHash("sha256");
  for (const table of CONTENT_TABLES) {
    const { rows } = await serverDb().execute(`select * from ${table} order by 1`);
    hash.update(table).update(JSON.stringify(rows));
  }
  for (const table of COUNTED_TABLES) {
    const { rows } = await serverDb().execute(`select count(*) as n from ${table}`);
    hash.update(table).update(String(rows[0]!.n));
  }
  return hash.digest("hex");
}

/** Signs in through next-auth's credentials callback as the sign-in page does; the session cookie, or the error. */
export async function signInOverHttp(email: string, password: string, clientAddress = "198.51.100.1") {
  const csrf = await fetch(`${baseUrl()}/api/auth/csrf`);
  const { csrfToken } = (await csrf.json()) as { csrfToken: string };
  const csrfCookie = csrf.headers.getSetCookie().map((c) => c.split(";")[0]).join("; ");
  const response = await fetch(`${baseUrl()}/api/auth/callback/credentials`, {
    method: "POST",
    redirect: "manual",
    headers: { "content-type": "application/x-www-form-urlencoded", cookie: csrfCookie, "x-forwarded-for": clientAddress },
    body: new URLSearchParams({ csrfToken, email, password, json: "true" }),
  });
  const session = response.headers.getSetCookie().find((c) => c.startsWith("next-auth.session-token="));
  // With json=true next-auth answers { url } (where the page would go) instead of redirecting.
  const location = response.headers.get("location") ?? ((await response.json().catch(() => ({}))) as { url?: string }).url ?? "";
  return {
    cookie: session ? `${session.split(";")[0]}; ${csrfCookie}` : null,
    error: new URL(location, baseUrl()).searchParams.get("error"),
    csrfToken,
  };
}

export type Caller = { name: string; token: string | null; role: "admin" | "engineer" | "technician" | "owner" | "logger" | null; sees: string[] };

/**
 * The kinds of caller an attacker can be: nobody, each demo role (the technician is a member of
 * MILL-FB only), an engineer of no structure, MILL-FB's logger, a revoked token and the token of
 * a deactivated account. `sees` lists the structures each may see.
 */
export async function makeCallers(suffix: string): Promise<Caller[]> {
  const { createToken } = await import("@/lib/services/tokens");
  const { createUser } = await import("@/lib/services/users");
  const userToken = async (email: string) => (await createToken(null, { kind: "user", email }, `security ${suffix}`)).token;
  const outsider = `outsider-${suffix}@hookeline.example`;
  const leaver = `leaver-${suffix}@hookeline.example`;
  await createUser(null, { email: outsider, name: "Outside Engineer", role: "engineer", password: "outsider-pass" });
  await createUser(null, { email: leaver, name: "Left Owner", role: "owner", password: "leaver-pass" });
  const revoked = await createToken(null, { kind: "user", email: "admin@hookeline.example" }, `revoked ${suffix}`);
  const leaverToken = await userToken(leaver);
  await serverDb().execute({ sql: "update api_tokens set revoked_at = ? where id = ?", args: [Date.now(), revoked.id] });
  await serverDb().execute({ sql: "update users set active = 0 where email = ?", args: [leaver] });
  const both = ["MILL-FB", "ORCH-PD"];
  return [
    { name: "nobody", token: null, role: null, sees: [] },
    { name: "admin", token: await userToken("admin@hookeline.example"), role: "admin", sees: both },
    { name: "engineer", token: await userToken("engineer@hookeline.example"), role: "engineer", sees: both },
    { name: "technician", token: await userToken("technician@hookeline.example"), role: "technician", sees: ["MILL-FB"] },
    { name: "owner", token: await userToken("owner@hookeline.example"), role: "owner", sees: both },
    { name: "engineer of nothing", token: await userToken(outsider), role: "engineer", sees: [] },
    { name: "MILL-FB logger", token: (await createToken(null, { kind: "logger", structureCode: "MILL-FB" }, `logger ${suffix}`)).token, role: "logger", sees: ["MILL-FB"] },
    { name: "revoked token", token: revoked.token, role: null, sees: [] },
    { name: "deactivated account", token: leaverToken, role: null, sees: [] },
  ];
}

/** Ids the id-addressed routes need: an alert, a file, a load test and a calibration certificate of MILL-FB. */
export async function millIds(): Promise<{ alert: number; file: number; loadTest: number; certificate: number }> {
  const one = async (sql: string) => Number((await serverDb().execute(sql)).rows[0]?.id ?? 999_999);
  // The demo records no load test: one without gauges gives the routes addressed by its id something to find.
  await serverDb().execute(
    "insert into load_tests (structure_id, title, load, start, end, created_by_label) select id, 'Matrix probe', 'none', 0, 1, 'security suite' from structures where code = 'MILL-FB' and not exists (select 1 from load_tests)",
  );
  // Nor any certificate: one of a logger, pointing at a stored file of MILL-FB, gives its file route something to serve.
  await serverDb().execute(
    "insert into calibration_certificates (structure_id, logger_name, certificate_number, issued_by, issued_on, expires_on, file_id, created_by_label) select s.id, 'Matrix probe logger', 'PROBE-1', 'security suite', '2026-01-01', '2027-01-01', f.id, 'security suite' from structures s join files f on f.structure_id = s.id where s.code = 'MILL-FB' and not exists (select 1 from calibration_certificates) order by f.id limit 1",
  );
  return {
    certificate: await one("select c.id from calibration_certificates c join structures s on s.id = c.structure_id where s.code = 'MILL-FB' order by c.id limit 1"),
    loadTest: await one("select t.id from load_tests t join structures s on s.id = t.structure_id where s.code = 'MILL-FB' order by t.id limit 1"),
    alert: await one("select a.id from alerts a join structures s on s.id = a.structure_id where s.code = 'MILL-FB' order by a.id limit 1"),
    file: await one("select f.id from files f join structures s on s.id = f.structure_id where s.code = 'MILL-FB' order by f.id limit 1"),
  };
}
