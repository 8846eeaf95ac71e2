import { and, eq, inArray, type SQL } from "drizzle-orm";
import type { SQLiteColumn, SQLiteTable } from "drizzle-orm/sqlite-core";
import { randomUUID } from "node:crypto";
import type { Db } from "../../db/client.ts";

/** The columns the life cycle reads on a record's table (mountings, condition_reports). */
type RecordTable = SQLiteTable & { id: SQLiteColumn; version: SQLiteColumn; status: SQLiteColumn };
/** The columns of its revisions' table (mounting_revisions, condition_revisions). */
type RevisionTable = SQLiteTable & { revision: SQLiteColumn; data: SQLiteColumn };

/** What every revisioned record row has. */
export type RecordBase = { id: string; objectId: string; status: string; version: number; currentRevision: number };
/** What every revision row has. */
export type RevisionBase = { revision: number; data: unknown; correctionReason: string | null; createdAt: Date; createdByName: string | null };

type User = { id: string; name: string };

/**
 * The Drizzle code of the revisioned life cycle for one pair of tables: a record table with `id`,
 * `status`, `version` and `currentRevision`, and a revisions table holding each numbered revision as
 * JSON, keyed by (`parent`, `revision`). A feature's repo binds it to its tables and adds its own columns.
 */
export function revisionedRepo<R extends RecordTable, V extends RevisionTable, P extends keyof V & keyof V["$inferInsert"] & string>(records: R, revisions: V, parent: P) {
  type Row = R["$inferSelect"] & RecordBase;
  type Rev = V["$inferSelect"] & RevisionBase;
  const parentCol = revisions[parent] as unknown as SQLiteColumn;
  const table = records as SQLiteTable;
  const revTable = revisions as SQLiteTable;
  const byNumber = (id: string, n: number) => and(eq(parentCol, id), eq(revisions.revision, n));

  /** Sets `patch` on the record when it is still at `version` (and, if given, in `status`); false when stale. */
  function updateIfVersion(db: Db, id: string, version: number, patch: Partial<R["$inferInsert"]>, status?: string): boolean {
    const where: SQL[] = [eq(records.id, id), eq(records.version, version)];
    if (status) where.push(eq(records.status, status));
    const r = db
      .update(table)
      .set({ ...patch, version: version + 1, updatedAt: new Date() } as never)
      .where(and(...where))
      .run();
    return r.changes === 1;
  }

  function insertRevision(db: Db, id: string, n: number, data: unknown, user: User, correctionReason?: string) {
    db.insert(revTable)
      .values({
        id: randomUUID(),
        [parent]: id,
        revision: n,
        data,
        ...(correctionReason === undefined ? {} : { correctionReason }),
        createdBy: user.id,
        createdByName: user.name,
      } as never)
      .run();
  }

  return {
    find(db: Db, id: string): Row | null {
      return (db.select().from(table).where(eq(records.id, id)).get() as Row | undefined) ?? null;
    },

    revisionsOf(db: Db, id: string): Rev[] {
      return db.select().from(revTable).where(eq(parentCol, id)).orderBy(revisions.revision).all() as Rev[];
    },

    revision(db: Db, id: string, n: number): Rev | null {
      return (db.select().from(revTable).where(byNumber(id, n)).get() as Rev | undefined) ?? null;
    },

    /** Current revisions for many records at once (an object's page lists all of its records). */
    currentRevisions(db: Db, rows: { id: string; currentRevision: number }[]): Map<string, Rev> {
      if (rows.length === 0) return new Map();
      const all = db
        .select()
        .from(revTable)
        .where(
          inArray(
            parentCol,
            rows.map((r) => r.id),
          ),
        )
        .all() as Rev[];
      const want = new Map(rows.map((r) => [r.id, r.currentRevision]));
      const of = (r: Rev) => (r as Record<string, unknown>)[parent] as string;
      return new Map(all.filter((r) => want.get(of(r)) === r.revision).map((r) => [of(r), r]));
    },

    updateIfVersion,

    /** A new draft: the record row (`values`, without status and revision) and its revision 1. */
    insertDraft(db: Db, values: Omit<R["$inferInsert"], "id" | "status" | "currentRevision">, data: unknown, user: User): string {
      const id = randomUUID();
      db.insert(table)
        .values({ id, ...values, status: "draft", currentRevision: 1 } as never)
        .run();
      insertRevision(db, id, 1, data, user);
      return id;
    },

    /** Rewrites a draft in place: its columns (`patch`) and revision 1; false when the version is stale or it is no longer a draft. */
    rewriteDraft(db: Db, id: string, version: number, patch: Partial<R["$inferInsert"]>, data: unknown): boolean {
      if (!updateIfVersion(db, id, version, patch, "draft")) return false;
      db.update(revTable)
        .set({ data, updatedAt: new Date() } as never)
        .where(byNumber(id, 1))
        .run();
      return true;
    },

    /**
     * A correction: the next revision with its reason, and the record moved on to it (with `patch`, the
     * columns copied from the data). Null when the version is stale (or the record is not in `status`).
     */
    addRevision(db: Db, row: RecordBase, version: number, c: { data: unknown; reason: string; user: User; patch?: Partial<R["$inferInsert"]>; status?: string }): number | null {
      const n = row.currentRevision + 1;
      if (!updateIfVersion(db, row.id, version, { ...c.patch, currentRevision: n } as Partial<R["$inferInsert"]>, c.status)) return null;
      insertRevision(db, row.id, n, c.data, c.user, c.reason);
      return n;
    },
  };
}
