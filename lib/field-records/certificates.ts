import { z } from "zod";
import { gaugeTag } from "@/lib/gauges/schema";
import { plainText } from "@/lib/validation";
import { calendarDate, daysBetween } from "./calendar";

/** The text fields of a certificate upload (multipart/form-data), shared by the API and the page. */
export const certificateFields = z
  .object({
    gauge: z.union([z.literal(""), gaugeTag]).optional(),
    logger: plainText().trim().max(100, "Keep the logger's name under 100 characters.").optional(),
    number: plainText({ error: "Give the certificate number." }).trim().min(1, "Give the certificate number.").max(80, "Keep the certificate number under 80 characters."),
    issuedBy: plainText({ error: "Say who issued the certificate." }).trim().min(1, "Say who issued the certificate (the calibration laboratory).").max(200, "Keep it under 200 characters."),
    issuedOn: calendarDate,
    expiresOn: calendarDate,
  })
  .superRefine((input, context) => {
    const gauge = input.gauge || undefined;
    const logger = input.logger || undefined;
    if ((gauge === undefined) === (logger === undefined)) {
      context.addIssue({ code: "custom", path: [gauge ? "logger" : "gauge"], message: "Name either the gauge (its tag) or the logger the certificate is for, one of the two." });
    }
    if (daysBetween(input.issuedOn, input.expiresOn) <= 0) {
      context.addIssue({ code: "custom", path: ["expiresOn"], message: `The expiry date must be after the issue date (${input.issuedOn}).` });
    }
  })
  .transform(({ gauge, logger, ...rest }) => ({ ...rest, subject: (gauge ? { gauge } : { logger: logger! }) as CertificateSubject }));

/** What a certificate is for: one of the structure's gauges, or one of its loggers by name. */
export type CertificateSubject = { gauge: string } | { logger: string };

export type CertificateInput = z.output<typeof certificateFields>;

export type CertificateState = "expired" | "expiring" | "valid";
export type CertificateStanding = { state: CertificateState; daysLeft: number; words: string };

const days = (n: number) => `${n} day${n === 1 ? "" : "s"}`;

/** Where a certificate stands on `today` (the structure's date), in a word and in a sentence with its date. */
export function certificateStanding(expiresOn: string, today: string, reminderDays: number): CertificateStanding {
  const daysLeft = daysBetween(today, expiresOn);
  if (daysLeft < 0) return { state: "expired", daysLeft, words: `Expired on ${expiresOn} (${days(-daysLeft)} ago)` };
  if (daysLeft === 0) return { state: "expiring", daysLeft, words: `Expires today, ${expiresOn}` };
  if (daysLeft <= reminderDays) return { state: "expiring", daysLeft, words: `Expires in ${days(daysLeft)}, on ${expiresOn}` };
  return { state: "valid", daysLeft, words: `Valid until ${expiresOn} (${days(daysLeft)} left)` };
}

/**
 * The reminder thresholds (days before expiry) a certificate has reached and not yet been
 * reminded of. Several reached at once (the job did not run, or the certificate was recorded
 * close to its expiry) are answered together, so they make one e-mail; an expired certificate
 * is not reminded of, since that e-mail would only say what the lists already show.
 */
export function thresholdsDue(daysLeft: number, thresholds: readonly number[], reminded: ReadonlySet<number>): number[] {
  if (daysLeft < 0) return [];
  return thresholds.filter((threshold) => daysLeft <= threshold && !reminded.has(threshold));
}

export const DEFAULT_REMINDER_DAYS = [30];
const MAX_REMINDER_DAYS = 365;

/** CERTIFICATE_REMINDER_DAYS: one number of days or several separated by commas ("30" or "60,30,7"), largest first. */
export function parseReminderDays(setting: string | undefined): number[] {
  if (setting === undefined || setting.trim() === "") return DEFAULT_REMINDER_DAYS;
  const values = setting.split(",").map((part) => part.trim());
  if (!values.every((value) => /^\d+$/.test(value) && Number(value) <= MAX_REMINDER_DAYS)) {
    throw new Error(`CERTIFICATE_REMINDER_DAYS must be whole numbers of days from 0 to ${MAX_REMINDER_DAYS} separated by commas (e.g. "30" or "60,30,7"), not ${JSON.stringify(setting)}.`);
  }
  return [...new Set(values.map(Number))].sort((a, b) => b - a);
}
