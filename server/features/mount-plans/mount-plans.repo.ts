import { and, desc, eq } from "drizzle-orm";
import { randomUUID } from "node:crypto";
import type { Db } from "../../db/client.ts";
import { mountPlans } from "../../db/schema.ts";
import type { MountPlanParsed } from "../../../shared/schemas/mount-plan.ts";

export type PlanRow = typeof mountPlans.$inferSelect;

export function findDraft(db: Db, objectId: string): PlanRow | null {
  return (
    db
      .select()
      .from(mountPlans)
      .where(and(eq(mountPlans.objectId, objectId), eq(mountPlans.status, "draft")))
      .orderBy(desc(mountPlans.updatedAt))
      .limit(1)
      .get() ?? null
  );
}

export function insertDraft(db: Db, objectId: string, input: MountPlanParsed, userId: string): PlanRow {
  const id = randomUUID();
  db.insert(mountPlans).values({ id, objectId, status: "draft", schemaVersion: input.schemaVersion, input, createdBy: userId, updatedBy: userId }).run();
  return db.select().from(mountPlans).where(eq(mountPlans.id, id)).get()!;
}

/** Writes only over the version the edit started from; null on a stale edit. */
export function updateDraft(db: Db, id: string, version: number, input: MountPlanParsed, userId: string): PlanRow | null {
  const r = db
    .update(mountPlans)
    .set({ input, schemaVersion: input.schemaVersion, version: version + 1, updatedBy: userId, updatedAt: new Date() })
    .where(and(eq(mountPlans.id, id), eq(mountPlans.version, version)))
    .run();
  return r.changes === 1 ? db.select().from(mountPlans).where(eq(mountPlans.id, id)).get()! : null;
}
