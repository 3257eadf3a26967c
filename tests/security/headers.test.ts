import { describe, expect, it } from "vitest";
import { baseUrl } from "./helpers";

// OWASP HTTP Headers Cheat Sheet: frame-ancestors 'none' and X-Frame-Options DENY against
// clickjacking, nosniff, a Referrer-Policy, HSTS over HTTPS; W3C CSP Level 3 for nonces.
const get = (path: string, headers: Record<string, string> = {}) => fetch(`${baseUrl()}${path}`, { headers, redirect: "manual" });

function expectFixedHeaders(response: Response, label: string) {
  expect(response.headers.get("x-frame-options"), label).toBe("DENY");
  expect(response.headers.get("x-content-type-options"), label).toBe("nosniff");
  expect(response.headers.get("referrer-policy"), label).toBe("same-origin");
  expect(response.headers.get("content-security-policy") ?? "frame-ancestors 'none'", label).toContain("frame-ancestors 'none'");
}

describe("security headers", () => {
  it("pages carry a policy with a fresh nonce per response, strict-dynamic and no unsafe-eval", async () => {
    const [first, second] = [await get("/signin"), await get("/signin")];
    const nonceOf = (r: Response) => /'nonce-([^']+)'/.exec(r.headers.get("content-security-policy") ?? "")?.[1];
    for (const response of [first, second]) {
      expectFixedHeaders(response, "/signin");
      const csp = response.headers.get("content-security-policy")!;
      expect(csp).toContain("'strict-dynamic'");
      expect(csp).toContain("object-src 'none'");
      expect(csp).not.toContain("unsafe-eval");
    }
    expect(nonceOf(first)).toBeTruthy();
    expect(nonceOf(first)).not.toBe(nonceOf(second));
    // Next.js put the nonce on its own scripts.
    const html = await second.text();
    expect(html).toContain(`nonce="${nonceOf(second)}"`);
  });

  it("the API, redirects, static files and the framework's refusals carry the fixed headers", async () => {
    const html = await (await get("/signin")).text();
    const script = /src="(\/_next\/static\/[^"]+\.js)"/.exec(html)![1]!;
    for (const path of ["/api/v1/structures", "/api/v1/openapi.json", "/api/v1/nowhere", "/", "/structures/MILL-FB", script]) {
      const response = await get(path);
      expectFixedHeaders(response, path);
      if (path.startsWith("/api/")) expect(response.headers.get("content-security-policy"), path).toContain("default-src 'none'");
      await response.body?.cancel();
    }
  });

  it("sends HSTS only when the request came over HTTPS", async () => {
    expect((await get("/signin")).headers.get("strict-transport-security")).toBeNull();
    const viaTls = await get("/signin", { "x-forwarded-proto": "https" });
    expect(viaTls.headers.get("strict-transport-security")).toMatch(/max-age=\d{7,}/);
    expect(viaTls.headers.get("content-security-policy")).toContain("upgrade-insecure-requests");
    expect((await get("/api/v1/structures", { "x-forwarded-proto": "https" })).headers.get("strict-transport-security")).toMatch(/max-age/);
  });
});
