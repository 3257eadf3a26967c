import { closeDb, databaseUrl } from "@/db/client";
import { migrateDatabase } from "@/db/migrate";

await migrateDatabase();
console.log(`Database up to date: ${databaseUrl()}`);
closeDb();
