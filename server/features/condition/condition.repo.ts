import { and, desc, eq, gt, gte, inArray, lte, sql, type SQL } from "drizzle-orm";
import { randomUUID } from "node:crypto";
import type { Db } from "../../db/client.ts";
import { conditionReports, conditionRevisions, conditionTerms, mountings, objects, photos, user } from "../../db/schema.ts";
import type { ConditionCreate, ConditionData, ConditionListQuery } from "../../../shared/schemas/condition.ts";

export type ReportRow = typeof conditionReports.$inferSelect;
export type RevisionRow = typeof conditionRevisions.$inferSelect;
export type TermRow = typeof conditionTerms.$inferSelect;

/** Columns copied from the current revision for the condition register's filters. */
const filterCols = (d: ConditionData) => ({ rating: d.overallRating, unresolvedCount: d.findings.filter((f) => !f.resolved).length });

export function findReport(db: Db, id: string): ReportRow | null {
  return db.select().from(conditionReports).where(eq(conditionReports.id, id)).get() ?? null;
}

export function reportsOfObject(db: Db, objectId: string): ReportRow[] {
  return db
    .select()
    .from(conditionReports)
    .where(eq(conditionReports.objectId, objectId))
    .orderBy(desc(conditionReports.reportDate), desc(conditionReports.createdAt), desc(conditionReports.id))
    .all();
}

export function revisionsOf(db: Db, reportId: string): RevisionRow[] {
  return db.select().from(conditionRevisions).where(eq(conditionRevisions.reportId, reportId)).orderBy(conditionRevisions.revision).all();
}

export function revision(db: Db, reportId: string, n: number): RevisionRow | null {
  return (
    db
      .select()
      .from(conditionRevisions)
      .where(and(eq(conditionRevisions.reportId, reportId), eq(conditionRevisions.revision, n)))
      .get() ?? null
  );
}

/** Current revisions for many reports at once (the object page lists all of an object's reports). */
export function currentRevisions(db: Db, rows: ReportRow[]): Map<string, RevisionRow> {
  if (rows.length === 0) return new Map();
  const all = db
    .select()
    .from(conditionRevisions)
    .where(
      inArray(
        conditionRevisions.reportId,
        rows.map((r) => r.id),
      ),
    )
    .all();
  const want = new Map(rows.map((r) => [r.id, r.currentRevision]));
  return new Map(all.filter((r) => want.get(r.reportId) === r.revision).map((r) => [r.reportId, r]));
}

export function insertDraft(db: Db, objectId: string, body: ConditionCreate, user: { id: string; name: string }): string {
  const id = randomUUID();
  db.insert(conditionReports)
    .values({
      id,
      objectId,
      status: "draft",
      context: body.context,
      reportDate: body.reportDate,
      examinerId: user.id,
      examinerName: user.name,
      mountingId: body.mountingId,
      currentRevision: 1,
      createdBy: user.id,
      ...filterCols(body.data),
    })
    .run();
  db.insert(conditionRevisions).values({ id: randomUUID(), reportId: id, revision: 1, data: body.data, createdBy: user.id, createdByName: user.name }).run();
  return id;
}

/** Rewrites a draft in place (only drafts may change); false when the version is stale or the report is signed. */
export function updateDraft(db: Db, row: ReportRow, version: number, body: ConditionCreate): boolean {
  const r = db
    .update(conditionReports)
    .set({ context: body.context, reportDate: body.reportDate, mountingId: body.mountingId, version: version + 1, updatedAt: new Date(), ...filterCols(body.data) })
    .where(and(eq(conditionReports.id, row.id), eq(conditionReports.version, version), eq(conditionReports.status, "draft")))
    .run();
  if (r.changes !== 1) return false;
  db.update(conditionRevisions)
    .set({ data: body.data, updatedAt: new Date() })
    .where(and(eq(conditionRevisions.reportId, row.id), eq(conditionRevisions.revision, 1)))
    .run();
  return true;
}

export function markSigned(db: Db, row: ReportRow, version: number, signedAt: Date, signedBy: string): boolean {
  const r = db
    .update(conditionReports)
    .set({ status: "signed", signedAt, signedBy, version: version + 1, updatedAt: new Date() })
    .where(and(eq(conditionReports.id, row.id), eq(conditionReports.version, version), eq(conditionReports.status, "draft")))
    .run();
  return r.changes === 1;
}

export function addRevision(db: Db, row: ReportRow, version: number, data: ConditionData, reason: string, user: { id: string; name: string }): number | null {
  const n = row.currentRevision + 1;
  const r = db
    .update(conditionReports)
    .set({ currentRevision: n, version: version + 1, updatedAt: new Date(), ...filterCols(data) })
    .where(and(eq(conditionReports.id, row.id), eq(conditionReports.version, version), eq(conditionReports.status, "signed")))
    .run();
  if (r.changes !== 1) return null;
  db.insert(conditionRevisions).values({ id: randomUUID(), reportId: row.id, revision: n, data, correctionReason: reason, createdBy: user.id, createdByName: user.name }).run();
  return n;
}

/** Sets the object's condition columns: the latest signed report's date and when the next check falls due. */
export function setObjectCondition(db: Db, objectId: string, lastConditionOn: string, checkDueOn: string) {
  db.update(objects).set({ lastConditionOn, checkDueOn }).where(eq(objects.id, objectId)).run();
}

export function findMountingOf(db: Db, id: string): { id: string; objectId: string; status: string } | null {
  return db.select({ id: mountings.id, objectId: mountings.objectId, status: mountings.status }).from(mountings).where(eq(mountings.id, id)).get() ?? null;
}

