import "server-only";
import type { InArgs, InValue, Transaction } from "@libsql/client";

export type SqlValue = InValue;
export type SqlArgs = InArgs;

/**
 * Plain SQL inside a write transaction, for bulk statements with thousands of bound parameters
 * (readings, roll-ups) that Drizzle's query builder would spend longer assembling than SQLite running.
 */
export interface BulkSql {
  /** Rows of a query, each its column values in order. */
  rows(sql: string, args?: SqlArgs): Promise<ArrayLike<SqlValue>[]>;
  /**
   * Runs `statementFor(n)` (a multi-row statement for n rows of `columns` values each) over
   * `values`, in chunks under SQLite's bound-parameter ceiling.
   */
  insertRows(statementFor: (rows: number) => string, columns: number, values: readonly SqlValue[]): Promise<void>;
}

/** SQLite's bound-parameter ceiling (stack-notes). */
const MAX_PARAMETERS = 32_766;

/** Over the libSQL client (a libSQL server): as few statements as the ceiling allows, each a round trip. */
export function clientBulkSql(transaction: Transaction): BulkSql {
  return {
    async rows(sql, args = []) {
      return (await transaction.execute({ sql, args })).rows;
    },
    async insertRows(statementFor, columns, values) {
      const width = Math.floor(MAX_PARAMETERS / columns) * columns;
      for (let start = 0; start < values.length; start += width) {
        const args = values.slice(start, start + width);
        await transaction.execute({ sql: statementFor(args.length / columns), args });
      }
    },
  };
}
