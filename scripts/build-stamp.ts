import fs from "node:fs";
import path from "node:path";

/**
 * What `npm run demo` writes beside a production build it made: the build's id, the fingerprint of
 * the sources it read (scripts/source-fingerprint.ts) and how long it took, so the next start can
 * reuse it.
 */
export type BuildStamp = { buildId: string; fingerprint: string; seconds: number };

const stampFile = (buildFolder: string) => path.join(buildFolder, "hookeline-build.json");
const buildIdFile = (buildFolder: string) => path.join(buildFolder, "BUILD_ID");

/** The id of the finished build in `buildFolder`: Next writes BUILD_ID once a build succeeded. */
export function currentBuildId(buildFolder: string): string | null {
  return fs.existsSync(buildIdFile(buildFolder)) ? fs.readFileSync(buildIdFile(buildFolder), "utf8").trim() : null;
}

/** The stamp in `buildFolder` as written, or null when there is none or it cannot be read. */
export function readStamp(buildFolder: string): BuildStamp | null {
  try {
    const stamp = JSON.parse(fs.readFileSync(stampFile(buildFolder), "utf8")) as Partial<BuildStamp>;
    const complete = typeof stamp.buildId === "string" && typeof stamp.fingerprint === "string" && typeof stamp.seconds === "number";
    return complete ? { buildId: stamp.buildId!, fingerprint: stamp.fingerprint!, seconds: stamp.seconds! } : null;
  } catch {
    return null;
  }
}

/** After a successful build: its id (read from the folder), the sources' fingerprint and its length. */
export function writeStamp(buildFolder: string, fingerprint: string, seconds: number): void {
  const buildId = currentBuildId(buildFolder);
  if (buildId) fs.writeFileSync(stampFile(buildFolder), JSON.stringify({ buildId, fingerprint, seconds } satisfies BuildStamp));
}

export type BuildDecision = { build: false } | { build: true; why: string };

/**
 * Whether the sources now (`fingerprint`, null outside a git checkout) need a new build, and why.
 * The stamp counts only for the build it was written beside (`buildId`): a `next build` run by
 * hand or by the tests since then replaced the build, from sources the stamp knows nothing of.
 */
export function buildDecision(fingerprint: string | null, stamp: BuildStamp | null, buildId: string | null): BuildDecision {
  if (buildId === null) return { build: true, why: "none yet" };
  if (fingerprint === null) return { build: true, why: "cannot tell what changed outside a git checkout" };
  if (stamp?.buildId !== buildId) return { build: true, why: "the build in .next was not made by npm run demo" };
  if (stamp.fingerprint !== fingerprint) return { build: true, why: "sources changed since the last one" };
  return { build: false };
}
