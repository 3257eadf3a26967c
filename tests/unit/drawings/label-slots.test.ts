import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { labelSlots } from "@/lib/drawings/label-slots";

describe("tags of markers on a drawing", () => {
  it("stacks the tags of a rosette's three gauges and leaves a lone gauge's beside it", () => {
    const slots = labelSlots([
      { tag: "GP-R1a", x: 0.2, y: 0.8 },
      { tag: "GP-R1b", x: 0.21, y: 0.8 },
      { tag: "GP-R1c", x: 0.22, y: 0.81 },
      { tag: "TC-M1", x: 0.6, y: 0.2 },
    ]);
    expect(Object.fromEntries(slots)).toEqual({ "GP-R1a": 0, "GP-R1b": 1, "GP-R1c": 2, "TC-M1": 0 });
  });

  it("never gives two close markers the same line", () => {
    const point = fc.record({ x: fc.double({ min: 0, max: 1, noNaN: true }), y: fc.double({ min: 0, max: 1, noNaN: true }) });
    fc.assert(
      fc.property(fc.array(point, { maxLength: 30 }), (raw) => {
        const points = raw.map((p, i) => ({ ...p, tag: `G${i}` }));
        const slots = labelSlots(points);
        for (const a of points) {
          for (const b of points) {
            if (a.tag !== b.tag && Math.abs(a.x - b.x) < 0.12 && Math.abs(a.y - b.y) < 0.05) expect(slots.get(a.tag)).not.toBe(slots.get(b.tag));
          }
        }
      }),
    );
  });
});
