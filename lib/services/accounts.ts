import "server-only";
import { randomBytes } from "node:crypto";
import { and, eq } from "drizzle-orm";
import { writeTransaction } from "@/db/client";
import { users, type User } from "@/db/schema";
import { accountLinkHolds, LINK_LIFETIME_MS, readAccountLink, signAccountLink, type LinkPurpose } from "@/lib/auth/account-links";
import type { UserActor } from "@/lib/auth/actor";
import { requirePermission } from "@/lib/auth/authorize";
import { hashPassword } from "@/lib/auth/passwords";
import { AppError } from "@/lib/errors";
import { buildInvitationMail } from "@/lib/mail/invitation";
import { appUrl } from "@/lib/mail/message";
import { queueMail } from "@/lib/mail/outbox";
import { buildPasswordResetMail } from "@/lib/mail/password-reset";
import type { InviteUserInput } from "@/lib/validation";
import { recordAudit } from "./audit";
import { endEverySessionOf, findUserByEmail, getUserById, insertUser, type UserView } from "./users";

/** Where each kind of link leads: the page that asks for the new password. */
const LINK_PAGES: Record<LinkPurpose, string> = { invitation: "/welcome", "password-reset": "/reset/confirm" };

/** One reset e-mail per person per quarter hour at most, however often the form is sent. */
const RESET_MAIL_WINDOW_MS = 15 * 60_000;

export const LINK_UNUSABLE = "This link has expired or has already been used.";

function accountLinkUrl(user: { id: number; passwordHash: string }, purpose: LinkPurpose, now: number): string {
  return `${appUrl()}${LINK_PAGES[purpose]}?token=${encodeURIComponent(signAccountLink(user, purpose, now))}`;
}

/**
 * Creates an account nobody can sign in to yet (its password is random and never shown) and
 * queues an invitation whose link lets the person choose a password.
 */
export async function inviteUser(actor: UserActor, input: InviteUserInput, now = new Date()): Promise<UserView> {
  await requirePermission(actor, "users:manage");
  const passwordHash = await hashPassword(randomBytes(32).toString("base64url"));
  return insertUser(actor, input, passwordHash, "user.invite", (tx, user) =>
    queueMail(tx, {
      ...buildInvitationMail({
        name: user.name,
        email: user.email,
        role: user.role,
        invitedBy: actor.name,
        link: accountLinkUrl({ id: user.id, passwordHash }, "invitation", now.getTime()),
        validForDays: LINK_LIFETIME_MS.invitation / (24 * 3600_000),
      }),
      to: user.email,
      toUserId: user.id,
      kind: "invitation",
      dedupeKey: `invitation:${user.id}`,
    }),
  );
}

/**
 * Queues a reset e-mail when an active account uses this address, and does nothing otherwise:
 * the caller answers the same either way, so the form does not reveal who has an account.
 */
export async function requestPasswordReset(email: string, now = new Date()): Promise<void> {
  const user = await findUserByEmail(email);
  if (!user || !user.active) return;
  const window = Math.floor(now.getTime() / RESET_MAIL_WINDOW_MS);
  await writeTransaction((tx) =>
    queueMail(tx, {
      ...buildPasswordResetMail({
        name: user.name,
        link: accountLinkUrl(user, "password-reset", now.getTime()),
        validForMinutes: LINK_LIFETIME_MS["password-reset"] / 60_000,
      }),
      to: user.email,
      toUserId: user.id,
      kind: "password-reset",
      dedupeKey: `password-reset:${user.id}:${window}`,
    }),
  );
}

async function holderOf(token: string, purpose: LinkPurpose, now: Date): Promise<User | null> {
  const claims = readAccountLink(token);
  const user = claims ? await getUserById(claims.userId) : undefined;
  if (!user || !user.active || !accountLinkHolds(token, purpose, user.passwordHash, now.getTime())) return null;
  return user;
}

/** Whose link this is, for the page to greet them; null when it cannot be used (any reason: the page says the same). */
export async function checkAccountLink(token: string, purpose: LinkPurpose, now = new Date()): Promise<{ name: string; email: string } | null> {
  const user = await holderOf(token, purpose, now);
  return user && { name: user.name, email: user.email };
}

/** Sets the password a link was sent for; the link stops working with it. */
export async function setPasswordWithLink(token: string, purpose: LinkPurpose, password: string, now = new Date()): Promise<void> {
  const user = await holderOf(token, purpose, now);
  if (!user) throw new AppError("bad_request", LINK_UNUSABLE);
  const passwordHash = await hashPassword(password);
  await writeTransaction(async (tx) => {
    // Only if the password is still the one the link was signed with: of two uses at once, one wins.
    const changed = await tx
      .update(users)
      .set({ passwordHash, ...endEverySessionOf })
      .where(and(eq(users.id, user.id), eq(users.passwordHash, user.passwordHash)))
      .returning({ id: users.id });
    if (changed.length === 0) throw new AppError("bad_request", LINK_UNUSABLE);
    await recordAudit(tx, {
      actor: { kind: "user", id: user.id, email: user.email, name: user.name, role: user.role },
      action: purpose === "invitation" ? "user.accept-invitation" : "user.reset-password",
      entityType: "user",
      entityKey: user.email,
    });
  });
}
