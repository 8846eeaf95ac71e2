import Database from "better-sqlite3";
import { drizzle } from "drizzle-orm/better-sqlite3";
import { migrate } from "drizzle-orm/better-sqlite3/migrator";
import fs from "node:fs";
import path from "node:path";
import { fileURLToPath } from "node:url";
import * as schema from "./schema.ts";

export const MIGRATIONS_DIR = path.resolve(path.dirname(fileURLToPath(import.meta.url)), "../../drizzle");

export type Db = ReturnType<typeof drizzle<typeof schema>>;
export type DbHandle = { db: Db; sqlite: Database.Database; close: () => void };

/** Opens (creating if needed) the SQLite file with WAL, foreign keys and a busy timeout, and applies migrations. */
export function openDatabase(file: string, opts: { migrate?: boolean } = {}): DbHandle {
  if (file !== ":memory:") fs.mkdirSync(path.dirname(path.resolve(file)), { recursive: true });
  const sqlite = new Database(file);
  sqlite.pragma("journal_mode = WAL");
  sqlite.pragma("foreign_keys = ON");
  sqlite.pragma("busy_timeout = 5000");
  sqlite.pragma("synchronous = NORMAL");
  const db = drizzle(sqlite, { schema });
  if (opts.migrate !== false) migrate(db, { migrationsFolder: MIGRATIONS_DIR });
  return { db, sqlite, close: () => sqlite.close() };
}

/**
 * A read-only connection to a database another connection writes (WAL lets it read meanwhile): for work
 * off the request thread, such as gathering a long document's rows in the render worker. No migrations.
 */
export function openReadOnly(file: string): DbHandle {
  const sqlite = new Database(file, { readonly: true, fileMustExist: true });
  sqlite.pragma("busy_timeout = 5000");
  const db = drizzle(sqlite, { schema });
  return { db, sqlite, close: () => sqlite.close() };
}

/**
 * Runs `fn` in one SQLite transaction. Drizzle types the transaction handle apart from the database,
 * but it offers the same queries, so repos and appendEvent take it as a Db; this is the one place that says so.
 */
export function inTransaction<T>(db: Db, fn: (tx: Db) => T): T {
  return db.transaction((t) => fn(t as unknown as Db));
}
