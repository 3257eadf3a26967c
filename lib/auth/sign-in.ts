import "server-only";
import { eq, sql } from "drizzle-orm";
import { getDb, writeTransaction } from "@/db/client";
import { signInFailures } from "@/db/schema";
import { appUrl } from "@/lib/mail/message";
import { queueMail } from "@/lib/mail/outbox";
import { buildSignInLockMail } from "@/lib/mail/sign-in-lock";
import { findUserByEmail } from "@/lib/services/users";
import type { UserActor } from "./actor";
import { spendPasswordCheckTime, verifyPassword } from "./passwords";

/** Failures are forgotten after this long without another one. */
const FAILURE_MEMORY_MS = 15 * 60_000;

/**
 * Per account: every fifth failure in a row pauses sign-in for a quarter hour. Per client
 * address: fifty failures (over any accounts) pause that address, so one machine cannot try a
 * common password on every account. Common practice (OWASP Authentication Cheat Sheet: account
 * lock-out after a small number of failures, for a limited time, with the owner notified).
 */
export const SIGN_IN_LIMITS = {
  account: { failures: 5, lockMs: 15 * 60_000 },
  address: { failures: 50, lockMs: 15 * 60_000 },
} as const;

type Scope = keyof typeof SIGN_IN_LIMITS;

const addressKey = (address: string) => `address:${address}`;

async function lockedUntil(key: string, now: number): Promise<number | null> {
  const [row] = await getDb()
    .select({ lockedUntil: signInFailures.lockedUntil })
    .from(signInFailures)
    .where(eq(signInFailures.emailKey, key))
    .limit(1);
  const until = row?.lockedUntil?.getTime();
  return until !== undefined && until > now ? until : null;
}

/**
 * Counts one failure in one statement, so parallel guesses each count: the row's count goes up
 * by one (or restarts at one after a quiet spell) and every `failures`-th failure sets the lock.
 * Returns the new count and whether this failure is the one that locked.
 */
async function countFailure(key: string, scope: Scope, now: number): Promise<{ failures: number; locked: boolean }> {
  const { failures: limit, lockMs } = SIGN_IN_LIMITS[scope];
  const quietSince = now - FAILURE_MEMORY_MS;
  const next = sql`(case when ${signInFailures.lastFailureAt} < ${quietSince} then 1 else ${signInFailures.failures} + 1 end)`;
  const [row] = await getDb()
    .insert(signInFailures)
    .values({ emailKey: key, failures: 1, lastFailureAt: new Date(now) })
    .onConflictDoUpdate({
      target: signInFailures.emailKey,
      set: {
        failures: next,
        lastFailureAt: new Date(now),
        lockedUntil: sql`case when ${next} % ${limit} = 0 then ${now + lockMs} else ${signInFailures.lockedUntil} end`,
      },
    })
    .returning({ failures: signInFailures.failures });
  const failures = row!.failures;
  return { failures, locked: failures % limit === 0 };
}

async function mailLockedOwner(email: string, failures: number, now: number) {
  const user = await findUserByEmail(email);
  if (!user || !user.active) return;
  const { lockMs } = SIGN_IN_LIMITS.account;
  await writeTransaction((tx) =>
    queueMail(tx, {
      ...buildSignInLockMail({ name: user.name, failures, lockedMinutes: lockMs / 60_000, resetLink: `${appUrl()}/reset` }),
      to: user.email,
      toUserId: user.id,
      kind: "sign-in-lock",
      // One message per lock-out window, however many guesses arrive at once.
      dedupeKey: `sign-in-lock:${user.id}:${Math.floor(now / lockMs)}`,
    }),
  );
}

/** Why a sign-in was refused; the sign-in page says the same for all but `locked`. */
export type SignInOutcome = { actor: UserActor; sessionVersion: number } | { refused: "credentials" | "locked" };

/**
 * Checks an e-mail and password. Unknown e-mails cost the same time as wrong passwords. While an
 * account or the client address is locked the answer comes at once, without checking the
 * password, so guesses gain nothing from waiting or from more connections. The right password
 * on an account that is not locked is never held back.
 */
export async function verifyCredentials(
  email: string,
  password: string,
  clientAddress: string | null,
  now = Date.now(),
): Promise<SignInOutcome> {
  const emailKey = email.trim().toLowerCase();
  const keys = clientAddress ? [emailKey, addressKey(clientAddress)] : [emailKey];
  for (const key of keys) if (await lockedUntil(key, now)) return { refused: "locked" };

  const user = await findUserByEmail(emailKey);
  const passwordMatches = user ? await verifyPassword(password, user.passwordHash) : (await spendPasswordCheckTime(password), false);
  if (user && passwordMatches && user.active) {
    await getDb().delete(signInFailures).where(eq(signInFailures.emailKey, emailKey));
    return {
      actor: { kind: "user", id: user.id, email: user.email, name: user.name, role: user.role },
      sessionVersion: user.sessionVersion,
    };
  }
  const account = await countFailure(emailKey, "account", now);
  if (account.locked) await mailLockedOwner(emailKey, account.failures, now);
  if (clientAddress) await countFailure(addressKey(clientAddress), "address", now);
  return { refused: "credentials" };
}

/**
 * The client's address as the nearest proxy saw it: the last `X-Forwarded-For` entry (Next.js
 * sets the header from the socket when no proxy did). A proxy in front must append to it.
 */
export function clientAddressOf(headers: Headers | Record<string, string | string[] | undefined>): string | null {
  const raw = headers instanceof Headers ? headers.get("x-forwarded-for") : headers["x-forwarded-for"];
  const value = Array.isArray(raw) ? raw.join(",") : raw;
  const last = value?.split(",").at(-1)?.trim();
  return last || null;
}
