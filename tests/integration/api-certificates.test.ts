import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { count, eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import * as listRoute from "@/app/api/v1/structures/[code]/certificates/route";
import * as fileRoute from "@/app/api/v1/structures/[code]/certificates/[id]/file/route";
import { runCertificateReminders } from "@/jobs/certificate-reminders";
import { JOBS } from "@/jobs/registry";
import { getDb } from "@/db/client";
import { auditLog, calibrationCertificates, files, mailOutbox } from "@/db/schema";
import type { CertificateList, CertificateView } from "@/lib/api/field-record-schemas";
import { createGauge, retireGauge } from "@/lib/services/gauges";
import { addMember } from "@/lib/services/memberships";
import { createStructure } from "@/lib/services/structures";
import { pdfDocument } from "../fixtures/documents";
import { microstrainGauge } from "../fixtures/gauges";
import { pngImage, TEXT_FILE } from "../fixtures/images";
import { apiRequest, makeUser, params, userToken } from "./helpers";

const storage = fs.mkdtempSync(path.join(os.tmpdir(), "hookeline-certificates-"));
process.env.FILE_STORAGE_DIR = storage;
afterAll(() => fs.rmSync(storage, { recursive: true, force: true }));
const storedFiles = () => fs.readdirSync(storage).filter((name) => name !== ".incoming");

// New Zealand keeps standard time (UTC+12) in June, from memory of the IANA tz database: at 13:00
// UTC on 30 June it is already 1 July on site, so a certificate expiring on 1 July expires "today".
const CODE = "CAL";
const NOW = Date.UTC(2026, 5, 30, 13, 0);
const DAY = 86_400_000;

const tokens = {} as Record<"engineer" | "technician" | "owner", string>;
let pdf: Uint8Array;

beforeAll(async () => {
  const users = { engineer: await makeUser("engineer"), technician: await makeUser("technician"), owner: await makeUser("owner") };
  await createStructure(null, { code: CODE, name: "Calibration bridge", timezone: "Pacific/Auckland" });
  for (const [role, user] of Object.entries(users)) {
    await addMember(null, user.email, CODE);
    tokens[role as keyof typeof tokens] = await userToken(user.email);
  }
  for (const tag of ["G1", "G2", "G3", "OLD"]) await createGauge(users.engineer, CODE, microstrainGauge(tag));
  await retireGauge(users.engineer, CODE, "OLD");
  pdf = await pdfDocument("Calibration certificate");
});

type Fields = Record<string, string>;
const valid: Fields = { gauge: "G1", number: "CC-2026-0412", issuedBy: "Test calibration laboratory", issuedOn: "2025-07-01", expiresOn: "2026-07-01" };

function post(fields: Fields, file: { bytes: Uint8Array; name: string; type: string } | null = { bytes: pdf, name: "certificate.pdf", type: "application/pdf" }, token = tokens.technician) {
  const form = new FormData();
  if (file) form.set("file", new File([Buffer.from(file.bytes)], file.name, { type: file.type }));
  for (const [name, value] of Object.entries(fields)) form.set(name, value);
  const request = new Request(`http://localhost/api/v1/structures/${CODE}/certificates`, { method: "POST", body: form, headers: { authorization: `Bearer ${token}` } });
  return listRoute.POST(request, params({ code: CODE }));
}

async function list(token = tokens.owner): Promise<CertificateList> {
  const response = await listRoute.GET(apiRequest(`/structures/${CODE}/certificates`, { token }), params({ code: CODE }));
  expect(response.status).toBe(200);
  return (await response.json()) as CertificateList;
}

const stored = async () => ({
  certificates: (await getDb().select({ n: count() }).from(calibrationCertificates))[0]!.n,
  files: (await getDb().select({ n: count() }).from(files))[0]!.n,
  bytes: storedFiles().length,
});

const reminders = () => getDb().select().from(mailOutbox).where(eq(mailOutbox.kind, "certificate-reminder"));

describe("calibration certificates through the API", () => {
  it("stores a technician's certificate with its PDF, audited, and serves the file back", async () => {
    const response = await post(valid);
    expect(response.status).toBe(201);
    const certificate = (await response.json()) as CertificateView;
    expect(certificate).toMatchObject({ gauge: "G1", logger: null, number: "CC-2026-0412", issuedOn: "2025-07-01", expiresOn: "2026-07-01", createdBy: "Test technician" });
    expect(certificate.file.contentType).toBe("application/pdf");
    const audit = await getDb().select().from(auditLog).where(eq(auditLog.action, "certificate.add"));
    expect(audit).toHaveLength(1);
    const served = await fileRoute.GET(apiRequest(certificate.file.url.replace("/api/v1", ""), { token: tokens.owner }), params({ code: CODE, id: String(certificate.id) }));
    expect(served.headers.get("content-type")).toBe("application/pdf");
    expect(served.headers.get("content-disposition")).toBe('attachment; filename="certificate-CC-2026-0412.pdf"');
    expect(Buffer.from(await served.arrayBuffer()).equals(Buffer.from(pdf))).toBe(true);
  });

  it("counts the days on the structure's clock: expiring on 1 July is today in Auckland while UTC still reads 30 June", async () => {
    const previous = Date.now;
    const { certificates, today } = await (async () => {
      Date.now = () => NOW;
      try {
        return await list();
      } finally {
        Date.now = previous;
      }
    })();
    expect(today).toBe("2026-07-01");
    expect(certificates[0]).toMatchObject({ state: "expiring", daysLeft: 0, standing: "Expires today, 2026-07-01" });
  });

  it("takes an image for a logger named in words; owners may read and not add", async () => {
    const image = await post({ ...valid, gauge: "", logger: "Pier 2 logger", number: "LG-77" }, { bytes: pngImage(20, 10), name: "scan.png", type: "image/png" });
    expect(image.status).toBe(201);
    expect(await image.json()).toMatchObject({ gauge: null, logger: "Pier 2 logger", file: { contentType: "image/png" } });
    const refused = await post({ ...valid, number: "OWN-1" }, undefined, tokens.owner);
    expect(refused.status).toBe(403);
  });

  it("refuses bad input with a clear error and stores nothing at all", async () => {
    const before = await stored();
    const cases: [Fields, Parameters<typeof post>[1], number, RegExp][] = [
      [{ ...valid, expiresOn: "2025-06-30" }, undefined, 400, /expiry date must be after the issue date \(2025-07-01\)/],
      [{ ...valid, expiresOn: "2025-07-01" }, undefined, 400, /expiry date must be after the issue date/],
      [{ ...valid, issuedOn: "2025-02-30" }, undefined, 400, /YYYY-MM-DD/],
      [{ ...valid, gauge: "NO-SUCH" }, undefined, 400, /Structure CAL has no gauge tagged "NO-SUCH"/],
      [{ ...valid, logger: "Pier 2 logger" }, undefined, 400, /either the gauge .* or the logger/],
      [valid, { bytes: TEXT_FILE, name: "certificate.pdf", type: "application/pdf" }, 415, /Only PDF files and PNG, JPEG or WebP images are accepted/],
      [valid, { bytes: pdf.subarray(0, 400), name: "certificate.pdf", type: "application/pdf" }, 400, /starts like a PDF but its end is missing/],
      [valid, null, 400, /Attach the certificate \(PDF or image\) as the form field "file"/],
    ];
    for (const [fields, file, status, message] of cases) {
      const response = await post(fields, file);
      const body = (await response.json()) as { error: { message: string } };
      expect(response.status, body.error.message).toBe(status);
      expect(body.error.message).toMatch(message);
    }
    expect(await stored()).toEqual(before);
  });
});

describe("certificate reminders", () => {
  it("is a daily job of the registry with its time zone named", () => {
    expect(JOBS.find((job) => job.name === "certificate-reminders")).toMatchObject({ schedule: "0 30 6 * * *", timezone: "UTC" });
  });

  it("mails each technician and engineer once per threshold, however often the job runs", async () => {
    // G2's certificate expires 20 days after the structure's today; G3's has been replaced by a later one; the retired gauge's is left alone.
    for (const [gauge, number, expiresOn] of [
      ["G2", "G2-A", "2026-07-21"],
      ["G3", "G3-A", "2026-07-10"],
      ["G3", "G3-B", "2027-07-10"],
      ["OLD", "OLD-A", "2026-07-05"],
    ]) expect((await post({ ...valid, gauge: gauge!, number: number!, expiresOn: expiresOn! })).status).toBe(201);
    await getDb().delete(mailOutbox);

    const first = await runCertificateReminders(NOW);
    const second = await runCertificateReminders(NOW);
    expect(second).toBe("0 certificates reminded of, 0 e-mails queued");
    const queued = await reminders();
    // G1 (today), G2 (20 days), and the logger's LG-77 (also 1 July): three certificates, two recipients each.
    expect(first).toBe("3 certificates reminded of, 6 e-mails queued");
    expect(queued.map((mail) => mail.toAddress).sort()).toEqual([...Array(3).fill("engineer@test.example"), ...Array(3).fill("technician@test.example")].sort());
    const aboutG2 = queued.filter((mail) => mail.subject.includes("gauge G2"));
    expect(aboutG2.map((mail) => mail.subject)).toEqual(Array(2).fill("Calibration certificate of gauge G2 on CAL expires in 20 days"));
    expect(aboutG2[0]!.text).toContain("expires in 20 days, on 2026-07-21");

    // Days later the same threshold has been reminded of: nothing more.
    expect(await runCertificateReminders(NOW + 5 * DAY)).toBe("0 certificates reminded of, 0 e-mails queued");
  });

  it("sends the next threshold once when several are configured", async () => {
    process.env.CERTIFICATE_REMINDER_DAYS = "30,7";
    try {
      await getDb().delete(mailOutbox);
      // 14 July on site: G2 (21 July) is 7 days out.
      const at = NOW + 13 * DAY;
      expect(await runCertificateReminders(at)).toBe("1 certificates reminded of, 2 e-mails queued");
      expect(await runCertificateReminders(at)).toBe("0 certificates reminded of, 0 e-mails queued");
      expect((await reminders()).map((mail) => mail.subject)).toEqual(Array(2).fill("Calibration certificate of gauge G2 on CAL expires in 7 days"));
    } finally {
      delete process.env.CERTIFICATE_REMINDER_DAYS;
    }
  });
});
