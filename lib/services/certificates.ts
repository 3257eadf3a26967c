import "server-only";
import { and, asc, eq, gte, inArray, lte } from "drizzle-orm";
import { getDb, writeTransaction } from "@/db/client";
import { calibrationCertificates, certificateReminders, files, gauges, structureMembers, structures, users, type CalibrationCertificate, type Structure } from "@/db/schema";
import type { CertificateList, CertificateView } from "@/lib/api/field-record-schemas";
import { actorLabel, type Actor } from "@/lib/auth/actor";
import { requirePermission } from "@/lib/auth/authorize";
import { CERTIFICATE_REMINDER_ROLES } from "@/lib/auth/permissions";
import { AppError } from "@/lib/errors";
import { daysBetween } from "@/lib/field-records/calendar";
import { dayOf } from "@/lib/time-format";
import { certificateFields, certificateStanding, parseReminderDays, thresholdsDue } from "@/lib/field-records/certificates";
import { buildCertificateReminderMail } from "@/lib/mail/certificate-reminder";
import { appUrl } from "@/lib/mail/message";
import { queueMail } from "@/lib/mail/outbox";
import { parseWith } from "@/lib/validation";
import { recordAudit } from "./audit";
import { auditedFile, openStored, storeUploads, type UploadRequest } from "./files";
import { getVisibleStructure } from "./structures";

/** Days before expiry that a reminder goes out, largest first (CERTIFICATE_REMINDER_DAYS, default 30). */
export function reminderDays(): number[] {
  return parseReminderDays(process.env.CERTIFICATE_REMINDER_DAYS);
}

type Row = { certificate: CalibrationCertificate; gaugeTag: string | null; contentType: string; bytes: number };

/** The instrument a certificate is for, as one key: certificates of the same key follow one another. */
const instrumentKey = (certificate: CalibrationCertificate) => (certificate.gaugeId != null ? `gauge:${certificate.gaugeId}` : `logger:${certificate.loggerName!.toLowerCase()}`);

/** For each certificate, the later one of the same instrument that expires last, if it expires later. */
function replacements(rows: CalibrationCertificate[]): Map<number, CalibrationCertificate> {
  const latest = new Map<string, CalibrationCertificate>();
  for (const row of rows) {
    const held = latest.get(instrumentKey(row));
    if (!held || row.expiresOn > held.expiresOn) latest.set(instrumentKey(row), row);
  }
  const replaced = new Map<number, CalibrationCertificate>();
  for (const row of rows) {
    const newest = latest.get(instrumentKey(row))!;
    if (newest.expiresOn > row.expiresOn) replaced.set(row.id, newest);
  }
  return replaced;
}

const certificatesUrl = (code: string) => `/structures/${encodeURIComponent(code)}/certificates`;

function toView(structure: Structure, row: Row, today: string, days: number[], replacedBy: CalibrationCertificate | undefined): CertificateView {
  const { certificate } = row;
  const standing = certificateStanding(certificate.expiresOn, today, days[0] ?? 0);
  return {
    id: certificate.id,
    gauge: row.gaugeTag,
    logger: certificate.loggerName,
    number: certificate.certificateNumber,
    issuedBy: certificate.issuedBy,
    issuedOn: certificate.issuedOn,
    expiresOn: certificate.expiresOn,
    state: standing.state,
    daysLeft: standing.daysLeft,
    standing: standing.words,
    replacedBy: replacedBy?.certificateNumber ?? null,
    file: { url: `/api/v1${certificatesUrl(structure.code)}/${certificate.id}/file`, contentType: row.contentType, bytes: row.bytes },
    createdBy: certificate.createdByLabel,
    createdAt: certificate.createdAt.toISOString(),
  };
}

function certificateRows(structureId: number) {
  return getDb()
    .select({ certificate: calibrationCertificates, gaugeTag: gauges.tag, contentType: files.contentType, bytes: files.bytes })
    .from(calibrationCertificates)
    .innerJoin(files, eq(files.id, calibrationCertificates.fileId))
    .leftJoin(gauges, eq(gauges.id, calibrationCertificates.gaugeId))
    .where(eq(calibrationCertificates.structureId, structureId))
    .orderBy(asc(calibrationCertificates.expiresOn), asc(calibrationCertificates.id));
}

