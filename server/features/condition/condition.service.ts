import type { Db } from "../../db/client.ts";
import { inTransaction } from "../../db/client.ts";
import { isCalendarDate } from "../../../shared/domain/dates.ts";
import type { SessionUser } from "../../../shared/schemas/auth.ts";
import {
  RATING_LABELS,
  TWO_PARTY_CONTEXTS,
  type ConditionContext,
  type ConditionCreate,
  type ConditionData,
  type ConditionListQuery,
  type ConditionReport,
  type ConditionRevision,
  type Rating,
  type Term,
} from "../../../shared/schemas/condition.ts";
import { compareFindings, nextCheckDue, type ComparedFinding } from "../../../shared/domain/condition.ts";
import { diffValues, type Change } from "../../../shared/domain/diff.ts";
import { can, isStudio } from "../../../shared/permissions.ts";
import { AppError, conflict, notFound } from "../../lib/errors.ts";
import { assertCan } from "../../middleware/require-permission.ts";
import { getSettings } from "../settings/settings.repo.ts";
import { findObject, type ObjectRow } from "../objects/objects.repo.ts";
import { appendEvent } from "../history/history.chain.ts";
import * as repo from "./condition.repo.ts";

const STALE = "Someone else changed this condition report while you were working on it. Your entries are still in the form: reload to see theirs, then try again.";

/** How a report's context reads in a sentence: "Condition on arrival", "Condition at a periodic check". */
export const CONTEXT_PHRASES: Record<ConditionContext, string> = {
  arrival: "on arrival",
  "before-mounting": "before mounting",
  "after-mounting": "after mounting",
  "periodic-check": "at a periodic check",
  "loan-out": "at loan out",
  "loan-return": "on return from loan",
  incident: "after an incident",
  claim: "for a claim",
};

const NOT_A_DAY = "That day is not in the calendar; use a date such as 2026-11-30.";

/** One 422 naming every field at fault, in the one error shape. */
function invalid(fields: Record<string, string>): AppError {
  const keys = Object.keys(fields);
  const message =
    keys.length === 1 ? `Check ${keys[0]}: ${fields[keys[0]]}` : `Check the ${keys.length} highlighted fields: ${keys.slice(0, 4).join(", ")}${keys.length > 4 ? "…" : ""}.`;
  return new AppError("validation_failed", message, fields);
}

/** Photographs may use the paper terms as well as their own (docs/trade-reference.md §14); everything else uses the paper list. */
const listsFor = (objectType: string): ("paper" | "photograph")[] => (objectType === "photograph" ? ["paper", "photograph"] : ["paper"]);

const distinct = <T>(xs: T[]) => [...new Set(xs)];
const max = (...xs: (string | null | undefined)[]) =>
  xs
    .filter((x): x is string => !!x)
    .sort()
    .pop() ?? null;

/** The missing signatures of a report about to be signed (or a signed report being corrected). */
function signatureFields(context: string, data: ConditionData): Record<string, string> {
  const fields: Record<string, string> = {};
  const { examiner, otherParty } = data.signatures;
  if (!examiner) fields["data.signatures.examiner"] = "The examiner signs the report: give their name and the date.";
  else if (!isCalendarDate(examiner.date)) fields["data.signatures.examiner.date"] = NOT_A_DAY;
  if (TWO_PARTY_CONTEXTS.includes(context as ConditionContext)) {
    if (!otherParty) fields["data.signatures.otherParty"] = "A loan report is signed by both parties: give the other party's name and the date.";
    else if (!isCalendarDate(otherParty.date)) fields["data.signatures.otherParty.date"] = NOT_A_DAY;
  } else if (otherParty && !isCalendarDate(otherParty.date)) fields["data.signatures.otherParty.date"] = NOT_A_DAY;
  return fields;
}

/** "Condition on arrival: fair — 3 findings (foxing, tear, mould). Examined by X." Never valuations. */
export function conditionSummary(context: string, examinerName: string, data: ConditionData): string {
  const terms = distinct(data.findings.map((f) => f.term));
  const n = data.findings.length;
  const findings = n === 0 ? "no findings" : `${n} finding${n === 1 ? "" : "s"} (${terms.join(", ")})`;
  const other = TWO_PARTY_CONTEXTS.includes(context as ConditionContext) && data.signatures.otherParty ? ` Signed for the other party by ${data.signatures.otherParty.name}.` : "";
  return `Condition ${CONTEXT_PHRASES[context as ConditionContext] ?? context}: ${RATING_LABELS[data.overallRating].toLowerCase()} — ${findings}. Examined by ${examinerName}.${other}`;
}

