import { and, desc, eq, gt, gte, inArray, lte, sql, type SQL } from "drizzle-orm";
import { randomUUID } from "node:crypto";
import type { Db } from "../../db/client.ts";
import { countWhere, newestFirstPage } from "../../db/register-page.ts";
import { conditionReports, conditionRevisions, conditionTerms, mountings, objects, photos, user } from "../../db/schema.ts";
import type { ConditionCreate, ConditionData, ConditionListQuery } from "../../../shared/schemas/condition.ts";
import { revisionedRepo } from "../revisioned/revisioned.repo.ts";

export type ReportRow = typeof conditionReports.$inferSelect;
export type RevisionRow = typeof conditionRevisions.$inferSelect;
export type TermRow = typeof conditionTerms.$inferSelect;

/** Columns copied from the current revision for the condition register's filters. */
const filterCols = (d: ConditionData) => ({ rating: d.overallRating, unresolvedCount: d.findings.filter((f) => !f.resolved).length });

/** The revisioned life cycle's Drizzle code, bound to the condition reports' tables. */
const revisioned = revisionedRepo(conditionReports, conditionRevisions, "reportId");
export const { revisionsOf, revision, currentRevisions } = revisioned;
export const findReport = revisioned.find;

export function reportsOfObject(db: Db, objectId: string): ReportRow[] {
  return db
    .select()
    .from(conditionReports)
    .where(eq(conditionReports.objectId, objectId))
    .orderBy(desc(conditionReports.reportDate), desc(conditionReports.createdAt), desc(conditionReports.id))
    .all();
}

export function insertDraft(db: Db, objectId: string, body: ConditionCreate, user: { id: string; name: string }): string {
  const values = {
    objectId,
    context: body.context,
    reportDate: body.reportDate,
    examinerId: user.id,
    examinerName: user.name,
    mountingId: body.mountingId,
    createdBy: user.id,
    ...filterCols(body.data),
  };
  return revisioned.insertDraft(db, values, body.data, user);
}

/** Rewrites a draft in place (only drafts may change); false when the version is stale or the report is signed. */
export function updateDraft(db: Db, row: ReportRow, version: number, body: ConditionCreate): boolean {
  return revisioned.rewriteDraft(db, row.id, version, { context: body.context, reportDate: body.reportDate, mountingId: body.mountingId, ...filterCols(body.data) }, body.data);
}

export function markSigned(db: Db, row: ReportRow, version: number, signedAt: Date, signedBy: string): boolean {
  return revisioned.updateIfVersion(db, row.id, version, { status: "signed", signedAt, signedBy }, "draft");
}

export function addRevision(db: Db, row: ReportRow, version: number, data: ConditionData, reason: string, user: { id: string; name: string }): number | null {
  return revisioned.addRevision(db, row, version, { data, reason, user, patch: filterCols(data), status: "signed" });
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
  const select = db
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
    .$dynamic();
  const items = newestFirstPage(select, conditionReports.reportDate, conditionReports.id, cond, q).all();
  // Every report has its object (a not-null foreign key), so the count needs no join.
  return { items, total: countWhere(db, conditionReports, cond) };
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
