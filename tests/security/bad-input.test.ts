import { beforeAll, describe, expect, it } from "vitest";
import { createToken } from "@/lib/services/tokens";
import { foilGaugeBody } from "../fixtures/gauges";
import { baseUrl, expectContractError, serverDb, storedFingerprint } from "./helpers";

// Bad input of every kind over every route, from the classes of OWASP's Input Validation Cheat
// Sheet and of IEEE 754 (NaN, Infinity, the largest double 1.797…e308): each is refused in the API
// contract's error shape (or, for readings, rejected one by one), never a 500, and nothing stored changes.
type Case = {
  label: string;
  method: string;
  path: string;
  body?: string | FormData;
  type?: string;
  /** Readings are judged one by one: a 200 whose readings were all rejected is the right answer. */
  perReading?: boolean;
};

const json = (value: unknown) => JSON.stringify(value);
const far = ["275760-09-13T00:00:00.001Z", "+999999-01-01T00:00:00Z", "0000-00-00T00:00:00Z", "2026-02-30T12:00:00Z", "2026-13-45T25:61:00Z", "9999-12-31T23:59:59Z", "yesterday", ""];
const hostile = ["<script>alert(1)</script>", "'; DROP TABLE users; --", "\" OR 1=1 --", "\u0000\u0001\u0007", "\u202eBF-LLIM", "👷‍♀️🏗️", "A".repeat(10_000), "line\r\nbreak"];
const numbersJson = ["1e999", "-1e999", "NaN", "Infinity", "1.7976931348623157e308", "-0", "\"12\"", "null", "true", "[]", "{}"];

