import { and, desc, eq, inArray, ne } from "drizzle-orm";
import { randomUUID } from "node:crypto";
import type { Db } from "../../db/client.ts";
import { mountingBatches, mountingRevisions, mountings, objects } from "../../db/schema.ts";
import type { MountingCreate, MountingData } from "../../../shared/schemas/mountings.ts";
import { boardBatches } from "../../../shared/domain/mounting.ts";
import { nextCheckDue } from "../../../shared/domain/condition.ts";
import { getSettings } from "../settings/settings.repo.ts";

export type MountingRow = typeof mountings.$inferSelect;
export type RevisionRow = typeof mountingRevisions.$inferSelect;

const filterCols = (d: MountingData) => ({ method: d.attachment.method, boardGrade: d.boards.window.grade, glazing: d.glazing.type });

export function findMounting(db: Db, id: string): MountingRow | null {
  return db.select().from(mountings).where(eq(mountings.id, id)).get() ?? null;
}

export function mountingsOfObject(db: Db, objectId: string): MountingRow[] {
  return db.select().from(mountings).where(eq(mountings.objectId, objectId)).orderBy(desc(mountings.mountedOn), desc(mountings.createdAt)).all();
}

export function revisionsOf(db: Db, mountingId: string): RevisionRow[] {
  return db.select().from(mountingRevisions).where(eq(mountingRevisions.mountingId, mountingId)).orderBy(mountingRevisions.revision).all();
}

export function revision(db: Db, mountingId: string, n: number): RevisionRow | null {
  return (
    db
      .select()
      .from(mountingRevisions)
      .where(and(eq(mountingRevisions.mountingId, mountingId), eq(mountingRevisions.revision, n)))
      .get() ?? null
  );
}

/** Revisions for many records at once (the object page lists all of an object's records). */
export function currentRevisions(db: Db, rows: MountingRow[]): Map<string, RevisionRow> {
  if (rows.length === 0) return new Map();
  const all = db
    .select()
    .from(mountingRevisions)
    .where(
      inArray(
        mountingRevisions.mountingId,
        rows.map((r) => r.id),
      ),
    )
    .all();
  const want = new Map(rows.map((r) => [r.id, r.currentRevision]));
  return new Map(all.filter((r) => want.get(r.mountingId) === r.revision).map((r) => [r.mountingId, r]));
}

function writeBatches(db: Db, mountingId: string, rev: number, data: MountingData) {
  for (const b of boardBatches(data)) db.insert(mountingBatches).values({ mountingId, revision: rev, role: b.role, batch: b.batch }).run();
}

export function insertDraft(db: Db, objectId: string, body: MountingCreate, user: { id: string; name: string }): string {
  const id = randomUUID();
  db.insert(mountings)
    .values({
      id,
      objectId,
      status: "draft",
      reason: body.reason,
      mountedOn: body.mountedOn,
      framerId: user.id,
      framerName: user.name,
      currentRevision: 1,
      createdBy: user.id,
      ...filterCols(body.data),
    })
    .run();
  db.insert(mountingRevisions).values({ id: randomUUID(), mountingId: id, revision: 1, data: body.data, createdBy: user.id, createdByName: user.name }).run();
  writeBatches(db, id, 1, body.data);
  return id;
}

/** Rewrites a draft in place (only drafts may change); false when the version is stale. */
export function updateDraft(db: Db, row: MountingRow, version: number, body: MountingCreate): boolean {
  const r = db
    .update(mountings)
    .set({ reason: body.reason, mountedOn: body.mountedOn, version: version + 1, updatedAt: new Date(), ...filterCols(body.data) })
    .where(and(eq(mountings.id, row.id), eq(mountings.version, version), eq(mountings.status, "draft")))
    .run();
  if (r.changes !== 1) return false;
  db.update(mountingRevisions)
    .set({ data: body.data, updatedAt: new Date() })
    .where(and(eq(mountingRevisions.mountingId, row.id), eq(mountingRevisions.revision, 1)))
    .run();
  db.delete(mountingBatches).where(eq(mountingBatches.mountingId, row.id)).run();
  writeBatches(db, row.id, 1, body.data);
  return true;
}

export function setStatus(db: Db, row: MountingRow, version: number, patch: Partial<MountingRow>): boolean {
  const r = db
    .update(mountings)
    .set({ ...patch, version: version + 1, updatedAt: new Date() })
    .where(and(eq(mountings.id, row.id), eq(mountings.version, version)))
    .run();
  return r.changes === 1;
}

export function addRevision(db: Db, row: MountingRow, version: number, data: MountingData, reason: string, user: { id: string; name: string }): number | null {
  const n = row.currentRevision + 1;
  if (!setStatus(db, row, version, { currentRevision: n, ...filterCols(data) })) return null;
  db.insert(mountingRevisions).values({ id: randomUUID(), mountingId: row.id, revision: n, data, correctionReason: reason, createdBy: user.id, createdByName: user.name }).run();
  writeBatches(db, row.id, n, data);
  return n;
}

/**
 * The mounting the object was in on `date` (an ISO date): the latest one mounted on or before it
 * that had not ended by then. Drafts were never built, so they never count.
 */
export function mountingInPlaceOn(db: Db, objectId: string, date: string): MountingRow | null {
  const rows = db
    .select()
    .from(mountings)
    .where(and(eq(mountings.objectId, objectId), ne(mountings.status, "draft")))
    .all();
  return (
    rows.filter((m) => m.mountedOn <= date && (!m.endedOn || m.endedOn > date)).sort((a, b) => (a.mountedOn < b.mountedOn ? 1 : a.mountedOn > b.mountedOn ? -1 : 0))[0] ?? null
  );
}

/** The object's current completed mounting other than `exceptId`, if any. */
export function currentCompleted(db: Db, objectId: string, exceptId: string): MountingRow | null {
  return (
    db
      .select()
      .from(mountings)
      .where(and(eq(mountings.objectId, objectId), eq(mountings.status, "completed"), ne(mountings.id, exceptId)))
      .get() ?? null
  );
}

/** Keeps the object's register columns in step with its current mounting. */
export function setObjectCurrentMount(db: Db, objectId: string, m: { id: string; data: MountingData; mountedOn: string } | null) {
  const o = db.select({ lastConditionOn: objects.lastConditionOn, status: objects.status }).from(objects).where(eq(objects.id, objectId)).get();
  const from = m ? [o?.lastConditionOn, m.mountedOn].filter(Boolean).sort().pop()! : null;
  db.update(objects)
    .set(
      m
        ? {
            currentMountingId: m.id,
            currentMethod: m.data.attachment.method,
            currentBoardGrade: m.data.boards.window.grade,
            currentGlazing: m.data.glazing.type,
            lastMountedOn: m.mountedOn,
            checkDueOn: nextCheckDue(from!, o?.status ?? "in-studio", getSettings(db)),
          }
        : { currentMountingId: null, currentMethod: null, currentBoardGrade: null, currentGlazing: null },
    )
    .where(eq(objects.id, objectId))
    .run();
}
