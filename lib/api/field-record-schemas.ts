import { z } from "zod";
import { fileSchema } from "./schemas";

/** Responses of /structures/{code}/certificates and /structures/{code}/site-visits. Dates of certificates are the structure's calendar days. */

export const CERTIFICATE_STATES = ["expired", "expiring", "valid"] as const;

export const certificateSchema = z
  .object({
    id: z.number().int(),
    gauge: z.string().nullable().meta({ description: "Tag of the gauge the certificate is for; null for a logger's" }),
    logger: z.string().nullable().meta({ description: "Name of the logger the certificate is for; null for a gauge's" }),
    number: z.string().meta({ description: "Certificate number as printed" }),
    issuedBy: z.string().meta({ description: "The calibration laboratory" }),
    issuedOn: z.string().meta({ description: "YYYY-MM-DD" }),
    expiresOn: z.string().meta({ description: "YYYY-MM-DD, the last day it is valid on the structure's clock" }),
    state: z.enum(CERTIFICATE_STATES).meta({ description: "`expired` after the expiry day; `expiring` within the longest reminder threshold; else `valid`" }),
    daysLeft: z.number().int().meta({ description: "Days from the structure's today to the expiry day (negative once expired)" }),
    standing: z.string().meta({ description: "The state in words with the date, e.g. \"Expires in 12 days, on 2026-07-01\"" }),
    replacedBy: z.string().nullable().meta({ description: "Number of a later certificate of the same instrument that expires later, which takes this one's place (no reminders then)" }),
    file: z.object({ url: z.string(), contentType: z.string().meta({ description: "application/pdf or an image type, detected from the content" }), bytes: z.number().int() }),
    createdBy: z.string(),
    createdAt: z.string().meta({ description: "UTC, ISO-8601 with milliseconds" }),
  })
  .meta({ id: "CalibrationCertificate" });

export const certificateListSchema = z
  .object({
    today: z.string().meta({ description: "The structure's date now, YYYY-MM-DD: what `daysLeft` counts from" }),
    reminderDays: z.array(z.number().int()).meta({ description: "Days before expiry a reminder goes to the structure's technicians and engineers (CERTIFICATE_REMINDER_DAYS)" }),
    certificates: z.array(certificateSchema).meta({ description: "Soonest expiry first" }),
  })
  .meta({ id: "CertificateList" });

export const siteVisitSchema = z
  .object({
    id: z.number().int(),
    visitedAt: z.string().meta({ description: "UTC, ISO-8601 with milliseconds" }),
    visitor: z.string().meta({ description: "Who went" }),
    work: z.string().meta({ description: "What was done" }),
    gauges: z.array(z.string()).meta({ description: "Tags of the gauges the visit touched" }),
    photos: z.array(fileSchema),
    createdBy: z.string(),
    createdAt: z.string(),
  })
  .meta({ id: "SiteVisit" });

export const siteVisitPageSchema = z
  .object({
    visits: z.array(siteVisitSchema).meta({ description: "Newest visit first" }),
    total: z.number().int().meta({ description: "Visits that match in all" }),
    page: z.number().int(),
    perPage: z.number().int(),
  })
  .meta({ id: "SiteVisitPage" });

export type CertificateView = z.infer<typeof certificateSchema>;
export type CertificateList = z.infer<typeof certificateListSchema>;
export type SiteVisitView = z.infer<typeof siteVisitSchema>;
export type SiteVisitPage = z.infer<typeof siteVisitPageSchema>;
export type CertificateState = (typeof CERTIFICATE_STATES)[number];