function corpus(): Case[] {
  const cases: Case[] = [];
  const add = (c: Case) => cases.push(c);
  const S = "/api/v1/structures";
  const G = `${S}/MILL-FB/gauges`;

  // Structures: codes, names and zones of every wrong kind.
  for (const code of [123, null, "", "A", "x".repeat(33), "MILL FB", "MILL-FB", ...hostile]) add({ label: `structure code ${json(code).slice(0, 40)}`, method: "POST", path: S, body: json({ code, name: "Probe" }) });
  for (const timezone of ["Mars/Olympus_Mons", "<b>UTC</b>", 1e308, "UTC\u0000", "+25:00"]) add({ label: `structure timezone ${json(timezone)}`, method: "POST", path: S, body: json({ code: "PROBE-TZ", name: "Probe", timezone }) });
  for (const name of [5, "", null, "x".repeat(100_000)]) add({ label: `structure name ${json(name).slice(0, 30)}`, method: "POST", path: S, body: json({ code: "PROBE-N", name }) });

  // Bodies that are not what the route reads.
  for (const [label, body, type] of [
    ["not JSON", "{", "application/json"],
    ["NaN literal", '{"code":NaN}', "application/json"],
    ["BOM before JSON", "\ufeff{}", "application/json"],
    ["JSON array", "[1,2]", "application/json"],
    ["empty body", "", "application/json"],
    ["deep nesting", "[".repeat(50_000) + "]".repeat(50_000), "application/json"],
    ["form body", "code=A&name=B", "application/x-www-form-urlencoded"],
    ["XML", "<structure><code>A</code></structure>", "application/xml"],
    ["2 MB of JSON", json({ code: "BIG", name: "x".repeat(2_000_000) }), "application/json"],
  ] as const) add({ label: `structures: ${label}`, method: "POST", path: S, body, type });

  // Gauges: numbers past what a double holds, wrong types, hostile tags.
  for (const raw of numbersJson) add({ label: `gauge factor ${raw}`, method: "POST", path: G, body: json(foilGaugeBody("PROBE-GF")).replace('"gaugeFactor":2.1', `"gaugeFactor":${raw}`) });
  for (const tag of [...hostile, "", 7]) add({ label: `gauge tag ${json(tag).slice(0, 30)}`, method: "POST", path: G, body: json(foilGaugeBody(tag as string)) });
  for (const E of [0, -210000, "210000", null]) add({ label: `gauge E ${json(E)}`, method: "POST", path: G, body: json({ ...foilGaugeBody("PROBE-E"), material: { E, nu: 0.3, alpha: 12, yield: 355 } }) });
  add({ label: "gauge that exists already", method: "POST", path: G, body: json(foilGaugeBody("LC-M1")) });
  for (const change of [{ label: 5 }, { gaugeFactor: "2" }, { material: { E: -1 } }, { expectedInterval: -5 }]) add({ label: `gauge change ${json(change)}`, method: "PATCH", path: `${G}/LC-M1`, body: json(change) });

  // Limits and their backtest.
  for (const limit of [
    { quantity: "stress", level: "critical", upper: "1e999" },
    { quantity: "stress", level: "mega", upper: 100 },
    { quantity: "<script>", level: "watch", upper: 100 },
    { quantity: "stress", level: "warning", upper: 10, lower: 20 },
    { quantity: "stress", level: "warning", upper: 10, hysteresis: -1 },
    { quantity: "stress", level: "warning", upper: 10, persistence: 1.5 },
    { quantity: "stress", level: "warning", upper: 10, persistence: 1e308 },
    { quantity: "stress", level: "warning" },
  ]) add({ label: `limit ${json(limit)}`, method: "PUT", path: `${G}/LC-M1/limits`, body: json({ limits: [limit] }) });
  add({ label: "limits not a list", method: "PUT", path: `${G}/LC-M1/limits`, body: json({ limits: "all of them" }) });
  for (const from of far) add({ label: `backtest from ${from}`, method: "POST", path: `${G}/LC-M1/limits/backtest`, body: json({ limits: [], from, to: "2026-01-01T00:00:00Z" }) });
  add({ label: "backtest backwards", method: "POST", path: `${G}/LC-M1/limits/backtest`, body: json({ limits: [], from: "2026-02-01T00:00:00Z", to: "2026-01-01T00:00:00Z" }) });

  // Thermal models, fitted and previewed: bad lags, periods, and periods a fit cannot use.
  const period = { from: "2026-01-01T00:00:00Z", to: "2026-01-08T00:00:00Z" };
  for (const model of [
    { ...period, lagMinutes: -60 },
    { ...period, lagMinutes: 1.5 },
    { ...period, lagMinutes: "soon" },
    { ...period, lagMinutes: 1e308 },
    { ...period, lagMinutes: 60, maxLagMinutes: 120 },
    { ...period, lagMinutes: "auto", maxLagMinutes: 20_000 },
    { ...period, drift: "yes" },
    { from: period.to, to: period.from },
    { from: far[0], to: far[1] },
    { from: "yesterday", to: period.to },
    { from: "2026-01-01T00:00:00Z", to: "2026-01-01T01:00:00Z" },
    { from: "2026-01-01T00:00:00Z", to: "2026-01-01T01:00:00Z", lagMinutes: 600 },
    { from: "2026-01-01T00:00:00Z", to: "2026-01-01T01:00:00Z", lagMinutes: "auto", maxLagMinutes: 600 },
    {},
  ]) {
    add({ label: `thermal model ${json(model).slice(0, 60)}`, method: "PUT", path: `${G}/LC-M1/thermal-model`, body: json(model) });
    add({ label: `thermal fit ${json(model).slice(0, 60)}`, method: "POST", path: `${G}/LC-M1/thermal-model/fit`, body: json(model) });
  }

  // Zero readings.
  for (const zero of [{ value: "NaN", temperature: 10, time: "2026-01-01T00:00:00Z" }, { value: 1, temperature: 10, time: far[0] }, { value: 1, temperature: "warm", time: "2026-01-01T00:00:00Z" }, { fromReadings: 0 }, { fromReadings: -3 }, { fromReadings: 1.5 }, { fromReadings: 1e308 }, {}])
    add({ label: `zero ${json(zero)}`, method: "POST", path: `${G}/LC-M1/zero`, body: json(zero) });

  // Shunt checks: bad numbers, and gauges the check does not apply to (TC-M1 reports microstrain with
  // no bridge recorded; LC-Q1 is a full bridge without its gauge resistance).
  const shunt = { shuntResistance: 174_650, measuredOutput: -0.52 };
  for (const check of [{}, { ...shunt, shuntResistance: 0 }, { ...shunt, shuntResistance: -174_650 }, { ...shunt, shuntResistance: 1e308 }, { ...shunt, shuntResistance: "174650" }, { ...shunt, measuredOutput: null }, { ...shunt, tolerancePercent: 0 }, { ...shunt, tolerancePercent: 500 }, { ...shunt, time: far[0] }, { ...shunt, time: "9999-12-31T23:59:59Z" }, { ...shunt, note: 5 }])
    add({ label: `shunt check ${json(check)}`, method: "POST", path: `${G}/LC-M1/shunt-checks`, body: json(check) });
  // −0 is a reading a dead channel can give: a real (failed) check, so not in this corpus.
  for (const raw of numbersJson.filter((raw) => raw !== "-0")) add({ label: `shunt check measured ${raw}`, method: "POST", path: `${G}/LC-M1/shunt-checks`, body: json(shunt).replace('"measuredOutput":-0.52', `"measuredOutput":${raw}`) });
  for (const tag of ["TC-M1", "LC-Q1"]) add({ label: `shunt check on ${tag}`, method: "POST", path: `${G}/${tag}/shunt-checks`, body: json(shunt) });

  // Readings: each bad on its own; the request stores none of them.
  const readings = `${S}/MILL-FB/readings`;
  for (const time of far) add({ label: `reading at ${time}`, method: "POST", path: readings, perReading: true, body: json({ readings: [{ gauge: "LC-M1", time, value: 0.1, temperature: 10 }] }) });
  for (const raw of ["1e999", "-1e999", "\"0.1\"", "null", "{}"]) add({ label: `reading value ${raw}`, method: "POST", path: readings, perReading: true, body: `{"readings":[{"gauge":"LC-M1","time":"2026-01-01T00:00:00Z","value":${raw},"temperature":10}]}` });
  for (const gauge of [...hostile.slice(0, 5), "lc-m1", "RETIRED?"]) add({ label: `reading for gauge ${json(gauge).slice(0, 30)}`, method: "POST", path: readings, perReading: true, body: json({ readings: [{ gauge, time: "2026-01-01T00:00:00Z", value: 0.1, temperature: 10 }] }) });
  add({ label: "readings not a list", method: "POST", path: readings, body: json({ readings: { gauge: "LC-M1" } }) });
  add({ label: "readings as text/plain", method: "POST", path: readings, body: "gauge,time,value", type: "text/plain" });
  add({ label: "readings CSV with a foreign header", method: "POST", path: `${readings}?timezone=UTC`, body: "sensor;when;reading\nLC-M1;now;1\n", type: "text/csv" });
  add({ label: "readings CSV with control characters", method: "POST", path: `${readings}?timezone=UTC`, perReading: true, body: "gauge,time,value,temperature\nLC-M1\u0000,2026-01-01T00:00:00Z,0.1,10\nLC-M1,2026-01-01T00:00:00Z\u0007,0.1,10\n", type: "text/csv" });
  add({ label: "readings CSV in a bad zone", method: "POST", path: `${readings}?timezone=Nowhere/Else`, body: "gauge,time,value,temperature\n", type: "text/csv" });
  add({ label: "readings CSV that is a zip file", method: "POST", path: `${readings}?timezone=UTC`, perReading: true, body: "PK\u0003\u0004\u0014\u0000\u0000\u0000\u0008\u0000", type: "text/csv" });

  // Files disguised as images and drawings.
  const file = (name: string, type: string, bytes: string | Uint8Array<ArrayBuffer>, title = "probe") => {
    const form = new FormData();
    form.set("title", title);
    form.set("file", new Blob([typeof bytes === "string" ? new TextEncoder().encode(bytes) : bytes], { type }), name);
    return form;
  };
  const disguised = [
    file("photo.png", "image/png", "<html><script>alert(1)</script></html>"),
    file("photo.jpg", "image/jpeg", "MZ\u0090\u0000\u0003\u0000\u0000\u0000 executable"),
    file("photo.svg", "image/svg+xml", '<svg xmlns="http://www.w3.org/2000/svg"><script>alert(1)</script></svg>'),
    file("photo.gif", "image/gif", "GIF89a<script>alert(1)</script>"),
    file("photo.png", "image/png", new Uint8Array([0x89, 0x50, 0x4e, 0x47])),
    file("empty.png", "image/png", new Uint8Array()),
    file("photo.php.png", "image/png", "<?php system($_GET['c']); ?>"),
    file("../../etc/passwd", "image/png", "root:x:0:0"),
  ];
  disguised.forEach((body, i) => add({ label: `disguised photo ${i}`, method: "POST", path: `${G}/LC-M1/photos`, body }));
  disguised.forEach((body, i) => add({ label: `disguised drawing ${i}`, method: "POST", path: `${S}/MILL-FB/drawings`, body }));
  add({ label: "drawing without a file", method: "POST", path: `${S}/MILL-FB/drawings`, body: (() => { const f = new FormData(); f.set("title", "x"); return f; })() });
  add({ label: "upload as JSON", method: "POST", path: `${S}/MILL-FB/uploads`, body: "{}", type: "application/json" });

  // Placement and rosettes.
  for (const placement of [{ drawingId: 1, x: 1e999, y: 0.5 }, { drawingId: 1, x: -0.1, y: 0.5 }, { drawingId: "1", x: 0.5, y: 0.5 }, { drawingId: 999_999, x: 0.5, y: 0.5 }, { x: 0.5 }])
    add({ label: `placement ${json(placement)}`, method: "PUT", path: `${G}/LC-M1/placement`, body: json(placement).replace("null", "1e999") });
  for (const rosette of [{ tag: "R9", layout: "rectangular", gauges: ["LC-M1", "LC-M1", "LC-M1"] }, { tag: "R9", layout: "<b>", gauges: ["GP-R1a", "GP-R1b", "GP-R1c"] }, { tag: "R9", layout: "rectangular", gauges: "GP-R1a" }, { tag: "R1", layout: "rectangular", gauges: ["GP-R1a", "GP-R1b", "GP-R1c"] }])
    add({ label: `rosette ${json(rosette)}`, method: "POST", path: `${S}/MILL-FB/rosettes`, body: json(rosette) });
  add({ label: "rosette limit on an unknown quantity", method: "PUT", path: `${S}/MILL-FB/rosettes/R1/limits`, body: json({ limits: [{ quantity: "sigma9", level: "warning", upper: 1 }] }) });
  add({ label: "rosette backtest far", method: "POST", path: `${S}/MILL-FB/rosettes/R1/limits/backtest`, body: json({ limits: [], from: far[0], to: far[1] }) });
  add({ label: "acknowledgement comment a number", method: "POST", path: "/api/v1/alerts/1/acknowledge", body: json({ comment: 5 }) });
  add({ label: "acknowledgement of alert NaN", method: "POST", path: "/api/v1/alerts/NaN/acknowledge", body: json({ comment: "ok" }) });

  // Load tests: windows, predicted strains as a list and as CSV; nothing may be stored half.
  const L = `${S}/MILL-FB/load-tests`;
  const test = { title: "Probe", load: "Probe truck", start: "2026-01-01T09:00:00Z", end: "2026-01-01T10:00:00Z" };
  const one = [{ gauge: "LC-M1", predicted: 80 }];
  for (const window of [{ end: "2026-01-01T09:00:00Z" }, { end: "2026-01-01T08:00:00Z" }, { end: "2026-02-01T09:00:00Z" }, { start: far[0] }, { start: "yesterday" }, { end: 1e308 }])
    add({ label: `load test window ${json(window)}`, method: "POST", path: L, body: json({ ...test, ...window, predicted: one }) });
  for (const raw of numbersJson) add({ label: `load test predicted ${raw}`, method: "POST", path: L, body: json({ ...test, predicted: one }).replace('"predicted":80', `"predicted":${raw}`) });
  for (const predicted of [[], [{ gauge: "NO-SUCH", predicted: 10 }, { gauge: "LC-M1", predicted: 10 }], [...one, ...one], [{ gauge: "<script>", predicted: 1 }], "LC-M1,80", [{ predicted: 0 }]])
    add({ label: `load test predicted list ${json(predicted).slice(0, 40)}`, method: "POST", path: L, body: json({ ...test, predicted }) });
  for (const csv of ["gauge,predicted\nNO-SUCH,10\nLC-M1,12\n", "gauge,predicted\nLC-M1,1,5\n", "gauge,predicted\nLC-M1,twelve\n", "gauge,predicted\nLC-M1,0\n", "gauge,predicted\nLC-M1,1e999\n", "gauge,predicted\n", "", '"unclosed,1\n', "gauge;predicted\nLC-M1;12\n"])
    add({ label: `load test CSV ${json(csv).slice(0, 40)}`, method: "POST", path: L, body: json({ ...test, predictedCsv: csv }) });
  add({ label: "load test with both tables", method: "POST", path: L, body: json({ ...test, predicted: one, predictedCsv: "LC-M1,80" }) });
  add({ label: "load test without a title", method: "POST", path: L, body: json({ ...test, title: "", predicted: one }) });
  add({ label: "load test without a load", method: "POST", path: L, body: json({ ...test, load: null, predicted: one }) });
  for (const id of ["NaN", "0", "-1", "1.5", "1e308", "%3Cscript%3E", "999999"]) {
    add({ label: `load test numbered ${id}`, method: "GET", path: `${L}/${id}` });
    add({ label: `load test CSV numbered ${id}`, method: "GET", path: `${L}/${id}/results.csv` });
  }

  // Calibration certificates: dates out of order or not dates, an unknown gauge, files that are no PDF or image.
  const C = `${S}/MILL-FB/certificates`;
  const certificate = (fields: Record<string, string>, part: Uint8Array<ArrayBuffer> | string | null = "%PDF-1.7\n1 0 obj\n<<>>\nendobj\n%%EOF\n") => {
    const form = new FormData();
    for (const [name, value] of Object.entries({ gauge: "LC-M1", number: "PROBE-C", issuedBy: "Probe lab", issuedOn: "2026-01-10", expiresOn: "2027-01-10", ...fields })) form.set(name, value);
    if (part !== null) form.set("file", new Blob([typeof part === "string" ? new TextEncoder().encode(part) : part], { type: "application/pdf" }), "certificate.pdf");
    return form;
  };
  for (const dates of [{ expiresOn: "2026-01-09" }, { expiresOn: "2026-01-10" }, { issuedOn: "2026-02-30" }, { expiresOn: "tomorrow" }, { issuedOn: "99999-01-01" }, { expiresOn: "" }] as Record<string, string>[])
    add({ label: `certificate dates ${json(dates)}`, method: "POST", path: C, body: certificate(dates) });
  for (const subject of [{ gauge: "NO-SUCH" }, { gauge: "<script>" }, { gauge: "", logger: "" }, { logger: "Probe logger" }, { gauge: "", logger: "x".repeat(500) }] as Record<string, string>[])
    add({ label: `certificate for ${json(subject).slice(0, 40)}`, method: "POST", path: C, body: certificate(subject) });
  for (const [label, part] of [["text named .pdf", "just text, not a PDF"], ["PDF cut short", "%PDF-1.7\n1 0 obj\n<<"], ["HTML", "<html><script>alert(1)</script></html>"], ["empty", new Uint8Array()]] as const)
    add({ label: `certificate file ${label}`, method: "POST", path: C, body: certificate({}, part) });
  add({ label: "certificate without a file", method: "POST", path: C, body: certificate({}, null) });
  add({ label: "certificate without a number", method: "POST", path: C, body: certificate({ number: "" }) });
  add({ label: "certificate as JSON", method: "POST", path: C, body: json({ gauge: "LC-M1" }) });
  for (const id of ["NaN", "0", "-1", "1.5", "1e308", "999999"]) add({ label: `certificate file numbered ${id}`, method: "GET", path: `${C}/${id}/file` });

  // Site visits, as JSON and as a form with photos: times, unknown gauges, photos that are no image.
  const V = `${S}/MILL-FB/site-visits`;
  const visit = { visitedAt: "2026-01-10T09:00:00Z", work: "Probe visit", gauges: ["LC-M1"] };
  for (const visitedAt of [...far.slice(0, 3), "yesterday", "2999-01-01T00:00:00Z", 1e308]) add({ label: `site visit at ${json(visitedAt)}`, method: "POST", path: V, body: json({ ...visit, visitedAt }) });
  for (const gauges of [["NO-SUCH"], ["LC-M1", "LC-M1"], "LC-M1", [7], [...hostile.slice(0, 3)]]) add({ label: `site visit gauges ${json(gauges).slice(0, 40)}`, method: "POST", path: V, body: json({ ...visit, gauges }) });
  for (const work of ["", null, 5, "x".repeat(5000)]) add({ label: `site visit work ${json(work).slice(0, 30)}`, method: "POST", path: V, body: json({ ...visit, work }) });
  const visitForm = (photo: FormData) => {
    const form = new FormData();
    for (const [name, value] of Object.entries({ visitedAt: visit.visitedAt, work: visit.work, gauges: "LC-M1" })) form.set(name, value);
    form.set("photos", photo.get("file")!);
    return form;
  };
  disguised.slice(0, 4).forEach((body, i) => add({ label: `site visit with disguised photo ${i}`, method: "POST", path: V, body: visitForm(body) }));
  for (const query of ["page=0", "page=-1", "page=1e308", "page=NaN", "gauge=NO-SUCH", "gauge=%3Cscript%3E"]) add({ label: `site visits ?${query}`, method: "GET", path: `${V}?${query}` });

  // Names in the path and the query.
  const pathNames = ["%3Cscript%3E", "'%20OR%201%3D1--", "%00", "..%2F..%2Fetc%2Fpasswd", "x".repeat(3000), "MILL-FB%E2%80%AE", "%F0%9F%92%A5", "1e308"];
  for (const name of pathNames) {
    add({ label: `structure named ${name.slice(0, 24)}`, method: "GET", path: `${S}/${name}` });
    add({ label: `gauge named ${name.slice(0, 24)}`, method: "GET", path: `${G}/${name}/series` });
    add({ label: `file numbered ${name.slice(0, 24)}`, method: "GET", path: `/api/v1/files/${name}` });
  }
  for (const query of ["from=NaN&to=NaN", `from=${far[0]}&to=${far[1]}`, "from=2026-02-01T00:00:00Z&to=2026-01-01T00:00:00Z", "points=0", "points=1e308", "points=-1", "quantity=%3Cscript%3E", "from=1e308"])
    add({ label: `series ?${query.slice(0, 40)}`, method: "GET", path: `${G}/LC-M1/series?${query}` });
  for (const query of ["limit=1e308", "limit=0", "cursor=%27%3B--", "cursor=" + "A".repeat(5000), "from=%00"]) add({ label: `readings ?${query.slice(0, 30)}`, method: "GET", path: `${G}/LC-M1/readings?${query}` });
  for (const query of ["month=2026-13", "month=%3Cb%3E", "month=99999-01", "format=exe"]) add({ label: `report ?${query}`, method: "GET", path: `${S}/MILL-FB/report?${query}` });
  for (const query of ["from=NaN", "to=1e308", "bins=-1"]) add({ label: `fatigue ?${query}`, method: "GET", path: `${G}/LC-M1/fatigue?${query}` });
  for (const query of ["state=%3Cb%3E", "limit=1e999", "from=yesterday"]) add({ label: `alerts ?${query}`, method: "GET", path: `${S}/MILL-FB/alerts?${query}` });
  return cases;
}

