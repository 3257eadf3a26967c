import { spawn, spawnSync, type ChildProcess } from "node:child_process";
import { once } from "node:events";
import fs from "node:fs";
import http from "node:http";
import os from "node:os";
import path from "node:path";
import { createClient, type Client } from "@libsql/client";
import Libsql from "libsql";
import { drizzle } from "drizzle-orm/libsql";
import { migrate } from "drizzle-orm/libsql/migrator";
import { closeDb } from "@/db/client";
import { migrateDatabase } from "@/db/migrate";
import { parseWith } from "@/lib/validation";
import { gaugeInput } from "@/lib/gauges/schema";
import { prepareGauge, type GaugeConfig, type GaugeConverter } from "@/lib/mechanics";
import { createBucketAccumulator, bucketGrid, DAY, MINUTE } from "@/lib/series";
import { createGauge } from "@/lib/services/gauges";
import { createStructure } from "@/lib/services/structures";
import { createToken } from "@/lib/services/tokens";
import { createUser } from "@/lib/services/users";
import type { UserActor } from "@/lib/auth/actor";
import { waitForServer } from "../e2e/app-server";
import { freePort } from "../free-port";
import type { BenchResult } from "./mechanics";

/**
 * Full-path figures against the production build: ingestion through HTTP versus raw inserts,
 * a year's series query versus reading every row, and the server's memory over a million-row
 * upload. Everything runs on temporary databases; nothing here asserts.
 */

const BATCH = 5_000;
/** Concurrent clients; in the main ingestion figure each is a logger sending its own gauges. */
const CLIENTS = 8;
const GAUGES_PER_LOGGER = 10;
const INGEST_READINGS = 400_000;
/** Ingestion is timed this many times, HTTP and raw in turn; the figures are the medians. */
const INGEST_ROUNDS = 5;
const YEAR_READINGS = 525_600;
const UPLOAD_ROWS = 1_000_000;
const START = Date.UTC(2025, 0, 1);
const READING_COLUMNS = 7;

/** A foil gauge read in microstrain, as most loggers report, on steel. */
export const GAUGE = {
  kind: "foil",
  input: "microstrain",
  gaugeFactor: 2.1,
  loggerGaugeFactor: 2,
  material: { E: 200000, nu: 0.3, alpha: 12, yield: 355 },
  thermal: { method: "cte", gaugeCte: 10.8 },
  zero: { value: 0, temperature: 15, time: "2024-12-31T00:00:00Z" },
};

const tagsOf = (prefix: string) => Array.from({ length: GAUGES_PER_LOGGER }, (_, g) => `${prefix}G${g}`);
/** Each logger's gauges: L0G0…L0G9 for logger 0, and so on. */
const LOGGER_TAGS = Array.from({ length: CLIENTS }, (_, logger) => tagsOf(`L${logger}`));
/** Gauges whose readings every client sends a share of. */
const SHARED_TAGS = tagsOf("S");
/** Gauges that take the warm-up batches. */
const WARM_UP_TAGS = tagsOf("W");
const WARM_UP_BATCHES = 16;

type Reading = { gauge: string; time: number; value: number; temperature: number };

/** Deterministic readings: gauge i reads a slow wave with a daily temperature swing. */
function reading(tag: string, i: number, step: number, phase: number): Reading {
  const time = START + i * step;
  return { gauge: tag, time, value: 200 * Math.sin(i / 500 + phase), temperature: 15 + 8 * Math.sin((2 * Math.PI * time) / DAY) };
}

/** Batches of BATCH readings of the gauges in time order, each gauge reading once a minute from minute `start`. */
function batchesOf(tags: string[], readings: number, start = 0): Reading[][] {
  const batches: Reading[][] = [];
  const perBatch = BATCH / tags.length;
  for (let first = start; first < start + readings / tags.length; first += perBatch) {
    const batch: Reading[] = [];
    for (let i = first; i < first + perBatch; i++) tags.forEach((tag, g) => batch.push(reading(tag, i, MINUTE, g)));
    batches.push(batch);
  }
  return batches;
}

export const jsonBody = (batch: Reading[]) =>
  JSON.stringify({ readings: batch.map((r) => ({ ...r, time: new Date(r.time).toISOString() })) });

