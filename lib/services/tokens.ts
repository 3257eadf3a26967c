import "server-only";
import { desc, eq } from "drizzle-orm";
import { getDb, writeTransaction } from "@/db/client";
import { apiTokens, structures, users, type TokenKind } from "@/db/schema";
import type { Actor } from "@/lib/auth/actor";
import { may, requirePermission } from "@/lib/auth/authorize";
import { roleAllows } from "@/lib/auth/permissions";
import { generateToken, hashToken, tokenHint } from "@/lib/auth/tokens";
import { forbidden, notFound } from "@/lib/errors";
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

/**
 * The permission comes first, then the lookup: someone who may not manage user tokens learns
 * nothing about which e-mail addresses have accounts.
 */
async function authorizeTokenOwner(actor: Actor | null, owner: TokenOwner) {
  if (owner.kind === "user") {
    if (actor) await requirePermission(actor, "users:manage");
    const user = await findUserByEmail(owner.email);
    if (!user) throw notFound(`User ${owner.email}`);
    return { userId: user.id, structureId: null, entityKey: user.email };
  }
  if (actor?.kind === "logger" || (actor && !roleAllows(actor.role, "token:manage"))) throw forbidden("Your role may not manage tokens.");
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

/** A token the actor may not manage answers like one that does not exist. */
export async function revokeToken(actor: Actor, tokenId: number): Promise<void> {
  if (actor.kind === "logger" || !(roleAllows(actor.role, "users:manage") || roleAllows(actor.role, "token:manage"))) {
    throw forbidden("Your role may not revoke tokens.");
  }
  const [token] = await tokenViewQuery().where(eq(apiTokens.id, tokenId)).limit(1);
  const structure = token?.structureCode ? await findStructureByCode(token.structureCode) : undefined;
  const mayRevoke =
    token && (token.kind === "user" ? await may(actor, "users:manage") : Boolean(structure) && (await may(actor, "token:manage", structure)));
  if (!token || !mayRevoke) throw notFound("Token");
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