/** The structure's certificates, soonest expiry first, or only a gauge's (`gauge`: its tag), each with where it stands today on the structure's clock. */
export async function listCertificates(actor: Actor, code: string, { gauge, now = Date.now() }: { gauge?: string; now?: number } = {}): Promise<CertificateList> {
  const structure = await getVisibleStructure(actor, code);
  await requirePermission(actor, "structure:view", structure);
  const rows = await certificateRows(structure.id);
  const replaced = replacements(rows.map((row) => row.certificate));
  const today = dayOf(now, structure.timezone);
  const days = reminderDays();
  return {
    today,
    reminderDays: days,
    certificates: rows.filter((row) => gauge === undefined || row.gaugeTag === gauge).map((row) => toView(structure, row, today, days, replaced.get(row.certificate.id))),
  };
}

/**
 * Records a certificate with its file (technicians, engineers and admins of the structure;
 * audited). The gauge must be the structure's; the file is judged by its content (PDF or image).
 * The file's row, the certificate and the audit entry commit together or not at all.
 */
export async function addCertificate(actor: Actor, code: string, upload: UploadRequest, now = Date.now()): Promise<CertificateView> {
  const structure = await getVisibleStructure(actor, code);
  await requirePermission(actor, "field-record:add", structure);
  const input = parseWith(certificateFields, upload.fields);
  let gauge: { id: number; tag: string } | null = null;
  if ("gauge" in input.subject) {
    const tag = input.subject.gauge;
    [gauge = null] = await getDb()
      .select({ id: gauges.id, tag: gauges.tag })
      .from(gauges)
      .where(and(eq(gauges.structureId, structure.id), eq(gauges.tag, tag)))
      .limit(1);
    if (!gauge) {
      throw new AppError("validation_failed", `Structure ${structure.code} has no gauge tagged "${tag}"; correct the tag, or name the logger instead.`, {
        field: "gauge",
        issues: [{ path: "gauge", message: `Structure ${structure.code} has no gauge tagged "${tag}".` }],
      });
    }
  }
  const logger = "logger" in input.subject ? input.subject.logger : null;
  const instrument = gauge ? `gauge ${gauge.tag}` : `logger ${logger}`;
  const id = await storeUploads(actor, structure, [{ kind: "certificate", title: `Calibration certificate ${input.number} of ${instrument}`, bytes: upload.bytes }], async (tx, [file]) => {
    const [row] = await tx
      .insert(calibrationCertificates)
      .values({
        structureId: structure.id,
        gaugeId: gauge?.id ?? null,
        loggerName: logger,
        certificateNumber: input.number,
        issuedBy: input.issuedBy,
        issuedOn: input.issuedOn,
        expiresOn: input.expiresOn,
        fileId: file!.id,
        createdById: actor.kind === "user" ? actor.id : null,
        createdByLabel: actor.kind === "user" ? actor.name : actorLabel(actor),
      })
      .returning({ id: calibrationCertificates.id });
    await recordAudit(tx, {
      actor,
      action: "certificate.add",
      entityType: "certificate",
      entityKey: `${structure.code}/${row!.id}`,
      structureId: structure.id,
      after: { gauge: gauge?.tag ?? null, logger, number: input.number, issuedBy: input.issuedBy, issuedOn: input.issuedOn, expiresOn: input.expiresOn, file: auditedFile(file!) },
    });
    return row!.id;
  });
  const list = await listCertificates(actor, code, { now });
  return list.certificates.find((certificate) => certificate.id === id)!;
}

/** The certificate's file, with the name it is offered under. */
export async function openCertificateFile(actor: Actor, code: string, id: number) {
  const structure = await getVisibleStructure(actor, code);
  await requirePermission(actor, "structure:view", structure);
  const [found] = await getDb()
    .select({ certificate: calibrationCertificates, file: files })
    .from(calibrationCertificates)
    .innerJoin(files, eq(files.id, calibrationCertificates.fileId))
    .where(and(eq(calibrationCertificates.id, id), eq(calibrationCertificates.structureId, structure.id)))
    .limit(1);
  if (!found) throw new AppError("not_found", `Structure "${structure.code}" has no calibration certificate ${id}.`);
  const extension = found.file.storageKey.split(".").pop();
  const filename = `certificate-${found.certificate.certificateNumber.replace(/[^A-Za-z0-9._-]+/g, "_")}.${extension}`;
  return { ...(await openStored(found.file)), filename };
}

