/**
 * Dynamic channels: bursts of samples at a fixed rate, reduced on arrival to interval summaries,
 * rainflow histograms and event waveforms. Pure functions over typed arrays, no I/O.
 *
 *   const block = summarizeBlock(stress, start, config, storedResidue);   // intervals + residue
 *   const { events, state } = captureEvents(stress, start, trigger, storedCaptureState);
 *   stored = mergeSummaries(stored, block.intervals[i]);                   // late bursts too
 */
export { countCycle, emptySummary, mergeSummaries, rmsOf, type IntervalSummary } from "./interval-summary";
export { SUMMARY_MINUTES, sampleTime, summarizeBlock, type BlockSummary, type SummaryConfig } from "./summarize-block";
export {
  addCycle,
  addRange,
  decodeHistogram,
  emptyHistogram,
  encodeHistogram,
  histogramCells,
  histogramCycles,
  largestBinnedRange,
  mergeHistograms,
  occupiedBins,
  rebinHistogram,
  type RangeHistogram,
} from "./range-histogram";
export {
  EVENT_EXTRA_SECONDS,
  MAX_EVENT_SAMPLES,
  captureEvents,
  closeOpenEvent,
  eventCapacity,
  type CaptureState,
  type CapturedEvent,
  type OpenEvent,
  type TriggerConfig,
  type TriggerSide,
} from "./event-capture";
export { NotWholeFloatsError, readFloat32LE, writeFloat32LE } from "./float32";
