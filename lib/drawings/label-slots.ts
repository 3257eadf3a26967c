/** A marker's point on a drawing, as fractions of its width and height. */
export type MarkerPoint = { tag: string; x: number; y: number };

/**
 * Markers nearer than this (fractions of the drawing) would put their tags over each other at the
 * widths drawings are shown at: about a tag's width across, a line's height down.
 */
const CLOSE_ACROSS = 0.12;
const CLOSE_DOWN = 0.05;

/**
 * The line each marker's tag goes on, 0 beside the marker and 1, 2, … below it, so tags of gauges
 * that sit close together (a rosette) stack instead of overlapping. Markers are taken top to
 * bottom, left to right; each takes the first line no close neighbour already took.
 */
export function labelSlots(points: readonly MarkerPoint[]): Map<string, number> {
  const order = [...points].sort((a, b) => a.y - b.y || a.x - b.x || a.tag.localeCompare(b.tag));
  const slots = new Map<string, number>();
  const placed: (MarkerPoint & { slot: number })[] = [];
  for (const point of order) {
    const taken = new Set(placed.filter((other) => Math.abs(other.x - point.x) < CLOSE_ACROSS && Math.abs(other.y - point.y) < CLOSE_DOWN).map((other) => other.slot));
    let slot = 0;
    while (taken.has(slot)) slot++;
    slots.set(point.tag, slot);
    placed.push({ ...point, slot });
  }
  return slots;
}
