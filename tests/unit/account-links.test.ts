import { beforeAll, describe, expect, it } from "vitest";
import { accountLinkHolds, readAccountLink, signAccountLink } from "@/lib/auth/account-links";

beforeAll(() => {
  process.env.NEXTAUTH_SECRET = "unit-test-secret";
});

const user = { id: 42, passwordHash: "$2b$10$abcdefghijklmnopqrstuv" };
const now = Date.UTC(2026, 6, 1, 12);

describe("signed account links", () => {
  it("hold for their purpose until they expire", () => {
    const token = signAccountLink(user, "password-reset", now);
    expect(readAccountLink(token)).toEqual({ userId: 42, purpose: "password-reset", expiresAt: now + 3_600_000 });
    expect(accountLinkHolds(token, "password-reset", user.passwordHash, now + 3_599_999)).toBe(true);
    expect(accountLinkHolds(token, "password-reset", user.passwordHash, now + 3_600_000)).toBe(false);
    expect(accountLinkHolds(token, "invitation", user.passwordHash, now)).toBe(false);
  });

  it("stop holding once the password changes, so a link works once", () => {
    const token = signAccountLink(user, "invitation", now);
    expect(accountLinkHolds(token, "invitation", "$2b$10$anotherhash", now)).toBe(false);
  });

  it("refuse a changed payload, another server's secret, and garbage", () => {
    const token = signAccountLink(user, "invitation", now);
    const [, sig] = token.split(".");
    const forged = `${Buffer.from(JSON.stringify({ userId: 1, purpose: "invitation", expiresAt: now + 1e9 })).toString("base64url")}.${sig}`;
    expect(accountLinkHolds(forged, "invitation", user.passwordHash, now)).toBe(false);
    process.env.NEXTAUTH_SECRET = "another-secret";
    expect(accountLinkHolds(token, "invitation", user.passwordHash, now)).toBe(false);
    process.env.NEXTAUTH_SECRET = "unit-test-secret";
    expect(accountLinkHolds(token, "invitation", user.passwordHash, now)).toBe(true);
    for (const garbage of ["", "abc", "a.b.c", "%%%.###"]) expect(readAccountLink(garbage)).toBeNull();
  });
});
