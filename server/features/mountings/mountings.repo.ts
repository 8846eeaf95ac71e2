import { and, desc, eq, ne } from "drizzle-orm";
import type { Db } from "../../db/client.ts";
import { mountingBatches, mountingRevisions, mountings, objects } from "../../db/schema.ts";
import type { MountingCreate, MountingData } from "../../../shared/schemas/mountings.ts";
import { boardBatches } from "../../../shared/domain/mounting.ts";
import { nextCheckDue } from "../../../shared/domain/condition.ts";
import { getSettings } from "../settings/settings.repo.ts";
import { revisionedRepo } from "../revisioned/revisioned.repo.ts";

export type MountingRow = typeof mountings.$inferSelect;
export type RevisionRow = typeof mountingRevisions.$inferSelect;

const filterCols = (d: MountingData) => ({ method: d.attachment.method, boardGrade: d.boards.window.grade, glazing: d.glazing.type });

/** The revisioned life cycle's Drizzle code, bound to the mountings' tables. */
const revisioned = revisionedRepo(mountings, mountingRevisions, "mountingId");
export const { revisionsOf, revision, currentRevisions } = revisioned;
export const findMounting = revisioned.find;

export function mountingsOfObject(db: Db, objectId: string): MountingRow[] {
  return db.select().from(mountings).where(eq(mountings.objectId, objectId)).orderBy(desc(mountings.mountedOn), desc(mountings.createdAt)).all();
}

function writeBatches(db: Db, mountingId: string, rev: number, data: MountingData) {
  for (const b of boardBatches(data)) db.insert(mountingBatches).values({ mountingId, revision: rev, role: b.role, batch: b.batch }).run();
}

export function insertDraft(db: Db, objectId: string, body: MountingCreate, user: { id: string; name: string }): string {
  const values = { objectId, reason: body.reason, mountedOn: body.mountedOn, framerId: user.id, framerName: user.name, createdBy: user.id, ...filterCols(body.data) };
  const id = revisioned.insertDraft(db, values, body.data, user);
  writeBatches(db, id, 1, body.data);
  return id;
}

/** Rewrites a draft in place (only drafts may change); false when the version is stale. */
export function updateDraft(db: Db, row: MountingRow, version: number, body: MountingCreate): boolean {
  if (!revisioned.rewriteDraft(db, row.id, version, { reason: body.reason, mountedOn: body.mountedOn, ...filterCols(body.data) }, body.data)) return false;
  db.delete(mountingBatches).where(eq(mountingBatches.mountingId, row.id)).run();
  writeBatches(db, row.id, 1, body.data);
  return true;
}

export function setStatus(db: Db, row: MountingRow, version: number, patch: Partial<MountingRow>): boolean {
  return revisioned.updateIfVersion(db, row.id, version, patch);
}

export function addRevision(db: Db, row: MountingRow, version: number, data: MountingData, reason: string, user: { id: string; name: string }): number | null {
  const n = revisioned.addRevision(db, row, version, { data, reason, user, patch: filterCols(data) });
  if (n !== null) writeBatches(db, row.id, n, data);
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