let token: string;
let adminToken: string;
beforeAll(async () => {
  token = (await createToken(null, { kind: "user", email: "engineer@hookeline.example" }, "bad input")).token;
  adminToken = (await createToken(null, { kind: "user", email: "admin@hookeline.example" }, "bad input")).token;
});

describe("bad-input corpus", () => {
  const cases = corpus();

  it("has at least 150 cases over every route that takes input", () => {
    expect(cases.length).toBeGreaterThanOrEqual(150);
    console.info(`bad-input corpus: ${cases.length} cases`);
  });

  it.each(cases.map((c) => [c.label, c] as const))("%s", async (label, c) => {
    const before = await storedFingerprint();
    const readingsBefore = (await serverDb().execute("select count(*) as n from readings")).rows[0]!.n;
    const headers: Record<string, string> = { authorization: `Bearer ${c.path === "/api/v1/structures" ? adminToken : token}` };
    if (typeof c.body === "string") headers["content-type"] = c.type ?? "application/json";
    const response = await fetch(`${baseUrl()}${c.path}`, { method: c.method, headers, body: c.body });
    expect(response.status, label).toBeLessThan(500);
    if (c.perReading && response.status === 200) {
      const report = (await response.json()) as { accepted: number; rejected: unknown[] };
      expect(report.accepted, label).toBe(0);
      expect(report.rejected.length, label).toBeGreaterThan(0);
    } else if (c.method === "GET" && response.status === 200) {
      // A query the route reads leniently (an unknown parameter ignored) is no error; nothing to store either.
      await response.body?.cancel();
    } else {
      expect(response.status, label).toBeGreaterThanOrEqual(400);
      await expectContractError(response, label);
    }
    expect(await storedFingerprint(), label).toBe(before);
    expect((await serverDb().execute("select count(*) as n from readings")).rows[0]!.n, label).toBe(readingsBefore);
  });
});