/** The bench database with its gauges; a logger token to send readings and a user token to read them. */
async function prepareDatabase(url: string, extra?: (admin: UserActor) => Promise<void>): Promise<{ logger: string; reader: string }> {
  process.env.DATABASE_URL = url;
  await migrateDatabase();
  await createStructure(null, { code: "BENCH", name: "Bench structure", timezone: "UTC" });
  const admin = await createUser(null, { ...BENCH_USER, name: "Bench", role: "admin" });
  const actor = { kind: "user" as const, id: admin.id, email: admin.email, name: admin.name, role: admin.role };
  for (const tag of [...LOGGER_TAGS.flat(), ...SHARED_TAGS, ...WARM_UP_TAGS, "YEAR", "UPLOAD"]) {
    await createGauge(actor, "BENCH", parseWith(gaugeInput, { ...GAUGE, tag }));
  }
  const logger = (await createToken(null, { kind: "logger", structureCode: "BENCH" }, "bench logger")).token;
  const reader = (await createToken(null, { kind: "user", email: admin.email }, "bench reader")).token;
  await extra?.(actor);
  closeDb();
  return { logger, reader };
}

/** BENCH_NODE_ARGS passes options to the server's node, e.g. "--cpu-prof --cpu-prof-dir=/tmp/profile" to see where its time goes. */
function startServer(url: string, port: number): ChildProcess {
  const next = path.join("node_modules", "next", "dist", "bin", "next");
  const nodeArgs = process.env.BENCH_NODE_ARGS?.split(" ").filter(Boolean) ?? [];
  return spawn(process.execPath, [...nodeArgs, next, "start", "-p", String(port), "-H", "127.0.0.1"], {
    env: { ...process.env, DATABASE_URL: url, NEXTAUTH_SECRET: "bench-secret", NEXTAUTH_URL: `http://127.0.0.1:${port}` },
    stdio: ["ignore", "ignore", "inherit"],
  });
}

/** RSS of the process and its children, kB: current and high-water mark. */
export function memoryOf(pid: number): { rss: number; hwm: number } {
  let rss = 0;
  let hwm = 0;
  const visit = (id: number) => {
    const status = fs.readFileSync(`/proc/${id}/status`, "utf8");
    rss += Number(/VmRSS:\s+(\d+)/.exec(status)?.[1] ?? 0);
    hwm += Number(/VmHWM:\s+(\d+)/.exec(status)?.[1] ?? 0);
    for (const task of fs.readdirSync(`/proc/${id}/task`)) {
      const children = fs.readFileSync(`/proc/${id}/task/${task}/children`, "utf8").trim();
      for (const child of children ? children.split(" ") : []) visit(Number(child));
    }
  };
  visit(pid);
  return { rss, hwm };
}

/** Clock ticks per second of /proc/<pid>/stat's times: USER_HZ, 100 on every Linux architecture Node runs on. */
const USER_HZ = 100;

/**
 * CPU time the process and its children have used, ms (user + system). A cost per request from it
 * holds still when other work shares the machine, where latencies stretch with the load.
 */
export function cpuMsOf(pid: number): number {
  let ticks = 0;
  const visit = (id: number) => {
    // The command name (field 2) is in parentheses and may hold spaces: count fields after it.
    const fields = fs.readFileSync(`/proc/${id}/stat`, "utf8").split(") ")[1]!.split(" ");
    ticks += Number(fields[11]) + Number(fields[12]);
    for (const task of fs.readdirSync(`/proc/${id}/task`)) {
      const children = fs.readFileSync(`/proc/${id}/task/${task}/children`, "utf8").trim();
      for (const child of children ? children.split(" ") : []) visit(Number(child));
    }
  };
  visit(pid);
  return (ticks * 1000) / USER_HZ;
}

/** Posts the bodies in order, `clients` requests in flight; answers the readings accepted. */
export async function postAll(baseUrl: string, token: string, bodies: (() => string)[], clients: number, structureCode = "BENCH") {
  let next = 0;
  let accepted = 0;
  const client = async () => {
    while (next < bodies.length) {
      const body = bodies[next++]!();
      const send = () =>
        fetch(`${baseUrl}/api/v1/structures/${structureCode}/readings`, {
          method: "POST",
          headers: { authorization: `Bearer ${token}`, "content-type": "application/json" },
          body,
        });
      // On a loaded machine the server may close a kept-alive socket as a request starts on it; a
      // logger resends, which is safe: what the first attempt stored comes back as duplicates.
      const response = await send().catch(send);
      if (!response.ok) throw new Error(`ingestion answered ${response.status}: ${await response.text()}`);
      const result = await response.json();
      if (result.rejected.length > 0) throw new Error(`a bench reading was rejected: ${JSON.stringify(result.rejected[0])}`);
      accepted += result.accepted + result.duplicates;
    }
  };
  await Promise.all(Array.from({ length: clients }, client));
  return accepted;
}

