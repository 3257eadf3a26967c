import { sampleTime } from "./summarize-block";

export type TriggerSide = "above" | "below";

export interface TriggerConfig {
  rateHz: number;
  /** MPa; a sample above it starts or prolongs an event. */
  above: number | null;
  /** MPa; a sample below it starts or prolongs an event. */
  below: number | null;
  preSeconds: number;
  postSeconds: number;
}

/** A captured waveform: stress samples (MPa) at the gauge's rate from `start`. */
export interface CapturedEvent {
  /** Epoch ms of the first sample kept (up to preSeconds before the first beyond the trigger). */
  start: number;
  rateHz: number;
  stress: Float32Array;
  /** Which bound the first sample beyond crossed. */
  trigger: TriggerSide;
  /** The stress furthest beyond the trigger, MPa, and when. */
  peak: number;
  peakAt: number;
  /** True when the event reached the cap and its tail was cut. */
  truncated: boolean;
}

/** An event still waiting for its postSeconds, carried into the gauge's next block. */
export interface OpenEvent {
  start: number;
  trigger: TriggerSide;
  peak: number;
  peakAt: number;
  /** Samples kept so far. */
  stress: Float32Array;
  /** Samples after the last one beyond the trigger. */
  quietSamples: number;
}

/** What capture carries from one block to the next, so an event can start or end across a burst boundary. */
export interface CaptureState {
  /** Epoch ms the next contiguous sample would have; another start means a gap, which cuts an event. */
  nextTime: number;
  /** The last samples, oldest first, up to preSeconds of them. */
  recent: Float32Array;
  open: OpenEvent | null;
}

/** Longest waveform kept beyond its pre and post seconds, and the most samples any event keeps (1 MB of Float32). */
export const EVENT_EXTRA_SECONDS = 30;
export const MAX_EVENT_SAMPLES = 250_000;

export function eventCapacity(config: TriggerConfig): number {
  return Math.min(MAX_EVENT_SAMPLES, Math.ceil((config.preSeconds + config.postSeconds + EVENT_EXTRA_SECONDS) * config.rateHz));
}

// A block's samples are stepped in the gauge's fixed rate, so a start within a fifth of a sample
// of where the last block ended is the same signal going on.
const isContiguous = (state: CaptureState, start: number, rateHz: number) => Math.abs(start - state.nextTime) <= 200 / rateHz;

/** An open event as far as it got, for when its post window can no longer be completed (a gap, or a late burst). */
export function closeOpenEvent(open: OpenEvent, rateHz: number): CapturedEvent {
  return { start: open.start, rateHz, stress: open.stress, trigger: open.trigger, peak: open.peak, peakAt: open.peakAt, truncated: false };
}

/**
 * Captures the waveforms around trigger crossings in one block of stress samples (MPa), going on
 * from `resume` when the block continues the previous one without a gap. An event keeps
 * preSeconds before its first sample beyond the trigger and ends postSeconds after its last one;
 * a crossing within the post window prolongs the same event. Returns the events closed in the
 * block and the state to resume from; an event still open at the end is in the state.
 */
export function captureEvents(
  stress: ArrayLike<number>,
  start: number,
  config: TriggerConfig,
  resume?: CaptureState | null,
): { events: CapturedEvent[]; state: CaptureState } {
  const { rateHz } = config;
  const above = config.above ?? Infinity;
  const below = config.below ?? -Infinity;
  const preSamples = Math.round(config.preSeconds * rateHz);
  const postSamples = Math.round(config.postSeconds * rateHz);
  const capacity = eventCapacity(config);
  const events: CapturedEvent[] = [];
  const continuing = resume != null && isContiguous(resume, start, rateHz);

  // The recent samples live in a ring of preSamples; `ringCount` of them are valid.
  const ring = new Float32Array(Math.max(preSamples, 1));
  let ringNext = 0;
  let ringCount = 0;
  const remember = (value: number) => {
    if (preSamples === 0) return;
    ring[ringNext] = value;
    ringNext = (ringNext + 1) % preSamples;
    if (ringCount < preSamples) ringCount++;
  };
  let open: OpenEvent | null = null;
  let openBuffer: Float32Array = new Float32Array(0);
  let openLength = 0;

  const close = (truncated: boolean) => {
    events.push({ start: open!.start, rateHz, stress: openBuffer.slice(0, openLength), trigger: open!.trigger, peak: open!.peak, peakAt: open!.peakAt, truncated });
    open = null;
    openLength = 0;
  };

  if (resume && continuing) {
    resume.recent.forEach(remember);
    if (resume.open) {
      open = { ...resume.open };
      openBuffer = new Float32Array(capacity);
      openBuffer.set(resume.open.stress.subarray(0, capacity));
      openLength = Math.min(resume.open.stress.length, capacity);
    }
  } else if (resume?.open) {
    events.push(closeOpenEvent(resume.open, rateHz));
  }

  /** Remembers samples [from, to) as `remember` would one by one, copying only the last preSamples of a long run. */
  const rememberRun = (from: number, to: number) => {
    if (to - from < preSamples) {
      for (let k = from; k < to; k++) remember(stress[k]!);
      return;
    }
    for (let k = 0; k < preSamples; k++) ring[k] = stress[to - preSamples + k]!;
    ringNext = 0;
    ringCount = preSamples;
  };

  for (let i = 0; i < stress.length; i++) {
    if (open === null) {
      // Between events most samples stay inside the bounds: scanning for the next one beyond and
      // keeping only the last preSamples of the run took the capture step from 7 to 3 ms of CPU
      // per million samples on the bursts bench's signal (it had written every sample into the ring).
      let next = i;
      while (next < stress.length && !(stress[next]! > above) && !(stress[next]! < below)) next++;
      rememberRun(i, next);
      if (next === stress.length) break;
      i = next;
    }
    const value = stress[i]!;
    const beyond = value > above ? "above" : value < below ? "below" : null;
    if (open === null) {
      openBuffer = new Float32Array(capacity);
      openLength = 0;
      for (let k = 0; k < ringCount; k++) openBuffer[openLength++] = ring[(ringNext - ringCount + k + preSamples) % preSamples]!;
      ringCount = 0;
      const time = sampleTime(start, rateHz, i);
      // The scan above stopped on a sample beyond one bound.
      open = { start: time - (openLength * 1000) / rateHz, trigger: value > above ? "above" : "below", peak: value, peakAt: time, stress: openBuffer, quietSamples: 0 };
    }
    const event: OpenEvent = open;
    openBuffer[openLength++] = value;
    if (beyond !== null) {
      event.quietSamples = 0;
      if (event.trigger === "above" ? value > event.peak : value < event.peak) {
        event.peak = value;
        event.peakAt = sampleTime(start, rateHz, i);
      }
    } else {
      event.quietSamples++;
    }
    if (event.quietSamples >= postSamples && beyond === null) close(false);
    else if (openLength >= capacity) close(true);
  }

  const recent = new Float32Array(ringCount);
  for (let k = 0; k < ringCount; k++) recent[k] = ring[(ringNext - ringCount + k + preSamples) % preSamples]!;
  const stillOpen: OpenEvent | null = open;
  return {
    events,
    state: {
      nextTime: sampleTime(start, rateHz, stress.length),
      recent,
      open: stillOpen === null ? null : { ...(stillOpen as OpenEvent), stress: openBuffer.slice(0, openLength) },
    },
  };
}
