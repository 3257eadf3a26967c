import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { afterEach, beforeEach, describe, expect, it } from "vitest";
import { buildDecision, currentBuildId, readStamp, writeStamp } from "@/scripts/build-stamp";

let folder: string;
const finishBuild = (id: string) => fs.writeFileSync(path.join(folder, "BUILD_ID"), id);
/** What `npm run demo` decides for the sources' `fingerprint` and the folder as it stands. */
const decide = (fingerprint: string | null) => buildDecision(fingerprint, readStamp(folder), currentBuildId(folder));

beforeEach(() => {
  folder = fs.mkdtempSync(path.join(os.tmpdir(), "hookeline-build-stamp-"));
});
afterEach(() => fs.rmSync(folder, { recursive: true, force: true }));

describe("reusing the demo's production build", () => {
  it("builds when there is no finished build, then reuses it while the sources stay the same", () => {
    expect(decide("a")).toEqual({ build: true, why: "none yet" });
    finishBuild("first");
    writeStamp(folder, "a", 95);
    expect(decide("a")).toEqual({ build: false });
    expect(readStamp(folder)).toEqual({ buildId: "first", fingerprint: "a", seconds: 95 });
  });

  it("builds again when a source changed", () => {
    finishBuild("first");
    writeStamp(folder, "a", 95);
    expect(decide("b")).toEqual({ build: true, why: "sources changed since the last one" });
  });

  it("does not trust its stamp for a build someone else made since, whatever sources that build read", () => {
    finishBuild("first");
    writeStamp(folder, "a", 95);
    finishBuild("by-hand");
    expect(decide("a")).toEqual({ build: true, why: "the build in .next was not made by npm run demo" });
  });

  it("builds when it cannot tell the sources apart, or the stamp is unreadable", () => {
    finishBuild("first");
    writeStamp(folder, "a", 95);
    expect(decide(null)).toMatchObject({ build: true });
    fs.writeFileSync(path.join(folder, "hookeline-build.json"), "{ not json");
    expect(decide("a")).toMatchObject({ build: true });
  });

  it("writes no stamp when the build did not finish", () => {
    writeStamp(folder, "a", 95);
    expect(readStamp(folder)).toBeNull();
  });
});
