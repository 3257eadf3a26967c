import { parseWith } from "@/lib/validation";
import type { UserActor } from "@/lib/auth/actor";
import { gaugeInput } from "@/lib/gauges/schema";
import { createGauge } from "@/lib/services/gauges";
import { addMember } from "@/lib/services/memberships";
import { createStructure } from "@/lib/services/structures";
import { createToken } from "@/lib/services/tokens";
import { createUser } from "@/lib/services/users";
import { launchBrowser } from "../e2e/browser";
import { signedIn } from "./gauge-page";
import { cpuMsOf, GAUGE, jsonBody, postAll, startBenchServer, verdict } from "./ingest";
import type { BenchResult } from "./mechanics";

/**
 * The home page (the structure cards with each one's state) for an engineer whose one structure
 * has 60 gauges with a day of 10-minute readings each: latency of whole responses (the streamed
 * cards included) with 10 requests in flight. Prints figures; asserts nothing.
 */

const CODE = "HOME60";
const GAUGES = 60;
const CONNECTIONS = 10;
const WARM_UP = 20;
const REQUESTS = 200;
const READING_STEP = 600_000;
const DAY = 86_400_000;
const HOME_USER = { email: "home-bench@hookeline.example", password: "home-bench-password" };

const tags = Array.from({ length: GAUGES }, (_, g) => `H${String(g).padStart(2, "0")}`);

async function prepareHomeStructure(admin: UserActor, issued: { logger?: string }) {
  await createStructure(null, { code: CODE, name: "Sixty-gauge viaduct", timezone: "UTC" });
  for (const tag of tags) await createGauge(admin, CODE, parseWith(gaugeInput, { ...GAUGE, tag }));
  await createUser(null, { ...HOME_USER, name: "Home bench engineer", role: "engineer" });
  await addMember(null, HOME_USER.email, CODE);
  issued.logger = (await createToken(null, { kind: "logger", structureCode: CODE }, "home bench logger")).token;
}

/** The last day of readings for every gauge, one request per two hours of readings. */
async function loadDay(baseUrl: string, token: string) {
  const end = Math.floor(Date.now() / READING_STEP) * READING_STEP;
  const times = Array.from({ length: DAY / READING_STEP }, (_, i) => end - DAY + (i + 1) * READING_STEP);
  const perRequest = 12;
  const bodies = Array.from({ length: times.length / perRequest }, (_, b) => () =>
    jsonBody(
      times.slice(b * perRequest, (b + 1) * perRequest).flatMap((time, i) =>
        tags.map((gauge, g) => ({ gauge, time, value: 150 * Math.sin((b * perRequest + i) / 20 + g), temperature: 15 })),
      ),
    ),
  );
  await postAll(baseUrl, token, bodies, 2, CODE);
}

/** Milliseconds of each of `count` GETs of the page, `connections` at a time, body read to the end. */
async function timeRequests(url: string, cookie: string, count: number, connections: number): Promise<number[]> {
  const times: number[] = [];
  let next = 0;
  const client = async () => {
    while (next++ < count) {
      const started = performance.now();
      const response = await fetch(url, { headers: { cookie }, redirect: "manual" });
      const html = await response.text();
      if (response.status !== 200 || !html.includes(CODE)) throw new Error(`home page answered ${response.status} without ${CODE}`);
      times.push(performance.now() - started);
    }
  };
  await Promise.all(Array.from({ length: connections }, client));
  return times;
}

const percentile = (values: number[], p: number) => [...values].sort((a, b) => a - b)[Math.min(values.length - 1, Math.floor((p / 100) * values.length))]!;

export async function benchHomePage(): Promise<BenchResult[]> {
  const issued: { logger?: string } = {};
  const bench = await startBenchServer((admin) => prepareHomeStructure(admin, issued));
  try {
    await loadDay(bench.baseUrl, issued.logger!);
    const browser = await launchBrowser();
    const session = await signedIn(browser, bench.baseUrl, HOME_USER).finally(() => browser.close());
    const cookie = session.cookies.map((c) => `${c.name}=${c.value}`).join("; ");
    await timeRequests(`${bench.baseUrl}/`, cookie, WARM_UP, CONNECTIONS);
    const cpuBefore = cpuMsOf(bench.server.pid!);
    const times = await timeRequests(`${bench.baseUrl}/`, cookie, REQUESTS, CONNECTIONS);
    const cpuPerResponse = (cpuMsOf(bench.server.pid!) - cpuBefore) / REQUESTS;
    const p50 = percentile(times, 50);
    const p95 = percentile(times, 95);
    return [
      { label: `home page, one structure of ${GAUGES} gauges, ${CONNECTIONS} connections: p50 of ${REQUESTS} whole responses (target < 150 ms)`, value: Math.round(p50), unit: `ms ${verdict(p50 < 150)}` },
      { label: "home page: p95 of the same", value: Math.round(p95), unit: "ms" },
      // Latencies grow with whatever else runs on the machine; the server's CPU per response does not.
      { label: "home page: server CPU per response (user + system)", value: Number(cpuPerResponse.toFixed(1)), unit: "ms" },
    ];
  } finally {
    bench.stop();
  }
}