/** Readings/s of posting every queue at once, each queue by one client in order. */
async function ingestionRate(baseUrl: string, token: string, queues: string[][], clientsPerQueue: number): Promise<number> {
  const started = performance.now();
  const accepted = await Promise.all(queues.map((queue) => postAll(baseUrl, token, queue.map((body) => () => body), clientsPerQueue)));
  const seconds = (performance.now() - started) / 1000;
  const total = accepted.reduce((sum, count) => sum + count, 0);
  if (total !== INGEST_READINGS) throw new Error(`only ${total} of ${INGEST_READINGS} readings accepted`);
  return total / seconds;
}

/**
 * The same rows, converted the same way, inserted with plain multi-row INSERTs, one transaction per
 * batch, into a database of their own; `insert` answers readings/s.
 */
async function openRawStore(folder: string) {
  const client = createClient({ url: `file:${path.join(folder, "raw.db")}` });
  await client.execute("PRAGMA journal_mode = WAL");
  await migrate(drizzle(client), { migrationsFolder: path.join(process.cwd(), "drizzle") });
  const prepared = prepareGauge({ ...GAUGE, zero: { value: 0, temperature: 15 } } as GaugeConfig);
  if (!prepared.ok) throw new Error(prepared.message);
  const converter: GaugeConverter = prepared;
  const gaugeIds = new Map(LOGGER_TAGS.flat().map((tag, i) => [tag, i + 1]));
  const rowsPerStatement = Math.floor(32_766 / READING_COLUMNS);
  const sqlFor = (rows: number) =>
    `INSERT INTO readings (gauge_id, t, value, temperature, strain, stress, flags) VALUES ${Array(rows).fill("(?,?,?,?,?,?,?)").join(",")}`;
  async function insert(batches: Reading[][]): Promise<number> {
    const started = performance.now();
    for (const batch of batches) {
      const tx = await client.transaction("write");
      for (let from = 0; from < batch.length; from += rowsPerStatement) {
        const chunk = batch.slice(from, from + rowsPerStatement);
        const args: (number | null)[] = [];
        for (const r of chunk) {
          const result = converter.convert(r.value, r.temperature);
          if (!result.ok) throw new Error(result.message);
          args.push(gaugeIds.get(r.gauge)!, r.time, r.value, r.temperature, result.strain, result.stress, result.flags);
        }
        await tx.execute({ sql: sqlFor(chunk.length), args });
      }
      await tx.commit();
    }
    return batches.reduce((sum, batch) => sum + batch.length, 0) / ((performance.now() - started) / 1000);
  }
  return { insert, close: () => client.close() };
}

/**
 * The fastest plain insert of the same rows the native connection can do: one prepared multi-row
 * statement of 500 rows reused (and one for the remainder), one transaction per batch of 5 000.
 */
