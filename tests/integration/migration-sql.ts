import fs from "node:fs";
import path from "node:path";
import { getClient } from "@/db/client";

/**
 * Runs one committed migration's SQL again, found by the name it was generated with (whatever
 * number a merge gives it), over rows a test stored after the migrations had run on the empty
 * database: the way an existing installation meets it.
 */
export async function rerunMigration(name: string): Promise<void> {
  const folder = path.join(process.cwd(), "drizzle");
  const file = fs.readdirSync(folder).find((entry) => entry.endsWith(".sql") && entry.replace(/^\d+_/, "") === `${name}.sql`);
  if (!file) throw new Error(`no migration named ${name}`);
  const statements = fs.readFileSync(path.join(folder, file), "utf8").split("--> statement-breakpoint");
  for (const statement of statements) {
    const sql = statement.replace(/^--.*$/gm, "").trim();
    if (sql) await getClient().execute(sql);
  }
}

/**
 * A copy of the committed migrations in `folder` with the journal cut before the migration whose
 * tag ends with `name` (whatever number a merge gives it): migrating with it makes a database as
 * it stood before that migration, for a test to store rows in and then migrate the rest of the way.
 */
export function migrationsBefore(name: string, folder: string): string {
  const target = path.join(folder, "before");
  fs.cpSync(path.join(process.cwd(), "drizzle"), target, { recursive: true });
  const journalPath = path.join(target, "meta", "_journal.json");
  const journal = JSON.parse(fs.readFileSync(journalPath, "utf8")) as { entries: { tag: string }[] };
  const index = journal.entries.findIndex((entry) => entry.tag.endsWith(name));
  if (index < 1) throw new Error(`no migration after the first named ${name}`);
  journal.entries = journal.entries.slice(0, index);
  fs.writeFileSync(journalPath, JSON.stringify(journal));
  return target;
}
