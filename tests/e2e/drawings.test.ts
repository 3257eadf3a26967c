import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Browser, Page } from "playwright-core";
import { PHONE, SignInPage, launchBrowser, newContext, saveScreenshot } from "./browser";
import { foilGaugeBody } from "../fixtures/gauges";
import { TEXT_FILE, pngImage } from "../fixtures/images";

let browser: Browser;
const folder = fs.mkdtempSync(path.join(os.tmpdir(), "hookeline-e2e-uploads-"));
beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
  fs.rmSync(folder, { recursive: true, force: true });
});

const TAG = "E2E-PLACE-1";

/** A pale elevation sketch: a frame and a truss-like zigzag, so the screenshot shows where the marker sits. */
function elevationSketch(width: number, height: number) {
  return pngImage(width, height, (x, y) => {
    const onFrame = x < 2 || y < 2 || x >= width - 2 || y >= height - 2;
    const zig = Math.abs(((x % 80) < 40 ? x % 80 : 80 - (x % 80)) * (height / 40 / 2) - (y - height / 4)) < 1.5 && y > height / 4 && y < height * 0.75;
    const chord = Math.abs(y - height / 4) < 1.5 || Math.abs(y - height * 0.75) < 1.5;
    return onFrame || zig || chord ? [60, 70, 80] : [248, 249, 247];
  });
}

function writeTemp(name: string, bytes: Uint8Array) {
  const file = path.join(folder, name);
  fs.writeFileSync(file, bytes);
  return file;
}

/** Page object of the Drawings section on a structure page. */
class StructureDrawings {
  constructor(private readonly page: Page) {}

  async open(code: string) {
    await this.page.goto(`/structures/${code}`);
    await this.page.getByRole("heading", { name: "Drawings" }).waitFor();
  }

  private form() {
    return this.page.getByRole("form", { name: "Upload a drawing" });
  }

  async upload(file: string, title: string) {
    await this.form().getByLabel("Drawing image").setInputFiles(file);
    await this.form().getByLabel("Title").fill(title);
    await this.form().getByRole("button", { name: "Upload drawing" }).click();
  }

  refusal() {
    return this.form().getByRole("alert");
  }

  async openDrawing(title: string) {
    await this.page.getByRole("link", { name: title }).click();
    await this.page.getByRole("heading", { name: title }).waitFor();
  }
}

/** Page object of a drawing page. */
class DrawingPage {
  constructor(private readonly page: Page) {}

  canvas() {
    return this.page.getByTestId("drawing-canvas");
  }

  async chooseGauge(tag: string) {
    await this.page.getByLabel("Gauge to place").selectOption(tag);
  }

  /** Taps the drawing at fractions of its width and height. */
  async tapAt(x: number, y: number) {
    const box = (await this.canvas().boundingBox())!;
    await this.canvas().click({ position: { x: box.width * x, y: box.height * y } });
  }

  marker(tag: string) {
    return this.page.getByRole("link", { name: `Gauge ${tag},` });
  }

  /** Where the marker's shape is centred, as fractions of the drawing. */
  async markerPosition(tag: string) {
    const canvas = (await this.canvas().boundingBox())!;
    const shape = (await this.marker(tag).locator("svg").boundingBox())!;
    return { x: (shape.x + shape.width / 2 - canvas.x) / canvas.width, y: (shape.y + shape.height / 2 - canvas.y) / canvas.height, canvas };
  }
}

describe("drawings on a phone", () => {
  it("a technician uploads a drawing, places a gauge by tapping it, and finds the marker there after reloading", async () => {
    const page = await (await newContext(browser, PHONE)).newPage();
    await new SignInPage(page).signInAs("technician");
    const created = await page.request.post("/api/v1/structures/MILL-FB/gauges", { data: foilGaugeBody(TAG) });
    expect(created.status()).toBe(201);

    const drawings = new StructureDrawings(page);
    await drawings.open("MILL-FB");
    // The demo seed's own drawing is there already.
    await page.getByText("North truss elevation").waitFor();
    await drawings.upload(writeTemp("notes.png", TEXT_FILE), "Not a drawing");
    await expect(drawings.refusal().textContent()).resolves.toContain("Only PNG, JPEG or WebP images are accepted");
    await saveScreenshot(page, "drawing-upload-refused-phone");

    await drawings.upload(writeTemp("elevation.png", elevationSketch(480, 240)), "South elevation");
    await drawings.openDrawing("South elevation");

    const drawing = new DrawingPage(page);
    await drawing.chooseGauge(TAG);
    await drawing.tapAt(0.3, 0.6);
    await page.getByText(`${TAG} placed at`).waitFor();

    await page.reload();
    await drawing.marker(TAG).waitFor();
    const placed = await drawing.markerPosition(TAG);
    // Within one CSS pixel of where the tap landed.
    expect(Math.abs(placed.x - 0.3) * placed.canvas.width).toBeLessThan(1.5);
    expect(Math.abs(placed.y - 0.6) * placed.canvas.height).toBeLessThan(1.5);
    // A gauge without readings yet shows that it has no data, never a fine state.
    await expect(drawing.marker(TAG).getAttribute("data-state")).resolves.toBe("no-data");
    await saveScreenshot(page, "drawing-placement-phone");
  });
});
