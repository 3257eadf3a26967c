import type { Browser, Page, Response } from "playwright-core";
import { dragAcrossChart, launchBrowser, SignInPage } from "../e2e/browser";
import { BENCH_USER, loadYear, startBenchServer, verdict } from "./ingest";
import type { BenchResult } from "./mechanics";

/**
 * The gauge page in Chromium against the production build, for a gauge holding a year of
 * 1-minute readings: time until the first chart is drawn, time from a drag-zoom until the finer
 * data are drawn, and the JavaScript the page loads. Prints figures; asserts nothing.
 */

const RUNS = 5;
const PAGE = "/structures/BENCH/gauges/YEAR";
const STRESS_CHART = "Stress chart";

type Draw = { chart: string | null; at: number };
declare global {
  interface Window {
    chartDraws: Draw[];
  }
}

/**
 * Runs in the page before its own scripts. The gauge charts' draw hook rewrites
 * `data-limit-lines` on every draw; each time, the next animation frame (the one that paints the
 * canvas) is recorded with the chart it belongs to, on the page's clock (0 = navigation start).
 */
function recordDraws() {
  window.chartDraws = [];
  new MutationObserver((records) => {
    for (const record of records) {
      const chart = (record.target as Element).closest("section")?.getAttribute("aria-label") ?? null;
      requestAnimationFrame(() => window.chartDraws.push({ chart, at: performance.now() }));
    }
  }).observe(document, { subtree: true, attributes: true, attributeFilter: ["data-limit-lines"] });
}

const median = (values: number[]) => [...values].sort((a, b) => a - b)[Math.floor(values.length / 2)]!;

/** Opens the page in a context of its own (empty HTTP cache, as a first visit): ms until the stress chart is painted, and the scripts it loaded. */
async function firstChart(browser: Browser, baseUrl: string, session: Awaited<ReturnType<typeof signedIn>>) {
  const context = await browser.newContext({ baseURL: baseUrl, viewport: { width: 1280, height: 860 }, storageState: session });
  const page = await context.newPage();
  await page.addInitScript(recordDraws);
  const scripts: Response[] = [];
  page.on("response", (response) => {
    if (response.request().resourceType() === "script") scripts.push(response);
  });
  await page.goto(PAGE, { waitUntil: "commit" });
  await page.waitForFunction((chart) => window.chartDraws.some((draw) => draw.chart === chart), STRESS_CHART, { timeout: 30_000 });
  const ms = await page.evaluate((chart) => window.chartDraws.find((draw) => draw.chart === chart)!.at, STRESS_CHART);
  return { page, ms, scripts: [...scripts] };
}

/** Drags across the middle fifth of the stress chart: ms from releasing the mouse until the finer data are painted. */
async function zoomRedraw(page: Page): Promise<number> {
  // Let the first load settle: all three charts drawn, no series request still in flight.
  await page.waitForFunction(() => new Set(window.chartDraws.map((draw) => draw.chart)).size >= 3, null, { timeout: 30_000 });
  await page.waitForLoadState("networkidle");
  const before = await page.evaluate(() => {
    const series = performance.getEntriesByType("resource").filter((entry) => entry.name.includes("quantity=stress"));
    addEventListener("mouseup", (event) => ((window as unknown as { releasedAt: number }).releasedAt = event.timeStamp), { capture: true, once: true });
    return series.length;
  });
  await dragAcrossChart(page, page.getByRole("region", { name: STRESS_CHART }));
  // The finer data are drawn at the first stress-chart draw after the zoomed series arrived (uPlot
  // redraws the old data at the new scale at once; that draw comes before the answer and is not counted).
  const handle = await page.waitForFunction(
    ([chart, before]) => {
      const series = performance.getEntriesByType("resource").filter((entry) => entry.name.includes("quantity=stress")) as PerformanceResourceTiming[];
      const arrived = series[before]?.responseEnd;
      if (!arrived) return null;
      const drawn = window.chartDraws.find((draw) => draw.chart === chart && draw.at > arrived);
      return drawn ? drawn.at - (window as unknown as { releasedAt: number }).releasedAt : null;
    },
    [STRESS_CHART, before] as const,
    { timeout: 30_000, polling: 50 },
  );
  return (await handle.jsonValue())!;
}

/** Signs in through the sign-in page; answers the session (cookies) to reuse in new contexts or requests. */
export async function signedIn(browser: Browser, baseUrl: string, user: { email: string; password: string } = BENCH_USER) {
  const context = await browser.newContext({ baseURL: baseUrl });
  const page = await context.newPage();
  const signIn = new SignInPage(page);
  await signIn.open();
  await signIn.signIn(user.email, user.password);
  await page.waitForURL((url) => url.pathname === "/");
  const state = await context.storageState();
  await context.close();
  return state;
}

/** Bytes of the scripts as transferred (compressed when the server compresses) and as decoded. */
async function scriptBytes(scripts: Response[]) {
  let transferred = 0;
  let raw = 0;
  const encodings = new Set<string>();
  for (const script of scripts) {
    transferred += (await script.request().sizes()).responseBodySize;
    raw += (await script.body()).length;
    encodings.add((await script.headerValue("content-encoding")) ?? "identity");
  }
  return { transferred, raw, encodings: [...encodings].join("+"), count: scripts.length };
}

export async function benchGaugePage(): Promise<BenchResult[]> {
  const bench = await startBenchServer();
  const browser = await launchBrowser();
  try {
    await loadYear(bench.baseUrl, bench.token);
    const session = await signedIn(browser, bench.baseUrl);
    // One visit first, so the server's first-request costs are not counted.
    await (await firstChart(browser, bench.baseUrl, session)).page.context().close();
    const first: number[] = [];
    const zoom: number[] = [];
    let js: Awaited<ReturnType<typeof scriptBytes>> | null = null;
    for (let run = 0; run < RUNS; run++) {
      const visit = await firstChart(browser, bench.baseUrl, session);
      first.push(visit.ms);
      js ??= await scriptBytes(visit.scripts);
      zoom.push(await zoomRedraw(visit.page));
      await visit.page.context().close();
    }
    const firstMs = median(first);
    const zoomMs = median(zoom);
    const kB = (bytes: number) => Number((bytes / 1000).toFixed(1));
    return [
      { label: `gauge page, year of 1-min data: navigation start → stress chart painted, median of ${RUNS} cold-cache visits (target < 1500 ms)`, value: Math.round(firstMs), unit: `ms ${verdict(firstMs < 1500)}` },
      { label: `gauge page: drag-zoom released → finer data painted, median of ${RUNS} (target < 300 ms)`, value: Math.round(zoomMs), unit: `ms ${verdict(zoomMs < 300)}` },
      { label: `gauge page: JavaScript loaded until the first chart, ${js!.count} scripts as transferred (${js!.encodings}; target < 300 kB)`, value: kB(js!.transferred), unit: `kB ${verdict(js!.transferred < 300_000)}` },
      { label: "gauge page: the same scripts decoded (raw)", value: kB(js!.raw), unit: "kB" },
    ];
  } finally {
    await browser.close();
    bench.stop();
  }
}
