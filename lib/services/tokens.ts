import { desc, eq } from "drizzle-orm";
import { getDb, writeTransaction } from "@/db/client";
import { apiTokens, structures, users, type TokenKind } from "@/db/schema";
import type { Actor } from "@/lib/auth/actor";
import { requirePermission } from "@/lib/auth/authorize";
import { generateToken, hashToken, tokenHint } from "@/lib/auth/tokens";
import { notFound } from "@/lib/errors";
import { recordAudit } from "./audit";
import { findStructureByCode } from "./structures";
import { findUserByEmail } from "./users";

export type TokenView = {
  id: number;
  name: string;
  kind: TokenKind;
  hint: string;
  userEmail: string | null;
  structureCode: string | null;
  createdAt: Date;
  lastUsedAt: Date | null;
  revokedAt: Date | null;
};

/** The new token in clear text, returned once and never again. */
export type IssuedToken = { id: number; token: string };

type TokenOwner = { kind: "user"; email: string } | { kind: "logger"; structureCode: string };

async function authorizeTokenOwner(actor: Actor | null, owner: TokenOwner) {
  if (owner.kind === "user") {
    const user = await findUserByEmail(owner.email);
    if (!user) throw notFound(`User ${owner.email}`);
    if (actor) await requirePermission(actor, "users:manage");
    return { userId: user.id, structureId: null, entityKey: user.email };
  }
  const structure = await findStructureByCode(owner.structureCode);
  if (!structure) throw notFound(`Structure "${owner.structureCode}"`);
  if (actor) await requirePermission(actor, "token:manage", structure);
  return { userId: null, structureId: structure.id, entityKey: structure.code };
}

export async function createToken(actor: Actor | null, owner: TokenOwner, name: string): Promise<IssuedToken> {
  const { userId, structureId, entityKey } = await authorizeTokenOwner(actor, owner);
  const token = generateToken();
  return writeTransaction(async (tx) => {
    const [created] = await tx
      .insert(apiTokens)
      .values({
        name,
        kind: owner.kind,
        userId,
        structureId,
        tokenHash: hashToken(token),
        hint: tokenHint(token),
        createdById: actor?.kind === "user" ? actor.id : null,
      })
      .returning({ id: apiTokens.id });
    await recordAudit(tx, {
      actor,
      action: "token.create",
      entityType: `${owner.kind} token`,
      entityKey: `${entityKey}: ${name}`,
      structureId,
    });
    return { id: created!.id, token };
  });
}

const tokenViewQuery = () =>
  getDb()
    .select({
      id: apiTokens.id,
      name: apiTokens.name,
      kind: apiTokens.kind,
      hint: apiTokens.hint,
      userEmail: users.email,
      structureCode: structures.code,
      createdAt: apiTokens.createdAt,
      lastUsedAt: apiTokens.lastUsedAt,
      revokedAt: apiTokens.revokedAt,
    })
    .from(apiTokens)
    .leftJoin(users, eq(users.id, apiTokens.userId))
    .leftJoin(structures, eq(structures.id, apiTokens.structureId));

export async function listAllTokens(actor: Actor): Promise<TokenView[]> {
  await requirePermission(actor, "users:manage");
  return tokenViewQuery().orderBy(desc(apiTokens.createdAt));
}

export async function listLoggerTokens(actor: Actor, structureCode: string): Promise<TokenView[]> {
  const structure = await findStructureByCode(structureCode);
  if (!structure) throw notFound(`Structure "${structureCode}"`);
  await requirePermission(actor, "token:manage", structure);
  return tokenViewQuery().where(eq(apiTokens.structureId, structure.id)).orderBy(desc(apiTokens.createdAt));
}

export async function revokeToken(actor: Actor, tokenId: number): Promise<void> {
  const [token] = await tokenViewQuery().where(eq(apiTokens.id, tokenId)).limit(1);
  if (!token) throw notFound("Token");
  await authorizeTokenOwner(
    actor,
    token.kind === "user" ? { kind: "user", email: token.userEmail! } : { kind: "logger", structureCode: token.structureCode! },
  );
  if (token.revokedAt) return;
  await writeTransaction(async (tx) => {
    await tx.update(apiTokens).set({ revokedAt: new Date() }).where(eq(apiTokens.id, tokenId));
    await recordAudit(tx, {
      actor,
      action: "token.revoke",
      entityType: `${token.kind} token`,
      entityKey: `${token.userEmail ?? token.structureCode}: ${token.name}`,
    });
  });
}
