import { and, asc, desc, eq, isNotNull, isNull, lte, sql, type SQL } from "drizzle-orm";
import { randomUUID } from "node:crypto";
import type { Db } from "../../db/client.ts";
import { clients, objects } from "../../db/schema.ts";
import type { ObjectCreate, ObjectListQuery } from "../../../shared/schemas/objects.ts";

export type ObjectRow = typeof objects.$inferSelect & { clientName: string };

/** Turns what a person typed into an FTS5 query: every word must match as a prefix. */
export function toFtsQuery(text: string): string | null {
  const words = text
    .normalize("NFKC")
    .split(/[^\p{L}\p{N}]+/u)
    .filter(Boolean)
    .slice(0, 8);
  if (words.length === 0) return null;
  return words.map((w) => `"${w.replace(/"/g, "")}"*`).join(" AND ");
}

const SORT_COLUMNS = {
  objectNumber: objects.objectNumber,
  title: objects.title,
  maker: objects.maker,
  updatedAt: objects.updatedAt,
  status: objects.status,
  lastMountedOn: objects.lastMountedOn,
  checkDueOn: objects.checkDueOn,
} as const;

/** Date sorts put objects without the date (never mounted, no check planned) last in both directions. */
const NULLS_LAST_SORTS: ReadonlySet<ObjectListQuery["sort"]> = new Set(["lastMountedOn", "checkDueOn"]);

const listColumns = {
  id: objects.id,
  objectNumber: objects.objectNumber,
  title: objects.title,
  maker: objects.maker,
  objectType: objects.objectType,
  status: objects.status,
  location: objects.location,
  clientId: objects.clientId,
  clientName: clients.name,
  sheetWidthMm: objects.sheetWidthMm,
  sheetHeightMm: objects.sheetHeightMm,
  updatedAt: objects.updatedAt,
  currentMethod: objects.currentMethod,
  currentBoardGrade: objects.currentBoardGrade,
  currentGlazing: objects.currentGlazing,
  lastMountedOn: objects.lastMountedOn,
  checkDueOn: objects.checkDueOn,
};

/** The register's filter (everything in the list query but sort and page) as SQL conditions: the list and the schedule of values read the same set. */
export type ObjectFilter = Omit<ObjectListQuery, "sort" | "dir" | "page" | "pageSize">;
export function objectFilterWhere(query: ObjectFilter, scopeClientId: string | null): SQL[] {
  const where: SQL[] = [];
  const clientId = scopeClientId ?? query.clientId;
  if (scopeClientId && query.clientId && query.clientId !== scopeClientId) where.push(sql`0`);
  if (clientId) where.push(eq(objects.clientId, clientId));
  if (query.status) where.push(eq(objects.status, query.status));
  if (query.objectType) where.push(eq(objects.objectType, query.objectType));
  if (query.method) where.push(eq(objects.currentMethod, query.method));
  if (query.boardGrade) where.push(eq(objects.currentBoardGrade, query.boardGrade));
  if (query.glazing) where.push(eq(objects.currentGlazing, query.glazing));
  if (query.checkDueBy) where.push(lte(objects.checkDueOn, query.checkDueBy));
  if (query.q) {
    const fts = toFtsQuery(query.q);
    if (fts) where.push(sql`${objects.id} in (select object_id from objects_fts where objects_fts match ${fts})`);
  }
  return where;
}

export function listObjects(db: Db, query: ObjectListQuery, scopeClientId: string | null) {
  const where = objectFilterWhere(query, scopeClientId);
  const cond = where.length ? and(...where) : undefined;
  const col = SORT_COLUMNS[query.sort];
  const order = query.dir === "desc" ? [desc(col), desc(objects.id)] : [asc(col), asc(objects.id)];
  const page = (extra: SQL | undefined, orderBy: SQL[], limit: number, offset: number) =>
    db
      .select(listColumns)
      .from(objects)
      .innerJoin(clients, eq(clients.id, objects.clientId))
      .where(extra ? and(cond, extra) : cond)
      .orderBy(...orderBy)
      .limit(limit)
      .offset(offset)
      .all();
  const count = (extra?: SQL) =>
    db
      .select({ n: sql<number>`count(*)` })
      .from(objects)
      .where(extra ? and(cond, extra) : cond)
      .get()?.n ?? 0;
  const offset = (query.page - 1) * query.pageSize;
  let items: ReturnType<typeof page>;
  if (NULLS_LAST_SORTS.has(query.sort)) {
    // Two index ranges read one after the other (the dated rows in order, then the undated ones by id),
    // because "nulls last" in the ORDER BY is something no index can serve. Past the first page the dated
    // rows are counted first (a covering-index count), so a page among the undated ones does not walk
    // every dated row only to discard it.
    let dated = offset > 0 ? count(isNotNull(col)) : null;
    items = dated !== null && offset >= dated ? [] : page(isNotNull(col), order, query.pageSize, offset);
    if (items.length < query.pageSize) {
      dated ??= items.length > 0 ? offset + items.length : count(isNotNull(col));
      const byId = query.dir === "desc" ? desc(objects.id) : asc(objects.id);
      items = items.concat(page(isNull(col), [byId], query.pageSize - items.length, Math.max(0, offset - dated)));
    }
  } else {
    items = page(undefined, order, query.pageSize, offset);
  }
  return { items, total: count() };
}

/** The ids of the objects a register filter matches, at most `limit` of them. */
export function objectIdsMatching(db: Db, filter: ObjectFilter, limit: number): string[] {
  const where = objectFilterWhere(filter, null);
  return db
    .select({ id: objects.id })
    .from(objects)
    .where(where.length ? and(...where) : undefined)
    .limit(limit)
    .all()
    .map((o) => o.id);
}

export function findObject(db: Db, id: string): ObjectRow | null {
  const row = db.select({ o: objects, clientName: clients.name }).from(objects).innerJoin(clients, eq(clients.id, objects.clientId)).where(eq(objects.id, id)).get();
  return row ? { ...row.o, clientName: row.clientName } : null;
}

export function findObjectIdByNumber(db: Db, objectNumber: string): string | null {
  return db.select({ id: objects.id }).from(objects).where(sql`${objects.objectNumber} = ${objectNumber} collate nocase`).get()?.id ?? null;
}

export function insertObject(db: Db, data: ObjectCreate, createdBy: string | null, id: string = randomUUID()): string {
  db.insert(objects)
    .values({ id, ...data, createdBy })
    .run();
  return id;
}

/** Writes only when the stored version is the one the edit started from; returns false on a stale edit. */
export function updateObject(db: Db, id: string, version: number, data: Partial<ObjectCreate>): boolean {
  const result = db
    .update(objects)
    .set({ ...data, version: version + 1, updatedAt: new Date() })
    .where(and(eq(objects.id, id), eq(objects.version, version)))
    .run();
  return result.changes === 1;
}

/** The highest sequence used this year in numbers shaped YYYY-NNNN. */
export function lastSequenceForYear(db: Db, year: number): number {
  // The leading digits only, as SQLite's cast reads them: 2026-0009.1 (a part number) counts as 9.
  const seq = sql<number>`cast(substr(${objects.objectNumber}, 6) as integer)`;
  const row = db
    .select({ n: seq })
    .from(objects)
    .where(sql`${objects.objectNumber} glob ${`${year}-[0-9]*`}`)
    .orderBy(desc(seq))
    .limit(1)
    .get();
  return row ? Number(row.n) || 0 : 0;
}
