import fs from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";

// What the browser downloads (.next/static after `next build`) must hold nothing of the server:
// no password hashing, no table definitions or SQL, no mail transport, no file storage.
const MARKERS = [
  "bcrypt",
  "sqliteTable",
  "drizzle-orm",
  "password_hash",
  "sign_in_failures",
  "mail_outbox",
  "api_tokens",
  "ended_sessions",
  "nodemailer",
  "smtp-server",
  "libsql",
  "FILE_STORAGE_DIR",
  "NEXTAUTH_SECRET",
];

function filesUnder(folder: string): string[] {
  return fs.readdirSync(folder, { withFileTypes: true }).flatMap((entry) => {
    const full = path.join(folder, entry.name);
    return entry.isDirectory() ? filesUnder(full) : /\.(js|css|json)$/.test(entry.name) ? [full] : [];
  });
}

describe("client bundles", () => {
  it("hold none of the server modules' markers", () => {
    const files = filesUnder(path.join(".next", "static"));
    expect(files.length).toBeGreaterThan(20);
    const found = files.flatMap((file) => {
      const text = fs.readFileSync(file, "utf8");
      return MARKERS.filter((marker) => text.includes(marker)).map((marker) => `${marker} in ${file}`);
    });
    expect(found).toEqual([]);
  });
});
