import { execFile } from "node:child_process";
import { promisify } from "node:util";
import { encode } from "next-auth/jwt";
import { beforeAll, describe, expect, it } from "vitest";
import { SESSION_FORMAT } from "@/lib/auth/session-claims";
import { createUser } from "@/lib/services/users";
import { baseUrl, serverDb, signInOverHttp } from "./helpers";

// OWASP Session Management Cheat Sheet: a session ends on the server at sign-out and when the
// password changes; a copy of the cookie made before must not keep working.
const whoAmI = (cookie: string) => fetch(`${baseUrl()}/api/v1/structures`, { headers: { cookie } });

beforeAll(async () => {
  for (const who of ["guessed", "replayed", "reset", "upgraded"]) {
    await createUser(null, { email: `${who}@sessions.example`, name: `Session ${who}`, role: "owner", password: "right-password" });
  }
});

describe("sign-in throttling over HTTP", () => {
  it("counts every checked one of 20 parallel wrong passwords, locks the account, mails its owner once and refuses the right password at once", async () => {
    const guesses = await Promise.all(
      Array.from({ length: 20 }, (_, i) => signInOverHttp("guessed@sessions.example", `wrong-${i}`, `203.0.113.${i + 1}`)),
    );
    expect(guesses.every((g) => g.cookie === null)).toBe(true);
    // A guess that arrives once the lock is set is refused unchecked; every guess whose password
    // was checked must be counted, however they interleave (none lost to a read-then-write race).
    expect(guesses.filter((g) => g.error !== "locked" && g.error !== "CredentialsSignin")).toEqual([]);
    const checked = guesses.filter((g) => g.error === "CredentialsSignin").length;
    expect(checked).toBeGreaterThanOrEqual(5);
    const { rows } = await serverDb().execute("select failures, locked_until from sign_in_failures where email_key = 'guessed@sessions.example'");
    expect(rows[0]!.failures).toBe(checked);
    expect(Number(rows[0]!.locked_until)).toBeGreaterThan(Date.now());
    const mails = await serverDb().execute("select kind from mail_outbox where to_address = 'guessed@sessions.example'");
    expect(mails.rows.map((r) => r.kind)).toEqual(["sign-in-lock"]);
    const right = await signInOverHttp("guessed@sessions.example", "right-password", "203.0.113.99");
    expect(right).toMatchObject({ cookie: null, error: "locked" });
  });
});

describe("session replay", () => {
  it("a cookie copied before signing out is refused after it", async () => {
    const { cookie, csrfToken } = await signInOverHttp("replayed@sessions.example", "right-password");
    expect(cookie).not.toBeNull();
    expect((await whoAmI(cookie!)).status).toBe(200);
    const signOut = await fetch(`${baseUrl()}/api/auth/signout`, {
      method: "POST",
      redirect: "manual",
      headers: { "content-type": "application/x-www-form-urlencoded", cookie: cookie! },
      body: new URLSearchParams({ csrfToken, json: "true" }),
    });
    expect(signOut.status).toBeLessThan(400);
    expect((await whoAmI(cookie!)).status).toBe(401);
    const page = await fetch(`${baseUrl()}/`, { headers: { cookie: cookie! }, redirect: "manual" });
    expect(page.status === 307 || page.headers.get("location") !== null || (await page.text()).includes("Sign in")).toBe(true);
  });

  it("a cookie from before `npm run admin -- user password` is refused after it", async () => {
    const { cookie } = await signInOverHttp("reset@sessions.example", "right-password");
    expect((await whoAmI(cookie!)).status).toBe(200);
    // Run without blocking this process: a blocked event loop misses the server closing the idle
    // kept-alive connection, and the next request is sent on the dead socket ("other side closed").
    await promisify(execFile)(
      "node_modules/.bin/tsx",
      ["--conditions=react-server", "scripts/admin.ts", "user", "password", "--email", "reset@sessions.example", "--password", "another-password"],
      { env: process.env, encoding: "utf8" },
    );
    expect((await whoAmI(cookie!)).status).toBe(401);
    expect((await signInOverHttp("reset@sessions.example", "another-password")).cookie).not.toBeNull();
  });
});

describe("sessions of an earlier release", () => {
  /** A session cookie as a release writing `format` would have, signed with the server's secret. */
  async function cookieOfFormat(format: number | undefined) {
    const { rows } = await serverDb().execute("select id, email, role, session_version from users where email = 'upgraded@sessions.example'");
    const user = rows[0]!;
    const token = { sub: String(user.id), email: String(user.email), role: user.role, sessionVersion: Number(user.session_version), sessionId: crypto.randomUUID(), sessionFormat: format };
    return `next-auth.session-token=${await encode({ token: token as never, secret: process.env.NEXTAUTH_SECRET! })}`;
  }

  it("asks the holder of a cookie in an earlier session format to sign in again, and accepts the current format", async () => {
    // The same claims with this release's format work: the refusal below is the format's alone.
    expect((await whoAmI(await cookieOfFormat(SESSION_FORMAT))).status).toBe(200);
    for (const format of [undefined, SESSION_FORMAT - 1]) {
      const cookie = await cookieOfFormat(format);
      expect((await whoAmI(cookie)).status, `format ${format}`).toBe(401);
      const page = await fetch(`${baseUrl()}/`, { headers: { cookie }, redirect: "manual" });
      expect(new URL(page.headers.get("location") ?? "", baseUrl()).pathname, `format ${format}`).toBe("/signin");
    }
  });
});
