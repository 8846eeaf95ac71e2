import { and, desc, eq, gte, inArray, lte, sql, type SQL } from "drizzle-orm";
import { randomUUID } from "node:crypto";
import type { Db } from "../../db/client.ts";
import { clients, custodyReceipts, objects } from "../../db/schema.ts";
import type { CustodyCreate, CustodyKind, InStudioItem } from "../../../shared/schemas/custody.ts";

export type ReceiptRow = typeof custodyReceipts.$inferSelect & { objectNumber: string; objectTitle: string };

const receiptColumns = {
  r: custodyReceipts,
  objectNumber: objects.objectNumber,
  objectTitle: objects.title,
};
const flat = (row: { r: typeof custodyReceipts.$inferSelect; objectNumber: string; objectTitle: string }): ReceiptRow => ({
  ...row.r,
  objectNumber: row.objectNumber,
  objectTitle: row.objectTitle,
});

// Receipts of one day are told apart by insertion order (rowid), which the (object_id, date) index carries.
const rowid = sql`${custodyReceipts}.rowid`;

export function insertReceipt(db: Db, objectId: string, data: CustodyCreate, direction: "in" | "out", createdBy: string | null): string {
  const id = randomUUID();
  db.insert(custodyReceipts)
    .values({
      id,
      objectId,
      direction,
      kind: data.kind,
      date: data.date,
      fromParty: data.fromParty,
      toParty: data.toParty,
      condition: data.condition,
      location: data.location,
      signedBy: data.signedBy,
      notes: data.notes,
      returnDue: data.returnDue ?? null,
      createdBy,
    })
    .run();
  return id;
}

export function findReceipt(db: Db, id: string): ReceiptRow | null {
  const row = db.select(receiptColumns).from(custodyReceipts).innerJoin(objects, eq(objects.id, custodyReceipts.objectId)).where(eq(custodyReceipts.id, id)).get();
  return row ? flat(row) : null;
}

/** The object's newest receipt (by date, then by when it was written), or null. */
export function latestReceipt(db: Db, objectId: string): { date: string; direction: string } | null {
  return (
    db
      .select({ date: custodyReceipts.date, direction: custodyReceipts.direction })
      .from(custodyReceipts)
      .where(eq(custodyReceipts.objectId, objectId))
      .orderBy(desc(custodyReceipts.date), desc(rowid))
      .limit(1)
      .get() ?? null
  );
}

/** Moves the object, only over the version it was read at; false when someone changed it meanwhile. */
export function moveObject(db: Db, id: string, version: number, change: { status: string; location?: string | null }): boolean {
  const set: Partial<typeof objects.$inferInsert> = { status: change.status, version: version + 1, updatedAt: new Date() };
  if (change.location) set.location = change.location;
  return (
    db
      .update(objects)
      .set(set)
      .where(and(eq(objects.id, id), eq(objects.version, version)))
      .run().changes === 1
  );
}

/** One object's receipts, newest first. */
export function listForObject(db: Db, objectId: string): ReceiptRow[] {
  return db
    .select(receiptColumns)
    .from(custodyReceipts)
    .innerJoin(objects, eq(objects.id, custodyReceipts.objectId))
    .where(eq(custodyReceipts.objectId, objectId))
    .orderBy(desc(custodyReceipts.date), desc(rowid))
    .all()
    .map(flat);
}

export type ReceiptFilter = { direction?: "in" | "out"; kind?: CustodyKind; from?: string; to?: string; page: number; pageSize: number };

/** Receipts across objects, newest first; the (date, id) index gives the order and the date range. */
export function listReceipts(db: Db, q: ReceiptFilter): { items: ReceiptRow[]; total: number } {
  const where: SQL[] = [];
  if (q.direction) where.push(eq(custodyReceipts.direction, q.direction));
  if (q.kind) where.push(eq(custodyReceipts.kind, q.kind));
  if (q.from) where.push(gte(custodyReceipts.date, q.from));
  if (q.to) where.push(lte(custodyReceipts.date, q.to));
  const cond = where.length ? and(...where) : undefined;
  // The page is cut from the index alone; only its rows are joined to their objects.
  const pageIds = db
    .select({ id: custodyReceipts.id })
    .from(custodyReceipts)
    .where(cond)
    .orderBy(desc(custodyReceipts.date), desc(custodyReceipts.id))
    .limit(q.pageSize)
    .offset((q.page - 1) * q.pageSize)
    .all()
    .map((r) => r.id);
  const items = pageIds.length
    ? db
        .select(receiptColumns)
        .from(custodyReceipts)
        .innerJoin(objects, eq(objects.id, custodyReceipts.objectId))
        .where(inArray(custodyReceipts.id, pageIds))
        .orderBy(desc(custodyReceipts.date), desc(custodyReceipts.id))
        .all()
        .map(flat)
    : [];
  const total = db.select({ n: sql<number>`count(*)` }).from(custodyReceipts).where(cond).get()?.n ?? 0;
  return { items, total };
}

/** An in-studio item as one flat row: its object's fields as the item has them, and the receipt's columns (null without one). */
export type InStudioRow = Pick<InStudioItem, "objectId" | "objectNumber" | "title" | "clientId" | "clientName" | "location" | "since"> & {
  receiptId: string | null;
  receivedOn: string | null;
  fromParty: string | null;
  condition: string | null;
};

/**
 * Objects in the studio, each with its latest "in" receipt, oldest arrival first.
 * The status index picks the objects and one seek on (object_id, date) per object gives its arrival
 * date, which is all the sort needs; only the page's rows are then joined to their receipt and owner.
 */
export function listInStudio(db: Db, page: number, pageSize: number): { items: InStudioRow[]; total: number } {
  const latestIn = (objectId: SQL, column: SQL) =>
    sql`(select ${column} from ${custodyReceipts} ri where ri.object_id = ${objectId} and ri.direction = 'in' order by ri.date desc, ri.rowid desc limit 1)`;
  const rows = db.all<InStudioRow>(sql`
    with page as (
      select o.id as object_id, o.object_number as object_number,
        coalesce(${latestIn(sql`o.id`, sql`ri.date`)}, date(o.created_at / 1000, 'unixepoch')) as since
      from ${objects} o
      where o.status = 'in-studio'
      order by since asc, o.object_number asc
      limit ${pageSize} offset ${(page - 1) * pageSize}
    )
    select p.object_id as objectId, o.object_number as objectNumber, o.title as title, o.client_id as clientId, c.name as clientName,
      o.location as location, r.id as receiptId, r.date as receivedOn, r.from_party as fromParty, r.condition as condition, p.since as since
    from page p
    join ${objects} o on o.id = p.object_id
    join ${clients} c on c.id = o.client_id
    left join ${custodyReceipts} r on r.rowid = ${latestIn(sql`p.object_id`, sql`ri.rowid`)}
    order by p.since asc, p.object_number asc
  `);
  const total = db.select({ n: sql<number>`count(*)` }).from(objects).where(eq(objects.status, "in-studio")).get()?.n ?? 0;
  return { items: rows, total };
}
