import { and, asc, desc, eq, sql, type SQL } from "drizzle-orm";
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
} as const;

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
};

export function listObjects(db: Db, query: ObjectListQuery, scopeClientId: string | null) {
  const where: SQL[] = [];
  const clientId = scopeClientId ?? query.clientId;
  if (scopeClientId && query.clientId && query.clientId !== scopeClientId) where.push(sql`0`);
  if (clientId) where.push(eq(objects.clientId, clientId));
  if (query.status) where.push(eq(objects.status, query.status));
  if (query.objectType) where.push(eq(objects.objectType, query.objectType));
  if (query.q) {
    const fts = toFtsQuery(query.q);
    if (fts) where.push(sql`${objects.id} in (select object_id from objects_fts where objects_fts match ${fts})`);
  }
  const cond = where.length ? and(...where) : undefined;
  const col = SORT_COLUMNS[query.sort];
  const order = query.dir === "desc" ? [desc(col), desc(objects.id)] : [asc(col), asc(objects.id)];
  const items = db
    .select(listColumns)
    .from(objects)
    .innerJoin(clients, eq(clients.id, objects.clientId))
    .where(cond)
    .orderBy(...order)
    .limit(query.pageSize)
    .offset((query.page - 1) * query.pageSize)
    .all();
  const total = db.select({ n: sql<number>`count(*)` }).from(objects).where(cond).get()?.n ?? 0;
  return { items, total };
}

export function findObject(db: Db, id: string): ObjectRow | null {
  const row = db
    .select({ o: objects, clientName: clients.name })
    .from(objects)
    .innerJoin(clients, eq(clients.id, objects.clientId))
    .where(eq(objects.id, id))
    .get();
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
