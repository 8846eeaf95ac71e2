import { and, eq, gte, inArray, lte, sql, type SQL } from "drizzle-orm";
import type { Db } from "../../db/client.ts";
import { countWhere, newestFirstPage } from "../../db/register-page.ts";
import { mountingBatches, mountings, objects, user } from "../../db/schema.ts";
import type { MountingListItem, MountingListQuery, MountingStatus } from "../../../shared/schemas/mountings.ts";

const ROLE_ORDER: Record<string, number> = { window: 0, backing: 1, top: 2 };

/**
 * Every mounting record across objects, newest first, for the mountings register. The filters run on
 * columns copied from each record's current revision (method) and on its own columns; the batch filter
 * looks at every revision's boards, so a batch corrected away still finds the record it was used in.
 */
export function listMountings(db: Db, q: MountingListQuery): { items: MountingListItem[]; total: number } {
  const where: SQL[] = [];
  if (q.framerId) where.push(eq(mountings.framerId, q.framerId));
  if (q.from) where.push(gte(mountings.mountedOn, q.from));
  if (q.to) where.push(lte(mountings.mountedOn, q.to));
  if (q.method) where.push(eq(mountings.method, q.method));
  if (q.status) where.push(eq(mountings.status, q.status));
  if (q.batch) {
    where.push(sql`${mountings.id} in (select ${mountingBatches.mountingId} from ${mountingBatches} where ${mountingBatches.batch} = ${q.batch} collate nocase)`);
  }
  const cond = where.length ? and(...where) : undefined;
  const select = db
    .select({
      id: mountings.id,
      objectId: mountings.objectId,
      objectNumber: objects.objectNumber,
      objectTitle: objects.title,
      status: mountings.status,
      reason: mountings.reason,
      mountedOn: mountings.mountedOn,
      framerName: mountings.framerName,
      method: mountings.method,
      boardGrade: mountings.boardGrade,
      glazing: mountings.glazing,
      currentRevision: mountings.currentRevision,
    })
    .from(mountings)
    .innerJoin(objects, eq(objects.id, mountings.objectId))
    .$dynamic();
  const rows = newestFirstPage(select, mountings.mountedOn, mountings.id, cond, q).all();
  // Every mounting has its object (a not-null foreign key), so the count needs no join.
  const total = countWhere(db, mountings, cond);

  const batches = new Map<string, { role: string; batch: string }[]>();
  if (rows.length) {
    const found = db
      .select({ mountingId: mountingBatches.mountingId, revision: mountingBatches.revision, role: mountingBatches.role, batch: mountingBatches.batch })
      .from(mountingBatches)
      .where(
        inArray(
          mountingBatches.mountingId,
          rows.map((r) => r.id),
        ),
      )
      .all();
    const current = new Map(rows.map((r) => [r.id, r.currentRevision]));
    for (const b of found) {
      if (current.get(b.mountingId) !== b.revision) continue;
      const list = batches.get(b.mountingId) ?? [];
      list.push(b);
      batches.set(b.mountingId, list);
    }
  }

  const items = rows.map(({ currentRevision: _r, ...r }) => {
    const own = (batches.get(r.id) ?? []).sort((a, b) => (ROLE_ORDER[a.role] ?? 9) - (ROLE_ORDER[b.role] ?? 9));
    return { ...r, status: r.status as MountingStatus, batches: [...new Set(own.map((b) => b.batch))] };
  });
  return { items, total };
}

/** The people who have made mounting records, for the framer filter (names as their accounts have them now). */
export function listFramers(db: Db): { id: string; name: string }[] {
  return db.select({ id: user.id, name: user.name }).from(user).where(sql`exists (select 1 from ${mountings} where ${mountings.framerId} = ${user.id})`).orderBy(user.name).all();
}
