import "server-only";
import { createHash, randomBytes } from "node:crypto";
import { eq } from "drizzle-orm";
import { getDb, writeTransaction } from "@/db/client";
import { apiTokens, users } from "@/db/schema";
import { AppError } from "@/lib/errors";
import type { Actor } from "./actor";

const TOKEN_PREFIX = "hkl_";
const LAST_USE_RESOLUTION_MS = 60_000;

export function generateToken(): string {
  return TOKEN_PREFIX + randomBytes(32).toString("base64url");
}

export function hashToken(token: string): string {
  return createHash("sha256").update(token).digest("hex");
}

export function tokenHint(token: string): string {
  return `${token.slice(0, TOKEN_PREFIX.length + 4)}…`;
}

const unauthorized = (message: string) => new AppError("unauthorized", message);

export function bearerFrom(header: string | null): string {
  if (!header) throw unauthorized("Send an API token in the Authorization header: \"Bearer <token>\".");
  const match = /^Bearer\s+(\S+)\s*$/i.exec(header);
  if (!match) throw unauthorized("The Authorization header must read \"Bearer <token>\".");
  return match[1]!;
}

/** Resolves a bearer token to whoever it acts for; revoked tokens and deactivated users are refused. */
export async function actorForToken(token: string): Promise<Actor> {
  const db = getDb();
  const [row] = await db
    .select({ token: apiTokens, user: users })
    .from(apiTokens)
    .leftJoin(users, eq(users.id, apiTokens.userId))
    .where(eq(apiTokens.tokenHash, hashToken(token)))
    .limit(1);
  if (!row || row.token.revokedAt) throw unauthorized("This API token is unknown or has been revoked.");
  await noteTokenUse(row.token.id, row.token.lastUsedAt);
  if (row.token.kind === "logger") {
    return { kind: "logger", tokenId: row.token.id, name: row.token.name, structureId: row.token.structureId! };
  }
  if (!row.user || !row.user.active) throw unauthorized("The account behind this API token is deactivated.");
  const { id, email, name, role } = row.user;
  return { kind: "user", id, email, name, role };
}

async function noteTokenUse(tokenId: number, lastUsedAt: Date | null) {
  const now = Date.now();
  // A logger posting every few seconds need not cost a write each time.
  if (lastUsedAt && now - lastUsedAt.getTime() < LAST_USE_RESOLUTION_MS) return;
  // Queued behind open write transactions (an ingestion in progress): a write beside one waits
  // for SQLite's lock synchronously and stalls the whole process until SQLITE_BUSY.
  await writeTransaction((tx) => tx.update(apiTokens).set({ lastUsedAt: new Date(now) }).where(eq(apiTokens.id, tokenId)));
}
