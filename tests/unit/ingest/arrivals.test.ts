import { describe, expect, it } from "vitest";
import { arrivalTally } from "@/lib/ingest/arrivals";

describe("readings that arrived per gauge", () => {
  it("adds up each gauge's readings over the batches and keeps its earliest and latest time", () => {
    const tally = arrivalTally();
    tally.add("LC-M1", [300, 100, 200]);
    tally.add("DG-3", [150]);
    tally.add("LC-M1", [50, 400]);
    tally.add("TC-M1", []);
    expect(tally.arrivals()).toEqual([
      { gauge: "DG-3", readings: 1, first: 150, last: 150 },
      { gauge: "LC-M1", readings: 5, first: 50, last: 400 },
    ]);
  });
});
