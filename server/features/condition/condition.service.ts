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
import type { Correction } from "../../../shared/schemas/revisioned.ts";
import { can, isStudio } from "../../../shared/permissions.ts";
import { AppError, conflict, notFound } from "../../lib/errors.ts";
import { assertCan } from "../../middleware/require-permission.ts";
import { getSettings } from "../settings/settings.repo.ts";
import { findObject, type ObjectRow } from "../objects/objects.repo.ts";
import { lockMessages, recordFields, revisionedService, revisionFields } from "../revisioned/revisioned.service.ts";
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
  const [only] = keys;
  const message =
    keys.length === 1 && only ? `Check ${only}: ${fields[only]}` : `Check the ${keys.length} highlighted fields: ${keys.slice(0, 4).join(", ")}${keys.length > 4 ? "…" : ""}.`;
  return new AppError("validation_failed", message, fields);
}

/** Photographs may use the paper terms as well as their own (docs/trade.md §14); everything else uses the paper list. */
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
  /** Handling cautions of the findings' terms, each once, in the order the findings give them. Retired terms keep theirs. */
  function cautionsFor(data: ConditionData, o: ObjectRow): string[] {
    if (data.findings.length === 0) return [];
    const byWords = new Map<string, string>();
    for (const t of repo.termsOfLists(db, listsFor(o.objectType))) if (t.caution) byWords.set(t.term.toLowerCase(), t.caution);
    return distinct(data.findings.map((f) => byWords.get(f.term.toLowerCase())).filter((c): c is string => !!c));
  }

  function toRevision(r: repo.RevisionRow): ConditionRevision {
    return revisionFields(r, r.data);
  }

  function toReport(row: repo.ReportRow, o: ObjectRow, current: ConditionRevision): ConditionReport {
    return {
      ...recordFields(row, o, current),
      context: row.context as ConditionContext,
      reportDate: row.reportDate,
      examinerName: row.examinerName,
      mountingId: row.mountingId,
      rating: row.rating as Rating,
      signedAt: row.signedAt ? row.signedAt.toISOString() : null,
      cautions: cautionsFor(current.data, o),
    };
  }

  const life = revisionedService<repo.ReportRow, repo.RevisionRow, ConditionData, ConditionReport, ConditionRevision>(db, {
    repo: { find: repo.findReport, revision: repo.revision, revisionsOf: repo.revisionsOf, currentRevisions: repo.currentRevisions, addRevision: repo.addRevision },
    actions: { read: "condition:read", write: "condition:write" },
    what: "That condition report",
    stale: STALE,
    messages: lockMessages("condition report", "signed", "signed reports"),
    versionFirst: true,
    dataOf: (r) => r.data,
    toRevision,
    toRecord: toReport,
  });
  const { load } = life;

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
    ...life.reads(repo.reportsOfObject),

    create(user: SessionUser, objectId: string, body: ConditionCreate): ConditionReport {
      return life.create(user, objectId, {
        check: (o) => checkContent(user, o, body, null),
        insert: (t, data) => repo.insertDraft(t, objectId, { ...body, data }, user),
      });
    },

    updateDraft(user: SessionUser, id: string, body: ConditionCreate & { version: number }): ConditionReport {
      return life.updateDraft(user, id, {
        check: (_row, o) => checkContent(user, o, body, repo.revision(db, id, 1)!.data),
        rewrite: (t, row, data) => repo.updateDraft(t, row, body.version, { ...body, data }),
      });
    },

    sign(user: SessionUser, id: string, version: number): ConditionReport {
      return life.lock(user, id, version, (row, _o, data) => {
        const missing = signatureFields(row.context, data);
        if (Object.keys(missing).length) throw invalid(missing);
        const now = clock();
        return (d) => {
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
        };
      });
    },

    correct(user: SessionUser, id: string, body: Correction<ConditionData>): ConditionReport {
      return life.correct(user, id, body, {
        check: (row, o, before) => {
          const data = checkContent(user, o, { data: body.data }, before);
          const missing = signatureFields(row.context, data);
          if (Object.keys(missing).length) throw invalid(missing);
          return data;
        },
        event: (row, n, data, changes) => ({
          type: "condition-reported",
          at: clock(),
          summary: `Condition report of ${row.reportDate} (${CONTEXT_PHRASES[row.context as ConditionContext] ?? row.context}) corrected (revision ${n}): ${body.correctionReason}`,
          data: { reportId: row.id, revision: n, corrected: true, rating: data.overallRating, changes },
        }),
      });
    },

    /** Two reports of one object, earlier and later by report date whichever way they are asked for. */
    compare(user: SessionUser, fromId: string, toId: string): { earlier: ConditionReport; later: ConditionReport; findings: ComparedFinding[] } {
      const a = load(user, fromId);
      const b = load(user, toId);
      if (a.row.id === b.row.id) throw invalid({ to: "Choose two different reports to compare." });
      if (a.row.objectId !== b.row.objectId) throw invalid({ to: "Choose two reports of the same object." });
      const aFirst = a.row.reportDate < b.row.reportDate || (a.row.reportDate === b.row.reportDate && a.row.createdAt.getTime() <= b.row.createdAt.getTime());
      const [e, l] = aFirst ? [a, b] : [b, a];
      const earlier = life.show(e.row, e.o);
      const later = life.show(l.row, l.o);
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