const DAY_MS = 86_400_000;

/**
 * Queues the reminders that are due: for each certificate whose structure's date has reached a
 * threshold before its expiry, one e-mail to each active technician and engineer of the
 * structure. The reminder row and the e-mails commit together, and a threshold with a row is
 * never reminded again, so a second run (or a second instance) sends nothing more. Certificates
 * replaced by a later one of the same instrument, and those of retired gauges, are left alone.
 * A system task, no actor.
 */
export async function queueCertificateReminders(now = Date.now()): Promise<{ certificates: number; mails: number }> {
  const thresholds = reminderDays();
  if (thresholds.length === 0) return { certificates: 0, mails: 0 };
  // Dates on every clock lie within a day of UTC's: a wide window, then each structure's own date.
  const from = dayOf(now - DAY_MS, "UTC");
  const to = dayOf(now + (thresholds[0]! + 1) * DAY_MS, "UTC");
  const candidates = await getDb()
    .select({ certificate: calibrationCertificates, structure: structures, gaugeTag: gauges.tag, gaugeStatus: gauges.status })
    .from(calibrationCertificates)
    .innerJoin(structures, eq(structures.id, calibrationCertificates.structureId))
    .leftJoin(gauges, eq(gauges.id, calibrationCertificates.gaugeId))
    .where(and(gte(calibrationCertificates.expiresOn, from), lte(calibrationCertificates.expiresOn, to)));
  if (candidates.length === 0) return { certificates: 0, mails: 0 };
  const structureIds = [...new Set(candidates.map((row) => row.structure.id))];
  const everyCertificate = await getDb().select().from(calibrationCertificates).where(inArray(calibrationCertificates.structureId, structureIds));
  const replaced = replacements(everyCertificate);
  const reminded = await getDb()
    .select({ certificateId: certificateReminders.certificateId, thresholdDays: certificateReminders.thresholdDays })
    .from(certificateReminders)
    .where(inArray(certificateReminders.certificateId, candidates.map((row) => row.certificate.id)));
  const remindedOf = (id: number) => new Set(reminded.filter((row) => row.certificateId === id).map((row) => row.thresholdDays));

  let certificates = 0;
  let mails = 0;
  for (const { certificate, structure, gaugeTag, gaugeStatus } of candidates) {
    if (replaced.has(certificate.id) || gaugeStatus === "retired") continue;
    const daysLeft = daysBetween(dayOf(now, structure.timezone), certificate.expiresOn);
    const due = thresholdsDue(daysLeft, thresholds, remindedOf(certificate.id));
    if (due.length === 0) continue;
    const queued = await writeTransaction(async (tx) => {
      const recipients = await tx
        .select({ id: users.id, email: users.email, name: users.name })
        .from(structureMembers)
        .innerJoin(users, eq(users.id, structureMembers.userId))
        .where(and(eq(structureMembers.structureId, structure.id), eq(users.active, true), inArray(users.role, [...CERTIFICATE_REMINDER_ROLES])));
      const claimed = await tx
        .insert(certificateReminders)
        .values(due.map((thresholdDays) => ({ certificateId: certificate.id, thresholdDays, daysLeft, recipients: recipients.length })))
        .onConflictDoNothing()
        .returning({ thresholdDays: certificateReminders.thresholdDays });
      // Another instance claimed these thresholds between the read above and this transaction.
      if (claimed.length === 0) return 0;
      const threshold = Math.min(...claimed.map((row) => row.thresholdDays));
      for (const recipient of recipients) {
        const mail = buildCertificateReminderMail({
          name: recipient.name,
          structure: { code: structure.code, name: structure.name },
          instrument: gaugeTag ? `gauge ${gaugeTag}` : `logger ${certificate.loggerName}`,
          number: certificate.certificateNumber,
          issuedBy: certificate.issuedBy,
          expiresOn: certificate.expiresOn,
          daysLeft,
          link: `${appUrl()}${certificatesUrl(structure.code)}`,
        });
        await queueMail(tx, { ...mail, to: recipient.email, toUserId: recipient.id, kind: "certificate-reminder", dedupeKey: `certificate:${certificate.id}:${threshold}:${recipient.id}` });
      }
      return recipients.length;
    });
    certificates += 1;
    mails += queued;
  }
  return { certificates, mails };
}
