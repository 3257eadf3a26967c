import { buildLinkMail, type BuiltMail } from "./message";

export type SignInLockMailInput = {
  name: string;
  failures: number;
  lockedMinutes: number;
  /** The page where the owner can ask for a password-reset link. */
  resetLink: string;
};

export function buildSignInLockMail(input: SignInLockMailInput): BuiltMail {
  return buildLinkMail({
    subject: "Sign-in to your Hookeline account paused",
    lines: [
      `Hello ${input.name},`,
      `Someone entered a wrong password for your Hookeline account ${input.failures} times in a row, so signing in to it is paused for ${input.lockedMinutes} minutes.`,
      "If that was you, wait and try again. If it was not, someone may be guessing your password: choose a new one here.",
    ],
    link: input.resetLink,
    buttonLabel: "Choose a new password",
    footer: "Alert e-mails keep coming while sign-in is paused.",
  });
}
