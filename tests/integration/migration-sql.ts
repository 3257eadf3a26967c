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
