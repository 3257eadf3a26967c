/** How many readings of one gauge an import stored, and the times they span (epoch ms). */
export type GaugeArrival = { gauge: string; readings: number; first: number; last: number };

/** Per-gauge arrivals over the batches of an import, fed with each batch's stored readings. */
export function arrivalTally() {
  const byGauge = new Map<string, GaugeArrival>();
  return {
    add(gauge: string, times: readonly number[]) {
      if (times.length === 0) return;
      let first = Infinity;
      let last = -Infinity;
      for (const time of times) {
        if (time < first) first = time;
        if (time > last) last = time;
      }
      const known = byGauge.get(gauge);
      byGauge.set(
        gauge,
        known
          ? { gauge, readings: known.readings + times.length, first: Math.min(known.first, first), last: Math.max(known.last, last) }
          : { gauge, readings: times.length, first, last },
      );
    },
    /** By tag, so the report reads in the order a person looks a gauge up. */
    arrivals(): GaugeArrival[] {
      return [...byGauge.values()].sort((a, b) => a.gauge.localeCompare(b.gauge));
    },
  };
}
