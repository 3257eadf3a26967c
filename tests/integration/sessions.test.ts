import { describe, expect, it } from "vitest";
import { userForSession, endSession, SESSION_FORMAT, type SessionClaims } from "@/lib/auth/session-claims";
import { verifyCredentials } from "@/lib/auth/sign-in";
import { requestPasswordReset, setPasswordWithLink } from "@/lib/services/accounts";
import { endEverySession, setPasswordFromCommandLine, updateUser } from "@/lib/services/users";
import { getDb } from "@/db/client";
import { mailOutbox } from "@/db/schema";
import { makeUser } from "./helpers";

process.env.NEXTAUTH_SECRET = "integration-test-secret";

/** The claims next-auth puts in the cookie when this person signs in now. */
async function signIn(email: string, password = "correct-horse", sessionId = crypto.randomUUID()): Promise<SessionClaims> {
  const outcome = await verifyCredentials(email, password, null);
  if (!("actor" in outcome)) throw new Error(`sign-in refused: ${outcome.refused}`);
  return { sub: String(outcome.actor.id), sessionFormat: SESSION_FORMAT, sessionVersion: outcome.sessionVersion, sessionId };
}

const resetLinkToken = async (to: string) => {
  const rows = await getDb().select().from(mailOutbox);
  const text = rows.filter((row) => row.toAddress === to).at(-1)!.text;
  return decodeURIComponent(/token=([^\s]+)/.exec(text)![1]!);
};

describe("sessions end on the server", () => {
  it("a signed-out session stays refused while another sign-in of the same user works", async () => {
    await makeUser("engineer", "two-devices@test.example");
    const laptop = await signIn("two-devices@test.example");
    const phone = await signIn("two-devices@test.example");
    await endSession(laptop.sessionId!, new Date(Date.now() + 3600_000));
    expect(await userForSession(laptop)).toBeNull();
    expect(await userForSession(phone)).toMatchObject({ email: "two-devices@test.example" });
  });

  it("a password reset, a new password from the command line and 'sign out everywhere' end every session", async () => {
    const user = await makeUser("technician", "reset-me@test.example");
    const before = await signIn(user.email);
    await requestPasswordReset(user.email);
    await setPasswordWithLink(await resetLinkToken(user.email), "password-reset", "new-password-1");
    expect(await userForSession(before)).toBeNull();

    const afterReset = await signIn(user.email, "new-password-1");
    expect(await userForSession(afterReset)).not.toBeNull();
    await setPasswordFromCommandLine(user.email, "new-password-2");
    expect(await userForSession(afterReset)).toBeNull();

    const afterCli = await signIn(user.email, "new-password-2");
    await endEverySession(user);
    expect(await userForSession(afterCli)).toBeNull();
  });

  it("a role change and a deactivation end the sessions; a change of nothing does not", async () => {
    const admin = await makeUser("admin", "boss@test.example");
    const user = await makeUser("owner", "moved@test.example");
    const first = await signIn(user.email);
    await updateUser(admin, user.id, { role: "owner" });
    expect(await userForSession(first)).not.toBeNull();
    await updateUser(admin, user.id, { role: "technician" });
    expect(await userForSession(first)).toBeNull();

    const second = await signIn(user.email);
    await updateUser(admin, user.id, { active: false });
    await updateUser(admin, user.id, { active: true });
    expect(await userForSession(second)).toBeNull();
  });

  it("refuses claims without a session id or with a made-up user", async () => {
    const user = await makeUser("owner", "claims@test.example");
    const claims = await signIn(user.email);
    expect(await userForSession({ ...claims, sessionId: undefined })).toBeNull();
    expect(await userForSession({ ...claims, sub: "999999" })).toBeNull();
    expect(await userForSession({ ...claims, sessionVersion: claims.sessionVersion! + 1 })).toBeNull();
  });

  it("refuses sessions written by a release with another session format, however right their other claims", async () => {
    const user = await makeUser("owner", "old-release@test.example");
    const claims = await signIn(user.email);
    expect(await userForSession(claims)).not.toBeNull();
    const { sessionFormat: _, ...withoutFormat } = claims;
    expect(await userForSession(withoutFormat)).toBeNull();
    expect(await userForSession({ ...claims, sessionFormat: SESSION_FORMAT - 1 })).toBeNull();
    expect(await userForSession({ ...claims, sessionFormat: SESSION_FORMAT + 1 })).toBeNull();
  });
});
