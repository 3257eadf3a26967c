import { closeDb, databaseUrl } from "@/db/client";
import { migrateDatabase } from "@/db/migrate";
import { seedDemo } from "@/db/seed";

await migrateDatabase();
await seedDemo();
console.log(`Demo data in place: ${databaseUrl()}`);
closeDb();
