import { eq, like } from "drizzle-orm";
import { describe, expect, it } from "vitest";
import { getDb } from "@/db/client";
import { mailOutbox, signInFailures } from "@/db/schema";
import { SIGN_IN_LIMITS, verifyCredentials } from "@/lib/auth/sign-in";
import { makeUser } from "./helpers";

// Common practice (OWASP Authentication Cheat Sheet): failed attempts are counted per account
// and per client, an account is locked for a while after a few failures and its owner told.
const failuresOf = async (key: string) =>
  (await getDb().select().from(signInFailures).where(eq(signInFailures.emailKey, key)))[0];
const lockMails = (to: string) => getDb().select().from(mailOutbox).where(eq(mailOutbox.toAddress, to));

describe("sign-in throttling", () => {
  it("counts every one of 20 parallel wrong passwords, locks the account and mails its owner once", async () => {
    await makeUser("engineer", "target@test.example");
    const now = Date.now();
    const outcomes = await Promise.all(
      Array.from({ length: 20 }, (_, i) => verifyCredentials("target@test.example", `guess-${i}`, `10.0.0.${i}`, now)),
    );
    expect(outcomes.every((o) => "refused" in o && o.refused === "credentials")).toBe(true);
    const row = await failuresOf("target@test.example");
    expect(row!.failures).toBe(20);
    expect(row!.lockedUntil!.getTime()).toBe(now + SIGN_IN_LIMITS.account.lockMs);
    const mails = await lockMails("target@test.example");
    expect(mails.map((m) => m.kind)).toEqual(["sign-in-lock"]);
    expect(mails[0]!.text).toContain("paused for 15 minutes");

    // Locked: even the right password is refused, without being checked, until the window ends.
    expect(await verifyCredentials("target@test.example", "correct-horse", "10.0.1.1", now + 1000)).toEqual({ refused: "locked" });
    const later = now + SIGN_IN_LIMITS.account.lockMs + 1;
    expect(await verifyCredentials("target@test.example", "correct-horse", "10.0.1.1", later)).toHaveProperty("actor");
    expect(await failuresOf("target@test.example")).toBeUndefined();
  });

  it("does not hold back the right password after a few failures short of the lock", async () => {
    await makeUser("owner", "typo@test.example");
    const now = Date.now();
    for (let i = 0; i < SIGN_IN_LIMITS.account.failures - 1; i++) {
      expect(await verifyCredentials("typo@test.example", "wrong", "10.1.0.1", now)).toEqual({ refused: "credentials" });
    }
    expect(await verifyCredentials("typo@test.example", "correct-horse", "10.1.0.1", now)).toHaveProperty("actor");
    expect(await lockMails("typo@test.example")).toEqual([]);
  });

  it("forgets failures after a quiet quarter hour", async () => {
    await makeUser("technician", "slow@test.example");
    const now = Date.now();
    await verifyCredentials("slow@test.example", "wrong", null, now);
    await verifyCredentials("slow@test.example", "wrong", null, now + 16 * 60_000);
    expect((await failuresOf("slow@test.example"))!.failures).toBe(1);
  });

  it("pauses one client address that tries many accounts, and no other address", async () => {
    const now = Date.now();
    const { failures } = SIGN_IN_LIMITS.address;
    await Promise.all(
      Array.from({ length: failures }, (_, i) => verifyCredentials(`nobody-${i}@test.example`, "password1", "192.0.2.7", now)),
    );
    expect((await failuresOf("address:192.0.2.7"))!.failures).toBe(failures);
    await makeUser("owner", "bystander@test.example");
    expect(await verifyCredentials("bystander@test.example", "correct-horse", "192.0.2.7", now)).toEqual({ refused: "locked" });
    expect(await verifyCredentials("bystander@test.example", "correct-horse", "192.0.2.8", now)).toHaveProperty("actor");
    // Unknown accounts are counted like real ones but nobody is mailed.
    expect(await getDb().select().from(mailOutbox).where(like(mailOutbox.toAddress, "nobody-%"))).toEqual([]);
  });
});
