import "server-only";
import { createHmac, timingSafeEqual } from "node:crypto";

/**
 * Signed, expiring links for invitations and password resets, kept in no table: the link carries
 * the user id, purpose and expiry, signed with NEXTAUTH_SECRET together with the user's current
 * password hash. Setting a password changes that hash, so a link works once, and any older
 * link of the same person stops working with it.
 */
export const LINK_PURPOSES = ["invitation", "password-reset"] as const;
export type LinkPurpose = (typeof LINK_PURPOSES)[number];

export const LINK_LIFETIME_MS: Record<LinkPurpose, number> = {
  invitation: 7 * 24 * 3600_000,
  "password-reset": 60 * 60_000,
};

export type LinkClaims = { userId: number; purpose: LinkPurpose; expiresAt: number };

function secret(): string {
  const value = process.env.NEXTAUTH_SECRET;
  if (!value) throw new Error("NEXTAUTH_SECRET must be set to sign invitation and password-reset links.");
  return value;
}

function signature(payload: string, passwordHash: string): Buffer {
  return createHmac("sha256", secret()).update(`${payload}.${passwordHash}`).digest();
}

export function signAccountLink(user: { id: number; passwordHash: string }, purpose: LinkPurpose, now = Date.now()): string {
  const claims: LinkClaims = { userId: user.id, purpose, expiresAt: now + LINK_LIFETIME_MS[purpose] };
  const payload = Buffer.from(JSON.stringify(claims)).toString("base64url");
  return `${payload}.${signature(payload, user.passwordHash).toString("base64url")}`;
}

/** The claims a link makes, unchecked: enough to find whose password hash checks it. */
export function readAccountLink(token: string): LinkClaims | null {
  const [payload, sig, extra] = token.split(".");
  if (!payload || !sig || extra !== undefined) return null;
  try {
    const claims = JSON.parse(Buffer.from(payload, "base64url").toString("utf8")) as Partial<LinkClaims>;
    if (!Number.isInteger(claims.userId) || typeof claims.expiresAt !== "number") return null;
    if (!LINK_PURPOSES.includes(claims.purpose as LinkPurpose)) return null;
    return claims as LinkClaims;
  } catch {
    return null;
  }
}

/** True when the link was signed by this server for this password hash, for `purpose`, and has not expired. */
export function accountLinkHolds(token: string, purpose: LinkPurpose, passwordHash: string, now = Date.now()): boolean {
  const claims = readAccountLink(token);
  if (!claims || claims.purpose !== purpose || claims.expiresAt <= now) return false;
  const [payload, sig] = token.split(".") as [string, string];
  const given = Buffer.from(sig, "base64url");
  const expected = signature(payload, passwordHash);
  return given.length === expected.length && timingSafeEqual(given, expected);
}
