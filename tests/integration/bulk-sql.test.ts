import { describe, expect, it } from "vitest";
import { bulkSql, getClient, getDb, writeTransaction } from "@/db/client";
import { clientBulkSql, type BulkSql } from "@/db/bulk-sql";
import { structures } from "@/db/schema";

/**
 * Bulk statements must store every row exactly once whatever the row count: the embedded file's
 * connection splits a batch into a few fixed statement sizes, the libSQL client (the scale-out
 * path, run here on the same file) into statements under SQLite's 32 766-parameter ceiling.
 */
const SCRATCH = "CREATE TABLE IF NOT EXISTS bulk_scratch (n INTEGER PRIMARY KEY, twice INTEGER NOT NULL, label TEXT)";
const insertSql = (rows: number) => `INSERT INTO bulk_scratch (n, twice, label) VALUES ${Array(rows).fill("(?,?,?)").join(",")}`;

function rowsOf(count: number, offset: number): (number | string)[] {
  const values: (number | string)[] = [];
  for (let n = offset; n < offset + count; n++) values.push(n, 2 * n, `r${n}`);
  return values;
}

async function storedRows(): Promise<{ count: number; sum: number; twiceSum: number }> {
  const result = await getClient().execute("SELECT count(*), coalesce(sum(n), 0), coalesce(sum(twice), 0) FROM bulk_scratch");
  const [count, sum, twiceSum] = Array.from(result.rows[0]!) as number[];
  return { count: count!, sum: sum!, twiceSum: twiceSum! };
}

/** Counts that land on and beside the chunk sizes, and one over the parameter ceiling (10 923 × 3 > 32 766). */
const COUNTS = [1, 31, 32, 33, 511, 512, 545, 5_000, 10_923];

async function checkInsertRows(bulkOf: (run: (bulk: BulkSql) => Promise<void>) => Promise<void>) {
  await getClient().execute(SCRATCH);
  await getClient().execute("DELETE FROM bulk_scratch");
  let offset = 0;
  for (const count of COUNTS) {
    await bulkOf((bulk) => bulk.insertRows(insertSql, 3, rowsOf(count, offset)));
    offset += count;
    // Arithmetic series: 0 + 1 + … + (offset − 1).
    expect(await storedRows(), `after ${count} rows`).toEqual({ count: offset, sum: (offset * (offset - 1)) / 2, twiceSum: offset * (offset - 1) });
  }
}

describe("bulk SQL inside a write transaction", () => {
  it("stores every row exactly once on the embedded file's own connection", async () => {
    await checkInsertRows((run) => writeTransaction((tx) => run(bulkSql(tx))));
  });

  it("stores every row exactly once through the libSQL client", async () => {
    await checkInsertRows(async (run) => {
      const transaction = await getClient().transaction("write");
      try {
        await run(clientBulkSql(transaction));
        await transaction.commit();
      } finally {
        transaction.close();
      }
    });
  });

  it("reads rows back as arrays of column values, named or positional parameters alike", async () => {
    await writeTransaction(async (tx) => {
      const bulk = bulkSql(tx);
      await bulk.insertRows(insertSql, 3, rowsOf(3, 1_000_000));
      // The native connection answers arrays, the client array-like rows: compare their values.
      const rows = await bulk.rows("SELECT n, label FROM bulk_scratch WHERE n >= ? ORDER BY n", [1_000_001]);
      expect(rows.map((row) => Array.from(row))).toEqual([
        [1_000_001, "r1000001"],
        [1_000_002, "r1000002"],
      ]);
      const named = await bulk.rows("SELECT twice FROM bulk_scratch WHERE n = :n", { n: 1_000_000 });
      expect(Array.from(named[0]!)).toEqual([2_000_000]);
    });
  });

  it("rolls the whole transaction back when its work fails, bulk rows and Drizzle rows alike", async () => {
    const before = await storedRows();
    await expect(
      writeTransaction(async (tx) => {
        await bulkSql(tx).insertRows(insertSql, 3, rowsOf(600, 2_000_000));
        await tx.insert(structures).values({ code: "ROLLBACK", name: "Never kept", timezone: "UTC" });
        throw new Error("work failed");
      }),
    ).rejects.toThrow("work failed");
    expect(await storedRows()).toEqual(before);
    expect(await getDb().select().from(structures)).toEqual([]);
  });

  it("refuses bulk SQL outside a write transaction's own handle", async () => {
    await writeTransaction(async (tx) => {
      await tx.transaction(async (nested) => {
        expect(() => bulkSql(nested)).toThrow(/Not the transaction of a writeTransaction/);
      });
    });
  });
});
