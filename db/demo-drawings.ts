import "server-only";
import { deflateSync } from "node:zlib";

/**
 * The demo's drawings, drawn here as plain line art so the repository ships no image files:
 * an elevation of the invented footbridge's truss and a plan of the parking deck's level 2.
 * Gauge positions are fractions of the drawing's width and height.
 */

type Canvas = { width: number; height: number; pixels: Uint8Array };

function canvas(width: number, height: number): Canvas {
  return { width, height, pixels: new Uint8Array(width * height).fill(255) };
}

function dot(c: Canvas, x: number, y: number, radius: number, shade: number) {
  for (let dy = -radius; dy <= radius; dy++) {
    for (let dx = -radius; dx <= radius; dx++) {
      const px = Math.round(x + dx);
      const py = Math.round(y + dy);
      if (px >= 0 && py >= 0 && px < c.width && py < c.height && dx * dx + dy * dy <= radius * radius) c.pixels[py * c.width + px] = shade;
    }
  }
}

function line(c: Canvas, x0: number, y0: number, x1: number, y1: number, thickness = 2, shade = 40) {
  const steps = Math.ceil(Math.hypot(x1 - x0, y1 - y0));
  for (let i = 0; i <= steps; i++) dot(c, x0 + ((x1 - x0) * i) / steps, y0 + ((y1 - y0) * i) / steps, thickness, shade);
}

const CRC_TABLE = Array.from({ length: 256 }, (_, n) => {
  let c = n;
  for (let k = 0; k < 8; k++) c = c & 1 ? 0xedb88320 ^ (c >>> 1) : c >>> 1;
  return c >>> 0;
});

function crc32(bytes: Uint8Array): number {
  let crc = 0xffffffff;
  for (const byte of bytes) crc = CRC_TABLE[(crc ^ byte) & 0xff]! ^ (crc >>> 8);
  return (crc ^ 0xffffffff) >>> 0;
}

function chunk(type: string, data: Uint8Array): Buffer {
  const head = Buffer.alloc(8);
  head.writeUInt32BE(data.length, 0);
  head.write(type, 4, "ascii");
  const crc = Buffer.alloc(4);
  crc.writeUInt32BE(crc32(Buffer.concat([head.subarray(4), data])), 0);
  return Buffer.concat([head, data, crc]);
}

/** An 8-bit greyscale PNG (PNG specification, ISO/IEC 15948: IHDR, IDAT, IEND). */
function encodePng(c: Canvas): Uint8Array {
  const header = Buffer.alloc(13);
  header.writeUInt32BE(c.width, 0);
  header.writeUInt32BE(c.height, 4);
  header.set([8, 0, 0, 0, 0], 8);
  const rows = Buffer.alloc((c.width + 1) * c.height);
  for (let y = 0; y < c.height; y++) rows.set(c.pixels.subarray(y * c.width, (y + 1) * c.width), y * (c.width + 1) + 1);
  const signature = Buffer.from([137, 80, 78, 71, 13, 10, 26, 10]);
  return new Uint8Array(Buffer.concat([signature, chunk("IHDR", header), chunk("IDAT", deflateSync(rows)), chunk("IEND", new Uint8Array())]));
}

const TRUSS = { width: 1200, height: 420, left: 80, right: 1120, top: 120, bottom: 300, panels: 8 };

function footbridgeElevation(): Uint8Array {
  const c = canvas(TRUSS.width, TRUSS.height);
  const { left, right, top, bottom, panels } = TRUSS;
  const panel = (right - left) / panels;
  line(c, left, bottom, right, bottom, 3);
  line(c, left + panel / 2, top, right - panel / 2, top, 3);
  for (let i = 0; i < panels; i++) {
    const x = left + i * panel;
    line(c, x, bottom, x + panel / 2, top);
    line(c, x + panel / 2, top, x + panel, bottom);
  }
  for (const x of [left, right]) line(c, x - 30, bottom + 40, x + 30, bottom + 40, 3, 90);
  line(c, 20, bottom + 80, TRUSS.width - 20, bottom + 80, 1, 150);
  return encodePng(c);
}

function parkingDeckPlan(): Uint8Array {
  const c = canvas(1000, 700);
  for (let i = 0; i <= 5; i++) line(c, 100 + i * 160, 80, 100 + i * 160, 620, 1, 170);
  for (let j = 0; j <= 3; j++) line(c, 100, 80 + j * 180, 900, 80 + j * 180, 1, 170);
  for (let i = 0; i <= 5; i++) for (let j = 0; j <= 3; j++) dot(c, 100 + i * 160, 80 + j * 180, 9, 40);
  line(c, 100, 80, 900, 80, 3);
  line(c, 100, 620, 900, 620, 3);
  line(c, 100, 80, 100, 620, 3);
  line(c, 900, 80, 900, 620, 3);
  line(c, 420, 440, 580, 440, 6, 60);
  return encodePng(c);
}

export const DEMO_DRAWINGS = [
  {
    structure: "MILL-FB",
    title: "North truss elevation",
    png: footbridgeElevation,
    placements: {
      "LC-M1": [0.5, 0.715],
      "LC-Q1": [0.283, 0.715],
      "DG-3": [0.391, 0.5],
      "TC-M1": [0.5, 0.285],
      "GP-R1a": [0.175, 0.73],
      "GP-R1b": [0.19, 0.69],
      "GP-R1c": [0.205, 0.73],
    } as Record<string, [number, number]>,
  },
  {
    structure: "ORCH-PD",
    title: "Level 2 plan",
    png: parkingDeckPlan,
    placements: {
      "L2-S1": [0.5, 0.52],
      "L2-S2": [0.54, 0.56],
      "L2-B7": [0.5, 0.629],
      "L3-C2": [0.58, 0.371],
    } as Record<string, [number, number]>,
  },
];
