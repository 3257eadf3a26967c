import { buildLinkMail, type BuiltMail } from "./message";

export type PasswordResetMailInput = {
  name: string;
  /** The signed link to the page where the person chooses a new password. */
  link: string;
  validForMinutes: number;
};

export function buildPasswordResetMail(input: PasswordResetMailInput): BuiltMail {
  return buildLinkMail({
    subject: "Choose a new Hookeline password",
    lines: [
      `Hello ${input.name},`,
      "Someone, probably you, asked to choose a new password for your Hookeline account.",
      `Choose it here within ${input.validForMinutes} minutes; the link works once:`,
    ],
    link: input.link,
    buttonLabel: "Choose a new password",
    footer: "If you did not ask for this, ignore this e-mail: your password stays as it is.",
  });
}
