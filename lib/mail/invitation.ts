import { buildLinkMail, type BuiltMail } from "./message";

export type InvitationMailInput = {
  name: string;
  email: string;
  role: string;
  invitedBy: string;
  /** The signed link to the page where the person chooses a password. */
  link: string;
  validForDays: number;
};

export function buildInvitationMail(input: InvitationMailInput): BuiltMail {
  return buildLinkMail({
    subject: "You are invited to Hookeline",
    lines: [
      `Hello ${input.name},`,
      `${input.invitedBy} has given you a Hookeline account (${input.email}) with the ${input.role} role.`,
      `Choose your password here within ${input.validForDays} days; the link works once:`,
    ],
    link: input.link,
    buttonLabel: "Choose my password",
    footer: "If you did not expect this invitation, ignore this e-mail: the account cannot be used until a password is chosen.",
  });
}
