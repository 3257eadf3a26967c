import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { afterAll, beforeAll } from "vitest";
import { closeDb } from "@/db/client";
import { migrateDatabase } from "@/db/migrate";

// Every test file gets its own SQLite file with the real migrations applied: no mocks of the database.
const folder = fs.mkdtempSync(path.join(os.tmpdir(), "hookeline-test-"));
process.env.DATABASE_URL = `file:${path.join(folder, "test.db")}`;

beforeAll(async () => {
  closeDb();
  await migrateDatabase();
});

afterAll(() => {
  closeDb();
  fs.rmSync(folder, { recursive: true, force: true });
});
