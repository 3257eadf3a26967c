import "server-only";
import { and, eq, inArray } from "drizzle-orm";
import { getDb, writeTransaction } from "@/db/client";
import { mailOutbox, structureMembers, structures, users, type Structure, type User } from "@/db/schema";
import type { UserActor } from "@/lib/auth/actor";
import { buildReportMail } from "@/lib/mail/report";
import { appUrl } from "@/lib/mail/message";
import { queueMail } from "@/lib/mail/outbox";
import { periodKey, previousMonthPeriod } from "@/lib/report/period";
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

/**
 * On the first of the month, every active owner of a structure gets the previous month's report
 * with the PDF attached, through the outbox. The
 * dedupe key makes a second run, or a second instance, queue nothing new; a structure whose
 * owners all have their copy is not even rebuilt.
 */
export async function runMonthlyReport(now = Date.now(), signal?: AbortSignal): Promise<string> {
  let reports = 0;
  let queued = 0;
  for (const { structure, owners } of (await ownersByStructure()).values()) {
    signal?.throwIfAborted();
    // The month that ended in UTC, whatever the site's zone: reports are UTC days, and on the 1st at
    // 07:00 UTC a site west of UTC still reads the last day of that month on its clocks.
    const period = previousMonthPeriod(new Date(now), "UTC");
    const month = periodKey(period);
    const done = await alreadyQueued(owners.map((owner) => dedupeKey(structure.code, month, owner.id)));
    const due = owners.filter((owner) => !done.has(dedupeKey(structure.code, month, owner.id)));
    if (due.length === 0) continue;
    // The report reads as an owner sees it, through the same permission check as the page.
    const reader: UserActor = { kind: "user", id: due[0]!.id, email: due[0]!.email, name: due[0]!.name, role: due[0]!.role };
    const report = await structureReport(reader, structure.code, period, new Date(now));
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
