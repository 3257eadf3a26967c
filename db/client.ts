import "server-only";
import fs from "node:fs";
import path from "node:path";
import { createClient, type Client, type Transaction } from "@libsql/client";
import type { ExtractTablesWithRelations } from "drizzle-orm";
import { drizzle, type LibSQLDatabase } from "drizzle-orm/libsql";
import type { SQLiteTransaction } from "drizzle-orm/sqlite-core";
import { clientBulkSql, type BulkSql } from "./bulk-sql";
import { openNativeWriter, type NativeWriter } from "./native-writer";
import * as schema from "./schema";

export type Database = LibSQLDatabase<typeof schema>;

const DEFAULT_DATABASE_FILE = path.join("data", "hookeline.db");
const BUSY_TIMEOUT_MS = 5_000;

/** DATABASE_URL, or the embedded file under data/ when it is unset. */
export function databaseUrl(): string {
  return process.env.DATABASE_URL || `file:${DEFAULT_DATABASE_FILE}`;
}

/** The embedded file's path, or null for a libSQL server or an in-memory database. */
function embeddedFile(url: string): string | null {
  if (!url.startsWith("file:")) return null;
  const file = url.slice("file:".length).split("?")[0]!;
  return file === ":memory:" ? null : file;
}

function ensureParentFolder(url: string) {
  const file = embeddedFile(url);
  if (file !== null) fs.mkdirSync(path.dirname(path.resolve(file)), { recursive: true });
}

function openClient(url: string): Client {
  ensureParentFolder(url);
  return createClient({
    url,
    authToken: process.env.DATABASE_AUTH_TOKEN || undefined,
    timeout: BUSY_TIMEOUT_MS,
  });
}

type Connection = { url: string; client: Client; db: Database; ready: Promise<void>; writer: NativeWriter | null };

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
  const ready = applyPragmas(client, url);
  // DATABASE_WRITER=client sends an embedded file's transactions through @libsql/client too: the
  // path a libSQL server URL takes, so the tests can run it without a server.
  const file = process.env.DATABASE_WRITER === "client" ? null : embeddedFile(url);
  const created: Connection = { url, client, db, ready, writer: file === null ? null : openNativeWriter(file, BUSY_TIMEOUT_MS) };
  globalForDb.hookelineDb = created;
  return created;
}

/** The Drizzle instance of the process for reads and single statements; transactions go through `writeTransaction`. */
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
  globalForDb.hookelineDb?.writer?.close();
  globalForDb.hookelineDb?.client.close();
  globalForDb.hookelineDb = undefined;
}

/** The transaction `writeTransaction` hands to its work, whichever connection it runs on. */
export type WriteTx = SQLiteTransaction<"async", unknown, typeof schema, ExtractTablesWithRelations<typeof schema>>;

const bulkOfTransaction = new WeakMap<WriteTx, BulkSql>();

let writeQueue: Promise<unknown> = Promise.resolve();

/**
 * Runs an interactive write transaction, one at a time per process.
 * On the embedded file it runs on a connection of its own that keeps its prepared statements
 * (see native-writer); on a libSQL server, through the client. The client pools connections:
 * two interactive transactions open at once can leave the pool unusable, so they queue here;
 * across processes SQLite's busy timeout serialises them.
 */
export function writeTransaction<T>(work: (tx: WriteTx) => Promise<T>): Promise<T> {
  const run = writeQueue.then(async () => {
    const { writer, db } = connection();
    await connection().ready;
    if (writer) {
      return writer.db.transaction(async (tx) => {
        bulkOfTransaction.set(tx, writer.bulk);
        return work(tx);
      }, { behavior: "immediate" });
    }
    return db.transaction(async (tx) => {
      bulkOfTransaction.set(tx, clientBulkSql(libsqlTransactionOf(tx)));
      return work(tx);
    }, { behavior: "immediate" });
  });
  writeQueue = run.catch(() => undefined);
  return run;
}

function libsqlTransactionOf(tx: object): Transaction {
  const inner = (tx as { session?: { tx?: Transaction } }).session?.tx;
  if (!inner) throw new Error("Drizzle's libSQL transaction no longer exposes the client's transaction.");
  return inner;
}

/** Plain SQL for bulk statements inside a `writeTransaction`, on the transaction's connection. */
export function bulkSql(tx: WriteTx): BulkSql {
  const bulk = bulkOfTransaction.get(tx);
  if (!bulk) throw new Error("Not the transaction of a writeTransaction: no bulk SQL to run on.");
  return bulk;
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