function openNativeRawStore(folder: string) {
  const file = path.join(folder, "native-raw.db");
  const setup = createClient({ url: `file:${file}` });
  const ready = (async () => {
    await setup.execute("PRAGMA journal_mode = WAL");
    await migrate(drizzle(setup), { migrationsFolder: path.join(process.cwd(), "drizzle") });
    setup.close();
  })();
  const prepared = prepareGauge({ ...GAUGE, zero: { value: 0, temperature: 15 } } as GaugeConfig);
  if (!prepared.ok) throw new Error(prepared.message);
  const converter: GaugeConverter = prepared;
  const gaugeIds = new Map(LOGGER_TAGS.flat().map((tag, i) => [tag, i + 1]));
  const ROWS = 500;
  let connection: Libsql.Database | null = null;
  const statements = new Map<number, Libsql.Statement>();
  const statementFor = (rows: number) => {
    let statement = statements.get(rows);
    if (!statement) {
      statement = connection!.prepare(`INSERT INTO readings (gauge_id, t, value, temperature, strain, stress, flags) VALUES ${Array(rows).fill("(?,?,?,?,?,?,?)").join(",")}`);
      statements.set(rows, statement);
    }
    return statement;
  };
  async function insert(batches: Reading[][]): Promise<number> {
    await ready;
    connection ??= new Libsql(file);
    const begin = connection.prepare("BEGIN IMMEDIATE");
    const commit = connection.prepare("COMMIT");
    const args: (number | null)[] = new Array(ROWS * READING_COLUMNS);
    const started = performance.now();
    for (const batch of batches) {
      begin.run();
      for (let from = 0; from < batch.length; from += ROWS) {
        const rows = Math.min(ROWS, batch.length - from);
        args.length = rows * READING_COLUMNS;
        for (let i = 0; i < rows; i++) {
          const r = batch[from + i]!;
          const result = converter.convert(r.value, r.temperature);
          if (!result.ok) throw new Error(result.message);
          const k = i * READING_COLUMNS;
          args[k] = gaugeIds.get(r.gauge)!;
          args[k + 1] = r.time;
          args[k + 2] = r.value;
          args[k + 3] = r.temperature;
          args[k + 4] = result.strain;
          args[k + 5] = result.stress;
          args[k + 6] = result.flags;
        }
        statementFor(rows).run(args);
      }
      commit.run();
    }
    return batches.reduce((sum, batch) => sum + batch.length, 0) / ((performance.now() - started) / 1000);
  }
  return { insert, close: () => connection?.close() };
}

/** The static path's HTTP readings/s of the last ingestion benchmark, for the burst benchmark to compare with. */
export let staticReadingsPerSecond: number | null = null;

const median = (values: number[]) => [...values].sort((a, b) => a - b)[Math.floor(values.length / 2)]!;
const spread = (rates: number[]) => `${Math.round(Math.min(...rates) / 1000)}k–${Math.round(Math.max(...rates) / 1000)}k`;

/**
 * A year of 1-minute readings for gauge YEAR, with one planted load peak, sent through ingestion;
 * answers the year's span. The peak rises and falls over 20 minutes: a lone reading far from its
 * neighbours is set aside as a sensor spike and rightly kept out of the series.
 */
export async function loadYear(baseUrl: string, token: string): Promise<{ from: number; to: number }> {
  const peakIndex = 200_000;
  const peakHalfWidth = 10;
  const yearBodies = Array.from({ length: YEAR_READINGS / BATCH }, (_, b) => () => {
    const batch: Reading[] = [];
    for (let i = b * BATCH; i < (b + 1) * BATCH; i++) {
      const r = reading("YEAR", i, MINUTE, 0);
      const fromPeak = Math.abs(i - peakIndex);
      if (fromPeak < peakHalfWidth) r.value = 5_000 * (1 - fromPeak / peakHalfWidth);
      batch.push(r);
    }
    return jsonBody(batch);
  });
  await postAll(baseUrl, token, yearBodies, CLIENTS);
  return { from: START, to: START + YEAR_READINGS * MINUTE };
}

async function seriesFigures(baseUrl: string, token: string, reader: string, url: string) {
  const { from, to } = await loadYear(baseUrl, token);
  const seriesUrl = `${baseUrl}/api/v1/structures/BENCH/gauges/YEAR/series?from=${new Date(from).toISOString()}&to=${new Date(to).toISOString()}&points=1000&quantity=strain`;
  const query = async () => {
    const response = await fetch(seriesUrl, { headers: { authorization: `Bearer ${reader}` } });
    if (!response.ok) throw new Error(`series answered ${response.status}: ${await response.text()}`);
    return (await response.json()) as { max: number[]; t: number[]; source: string };
  };
  for (let i = 0; i < 5; i++) await query();
  const times: number[] = [];
  let series = await query();
  for (let i = 0; i < 30; i++) {
    const started = performance.now();
    series = await query();
    times.push(performance.now() - started);
  }
  const peakShows = Math.max(...series.max) > 4_000;

  const client: Client = createClient({ url });
  const gauge = (await client.execute("SELECT id FROM gauges WHERE tag = 'YEAR'")).rows[0]![0] as number;
  const naive = async () => {
    const grid = bucketGrid(from, to, 1000);
    const rows = await client.execute({ sql: "SELECT t, strain FROM readings WHERE gauge_id = ? AND t >= ? AND t < ? ORDER BY t", args: [gauge, grid.start, grid.end] });
    const buckets = createBucketAccumulator(grid);
    for (const row of rows.rows) buckets.addValue(row[0] as number, row[1] as number);
    return buckets.result();
  };
  await naive();
  const naiveTimes: number[] = [];
  for (let i = 0; i < 5; i++) {
    const started = performance.now();
    await naive();
    naiveTimes.push(performance.now() - started);
  }
  client.close();
  return { median: median(times), naive: median(naiveTimes), peakShows, buckets: series.t.length, source: series.source };
}

