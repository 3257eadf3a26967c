import "server-only";
export * from "./client";
export * as schema from "./schema";
