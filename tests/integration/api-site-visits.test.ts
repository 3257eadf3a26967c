import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { count, eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import * as visitsRoute from "@/app/api/v1/structures/[code]/site-visits/route";
import * as fileRoute from "@/app/api/v1/files/[id]/route";
import { getDb } from "@/db/client";
import { auditLog, files, siteVisitGauges, siteVisits } from "@/db/schema";
import type { SiteVisitPage, SiteVisitView } from "@/lib/api/field-record-schemas";
import { SITE_VISITS_PER_PAGE } from "@/lib/field-records/site-visits";
import { createGauge } from "@/lib/services/gauges";
import { microstrainGauge } from "../fixtures/gauges";
import { jpegImage, pngImage, SVG_DRAWING } from "../fixtures/images";
import { pdfDocument } from "../fixtures/documents";
import { apiRequest, makeTeam, params } from "./helpers";

const storage = fs.mkdtempSync(path.join(os.tmpdir(), "hookeline-visits-"));
process.env.FILE_STORAGE_DIR = storage;
afterAll(() => fs.rmSync(storage, { recursive: true, force: true }));
const storedFiles = () => fs.readdirSync(storage).filter((name) => name !== ".incoming");

const CODE = "SV";
let team: Awaited<ReturnType<typeof makeTeam>>;

beforeAll(async () => {
  team = await makeTeam(CODE);
  for (const tag of ["G1", "G2", "G3"]) await createGauge(team.users.engineer, CODE, microstrainGauge(tag));
});

type Photo = { bytes: Uint8Array; name: string; type: string };

function postForm(fields: Record<string, string | string[]>, photos: Photo[] = [], token = team.tokens.technician) {
  const form = new FormData();
  for (const [name, value] of Object.entries(fields)) for (const one of [value].flat()) form.append(name, one);
  for (const photo of photos) form.append("photos", new File([Buffer.from(photo.bytes)], photo.name, { type: photo.type }));
  const request = new Request(`http://localhost/api/v1/structures/${CODE}/site-visits`, { method: "POST", body: form, headers: { authorization: `Bearer ${token}` } });
  return visitsRoute.POST(request, params({ code: CODE }));
}

const postJson = (body: unknown, token = team.tokens.engineer) => visitsRoute.POST(apiRequest(`/structures/${CODE}/site-visits`, { token, body }), params({ code: CODE }));

async function list(query = "", token = team.tokens.owner): Promise<SiteVisitPage> {
  const response = await visitsRoute.GET(apiRequest(`/structures/${CODE}/site-visits${query}`, { token }), params({ code: CODE }));
  expect(response.status).toBe(200);
  return (await response.json()) as SiteVisitPage;
}

const stored = async () => ({
  visits: (await getDb().select({ n: count() }).from(siteVisits))[0]!.n,
  gauges: (await getDb().select({ n: count() }).from(siteVisitGauges))[0]!.n,
  files: (await getDb().select({ n: count() }).from(files))[0]!.n,
  bytes: storedFiles().length,
});

describe("site visits through the API", () => {
  it("records a technician's visit with photos and gauges touched, the visitor defaulting to the sender, audited", async () => {
    const response = await postForm({ visitedAt: "2026-03-04T09:30:00+01:00", work: "Resealed the junction box of G1 and G2", gauges: ["G2", "G1"] }, [
      { bytes: pngImage(40, 30), name: "box.png", type: "image/png" },
      { bytes: jpegImage(16, 8), name: "IMG_0001.JPG", type: "image/jpeg" },
    ]);
    expect(response.status).toBe(201);
    const visit = (await response.json()) as SiteVisitView;
    expect(visit).toMatchObject({ visitedAt: "2026-03-04T08:30:00.000Z", visitor: "Test technician", gauges: ["G1", "G2"], createdBy: "Test technician" });
    expect(visit.photos.map((photo) => [photo.kind, photo.contentType, photo.width])).toEqual([
      ["visit-photo", "image/png", 40],
      ["visit-photo", "image/jpeg", 16],
    ]);
    const photo = await fileRoute.GET(apiRequest(visit.photos[0]!.url.replace("/api/v1", ""), { token: team.tokens.owner }), params({ id: String(visit.photos[0]!.id) }));
    expect(photo.headers.get("content-type")).toBe("image/png");
    expect(await getDb().select().from(auditLog).where(eq(auditLog.action, "site-visit.add"))).toHaveLength(1);
    // A visit's photo stays with its record.
    const deletion = await fileRoute.DELETE(apiRequest(`/files/${visit.photos[0]!.id}`, { token: team.tokens.engineer, method: "DELETE" }), params({ id: String(visit.photos[0]!.id) }));
    expect(deletion.status).toBe(409);
  });

  it("takes JSON without photos and a crew named in words; owners may read and not record", async () => {
    const response = await postJson({ visitedAt: "2026-03-05T14:00:00Z", visitor: "A. Example and B. Example", work: "Visual inspection", gauges: ["G3"] });
    expect(response.status).toBe(201);
    expect(await response.json()).toMatchObject({ visitor: "A. Example and B. Example", gauges: ["G3"], photos: [] });
    expect((await postJson({ visitedAt: "2026-03-05T14:00:00Z", work: "x" }, team.tokens.owner)).status).toBe(403);
  });

  it("lists newest first, pages in the database, and filters by gauge", async () => {
    const base = Date.UTC(2026, 0, 1);
    for (let i = 0; i < SITE_VISITS_PER_PAGE + 3; i++) expect((await postJson({ visitedAt: new Date(base + i * 3_600_000).toISOString(), work: `Routine check ${i}` })).status).toBe(201);
    const first = await list();
    const total = SITE_VISITS_PER_PAGE + 5;
    expect(first).toMatchObject({ total, page: 1, perPage: SITE_VISITS_PER_PAGE });
    expect(first.visits.map((visit) => visit.work).slice(0, 2)).toEqual(["Visual inspection", "Resealed the junction box of G1 and G2"]);
    const times = first.visits.map((visit) => visit.visitedAt);
    expect(times).toEqual([...times].sort().reverse());
    const second = await list("?page=2");
    expect(second.visits).toHaveLength(total - SITE_VISITS_PER_PAGE);
    expect(second.visits.at(-1)!.work).toBe("Routine check 0");
    expect((await list("?gauge=G1")).visits.map((visit) => visit.work)).toEqual(["Resealed the junction box of G1 and G2"]);
    expect((await list("?gauge=G3")).total).toBe(1);
  });

  it("refuses bad input with a clear error and stores nothing at all", async () => {
    const before = await stored();
    const png = { bytes: pngImage(4, 4), name: "ok.png", type: "image/png" };
    const good = { visitedAt: "2026-03-04T09:30:00Z", work: "Checked" };
    const cases: [Promise<Response>, number, RegExp][] = [
      [postForm({ ...good, gauges: ["G1", "NO-SUCH", "NOPE"] }, [png]), 400, /Structure SV has no gauge tagged "NO-SUCH", "NOPE"/],
      [postForm(good, [png, { bytes: SVG_DRAWING, name: "sketch.svg", type: "image/svg+xml" }]), 415, /SVG files are not accepted/],
      [postForm(good, [png, { bytes: await pdfDocument("not a photo"), name: "photo.jpg", type: "image/jpeg" }]), 415, /Only PNG, JPEG or WebP images are accepted/],
      [postForm({ ...good, visitedAt: new Date(Date.now() + 3_600_000).toISOString() }, [png]), 400, /in the future/],
      [postForm({ ...good, work: "" }, [png]), 400, /Say what was done/],
      [postForm({ work: "Checked" }, [png]), 400, /visitedAt/],
      [postJson({ ...good, gauges: ["G1", "G1"] }), 400, /Gauge G1 is named twice/],
      [postJson({ ...good, visitedAt: "yesterday" }), 400, /ISO-8601/],
      [postForm(good, Array(9).fill(png)), 400, /at most 8 photos/],
    ];
    for (const [sent, status, message] of cases) {
      const response = await sent;
      const body = (await response.json()) as { error: { message: string } };
      expect(response.status, body.error.message).toBe(status);
      expect(body.error.message).toMatch(message);
    }
    expect(await stored()).toEqual(before);
  });
});
