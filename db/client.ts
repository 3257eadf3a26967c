import fs from "node:fs";
import path from "node:path";
import { createClient, type Client, type Transaction } from "@libsql/client";
import { drizzle, type LibSQLDatabase } from "drizzle-orm/libsql";
import * as schema from "./schema";

export type Database = LibSQLDatabase<typeof schema>;

const DEFAULT_DATABASE_FILE = path.join("data", "hookeline.db");
const BUSY_TIMEOUT_MS = 5_000;

/** DATABASE_URL, or the embedded file under data/ when it is unset. */
export function databaseUrl(): string {
  return process.env.DATABASE_URL || `file:${DEFAULT_DATABASE_FILE}`;
}

function ensureParentFolder(url: string) {
  if (!url.startsWith("file:")) return;
  const file = url.slice("file:".length).split("?")[0]!;
  fs.mkdirSync(path.dirname(path.resolve(file)), { recursive: true });
}

function openClient(url: string): Client {
  ensureParentFolder(url);
  return createClient({
    url,
    authToken: process.env.DATABASE_AUTH_TOKEN || undefined,
    timeout: BUSY_TIMEOUT_MS,
  });
}

type Connection = { url: string; client: Client; db: Database; ready: Promise<void> };

const globalForDb = globalThis as unknown as { hookelineDb?: Connection };

async function applyPragmas(client: Client, url: string) {
  // WAL lets readers go on while a writer commits; it is a property of the file, set once.
  if (url.startsWith("file:")) await client.execute("PRAGMA journal_mode = WAL");
  await client.execute("PRAGMA foreign_keys = ON");
}

function connection(): Connection {
  const url = databaseUrl();
  const existing = globalForDb.hookelineDb;
  if (existing && existing.url === url) return existing;
  const client = openClient(url);
  const db = drizzle(client, { schema });
  const created: Connection = { url, client, db, ready: applyPragmas(client, url) };
  globalForDb.hookelineDb = created;
  return created;
}

/** The one Drizzle instance of the process. */
export function getDb(): Database {
  return connection().db;
}

/** The raw libSQL client behind getDb(), for bulk statements Drizzle would slow down. */
export function getClient(): Client {
  return connection().client;
}

export async function databaseReady(): Promise<void> {
  await connection().ready;
}

/** Closes the connection (tests and command-line tools). */
export function closeDb() {
  globalForDb.hookelineDb?.client.close();
  globalForDb.hookelineDb = undefined;
}

/** The transaction `writeTransaction` hands to its work. */
export type WriteTx = Parameters<Parameters<Database["transaction"]>[0]>[0];

let writeQueue: Promise<unknown> = Promise.resolve();

/**
 * Runs an interactive write transaction, one at a time per process.
 * The libSQL client pools connections: two interactive transactions open at once can
 * leave the pool unusable, so they queue here; across processes SQLite's busy timeout
 * serialises them.
 */
export function writeTransaction<T>(work: (tx: WriteTx) => Promise<T>): Promise<T> {
  const run = writeQueue.then(() => getDb().transaction(work, { behavior: "immediate" }));
  writeQueue = run.catch(() => undefined);
  return run;
}

/**
 * The libSQL transaction under a Drizzle one, for statements with thousands of bound parameters
 * (bulk readings) that Drizzle's query builder would spend longer assembling than SQLite running.
 */
export function libsqlTransaction(tx: WriteTx): Transaction {
  const inner = (tx as unknown as { session?: { tx?: Transaction } }).session?.tx;
  if (!inner) throw new Error("Not inside a writeTransaction: no libSQL transaction to run on.");
  return inner;
}

/** True when a statement failed on a UNIQUE or PRIMARY KEY constraint (Drizzle wraps the driver's error). */
export function isUniqueViolation(error: unknown): boolean {
  for (let e: unknown = error; e instanceof Error; e = e.cause) {
    if (/UNIQUE constraint failed|SQLITE_CONSTRAINT_(UNIQUE|PRIMARYKEY)/.test(`${(e as { code?: string }).code ?? ""} ${e.message}`)) {
      return true;
    }
  }
  return false;
}
