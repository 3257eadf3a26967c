import "server-only";
import { and, count, desc, eq, exists, inArray, asc } from "drizzle-orm";
import { getDb } from "@/db/client";
import { files, gauges, siteVisitGauges, siteVisitPhotos, siteVisits, type SiteVisit } from "@/db/schema";
import type { SiteVisitPage, SiteVisitView } from "@/lib/api/field-record-schemas";
import { actorLabel, type Actor } from "@/lib/auth/actor";
import { requirePermission } from "@/lib/auth/authorize";
import { AppError } from "@/lib/errors";
import { MAX_VISIT_PHOTOS, SITE_VISITS_PER_PAGE, siteVisitInput, siteVisitQuery } from "@/lib/field-records/site-visits";
import { parseWith } from "@/lib/validation";
import { recordAudit } from "./audit";
import { auditedFile, storeUploads, toFileView } from "./files";
import { gaugeRowsOf } from "./gauges";
import { getVisibleStructure } from "./structures";

/** A visit's time may run a little ahead of the server's clock (a phone's clock), not further. */
const FUTURE_ALLOWANCE_MS = 5 * 60_000;

const invalid = (field: string, message: string, details: Record<string, unknown> = {}) =>
  new AppError("validation_failed", message, { field, issues: [{ path: field, message }], ...details });

/** The visits' gauges and photos, for a page of visits at once. */
async function viewsOf(visits: SiteVisit[]): Promise<SiteVisitView[]> {
  const ids = visits.map((visit) => visit.id);
  if (ids.length === 0) return [];
  const [touched, photos] = await Promise.all([
    getDb()
      .select({ visitId: siteVisitGauges.visitId, tag: gauges.tag })
      .from(siteVisitGauges)
      .innerJoin(gauges, eq(gauges.id, siteVisitGauges.gaugeId))
      .where(inArray(siteVisitGauges.visitId, ids))
      .orderBy(asc(gauges.tag)),
    getDb().select({ visitId: siteVisitPhotos.visitId, file: files }).from(siteVisitPhotos).innerJoin(files, eq(files.id, siteVisitPhotos.fileId)).where(inArray(siteVisitPhotos.visitId, ids)).orderBy(asc(files.id)),
  ]);
  return visits.map((visit) => ({
    id: visit.id,
    visitedAt: visit.visitedAt.toISOString(),
    visitor: visit.visitor,
    work: visit.workDone,
    gauges: touched.filter((row) => row.visitId === visit.id).map((row) => row.tag),
    // Visit photos are checked as images on upload (lib/storage/upload-rules), so their types are the image ones.
    photos: photos.filter((row) => row.visitId === visit.id).map((row) => toFileView(row.file, null)) as SiteVisitView["photos"],
    createdBy: visit.createdByLabel,
    createdAt: visit.createdAt.toISOString(),
  }));
}

/** A page of the structure's visits, newest first, or of those naming one gauge; counted and paged in SQL. */
export async function listSiteVisits(actor: Actor, code: string, query: unknown = {}): Promise<SiteVisitPage> {
  const structure = await getVisibleStructure(actor, code);
  await requirePermission(actor, "structure:view", structure);
  const { page, gauge } = parseWith(siteVisitQuery, query);
  let where = eq(siteVisits.structureId, structure.id);
  if (gauge !== undefined) {
    const [row] = await gaugeRowsOf(structure.id, [gauge]);
    if (!row) throw new AppError("not_found", `Structure "${structure.code}" has no gauge tagged "${gauge}".`);
    const names = getDb()
      .select({ visitId: siteVisitGauges.visitId })
      .from(siteVisitGauges)
      .where(and(eq(siteVisitGauges.visitId, siteVisits.id), eq(siteVisitGauges.gaugeId, row.id)));
    where = and(where, exists(names))!;
  }
  const [total, rows] = await Promise.all([
    getDb().select({ n: count() }).from(siteVisits).where(where),
    getDb()
      .select()
      .from(siteVisits)
      .where(where)
      .orderBy(desc(siteVisits.visitedAt), desc(siteVisits.id))
      .limit(SITE_VISITS_PER_PAGE)
      .offset((page - 1) * SITE_VISITS_PER_PAGE),
  ]);
  return { visits: await viewsOf(rows), total: total[0]!.n, page, perPage: SITE_VISITS_PER_PAGE };
}

/**
 * Records a visit (technicians, engineers and admins of the structure; audited): when, who (the
 * sender by default), what was done, the gauges it touched and its photos. Every gauge named must
 * be the structure's and every photo an image; the photos' rows, the visit, its gauges and the
 * audit entry commit together or not at all.
 */
export async function addSiteVisit(actor: Actor, code: string, sent: { fields: unknown; photos: Uint8Array[] }, now = Date.now()): Promise<SiteVisitView> {
  const structure = await getVisibleStructure(actor, code);
  await requirePermission(actor, "field-record:add", structure);
  const input = parseWith(siteVisitInput, sent.fields);
  const visitedAt = Date.parse(input.visitedAt);
  if (visitedAt > now + FUTURE_ALLOWANCE_MS) throw invalid("visitedAt", "The visit's time is in the future; record a visit once it has happened.");
  if (sent.photos.length > MAX_VISIT_PHOTOS) throw invalid("photos", `A visit carries at most ${MAX_VISIT_PHOTOS} photos; this one has ${sent.photos.length}.`);
  const named = await gaugeRowsOf(structure.id, input.gauges);
  const unknown = input.gauges.filter((tag) => !named.some((gauge) => gauge.tag === tag));
  if (unknown.length > 0) {
    throw invalid("gauges", `Structure ${structure.code} has no gauge tagged ${unknown.map((tag) => `"${tag}"`).join(", ")}; correct the tag${unknown.length > 1 ? "s" : ""} or leave ${unknown.length > 1 ? "them" : "it"} out.`, {
      unknownGauges: unknown,
    });
  }
  const visitor = input.visitor || (actor.kind === "user" ? actor.name : actorLabel(actor));
  const when = new Date(visitedAt).toISOString();
  const uploads = sent.photos.map((bytes, i) => ({ kind: "visit-photo" as const, title: `Site visit ${when.slice(0, 10)}, photo ${i + 1}`, bytes }));
  const visit = await storeUploads(actor, structure, uploads, async (tx, photos) => {
    const [row] = await tx
      .insert(siteVisits)
      .values({
        structureId: structure.id,
        visitedAt: new Date(visitedAt),
        visitor,
        workDone: input.work,
        createdById: actor.kind === "user" ? actor.id : null,
        createdByLabel: actor.kind === "user" ? actor.name : actorLabel(actor),
      })
      .returning();
    if (named.length > 0) await tx.insert(siteVisitGauges).values(named.map((gauge) => ({ visitId: row!.id, gaugeId: gauge.id })));
    if (photos.length > 0) await tx.insert(siteVisitPhotos).values(photos.map((photo) => ({ visitId: row!.id, fileId: photo.id })));
    await recordAudit(tx, {
      actor,
      action: "site-visit.add",
      entityType: "site-visit",
      entityKey: `${structure.code}/${row!.id}`,
      structureId: structure.id,
      after: { visitedAt: when, visitor, work: input.work, gauges: named.map((gauge) => gauge.tag), photos: photos.map(auditedFile) },
    });
    return row!;
  });
  return (await viewsOf([visit]))[0]!;
}
