import { spawnSync } from "node:child_process";
import { createHash } from "node:crypto";
import fs from "node:fs";
import path from "node:path";

/** Files the production build does not read: tests, command-line scripts, migrations (read at run time), docs. */
const NOT_BUILT = [/^tests\//, /^scripts\//, /^drizzle\//, /^\.ci\//, /\.md$/];

/**
 * A hash of every file git would keep (tracked, or new and not ignored) that the production build
 * reads, by path and content; null outside a git checkout, where nothing can be said.
 */
export function sourceFingerprint(root = "."): string | null {
  const listed = spawnSync("git", ["ls-files", "--cached", "--others", "--exclude-standard", "-z"], { cwd: root, encoding: "utf8" });
  if (listed.status !== 0) return null;
  const files = [...new Set(listed.stdout.split("\0"))].filter((file) => file && !NOT_BUILT.some((pattern) => pattern.test(file))).sort();
  const hash = createHash("sha256");
  for (const file of files) {
    const full = path.join(root, file);
    // A file deleted but not yet staged is still listed; its absence is what counts.
    hash.update(`${file}\0${fs.existsSync(full) ? createHash("sha256").update(fs.readFileSync(full)).digest("hex") : "deleted"}\0`);
  }
  return hash.digest("hex");
}
