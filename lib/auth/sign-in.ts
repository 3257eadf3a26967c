import { eq } from "drizzle-orm";
import { getDb } from "@/db/client";
import { signInFailures } from "@/db/schema";
import { findUserByEmail } from "@/lib/services/users";
import type { UserActor } from "./actor";
import { spendPasswordCheckTime, verifyPassword } from "./passwords";

const FREE_ATTEMPTS = 3;
const MAX_DELAY_MS = 8_000;
const FAILURE_MEMORY_MS = 15 * 60_000;

/** How long to hold back the answer after this many recent failures: doubling, capped. */
export function signInDelayMs(recentFailures: number): number {
  if (recentFailures < FREE_ATTEMPTS) return 0;
  return Math.min(MAX_DELAY_MS, 500 * 2 ** (recentFailures - FREE_ATTEMPTS));
}

async function recentFailures(emailKey: string): Promise<number> {
  const [row] = await getDb().select().from(signInFailures).where(eq(signInFailures.emailKey, emailKey)).limit(1);
  if (!row || Date.now() - row.lastFailureAt.getTime() > FAILURE_MEMORY_MS) return 0;
  return row.failures;
}

async function noteFailure(emailKey: string, previous: number) {
  const now = new Date();
  await getDb()
    .insert(signInFailures)
    .values({ emailKey, failures: previous + 1, lastFailureAt: now })
    .onConflictDoUpdate({ target: signInFailures.emailKey, set: { failures: previous + 1, lastFailureAt: now } });
}

const sleep = (ms: number) => new Promise((resolve) => setTimeout(resolve, ms));

/**
 * Checks an e-mail and password. Unknown e-mails cost the same time as wrong passwords,
 * and repeated failures on one address are slowed down.
 */
export async function verifyCredentials(email: string, password: string): Promise<UserActor | null> {
  const emailKey = email.trim().toLowerCase();
  const failures = await recentFailures(emailKey);
  await sleep(signInDelayMs(failures));
  const user = await findUserByEmail(emailKey);
  const passwordMatches = user ? await verifyPassword(password, user.passwordHash) : (await spendPasswordCheckTime(password), false);
  if (!user || !passwordMatches || !user.active) {
    await noteFailure(emailKey, failures);
    return null;
  }
  if (failures > 0) await getDb().delete(signInFailures).where(eq(signInFailures.emailKey, emailKey));
  return { kind: "user", id: user.id, email: user.email, name: user.name, role: user.role };
}

