import "server-only";
import path from "node:path";
import { migrate } from "drizzle-orm/libsql/migrator";
import { databaseReady, getDb } from "./client";

/** Applies the committed migrations in drizzle/; safe to call on every start. */
export async function migrateDatabase(): Promise<void> {
  await databaseReady();
  await migrate(getDb(), { migrationsFolder: path.join(process.cwd(), "drizzle") });
}
