import { asc, eq, sql } from "drizzle-orm";
import { randomUUID } from "node:crypto";
import type { Db } from "../../db/client.ts";
import { clients, objects } from "../../db/schema.ts";
import type { ClientCreate, ClientRecord } from "../../../shared/schemas/clients.ts";

type Row = typeof clients.$inferSelect;

function toRecord(row: Row, objectCount: number): ClientRecord {
  return {
    id: row.id,
    kind: row.kind,
    name: row.name,
    contactName: row.contactName,
    email: row.email,
    phone: row.phone,
    address: row.address,
    notes: row.notes,
    objectCount,
    createdAt: row.createdAt.toISOString(),
    updatedAt: row.updatedAt.toISOString(),
  };
}

// Columns are written table-qualified: drizzle leaves them bare in a one-table select, and a bare
// "id" inside the subquery would be objects.id, so every count came out 0.
const objectCount = sql<number>`(select count(*) from ${objects} where ${objects}.${sql.identifier(objects.clientId.name)} = ${clients}.${sql.identifier(clients.id.name)})`;

export function listClients(db: Db, onlyId: string | null): ClientRecord[] {
  const q = db.select({ row: clients, n: objectCount }).from(clients).orderBy(asc(clients.name));
  const rows = onlyId ? q.where(eq(clients.id, onlyId)).all() : q.all();
  return rows.map((r) => toRecord(r.row, r.n));
}

export function findClient(db: Db, id: string): ClientRecord | null {
  const r = db.select({ row: clients, n: objectCount }).from(clients).where(eq(clients.id, id)).get();
  return r ? toRecord(r.row, r.n) : null;
}

export function insertClient(db: Db, data: ClientCreate, id: string = randomUUID()): ClientRecord {
  db.insert(clients)
    .values({ id, ...data })
    .run();
  return findClient(db, id)!;
}

export function updateClient(db: Db, id: string, data: ClientCreate): ClientRecord | null {
  db.update(clients)
    .set({ ...data, updatedAt: new Date() })
    .where(eq(clients.id, id))
    .run();
  return findClient(db, id);
}
