import { benchBurstSummary } from "./burst-summary";
import { benchBursts } from "./bursts";
import { benchGaugePage } from "./gauge-page";
import { benchHomePage } from "./home-page";
import { benchIngestion, buildUnlessAsked } from "./ingest";
import { benchMechanics, type BenchResult } from "./mechanics";

// `npm run bench -- --only=benchGaugePage` runs the benchmarks whose function name contains the word
// (or one of several words separated by commas: --only=Ingestion,Bursts).
const only = process.argv.find((arg) => arg.startsWith("--only="))?.slice("--only=".length).split(",");
const benchmarks: (() => Promise<BenchResult[]>)[] = [benchMechanics, benchBurstSummary, benchIngestion, benchBursts, benchGaugePage, benchHomePage].filter(
  (bench) => !only || only.some((word) => bench.name.includes(word)),
);

function printTable(rows: BenchResult[]): void {
  const labelWidth = Math.max(...rows.map((row) => row.label.length));
  const values = rows.map((row) => row.value.toLocaleString("en-US"));
  const valueWidth = Math.max(...values.map((value) => value.length));
  rows.forEach((row, i) => console.log(`${row.label.padEnd(labelWidth)}  ${values[i]!.padStart(valueWidth)} ${row.unit}`));
}

// The in-process benchmarks need no production build; the others start `next start` on it.
const IN_PROCESS: readonly (() => Promise<BenchResult[]>)[] = [benchMechanics, benchBurstSummary];
if (benchmarks.some((bench) => !IN_PROCESS.includes(bench))) buildUnlessAsked();
const rows: BenchResult[] = [];
for (const bench of benchmarks) rows.push(...(await bench()));
printTable(rows);