export function toTerm(r: repo.TermRow): Term {
  return { id: r.id, list: r.list, term: r.term, caution: r.caution, active: r.active, sortOrder: r.sortOrder };
}

export function createConditionService(db: Db, clock: () => Date = () => new Date()) {
  /** A draft is read only by those who may write it (shared/permissions.ts). */
  const sees = (user: SessionUser, o: ObjectRow, r: { status: string }) => can(user, "condition:read", { clientId: o.clientId, draft: r.status === "draft" });

  /** Handling cautions of the findings' terms, each once, in the order the findings give them. Retired terms keep theirs. */
  function cautionsFor(data: ConditionData, o: ObjectRow): string[] {
    if (data.findings.length === 0) return [];
    const byWords = new Map<string, string>();
    for (const t of repo.termsOfLists(db, listsFor(o.objectType))) if (t.caution) byWords.set(t.term.toLowerCase(), t.caution);
    return distinct(data.findings.map((f) => byWords.get(f.term.toLowerCase())).filter((c): c is string => !!c));
  }

  function toRevision(r: repo.RevisionRow): ConditionRevision {
    return { revision: r.revision, data: r.data, correctionReason: r.correctionReason, createdAt: r.createdAt.toISOString(), createdByName: r.createdByName };
  }

  function toReport(row: repo.ReportRow, o: ObjectRow, rev?: repo.RevisionRow): ConditionReport {
    const current = toRevision(rev ?? repo.revision(db, row.id, row.currentRevision)!);
    return {
      id: row.id,
      objectId: row.objectId,
      objectNumber: o.objectNumber,
      objectTitle: o.title,
      status: row.status,
      context: row.context as ConditionContext,
      reportDate: row.reportDate,
      examinerName: row.examinerName,
      mountingId: row.mountingId,
      rating: row.rating as Rating,
      currentRevision: row.currentRevision,
      signedAt: row.signedAt ? row.signedAt.toISOString() : null,
      version: row.version,
      current,
      cautions: cautionsFor(current.data, o),
    };
  }

  function loadObject(user: SessionUser, objectId: string): ObjectRow {
    const o = findObject(db, objectId);
    if (!o) throw notFound("That object");
    assertCan(user, "condition:read", { clientId: o.clientId }, { readAction: "condition:read", what: "That object" });
    return o;
  }

  /** A report the user may see: drafts only to those who may write them (404 otherwise, so a draft's existence is not revealed). */
  function load(user: SessionUser, id: string) {
    const row = repo.findReport(db, id);
    if (!row) throw notFound("That condition report");
    const o = findObject(db, row.objectId)!;
    assertCan(user, "condition:read", { clientId: o.clientId }, { readAction: "condition:read", what: "That condition report" });
    if (!sees(user, o, row)) throw notFound("That condition report");
    return { row, o };
  }

  function write(user: SessionUser, id: string) {
    const l = load(user, id);
    assertCan(user, "condition:write", { clientId: l.o.clientId }, { readAction: "condition:read", what: "That condition report" });
    return l;
  }

  /**
   * The checks the contract cannot make alone: a real report date, a mounting and photos of the same object,
   * and findings named from the vocabulary. A term already in the report may stay after it is retired, so
   * correcting an old report never forces its words to change. Returns the data with terms spelt as the list has them.
   */
  function checkContent(
    user: SessionUser,
    o: ObjectRow,
    body: { reportDate?: string; mountingId?: string | null; data: ConditionData },
    keep: ConditionData | null,
  ): ConditionData {
    const fields: Record<string, string> = {};
    if (body.reportDate !== undefined && !isCalendarDate(body.reportDate)) fields.reportDate = NOT_A_DAY;
    if (body.mountingId) {
      const m = repo.findMountingOf(db, body.mountingId);
      // A draft mounting is studio work; to anyone else it does not exist.
      const visible = m && m.objectId === o.id && can(user, "mounting:read", { clientId: o.clientId, draft: m.status === "draft" });
      if (!visible) fields.mountingId = "Choose a mounting record of this object.";
    }
    const found = repo.photoIdsOfObject(db, o.id, body.data.photoIds);
    body.data.photoIds.forEach((p, i) => {
      if (!found.has(p)) fields[`data.photoIds.${i}`] = "That photo is not one of this object's photos.";
    });
    const lists = listsFor(o.objectType);
    const terms = repo.termsOfLists(db, lists);
    const active = new Map(terms.filter((t) => t.active).map((t) => [t.term.toLowerCase(), t.term]));
    const kept = new Set((keep?.findings ?? []).map((f) => f.term.toLowerCase()));
    const findings = body.data.findings.map((f, i) => {
      const words = f.term.trim().toLowerCase();
      const term = active.get(words) ?? (kept.has(words) ? (terms.find((t) => t.term.toLowerCase() === words)?.term ?? f.term) : null);
      if (term === null) {
        const retired = terms.some((t) => t.term.toLowerCase() === words);
        fields[`data.findings.${i}.term`] = retired
          ? `“${f.term}” has been retired from the vocabulary; choose a current term.`
          : `“${f.term}” is not in the ${lists.length === 2 ? "vocabulary for photographs (paper or photograph terms)" : "vocabulary for paper"}; choose a term from the list.`;
        return f;
      }
      return { ...f, term };
    });
    if (Object.keys(fields).length) throw invalid(fields);
    return { ...body.data, findings };
  }

  return {
    listForObject(user: SessionUser, objectId: string): ConditionReport[] {
      const o = loadObject(user, objectId);
      // Drafts are work in progress: those who may only read see reports once they are signed.
      const rows = repo.reportsOfObject(db, objectId).filter((r) => sees(user, o, r));
      const revs = repo.currentRevisions(db, rows);
      return rows.map((r) => toReport(r, o, revs.get(r.id)));
    },

    get(user: SessionUser, id: string): ConditionReport {
      const { row, o } = load(user, id);
      return toReport(row, o);
    },

    revisions(user: SessionUser, id: string): (ConditionRevision & { changes: Change[] })[] {
      load(user, id);
      const revs = repo.revisionsOf(db, id).map(toRevision);
      return revs.map((r, i) => ({ ...r, changes: i === 0 ? [] : diffValues(revs[i - 1].data, r.data) }));
    },

    create(user: SessionUser, objectId: string, body: ConditionCreate): ConditionReport {
      const o = loadObject(user, objectId);
      assertCan(user, "condition:write", { clientId: o.clientId }, { readAction: "condition:read", what: "That object" });
      const data = checkContent(user, o, body, null);
      const id = inTransaction(db, (t) => repo.insertDraft(t, objectId, { ...body, data }, user));
      return toReport(repo.findReport(db, id)!, o);
    },

    updateDraft(user: SessionUser, id: string, body: ConditionCreate & { version: number }): ConditionReport {
      const { row, o } = write(user, id);
      if (row.status !== "draft") throw conflict("This condition report is signed and locked; make a correction instead, with a reason.");
      const data = checkContent(user, o, body, repo.revision(db, id, 1)!.data);
      const ok = inTransaction(db, (t) => repo.updateDraft(t, row, body.version, { ...body, data }));
      if (!ok) throw conflict(STALE);
      return toReport(repo.findReport(db, id)!, o);
    },

    sign(user: SessionUser, id: string, version: number): ConditionReport {
      const { row, o } = write(user, id);
      if (row.status !== "draft") throw conflict("This condition report is already signed.");
      if (row.version !== version) throw conflict(STALE);
      const data = repo.revision(db, id, row.currentRevision)!.data;
      const missing = signatureFields(row.context, data);
      if (Object.keys(missing).length) throw invalid(missing);
      const now = clock();
      const ok = inTransaction(db, (d) => {
        if (!repo.markSigned(d, row, version, now, user.id)) return false;
        // Read inside the transaction, so two reports signed at once cannot both win with stale dates.
        const fresh = findObject(d, row.objectId)!;
        const lastConditionOn = max(fresh.lastConditionOn, row.reportDate)!;
        // Due a studio interval after the last check or mounting, whichever is later (as mountings count it).
        const from = max(lastConditionOn, fresh.lastMountedOn)!;
        repo.setObjectCondition(d, row.objectId, lastConditionOn, nextCheckDue(from, fresh.status, getSettings(db)));
        appendEvent(d, {
          objectId: row.objectId,
          type: "condition-reported",
          actor: user,
          at: now,
          occurredOn: row.reportDate,
          summary: conditionSummary(row.context, row.examinerName, data),
          data: {
            reportId: row.id,
            revision: row.currentRevision,
            context: row.context,
            reportDate: row.reportDate,
            rating: data.overallRating,
            findings: data.findings.length,
            unresolved: data.findings.filter((f) => !f.resolved).length,
            terms: distinct(data.findings.map((f) => f.term)),
          },
        });
        return true;
      });
      if (!ok) throw conflict(STALE);
      return toReport(repo.findReport(db, id)!, o);
    },

    correct(user: SessionUser, id: string, body: { version: number; correctionReason: string; data: ConditionData }): ConditionReport {
      const { row, o } = write(user, id);
      if (row.status === "draft") throw conflict("A draft is edited directly; corrections are for signed reports.");
      if (row.version !== body.version) throw conflict(STALE);
      const before = repo.revision(db, id, row.currentRevision)!.data;
      const data = checkContent(user, o, { data: body.data }, before);
      const missing = signatureFields(row.context, data);
      if (Object.keys(missing).length) throw invalid(missing);
      const changes = diffValues(before, data);
      if (changes.length === 0) throw new AppError("validation_failed", "Check data: the correction changes nothing.", { data: "Change at least one entry, or cancel." });
      const now = clock();
      const ok = inTransaction(db, (d) => {
        const n = repo.addRevision(d, row, body.version, data, body.correctionReason, user);
        if (n === null) return false;
        appendEvent(d, {
          objectId: row.objectId,
          type: "condition-reported",
          actor: user,
          at: now,
          summary: `Condition report of ${row.reportDate} (${CONTEXT_PHRASES[row.context as ConditionContext] ?? row.context}) corrected (revision ${n}): ${body.correctionReason}`,
          data: { reportId: row.id, revision: n, corrected: true, rating: data.overallRating, changes },
        });
        return true;
      });
      if (!ok) throw conflict(STALE);
      return toReport(repo.findReport(db, id)!, o);
    },

    /** Two reports of one object, earlier and later by report date whichever way they are asked for. */
    compare(user: SessionUser, fromId: string, toId: string): { earlier: ConditionReport; later: ConditionReport; findings: ComparedFinding[] } {
      const a = load(user, fromId);
      const b = load(user, toId);
      if (a.row.id === b.row.id) throw invalid({ to: "Choose two different reports to compare." });
      if (a.row.objectId !== b.row.objectId) throw invalid({ to: "Choose two reports of the same object." });
      const aFirst = a.row.reportDate < b.row.reportDate || (a.row.reportDate === b.row.reportDate && a.row.createdAt.getTime() <= b.row.createdAt.getTime());
      const [e, l] = aFirst ? [a, b] : [b, a];
      const earlier = toReport(e.row, e.o);
      const later = toReport(l.row, l.o);
      return { earlier, later, findings: compareFindings(earlier.current.data, later.current.data) };
    },

    /** The condition register: the studio sees every report, a client's users their own objects' (collectors signed ones only). */
    list(user: SessionUser, q: ConditionListQuery) {
      const scope: repo.RegisterScope = isStudio(user)
        ? { clientId: null, signedOnly: false }
        : user.clientId
          ? { clientId: user.clientId, signedOnly: !can(user, "condition:read", { clientId: user.clientId, draft: true }) }
          : "none";
      const { items, total } = repo.listReports(db, q, scope);
      return {
        items: items.map((r) => ({ ...r, context: r.context as ConditionContext, rating: r.rating as Rating })),
        total,
        page: q.page,
        pageSize: q.pageSize,
        examiners: repo.listExaminers(db, scope),
      };
    },
  };
}

