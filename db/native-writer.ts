import "server-only";
import Libsql from "libsql";
import { drizzle, type SqliteRemoteDatabase } from "drizzle-orm/sqlite-proxy";
import * as schema from "./schema";
import type { BulkSql, SqlArgs, SqlValue } from "./bulk-sql";

type Statement = Libsql.Statement;

/**
 * Prepared statements by their text, on one connection. SQLite spends longer parsing a
 * multi-row INSERT than running it; a connection that keeps its statements parses each text once.
 * Texts are few (Drizzle's queries and the bulk chunk sizes), the ceiling only guards the memory.
 */
class StatementCache {
  private readonly statements = new Map<string, Statement>();
  constructor(
    private readonly connection: Libsql.Database,
    private readonly ceiling = 500,
  ) {}

  get(sql: string): Statement {
    let statement = this.statements.get(sql);
    if (!statement) {
      statement = this.connection.prepare(sql);
      if (statement.reader) statement.raw(true);
      if (this.statements.size >= this.ceiling) this.statements.delete(this.statements.keys().next().value!);
      this.statements.set(sql, statement);
    }
    return statement;
  }
}

/** What the libSQL client would bind for these JavaScript values. */
function bindable(value: unknown): unknown {
  if (typeof value === "boolean") return value ? 1 : 0;
  if (value instanceof Date) return value.getTime();
  return value;
}

type ProxyMethod = "run" | "all" | "values" | "get";

/**
 * Row counts per bulk statement on the native connection: a few fixed sizes, so a batch of any
 * size reuses the same handful of prepared statements (9 × 512 + 12 × 32 + 8 × 1 for 5 000 rows).
 */
const CHUNK_ROWS = [512, 32, 1];

export type NativeWriter = {
  db: SqliteRemoteDatabase<typeof schema>;
  bulk: BulkSql;
  close(): void;
};

/**
 * A connection of its own to the embedded file for write transactions, with Drizzle on top through
 * its SQLite proxy driver. Only `writeTransaction` uses it, one transaction at a time.
 */
export function openNativeWriter(file: string, busyTimeoutMs: number): NativeWriter {
  const connection = new Libsql(file, { timeout: busyTimeoutMs });
  connection.exec("PRAGMA foreign_keys = ON");
  const statements = new StatementCache(connection);

  const execute = async (sql: string, params: unknown[], method: ProxyMethod) => {
    const statement = statements.get(sql);
    const args = params.map(bindable);
    if (method === "run" || !statement.reader) {
      const info = statement.run(args);
      return { rows: [], rowsAffected: info.changes, lastInsertRowid: info.lastInsertRowid };
    }
    return { rows: method === "get" ? statement.get(args) : statement.all(args) };
  };
  // Drizzle's proxy types its callback loosely: rows come back as arrays, as it asks.
  const db = drizzle(execute as Parameters<typeof drizzle>[0], { schema });

  const bulk: BulkSql = {
    async rows(sql: string, args: SqlArgs = []) {
      return statements.get(sql).all(args) as SqlValue[][];
    },
    async insertRows(statementFor, columns, values) {
      let start = 0;
      for (const rows of CHUNK_ROWS) {
        const width = rows * columns;
        for (; values.length - start >= width; start += width) {
          statements.get(statementFor(rows)).run(values.slice(start, start + width));
        }
      }
    },
  };
  return { db, bulk, close: () => connection.close() };
}
