import { benchIngestion } from "./ingest";
import { benchMechanics, type BenchResult } from "./mechanics";

// `npm run bench -- --no-build` reuses the production build in .next instead of building first.
const benchmarks: (() => Promise<BenchResult[]>)[] = [benchMechanics, benchIngestion];

function printTable(rows: BenchResult[]): void {
  const labelWidth = Math.max(...rows.map((row) => row.label.length));
  const values = rows.map((row) => row.value.toLocaleString("en-US"));
  const valueWidth = Math.max(...values.map((value) => value.length));
  rows.forEach((row, i) => console.log(`${row.label.padEnd(labelWidth)}  ${values[i]!.padStart(valueWidth)} ${row.unit}`));
}

const rows: BenchResult[] = [];
for (const bench of benchmarks) rows.push(...(await bench()));
printTable(rows);
