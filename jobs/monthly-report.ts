import "server-only";
import { and, eq, inArray } from "drizzle-orm";
import { getDb, writeTransaction } from "@/db/client";
import { mailOutbox, structureMembers, structures, users, type Structure, type User } from "@/db/schema";
import type { UserActor } from "@/lib/auth/actor";
import { buildReportMail } from "@/lib/mail/report";
import { appUrl } from "@/lib/mail/message";
import { queueMail } from "@/lib/mail/outbox";
import { monthKey, monthsBefore } from "@/lib/report/period";
import { atWallClock, monthOf } from "@/lib/time-format";
import { structureReport, structureReportPdf } from "@/lib/services/report";

const dedupeKey = (code: string, month: string, userId: number) => `report:${code}:${month}:${userId}`;

/** Active owners by structure: the people the monthly report is for. */
async function ownersByStructure(): Promise<Map<number, { structure: Structure; owners: User[] }>> {
  const rows = await getDb()
    .select({ structure: structures, user: users })
    .from(structureMembers)
    .innerJoin(users, eq(users.id, structureMembers.userId))
    .innerJoin(structures, eq(structures.id, structureMembers.structureId))
    .where(and(eq(users.role, "owner"), eq(users.active, true)));
  const byStructure = new Map<number, { structure: Structure; owners: User[] }>();
  for (const { structure, user } of rows) {
    const entry = byStructure.get(structure.id) ?? { structure, owners: [] };
    entry.owners.push(user);
    byStructure.set(structure.id, entry);
  }
  return byStructure;
}

async function alreadyQueued(keys: string[]): Promise<Set<string>> {
  const rows = await getDb().select({ key: mailOutbox.dedupeKey }).from(mailOutbox).where(inArray(mailOutbox.dedupeKey, keys));
  return new Set(rows.map((row) => row.key));
}

/** The hour of the 1st, on the site's clocks, from which its report is sent: late logger uploads of the month's last hours have had the night to arrive. */
export const MONTHLY_REPORT_HOUR = 7;

/**
 * Whether the previous month's report is due on the structure's clocks: from 07:00 on the 1st
 * (later in the month too, so a day the jobs did not run delays the report instead of losing it;
 * the outbox's dedupe key still sends each one once).
 */
export function monthlyReportDue(now: number, timeZone: string): boolean {
  const first = `${monthKey(monthOf(now, timeZone))}-01`;
  return now >= atWallClock(first, MONTHLY_REPORT_HOUR, 0, timeZone).getTime();
}

/**
 * From 07:00 on the 1st of the month on the structure's clocks, every active owner of the
 * structure gets the previous month (of those clocks) as a report with the PDF attached, through
 * the outbox. The job runs every half hour so each zone's 07:00 is met within 30 minutes; the
 * dedupe key makes a later run, or a second instance, queue nothing new, and a structure whose
 * owners all have their copy is not even rebuilt.
 */
export async function runMonthlyReport(now = Date.now(), signal?: AbortSignal): Promise<string> {
  let reports = 0;
  let queued = 0;
  for (const { structure, owners } of (await ownersByStructure()).values()) {
    signal?.throwIfAborted();
    if (!monthlyReportDue(now, structure.timezone)) continue;
    const previous = monthsBefore(monthOf(now, structure.timezone), 1)[0]!;
    const month = monthKey(previous);
    const done = await alreadyQueued(owners.map((owner) => dedupeKey(structure.code, month, owner.id)));
    const due = owners.filter((owner) => !done.has(dedupeKey(structure.code, month, owner.id)));
    if (due.length === 0) continue;
    // The report reads as an owner sees it, through the same permission check as the page.
    const reader: UserActor = { kind: "user", id: due[0]!.id, email: due[0]!.email, name: due[0]!.name, role: due[0]!.role };
    const report = await structureReport(reader, structure.code, { month: previous }, new Date(now));
    const attachment = {
      filename: `${structure.code}-report-${month}.pdf`,
      contentType: "application/pdf",
      contentBase64: (await structureReportPdf(reader, report)).toString("base64"),
    };
    reports += 1;
    queued += await writeTransaction(async (tx) => {
      let added = 0;
      for (const owner of due) {
        const mail = buildReportMail({ recipientName: owner.name, report }, appUrl());
        const key = dedupeKey(structure.code, month, owner.id);
        if (await queueMail(tx, { ...mail, to: owner.email, toUserId: owner.id, kind: "report", dedupeKey: key, attachments: [attachment] })) added += 1;
      }
      return added;
    });
  }
  return `${reports} reports built, ${queued} e-mails queued`;
}
