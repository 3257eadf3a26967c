import { describe, expect, it } from "vitest";
import { captureEvents, readFloat32LE, writeFloat32LE, NotWholeFloatsError, type CaptureState } from "@/lib/dynamic";

const T0 = Date.UTC(2026, 2, 1, 8);
const RATE = 100;
const trigger = { rateHz: RATE, above: 10, below: -10, preSeconds: 2, postSeconds: 5 };

/** 60 s of 1 MPa with a 0.3 s pulse of 25 MPa from 20 s. */
function pulseSignal(): Float64Array {
  const values = new Float64Array(60 * RATE).fill(1);
  for (let i = 20 * RATE; i < 20.3 * RATE; i++) values[i] = 25;
  values[20 * RATE + 10] = 31;
  return values;
}

describe("event capture", () => {
  it("keeps preSeconds before the first sample beyond the trigger and postSeconds after the last", () => {
    const { events, state } = captureEvents(pulseSignal(), T0, trigger);
    expect(events).toHaveLength(1);
    const [event] = events;
    expect(event!.start).toBe(T0 + 18_000);
    expect(event!.trigger).toBe("above");
    // 2 s before + 0.3 s beyond + 5 s after, at 100 Hz.
    expect(event!.stress.length).toBe(200 + 30 + 500);
    expect(event!.peak).toBe(31);
    expect(event!.peakAt).toBe(T0 + 20_100);
    expect(event!.truncated).toBe(false);
    expect(state.open).toBeNull();
  });

  it("captures the same waveform when the burst boundary cuts through the event", () => {
    const signal = pulseSignal();
    const whole = captureEvents(signal, T0, trigger).events;
    for (const cut of [1850, 2010, 2200]) {
      const first = captureEvents(signal.subarray(0, cut), T0, trigger);
      const second = captureEvents(signal.subarray(cut), T0 + cut * 10, trigger, first.state);
      const events = [...first.events, ...second.events];
      expect(events).toHaveLength(1);
      expect(events[0]!.start).toBe(whole[0]!.start);
      expect([...events[0]!.stress]).toEqual([...whole[0]!.stress]);
    }
  });

  it("closes an open event at a gap instead of joining two separate signals", () => {
    const signal = pulseSignal();
    const first = captureEvents(signal.subarray(0, 2100), T0, trigger);
    expect(first.events).toHaveLength(0);
    const gapped = captureEvents(new Float64Array(100).fill(1), T0 + 3_600_000, trigger, first.state as CaptureState);
    expect(gapped.events).toHaveLength(1);
    expect(gapped.events[0]!.stress.length).toBe(200 + 100);
  });

  // A pre-trigger window (common practice in transient recorders) holds what the signal gave before
  // the crossing: less than preSeconds near the start, none when it is zero, a full one after an
  // earlier event closed.
  it("keeps only the samples there are before a crossing 0.5 s into the signal", () => {
    const signal = new Float64Array(10 * RATE).fill(1);
    signal.fill(25, 50, 60);
    const [event] = captureEvents(signal, T0, trigger).events;
    expect(event!.start).toBe(T0);
    expect(event!.stress.length).toBe(50 + 10 + 500);
    expect(event!.stress[49]).toBe(1);
    expect(event!.stress[50]).toBe(25);
  });

  it("keeps no samples before the crossing with preSeconds 0", () => {
    const [event] = captureEvents(pulseSignal(), T0, { ...trigger, preSeconds: 0 }).events;
    expect(event!.start).toBe(T0 + 20_000);
    expect(event!.stress.length).toBe(30 + 500);
  });

  it("gives a second event in the same block its own full pre-trigger window", () => {
    const signal = pulseSignal();
    signal.fill(-15, 40 * RATE, 40 * RATE + 20);
    signal[40 * RATE - 1] = 3;
    const { events } = captureEvents(signal, T0, trigger);
    expect(events).toHaveLength(2);
    expect(events[1]!.trigger).toBe("below");
    expect(events[1]!.start).toBe(T0 + 38_000);
    expect(events[1]!.stress.length).toBe(200 + 20 + 500);
    expect(events[1]!.stress[199]).toBe(3);
    expect(events[1]!.peak).toBe(-15);
  });

  it("caps an event that never ends", () => {
    const { events } = captureEvents(new Float64Array(RATE * 120).fill(50), T0, trigger);
    expect(events[0]!.truncated).toBe(true);
    expect(events[0]!.stress.length).toBe((2 + 5 + 30) * RATE);
  });
});

describe("32-bit little-endian floats", () => {
  it("round trip through bytes in the IEEE 754 binary32 layout", () => {
    // IEEE 754: 1.5 as binary32 is 0x3FC00000, little-endian bytes 00 00 C0 3F.
    const bytes = writeFloat32LE(new Float32Array([1.5, -2]));
    expect([...bytes]).toEqual([0, 0, 0xc0, 0x3f, 0, 0, 0, 0xc0]);
    expect([...readFloat32LE(bytes)]).toEqual([1.5, -2]);
    expect([...readFloat32LE(new Uint8Array([9, 0, 0, 0xc0, 0x3f]).subarray(1))]).toEqual([1.5]);
  });

  it("refuse a byte count that is not a multiple of 4", () => {
    expect(() => readFloat32LE(new Uint8Array(7))).toThrow(NotWholeFloatsError);
  });
});
