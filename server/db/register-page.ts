import { desc, sql, type SQL } from "drizzle-orm";
import type { SQLiteColumn, SQLiteSelect, SQLiteTable } from "drizzle-orm/sqlite-core";
import type { Db } from "./client.ts";

/**
 * One page of a register (a select already joined to what it shows, in drizzle's dynamic mode): the rows
 * matching `cond`, newest first by `date`, then by `id` so that pages are stable.
 */
export function newestFirstPage<T extends SQLiteSelect>(qb: T, date: SQLiteColumn, id: SQLiteColumn, cond: SQL | undefined, q: { page: number; pageSize: number }) {
  return qb
    .where(cond)
    .orderBy(desc(date), desc(id))
    .limit(q.pageSize)
    .offset((q.page - 1) * q.pageSize);
}

/** How many rows of `table` match `cond`, for a register's total. */
export function countWhere(db: Db, table: SQLiteTable, cond: SQL | undefined): number {
  return db.select({ n: sql<number>`count(*)` }).from(table).where(cond).get()?.n ?? 0;
}
