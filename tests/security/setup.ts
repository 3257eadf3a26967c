import { inject } from "vitest";

// The suite reads and prepares the server's own database file (tokens, users) beside the running
// server; the app's modules pick the file up from here.
process.env.DATABASE_URL = inject("databaseUrl");
process.env.NEXTAUTH_SECRET = "browser-test-secret";