/** Which of these photo ids are photos of the object. */
export function photoIdsOfObject(db: Db, objectId: string, ids: string[]): Set<string> {
  if (ids.length === 0) return new Set();
  const rows = db
    .select({ id: photos.id })
    .from(photos)
    .where(and(eq(photos.objectId, objectId), inArray(photos.id, [...new Set(ids)])))
    .all();
  return new Set(rows.map((r) => r.id));
}

// ── Terms ────────────────────────────────────────────────────────────────

export function listTerms(db: Db, q: { list?: "paper" | "photograph"; all: boolean }): TermRow[] {
  const where: SQL[] = [];
  if (q.list) where.push(eq(conditionTerms.list, q.list));
  if (!q.all) where.push(eq(conditionTerms.active, true));
  return db
    .select()
    .from(conditionTerms)
    .where(where.length ? and(...where) : undefined)
    .orderBy(conditionTerms.list, conditionTerms.sortOrder, conditionTerms.term)
    .all();
}

/** Every term of the given lists, active or not (validation and cautions look them up by their words). */
export function termsOfLists(db: Db, lists: ("paper" | "photograph")[]): TermRow[] {
  return db.select().from(conditionTerms).where(inArray(conditionTerms.list, lists)).all();
}

export function findTerm(db: Db, id: string): TermRow | null {
  return db.select().from(conditionTerms).where(eq(conditionTerms.id, id)).get() ?? null;
}

/** A term of the list with the same words, ignoring case, other than `exceptId`. */
export function findTermByWords(db: Db, list: "paper" | "photograph", term: string, exceptId?: string): TermRow | null {
  const rows = db
    .select()
    .from(conditionTerms)
    .where(and(eq(conditionTerms.list, list), sql`lower(${conditionTerms.term}) = lower(${term})`))
    .all();
  return rows.find((r) => r.id !== exceptId) ?? null;
}

export function insertTerm(db: Db, t: { list: "paper" | "photograph"; term: string; caution: string | null; active: boolean }): string {
  const id = randomUUID();
  const max =
    db
      .select({ n: sql<number>`coalesce(max(${conditionTerms.sortOrder}), 0)` })
      .from(conditionTerms)
      .where(eq(conditionTerms.list, t.list))
      .get()?.n ?? 0;
  db.insert(conditionTerms)
    .values({ id, ...t, sortOrder: max + 1 })
    .run();
  return id;
}

export function updateTerm(db: Db, id: string, t: { list: "paper" | "photograph"; term: string; caution: string | null; active: boolean; sortOrder?: number }) {
  db.update(conditionTerms).set(t).where(eq(conditionTerms.id, id)).run();
}

// ── The condition register ───────────────────────────────────────────────

export type RegisterScope = { clientId: string | null; signedOnly: boolean } | "none";

function scopeWhere(scope: Exclude<RegisterScope, "none">): SQL[] {
  const where: SQL[] = [];
  if (scope.clientId) where.push(sql`${conditionReports.objectId} in (select ${objects.id} from ${objects} where ${objects.clientId} = ${scope.clientId})`);
  if (scope.signedOnly) where.push(eq(conditionReports.status, "signed"));
  return where;
}

/**
 * Reports across objects, newest first. The filters run on the report's own columns (rating and the
 * unresolved count are copied from its current revision) and, for "due by", on the object's check date.
 */
export function listReports(db: Db, q: ConditionListQuery, scope: RegisterScope) {
  if (scope === "none") return { items: [], total: 0 };
  const where = scopeWhere(scope);
  if (q.rating) where.push(eq(conditionReports.rating, q.rating));
  if (q.context) where.push(eq(conditionReports.context, q.context));
  if (q.from) where.push(gte(conditionReports.reportDate, q.from));
  if (q.to) where.push(lte(conditionReports.reportDate, q.to));
  if (q.examinerId) where.push(eq(conditionReports.examinerId, q.examinerId));
  if (q.unresolved === true) where.push(gt(conditionReports.unresolvedCount, 0));
  if (q.unresolved === false) where.push(eq(conditionReports.unresolvedCount, 0));
  if (q.dueBy) where.push(sql`${conditionReports.objectId} in (select ${objects.id} from ${objects} where ${objects.checkDueOn} <= ${q.dueBy})`);
  const cond = where.length ? and(...where) : undefined;
  const items = db
    .select({
      id: conditionReports.id,
      objectId: conditionReports.objectId,
      objectNumber: objects.objectNumber,
      objectTitle: objects.title,
      reportDate: conditionReports.reportDate,
      context: conditionReports.context,
      rating: conditionReports.rating,
      status: conditionReports.status,
      examinerName: conditionReports.examinerName,
      unresolvedCount: conditionReports.unresolvedCount,
      checkDueOn: objects.checkDueOn,
    })
    .from(conditionReports)
    .innerJoin(objects, eq(objects.id, conditionReports.objectId))
    .where(cond)
    .orderBy(desc(conditionReports.reportDate), desc(conditionReports.id))
    .limit(q.pageSize)
    .offset((q.page - 1) * q.pageSize)
    .all();
  // Every report has its object (a not-null foreign key), so the count needs no join.
  const total = db.select({ n: sql<number>`count(*)` }).from(conditionReports).where(cond).get()?.n ?? 0;
  return { items, total };
}

/** The people who examined the reports in scope, for the examiner filter (names as their accounts have them now). */
export function listExaminers(db: Db, scope: RegisterScope): { id: string; name: string }[] {
  if (scope === "none") return [];
  const inScope = scopeWhere(scope);
  return db
    .select({ id: user.id, name: user.name })
    .from(user)
    .where(sql`exists (select 1 from ${conditionReports} where ${conditionReports.examinerId} = ${user.id}${inScope.length ? sql` and ${and(...inScope)}` : sql``})`)
    .orderBy(user.name)
    .all();
}
