import { buildLinkMail, type BuiltMail } from "./message";

export type CertificateReminderMailInput = {
  name: string;
  structure: { code: string; name: string };
  /** "gauge LC-M1" or "logger pier 2 logger". */
  instrument: string;
  number: string;
  issuedBy: string;
  expiresOn: string;
  daysLeft: number;
  /** The structure's certificate list. */
  link: string;
};

const inDays = (days: number) => (days === 0 ? "today" : `in ${days} day${days === 1 ? "" : "s"}`);

export function buildCertificateReminderMail(input: CertificateReminderMailInput): BuiltMail {
  const when = inDays(input.daysLeft);
  return buildLinkMail({
    subject: `Calibration certificate of ${input.instrument} on ${input.structure.code} expires ${when}`,
    lines: [
      `Hello ${input.name},`,
      `The calibration certificate ${input.number} of ${input.instrument} on ${input.structure.name} (${input.structure.code}), issued by ${input.issuedBy}, expires ${when}, on ${input.expiresOn} (the structure's date).`,
      "Arrange the recalibration, then record the new certificate in Hookeline; readings of an instrument past its calibration deserve less trust.",
    ],
    link: input.link,
    buttonLabel: "Open the certificates",
    footer: "You get this reminder as a technician or engineer of the structure, once for each reminder the installation sets before an expiry.",
  });
}
