import { execFileSync } from "node:child_process";
import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { afterEach, beforeEach, describe, expect, it } from "vitest";
import { sourceFingerprint } from "@/scripts/source-fingerprint";

let root: string;
const write = (file: string, text: string) => {
  fs.mkdirSync(path.dirname(path.join(root, file)), { recursive: true });
  fs.writeFileSync(path.join(root, file), text);
};

beforeEach(() => {
  root = fs.mkdtempSync(path.join(os.tmpdir(), "hookeline-fingerprint-"));
  execFileSync("git", ["init", "-q"], { cwd: root });
  write(".gitignore", ".next/\nnext-env.d.ts\n");
  write("app/page.tsx", "export default function Page() { return null; }\n");
  write("tests/unit/a.test.ts", "it('a', () => {});\n");
  write("package-lock.json", "{}\n");
});
afterEach(() => fs.rmSync(root, { recursive: true, force: true }));

describe("the fingerprint of what the production build reads", () => {
  it("stays the same when only tests, ignored files or the build's own output change", () => {
    const before = sourceFingerprint(root);
    write("tests/unit/a.test.ts", "it('b', () => {});\n");
    write("next-env.d.ts", "/// <reference types=\"next\" />\n");
    write(".next/BUILD_ID", "x");
    write("README.md", "# changed\n");
    expect(sourceFingerprint(root)).toBe(before);
  });

  it("changes with a page's content, a new source file, a deleted one or the lockfile", () => {
    const seen = new Set([sourceFingerprint(root)]);
    write("app/page.tsx", "export default function Page() { return <p />; }\n");
    seen.add(sourceFingerprint(root));
    write("lib/new.ts", "export const x = 1;\n");
    seen.add(sourceFingerprint(root));
    fs.rmSync(path.join(root, "lib/new.ts"));
    fs.rmSync(path.join(root, "app/page.tsx"));
    seen.add(sourceFingerprint(root));
    write("package-lock.json", '{ "lockfileVersion": 3 }\n');
    seen.add(sourceFingerprint(root));
    expect(seen.size).toBe(5);
  });

  it("says nothing outside a git checkout", () => {
    fs.rmSync(path.join(root, ".git"), { recursive: true });
    expect(sourceFingerprint(root)).toBeNull();
  });
});