/** The controlled vocabulary. Terms are never deleted: a retired term keeps old reports' words (and cautions). */
export function createTermsService(db: Db) {
  const duplicate = (list: string, term: string) =>
    conflict(`“${term}” is already in the ${list} list.`, { term: "This term is already in the list; edit that one, or bring it back if it was retired." });

  return {
    list(user: SessionUser, q: { list?: "paper" | "photograph"; all: boolean }): Term[] {
      if (q.all) assertCan(user, "terms:manage", { clientId: null }, { readAction: "settings:read" });
      return repo.listTerms(db, q).map(toTerm);
    },

    create(t: { list: "paper" | "photograph"; term: string; caution: string | null; active: boolean }): Term {
      const id = inTransaction(db, (d) => {
        if (repo.findTermByWords(d, t.list, t.term)) throw duplicate(t.list, t.term);
        return repo.insertTerm(d, t);
      });
      return toTerm(repo.findTerm(db, id)!);
    },

    update(id: string, t: { list: "paper" | "photograph"; term: string; caution: string | null; active: boolean; sortOrder?: number }): Term {
      inTransaction(db, (d) => {
        if (!repo.findTerm(d, id)) throw notFound("That term");
        if (repo.findTermByWords(d, t.list, t.term, id)) throw duplicate(t.list, t.term);
        repo.updateTerm(d, id, t);
      });
      return toTerm(repo.findTerm(db, id)!);
    },
  };
}
