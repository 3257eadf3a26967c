import "server-only";
import { asc, eq, sql } from "drizzle-orm";
import { getDb, isUniqueViolation, writeTransaction, type WriteTx } from "@/db/client";
import { users, type Role, type User } from "@/db/schema";
import type { Actor, UserActor } from "@/lib/auth/actor";
import type { UnitSystem } from "@/lib/units";
import { requirePermission } from "@/lib/auth/authorize";
import { hashPassword } from "@/lib/auth/passwords";
import { AppError, notFound } from "@/lib/errors";
import type { CreateUserInput } from "@/lib/validation";
import { recordAudit } from "./audit";

/** What of a user may leave the server: never the password hash. */
export type UserView = Pick<User, "id" | "email" | "name" | "role" | "active" | "createdAt">;

const userViewColumns = {
  id: users.id,
  email: users.email,
  name: users.name,
  role: users.role,
  active: users.active,
  createdAt: users.createdAt,
};

export function listUsers(): Promise<UserView[]> {
  return getDb().select(userViewColumns).from(users).orderBy(asc(users.name));
}

export async function findUserByEmail(email: string): Promise<User | undefined> {
  const [row] = await getDb().select().from(users).where(eq(users.email, email.trim().toLowerCase())).limit(1);
  return row;
}

export async function getUserById(id: number): Promise<User | undefined> {
  const [row] = await getDb().select().from(users).where(eq(users.id, id)).limit(1);
  return row;
}

async function requireUserById(id: number): Promise<User> {
  const user = await getUserById(id);
  if (!user) throw notFound("User");
  return user;
}

type NewUser = Pick<CreateUserInput, "email" | "name" | "role">;

/**
 * Inserts a user with its audit row, and runs `alongside` in the same transaction (the
 * invitation e-mail), so the account and what goes with it commit together.
 */
export async function insertUser(
  actor: Actor | null,
  input: NewUser,
  passwordHash: string,
  action: "user.create" | "user.invite",
  alongside?: (tx: WriteTx, user: UserView) => Promise<unknown>,
): Promise<UserView> {
  return writeTransaction(async (tx) => {
    const [created] = await tx
      .insert(users)
      .values({ email: input.email, name: input.name, role: input.role, passwordHash })
      .returning(userViewColumns);
    await recordAudit(tx, {
      actor,
      action,
      entityType: "user",
      entityKey: input.email,
      after: { name: input.name, role: input.role },
    });
    await alongside?.(tx, created!);
    return created!;
  }).catch((error: unknown) => {
    if (isUniqueViolation(error)) {
      throw new AppError("conflict", `A user with e-mail ${input.email} already exists.`, { field: "email" });
    }
    throw error;
  });
}

/** `actor` is null when the command line or the seed acts. */
export async function createUser(actor: Actor | null, input: CreateUserInput): Promise<UserView> {
  if (actor) await requirePermission(actor, "users:manage");
  return insertUser(actor, input, await hashPassword(input.password), "user.create");
}

/** For an UPDATE of users: every session signed in so far stops working. */
export const endEverySessionOf = { sessionVersion: sql`${users.sessionVersion} + 1` };

type UserChange = { role?: Role; active?: boolean };

export async function updateUser(actor: Actor, userId: number, change: UserChange): Promise<void> {
  await requirePermission(actor, "users:manage");
  const user = await requireUserById(userId);
  if (actor.kind === "user" && actor.id === userId) {
    // Locking yourself out of administration is never what was meant.
    throw new AppError("bad_request", "You cannot change your own role or deactivate yourself.");
  }
  const before = { role: user.role, active: user.active };
  const after = { ...before, ...change };
  // A new role or a closed account must not wait for old sessions to expire.
  const endsSessions = after.role !== before.role || (before.active && !after.active);
  await writeTransaction(async (tx) => {
    await tx.update(users).set({ ...change, ...(endsSessions ? endEverySessionOf : {}) }).where(eq(users.id, userId));
    await recordAudit(tx, { actor, action: "user.update", entityType: "user", entityKey: user.email, before, after });
  });
}

/** From the command line: sets a user's password and ends every session they have. */
export async function setPasswordFromCommandLine(email: string, password: string): Promise<void> {
  const user = await findUserByEmail(email);
  if (!user) throw notFound(`User ${email}`);
  const passwordHash = await hashPassword(password);
  await writeTransaction(async (tx) => {
    await tx.update(users).set({ passwordHash, ...endEverySessionOf }).where(eq(users.id, user.id));
    await recordAudit(tx, { actor: null, action: "user.set-password", entityType: "user", entityKey: user.email });
  });
}

/** "Sign out everywhere": every session of the user ends, this one included. */
export async function endEverySession(actor: UserActor): Promise<void> {
  await writeTransaction(async (tx) => {
    await tx.update(users).set(endEverySessionOf).where(eq(users.id, actor.id));
    await recordAudit(tx, { actor, action: "user.sign-out-everywhere", entityType: "user", entityKey: actor.email });
  });
}

export async function unitsOf(userId: number): Promise<UnitSystem> {
  const [row] = await getDb().select({ units: users.units }).from(users).where(eq(users.id, userId)).limit(1);
  return row?.units ?? "si";
}

/** Everyone chooses their own display units; the API stays SI. */
export async function setUnits(actor: UserActor, units: UnitSystem): Promise<void> {
  await getDb().update(users).set({ units }).where(eq(users.id, actor.id));
}
