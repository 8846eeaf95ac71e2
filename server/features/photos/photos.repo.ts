import { and, asc, eq, or, sql } from "drizzle-orm";
import { randomUUID } from "node:crypto";
import type { Db } from "../../db/client.ts";
import { conditionReports, objects, photos } from "../../db/schema.ts";

export type PhotoRow = typeof photos.$inferSelect;
/** A photo with its object's owner, which decides who may see it. */
export type PhotoWithOwner = PhotoRow & { clientId: string; objectNumber: string };

export type PhotoInsert = Omit<typeof photos.$inferInsert, "id" | "createdAt" | "updatedAt">;

// Photos of one object are shown in the order they were added; rowid breaks ties within a millisecond.
const rowid = sql`${photos}.rowid`;

export function insertPhoto(db: Db, data: PhotoInsert): string {
  const id = randomUUID();
  db.insert(photos)
    .values({ id, ...data })
    .run();
  return id;
}

export function findPhoto(db: Db, id: string): PhotoWithOwner | null {
  const row = db
    .select({ p: photos, clientId: objects.clientId, objectNumber: objects.objectNumber })
    .from(photos)
    .innerJoin(objects, eq(objects.id, photos.objectId))
    .where(eq(photos.id, id))
    .get();
  return row ? { ...row.p, clientId: row.clientId, objectNumber: row.objectNumber } : null;
}

export function listForObject(db: Db, objectId: string, reportId?: string): PhotoRow[] {
  const where = reportId ? and(eq(photos.objectId, objectId), eq(photos.reportId, reportId)) : eq(photos.objectId, objectId);
  return db.select().from(photos).where(where).orderBy(asc(photos.createdAt), asc(rowid)).all();
}

export function updatePhoto(db: Db, id: string, data: { kind: string; caption: string | null }): boolean {
  return (
    db
      .update(photos)
      .set({ ...data, updatedAt: new Date() })
      .where(eq(photos.id, id))
      .run().changes === 1
  );
}

/** True when any photo row names this storage key (files are shared by content, so one may serve two rows). */
export function keyInUse(db: Db, key: string): boolean {
  const row = db
    .select({ id: photos.id })
    .from(photos)
    .where(or(eq(photos.originalKey, key), eq(photos.fullKey, key), eq(photos.webKey, key), eq(photos.thumbKey, key)))
    .limit(1)
    .get();
  return !!row;
}

export function findReport(db: Db, id: string): { id: string; objectId: string; status: string } | null {
  return (
    db.select({ id: conditionReports.id, objectId: conditionReports.objectId, status: conditionReports.status }).from(conditionReports).where(eq(conditionReports.id, id)).get() ??
    null
  );
}