/**
 * Streams a million-row CSV to the upload endpoint, generated as it is sent, while sampling the
 * server's memory. A fresh connection (agent: false): a pooled keep-alive socket may be closed by
 * the server just as a long upload starts on it.
 */
async function uploadFigures(baseUrl: string, token: string, server: ChildProcess) {
  let peakRss = 0;
  const sampler = setInterval(() => (peakRss = Math.max(peakRss, memoryOf(server.pid!).rss)), 100);
  const started = performance.now();
  const request = http.request(`${baseUrl}/api/v1/structures/BENCH/uploads`, {
    method: "POST",
    agent: false,
    headers: { authorization: `Bearer ${token}`, "content-type": "text/csv" },
  });
  const answered = once(request, "response") as Promise<[http.IncomingMessage]>;
  request.write("gauge,time,value,temperature\n");
  for (let row = 0; row < UPLOAD_ROWS; ) {
    const lines: string[] = [];
    for (const end = Math.min(row + 10_000, UPLOAD_ROWS); row < end; row++) {
      const r = reading("UPLOAD", row, 30_000, 1);
      lines.push(`UPLOAD,${new Date(r.time).toISOString()},${r.value.toFixed(3)},${r.temperature.toFixed(2)}\n`);
    }
    if (!request.write(lines.join(""))) await once(request, "drain");
  }
  request.end();
  const [response] = await answered;
  let text = "";
  for await (const chunk of response) text += chunk;
  const seconds = (performance.now() - started) / 1000;
  clearInterval(sampler);
  const lines = text.trim().split("\n");
  const done = JSON.parse(lines[lines.length - 1]!);
  if (done.type !== "done") throw new Error(`upload ended with ${lines[lines.length - 1]}`);
  return { seconds, accepted: done.accepted as number, peakRss, hwm: memoryOf(server.pid!).hwm };
}

export const verdict = (pass: boolean) => (pass ? "PASS" : "MISS");

/** `npm run bench -- --no-build` reuses the production build in .next instead of building first. */
export function buildUnlessAsked(): void {
  if (process.argv.includes("--no-build")) return;
  const build = spawnSync("npx", ["next", "build"], { encoding: "utf8" });
  if (build.status !== 0) throw new Error(`next build failed:\n${build.stdout}\n${build.stderr}`);
}

export const BENCH_USER = { email: "bench@hookeline.example", password: "bench-password" };

export type BenchServer = { baseUrl: string; url: string; folder: string; token: string; reader: string; server: ChildProcess; stop(): void };

/** `next start` on a fresh temporary database holding the bench structure, its gauges and tokens, and whatever `extra` adds. */
export async function startBenchServer(extra?: (admin: UserActor) => Promise<void>): Promise<BenchServer> {
  const folder = fs.mkdtempSync(path.join(os.tmpdir(), "hookeline-bench-"));
  const url = `file:${path.join(folder, "bench.db")}`;
  const { logger: token, reader } = await prepareDatabase(url, extra);
  const port = await freePort();
  const baseUrl = `http://127.0.0.1:${port}`;
  const server = startServer(url, port);
  const stop = () => {
    server.kill("SIGTERM");
    fs.rmSync(folder, { recursive: true, force: true });
  };
  try {
    await waitForServer(baseUrl, server, () => "(server output goes to this terminal)");
  } catch (error) {
    stop();
    throw error;
  }
  return { baseUrl, url, folder, token, reader, server, stop };
}

