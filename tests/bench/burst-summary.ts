import { summarizeBlock, type SummaryConfig } from "@/lib/dynamic";
import type { RainflowResidue } from "@/lib/fatigue";
import { burstBody, BURST_SAMPLING, SAMPLES_PER_BURST, VARIANTS } from "./bursts";
import type { BenchResult } from "./mechanics";
import { verdict } from "./ingest";

/**
 * The summary step of burst ingestion alone, in this process: the bursts bench's footbridge
 * signal (0.2 MPa per µε) through summarizeBlock — interval min, max, mean and M2, streamed
 * rainflow and the range × mean histogram — burst after burst carrying the residue, as one
 * gauge's bursts arrive. Prints figures; asserts nothing.
 */

const ROUNDS = 7;
const BURSTS_PER_ROUND = 40;
const WARM_UP_BURSTS = 20;
const MPA_PER_MICROSTRAIN = 0.2;
const config: SummaryConfig = { rateHz: BURST_SAMPLING.rateHz, summaryMinutes: BURST_SAMPLING.summaryMinutes, rangeBin: BURST_SAMPLING.rangeBin };
const START = Date.UTC(2025, 6, 1);

function stressOf(variant: number): Float64Array {
  const microstrain = new Float32Array(burstBody(variant).buffer);
  return Float64Array.from(microstrain, (value) => value * MPA_PER_MICROSTRAIN);
}

function summarizeBursts(bodies: Float64Array[], count: number): number {
  let residue: RainflowResidue | undefined;
  let cycles = 0;
  for (let k = 0; k < count; k++) {
    const block = summarizeBlock(bodies[k % bodies.length]!, START + k * (SAMPLES_PER_BURST / config.rateHz) * 1000, config, residue);
    residue = block.residue;
    for (const interval of block.intervals) cycles += interval.cycles;
  }
  return cycles;
}

const median = (values: number[]) => [...values].sort((a, b) => a - b)[Math.floor(values.length / 2)]!;

export async function benchBurstSummary(): Promise<BenchResult[]> {
  const bodies = Array.from({ length: VARIANTS }, (_, v) => stressOf(v));
  summarizeBursts(bodies, WARM_UP_BURSTS);
  const samples = BURSTS_PER_ROUND * SAMPLES_PER_BURST;
  const wallRates: number[] = [];
  const cpuRates: number[] = [];
  let cycles = 0;
  // Rounds, because other work on the machine slows a single pass by whole factors; the rate per
  // second of this process's own CPU time moves less with it than the rate per wall-clock second.
  for (let round = 0; round < ROUNDS; round++) {
    const cpu = process.cpuUsage();
    const started = performance.now();
    cycles = summarizeBursts(bodies, BURSTS_PER_ROUND);
    wallRates.push(samples / ((performance.now() - started) / 1000));
    const used = process.cpuUsage(cpu);
    cpuRates.push(samples / ((used.user + used.system) / 1e6));
  }
  if (!(cycles > 0)) throw new Error("the bench signal closed no rainflow cycle");
  const rate = median(wallRates);
  const label = `burst summary step: ${BURSTS_PER_ROUND} bursts of ${SAMPLES_PER_BURST.toLocaleString("en-US")} samples, one gauge, in process`;
  return [
    { label: `${label}: median of ${ROUNDS} rounds (target ≥ 5 M/s)`, value: Math.round(rate), unit: `samples/s ${verdict(rate >= 5_000_000)}` },
    { label: "burst summary step: best round", value: Math.round(Math.max(...wallRates)), unit: "samples/s" },
    { label: "burst summary step: median per second of the process's CPU time", value: Math.round(median(cpuRates)), unit: "samples/s" },
    { label: "burst summary step: rainflow cycles closed per sample", value: Number((cycles / samples).toFixed(3)), unit: "cycles" },
  ];
}
