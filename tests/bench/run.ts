import { benchGaugePage } from "./gauge-page";
import { benchHomePage } from "./home-page";
import { benchIngestion, buildUnlessAsked } from "./ingest";
import { benchMechanics, type BenchResult } from "./mechanics";

// `npm run bench -- --only=benchGaugePage` runs the benchmarks whose function name contains the word.
const only = process.argv.find((arg) => arg.startsWith("--only="))?.slice("--only=".length);
const benchmarks: (() => Promise<BenchResult[]>)[] = [benchMechanics, benchIngestion, benchGaugePage, benchHomePage].filter((bench) => !only || bench.name.includes(only));

function printTable(rows: BenchResult[]): void {
  const labelWidth = Math.max(...rows.map((row) => row.label.length));
  const values = rows.map((row) => row.value.toLocaleString("en-US"));
  const valueWidth = Math.max(...values.map((value) => value.length));
  rows.forEach((row, i) => console.log(`${row.label.padEnd(labelWidth)}  ${values[i]!.padStart(valueWidth)} ${row.unit}`));
}

buildUnlessAsked();
const rows: BenchResult[] = [];
for (const bench of benchmarks) rows.push(...(await bench()));
printTable(rows);
