import net from "node:net";
import { beforeAll, describe, expect, it } from "vitest";
import { createToken } from "@/lib/services/tokens";
import { baseUrl, expectContractError, signInOverHttp, storedFingerprint } from "./helpers";

let loggerToken: string;
let engineerCookie: string;

beforeAll(async () => {
  loggerToken = (await createToken(null, { kind: "logger", structureCode: "MILL-FB" }, "requests suite")).token;
  engineerCookie = (await signInOverHttp("engineer@hookeline.example", "engineer-demo", "198.51.100.20")).cookie!;
});

/** Writes raw bytes on one socket; what came back, and whether the server closed it (RFC 9112 §9.6: `Connection: close`). */
function rawExchange(head: string, bodyStart: string, waitMs: number): Promise<{ text: string; closedByServer: boolean }> {
  const { hostname, port } = new URL(baseUrl());
  return new Promise((resolve, reject) => {
    const socket = net.connect(Number(port), hostname);
    let text = "";
    const timer = setTimeout(() => {
      socket.destroy();
      resolve({ text, closedByServer: false });
    }, waitMs);
    socket.on("data", (chunk) => (text += chunk.toString("latin1")));
    socket.on("end", () => {
      clearTimeout(timer);
      socket.destroy();
      resolve({ text, closedByServer: true });
    });
    socket.on("error", reject);
    socket.write(head + bodyStart);
  });
}

describe("early refusals close the connection", () => {
  it("a 413 from the declared length arrives before the body and the server closes the socket", async () => {
    const { host } = new URL(baseUrl());
    const head = [
      "POST /api/v1/structures/MILL-FB/readings HTTP/1.1",
      `Host: ${host}`,
      `Authorization: Bearer ${loggerToken}`,
      "Content-Type: application/json",
      "Content-Length: 20000000",
      "",
      "",
    ].join("\r\n");
    // The server would hold the socket for its keep-alive time (several seconds) if it waited for the rest.
    const { text, closedByServer } = await rawExchange(head, '{"readings":[', 4_000);
    expect(text).toMatch(/^HTTP\/1\.1 413/);
    expect(text.toLowerCase()).toContain("connection: close");
    expect(text).toContain('"code":"payload_too_large"');
    expect(closedByServer).toBe(true);
  });

  it("a refused token on a request with a body closes too, and a fresh connection then works", async () => {
    const { host } = new URL(baseUrl());
    const head = ["POST /api/v1/structures/MILL-FB/readings HTTP/1.1", `Host: ${host}`, "Authorization: Bearer nope", "Content-Type: application/json", "Content-Length: 100000", "", ""].join("\r\n");
    const { text, closedByServer } = await rawExchange(head, "{", 4_000);
    expect(text).toMatch(/^HTTP\/1\.1 401/);
    expect(closedByServer).toBe(true);
    expect((await fetch(`${baseUrl()}/api/v1/openapi.json`)).status).toBe(200);
  });
});

describe("foreign origins", () => {
  const photoForm = () => {
    const form = new FormData();
    form.set("title", "probe");
    return form;
  };
  const photos = `/api/v1/structures/MILL-FB/gauges/LC-M1/photos`;

  it("a cookie-authenticated upload from another site is refused with the contract's 403 and stores nothing", async () => {
    const before = await storedFingerprint();
    const foreign: Record<string, string>[] = [{ origin: "https://evil.example" }, { origin: "null" }, { "sec-fetch-site": "cross-site" }];
    for (const headers of foreign) {
      const response = await fetch(`${baseUrl()}${photos}`, { method: "POST", headers: { cookie: engineerCookie, ...headers }, body: photoForm() });
      expect(response.status, JSON.stringify(headers)).toBe(403);
      expect((await expectContractError(response, JSON.stringify(headers))).code).toBe("forbidden");
    }
    expect(await storedFingerprint()).toBe(before);
  });

  it("the app's own origin and bearer tokens pass the origin check (and fail later on the missing file)", async () => {
    const own = await fetch(`${baseUrl()}${photos}`, { method: "POST", headers: { cookie: engineerCookie, origin: baseUrl() }, body: photoForm() });
    expect(own.status).toBe(400);
    const engineerToken = (await createToken(null, { kind: "user", email: "engineer@hookeline.example" }, "origin probe")).token;
    const bearer = await fetch(`${baseUrl()}${photos}`, {
      method: "POST",
      headers: { authorization: `Bearer ${engineerToken}`, origin: "https://evil.example" },
      body: photoForm(),
    });
    expect(bearer.status).toBe(400);
  });

  it("a server action posted from another site is a 403, not a 500", async () => {
    const response = await fetch(`${baseUrl()}/admin/users`, {
      method: "POST",
      headers: { cookie: engineerCookie, origin: "https://evil.example", "next-action": "0123456789abcdef", "content-type": "text/plain;charset=UTF-8" },
      body: "[]",
      redirect: "manual",
    });
    expect(response.status).toBe(403);
    await expectContractError(response, "foreign server action");
  });
});

describe("malformed cookies", () => {
  const COOKIES = [
    "next-auth.session-token=%E0%A4%A",
    "next-auth.session-token=",
    "next-auth.session-token=not.a.jwt",
    "next-auth.session-token=eyJhbGciOiJkaXIiLCJlbmMiOiJBMjU2R0NNIn0..AAAA.BBBB.CCCC",
    "next-auth.session-token.0=%%%; next-auth.session-token.1=%zz",
    ";;;==;;",
    "next-auth.session-token=" + "A".repeat(6000),
    "next-auth.session-token=\u00e9\u00e8; other=%",
    "=next-auth.session-token",
  ];

  it.each(COOKIES.map((c) => [c.slice(0, 60), c]))("%s: the API says 401, pages redirect or show, nothing is a 500", async (_, cookie) => {
    const api = await fetch(`${baseUrl()}/api/v1/structures`, { headers: { cookie: Buffer.from(cookie, "latin1").toString("latin1") } });
    expect(api.status).toBe(401);
    await expectContractError(api, cookie);
    for (const path of ["/", "/signin", "/structures/MILL-FB"]) {
      const page = await fetch(`${baseUrl()}${path}`, { headers: { cookie }, redirect: "manual" });
      expect(page.status, path).toBeLessThan(500);
      await page.body?.cancel();
    }
  });
});