export async function benchIngestion(): Promise<BenchResult[]> {
  const { baseUrl, url, folder, token, reader, server, stop } = await startBenchServer();
  try {
    // The server's code is compiled as it runs: warm it up with the same kind of requests, on gauges of their own, before timing.
    const warmUp = batchesOf(WARM_UP_TAGS, WARM_UP_BATCHES * BATCH).map((batch) => () => jsonBody(batch));
    await postAll(baseUrl, token, warmUp, CLIENTS);
    // Rounds of the same work through HTTP and raw in turn, each the next stretch of time: the
    // ratio of the medians holds still where a single pass of either moves with the machine's load.
    const raw = await openRawStore(folder);
    const native = openNativeRawStore(folder);
    const httpRates: number[] = [];
    const rawRates: number[] = [];
    const nativeRates: number[] = [];
    for (let round = 0; round < INGEST_ROUNDS; round++) {
      const start = (round * INGEST_READINGS) / CLIENTS / GAUGES_PER_LOGGER;
      const loggerBatches = LOGGER_TAGS.map((tags) => batchesOf(tags, INGEST_READINGS / CLIENTS, start));
      httpRates.push(await ingestionRate(baseUrl, token, loggerBatches.map((batches) => batches.map(jsonBody)), 1));
      // The raw inserts take the loggers' batches in turn, one transaction each.
      rawRates.push(await raw.insert(loggerBatches.flat()));
      nativeRates.push(await native.insert(loggerBatches.flat()));
    }
    raw.close();
    native.close();
    const httpRate = median(httpRates);
    staticReadingsPerSecond = httpRate;
    const rawRate = median(rawRates);
    const nativeRate = median(nativeRates);
    const ratio = httpRate / rawRate;
    const nativeRatio = httpRate / nativeRate;
    // Every client posting the next window of the same gauges: batches commit out of order, so
    // evaluation replays from checkpoints. Shown for what it costs; loggers do not send this way.
    const sharedRate = await ingestionRate(baseUrl, token, [batchesOf(SHARED_TAGS, INGEST_READINGS).map(jsonBody)], CLIENTS);
    const series = await seriesFigures(baseUrl, token, reader, url);
    const upload = await uploadFigures(baseUrl, token, server);
    const peakMb = Math.max(upload.peakRss, upload.hwm) / 1024;
    const seriesRatio = series.naive / series.median;
    return [
      { label: `ingest: HTTP, ${CLIENTS} loggers at once, ${GAUGES_PER_LOGGER} gauges each, batches of ${BATCH}, ${INGEST_READINGS.toLocaleString("en-US")} readings, median of ${INGEST_ROUNDS}`, value: Math.round(httpRate), unit: `readings/s (${spread(httpRates)})` },
      { label: `ingest: raw @libsql/client multi-row INSERT, same rows, median of ${INGEST_ROUNDS}`, value: Math.round(rawRate), unit: `readings/s (${spread(rawRates)})` },
      { label: "ingest: HTTP / raw (target ≥ 0.6)", value: Number(ratio.toFixed(2)), unit: verdict(ratio >= 0.6) },
      { label: `ingest: raw native libsql, prepared 500-row INSERT reused, one transaction per ${BATCH} rows, median of ${INGEST_ROUNDS}`, value: Math.round(nativeRate), unit: `readings/s (${spread(nativeRates)})` },
      { label: "ingest: HTTP / native raw (goal ≥ 0.4)", value: Number(nativeRatio.toFixed(2)), unit: verdict(nativeRatio >= 0.4) },
      { label: `ingest: HTTP, ${CLIENTS} clients sharing ${GAUGES_PER_LOGGER} gauges (out-of-order batches, replays)`, value: Math.round(sharedRate), unit: `readings/s (${(sharedRate / rawRate).toFixed(2)} of raw)` },
      { label: `series: year of 1-min readings, 1000 points, median warm (target < 50 ms; ${series.buckets} buckets from ${series.source})`, value: Number(series.median.toFixed(1)), unit: `ms ${verdict(series.median < 50)}` },
      { label: "series: naive read of every row, median", value: Number(series.naive.toFixed(1)), unit: "ms" },
      { label: `series: naive / series (target ≥ 20; planted peak shown: ${series.peakShows ? "yes" : "NO"})`, value: Number(seriesRatio.toFixed(1)), unit: verdict(seriesRatio >= 20 && series.peakShows) },
      { label: `upload: ${UPLOAD_ROWS.toLocaleString("en-US")}-row CSV streamed, ${upload.accepted.toLocaleString("en-US")} stored`, value: Math.round(upload.accepted / upload.seconds), unit: "rows/s" },
      { label: "upload: server peak RSS while uploading (sampled every 100 ms)", value: Math.round(upload.peakRss / 1024), unit: "MB" },
      { label: "upload: server RSS high-water mark over the whole run (target < 512 MB)", value: Math.round(peakMb), unit: `MB ${verdict(peakMb < 512)}` },
    ];
  } finally {
    stop();
  }
}
