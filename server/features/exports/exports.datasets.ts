import { and, asc, eq, inArray, type SQL } from "drizzle-orm";
import { getSettings } from "../settings/settings.repo.ts";
import { stringify } from "csv-stringify/sync";
import type { Db } from "../../db/client.ts";
import type { Dataset, ExportFilters } from "../../../shared/schemas/exports.ts";
import { conditionReports, conditionRevisions, custodyReceipts, mountingRevisions, mountings, objects } from "../../db/schema.ts";
import { can } from "../../../shared/permissions.ts";
import type { SessionUser } from "../../../shared/schemas/auth.ts";
import type { ClientRecord } from "../../../shared/schemas/clients.ts";
import { OBJECT_STATUS_LABELS, OBJECT_TYPE_LABELS, PHOTO_PROCESS_LABELS, SENSITIVITY_LABELS, VALUATION_BASIS_LABELS } from "../../../shared/schemas/objects.ts";
import {
  ADHESIVE_LABELS,
  ATTACHMENT_METHOD_LABELS,
  BOARD_GRADE_LABELS,
  GLAZING_TYPE_LABELS,
  MOUNTING_REASON_LABELS,
  MOUNTING_STATUS_LABELS,
  type MountingData,
} from "../../../shared/schemas/mountings.ts";
import { CONDITION_CONTEXT_LABELS, RATING_LABELS, SEVERITY_LABELS, type ConditionData } from "../../../shared/schemas/condition.ts";
import { CUSTODY_KIND_LABELS } from "../../../shared/schemas/custody.ts";
import { AppError } from "../../lib/errors.ts";
import { VERDICT_WORDS } from "../../lib/pdf/blocks.tsx";
import { whereWords } from "../documents/record-blocks.tsx";
import { recordPlan, type PlanSettings } from "../../../shared/domain/mounting.ts";
import type { Verdict } from "../../../shared/schemas/mount-plan.ts";
import { type Row, columnsFor, label, minorToDecimal, text } from "./exports.columns.ts";

type ObjectRow = typeof objects.$inferSelect;

export function clientObjects(db: Db, clientId: string, f: ExportFilters): ObjectRow[] {
  const where: SQL[] = [eq(objects.clientId, clientId)];
  if (f.status) where.push(eq(objects.status, f.status));
  if (f.objectType) where.push(eq(objects.objectType, f.objectType));
  return db
    .select()
    .from(objects)
    .where(and(...where))
    .orderBy(asc(objects.objectNumber))
    .all();
}

function valuationCells(o: ObjectRow): Row {
  const has = o.valuationMinor != null && !!o.valuationCurrency;
  return {
    Valuation: has ? minorToDecimal(o.valuationMinor!, o.valuationCurrency!) : null,
    "Valuation currency": has ? o.valuationCurrency : null,
    "Valuation date": text(o.valuationDate),
    "Valuation basis": label(VALUATION_BASIS_LABELS, o.valuationBasis),
    Valuer: text(o.valuer),
  };
}

function objectRow(o: ObjectRow, client: ClientRecord): Row {
  return {
    "Object number": o.objectNumber,
    Title: o.title,
    "Object name": label(OBJECT_TYPE_LABELS, o.objectType),
    "Production person": text(o.maker),
    "Production date": text(o.dateMade),
    "Medium and technique": text(o.medium),
    Support: text(o.support),
    "Photographic process": label(PHOTO_PROCESS_LABELS, o.photoProcess),
    "Edition number": text(o.edition),
    "Inscription content": text(o.inscriptions),
    "Dimension: sheet width (mm)": o.sheetWidthMm,
    "Dimension: sheet height (mm)": o.sheetHeightMm,
    "Dimension: image border left (mm)": o.borderLeftMm,
    "Dimension: image border top (mm)": o.borderTopMm,
    "Dimension: image border right (mm)": o.borderRightMm,
    "Dimension: image border bottom (mm)": o.borderBottomMm,
    "Thickness and flatness notes": text(o.thicknessNotes),
    Sensitivities: o.sensitivities.length ? o.sensitivities.map((s) => label(SENSITIVITY_LABELS, s)).join("; ") : null,
    Owner: client.name,
    Status: label(OBJECT_STATUS_LABELS, o.status),
    "Current location": text(o.location),
    "Condition check date": text(o.lastConditionOn),
    "Next condition check due": text(o.checkDueOn),
    "Last mounted on": text(o.lastMountedOn),
    ...valuationCells(o),
  };
}

function mountingRows(db: Db, user: SessionUser, objs: ObjectRow[]): Row[] {
  const [first] = objs;
  if (!first) return [];
  const byId = new Map(objs.map((o) => [o.id, o]));
  // Drafts are studio work: to anyone who may not write them they do not exist (as in the mountings service).
  const withDrafts = can(user, "mounting:read", { clientId: first.clientId, draft: true });
  const rows = db
    .select({ m: mountings, data: mountingRevisions.data })
    .from(mountings)
    .innerJoin(mountingRevisions, and(eq(mountingRevisions.mountingId, mountings.id), eq(mountingRevisions.revision, mountings.currentRevision)))
    .where(inArray(mountings.objectId, [...byId.keys()]))
    .orderBy(asc(mountings.mountedOn), asc(mountings.id))
    .all()
    .filter((r) => withDrafts || r.m.status !== "draft");
  rows.sort((a, b) => cmp(byId.get(a.m.objectId)!.objectNumber, byId.get(b.m.objectId)!.objectNumber));
  // Figures in mm whatever the studio's unit (the header says so), from the same plan the record page shows.
  const settings = { ...getSettings(db), unit: "mm" as const };
  return rows.map(({ m, data }) => {
    const o = byId.get(m.objectId)!;
    const d = data;
    const board = (b: MountingData["boards"]["window"] | undefined) =>
      b ? `${label(BOARD_GRADE_LABELS, b.grade)}, ${b.ply} ply${b.buffered ? ", buffered" : ", unbuffered"}${b.colour ? `, ${b.colour}` : ""}` : null;
    return {
      "Object number": o.objectNumber,
      Title: o.title,
      "Mounting record id": m.id,
      "Record status": label(MOUNTING_STATUS_LABELS, m.status),
      Reason: label(MOUNTING_REASON_LABELS, m.reason),
      "Mounted on": m.mountedOn,
      Framer: m.framerName,
      Revision: m.currentRevision,
      "Attachment method": label(ATTACHMENT_METHOD_LABELS, d.attachment?.method),
      "Hinge tissue": text(d.attachment?.tissue),
      "Hinge adhesive": label(ADHESIVE_LABELS, d.attachment?.adhesive),
      "Number of hinges": d.attachment?.hinges?.length ?? 0,
      ...planCells(d, o, settings),
      "Window board": board(d.boards?.window),
      "Window board batch": text(d.boards?.window?.batch),
      "Backing board": board(d.boards?.backing),
      "Backing board batch": text(d.boards?.backing?.batch),
      Glazing: label(GLAZING_TYPE_LABELS, d.glazing?.type),
      "Glazing thickness (mm)": d.glazing?.thicknessMm ?? null,
      "Frame moulding": text(d.frame?.moulding),
      "How to undo": text(d.undoNotes),
      "Ended on": text(m.endedOn),
      "End reason": text(m.endReason),
    };
  });
}

const checkWord = (v: Verdict) => VERDICT_WORDS[v].toLowerCase();

/**
 * A mounting record's plan figures and checks, recomputed with recordPlan from the saved record and the
 * object's catalogue, as on the record page and in the dossier. Shown figures, so the borders and the
 * window add up to the outer size in the export too (docs/trade.md §9).
 */
function planCells(d: MountingData, o: ObjectRow, settings: PlanSettings): Row {
  const r = recordPlan(d, o, settings);
  if (!r.ok) {
    const why = Object.values(r.fields).join(" ");
    return { ...EMPTY_PLAN_CELLS, "Conservation checks": `The saved plan cannot be computed: ${why}`, "Checks not passed": why };
  }
  const f = r.geometry.figures;
  const n = (mm: number) => Math.round(mm * 10) / 10;
  const counts = (["pass", "warn", "fail"] as const).map((v) => [v, r.plan.checks.filter((c) => c.verdict === v).length] as const).filter(([, c]) => c > 0);
  const notPassed = r.plan.checks.filter((c) => c.verdict !== "pass");
  return {
    "Sheet width (mm)": n(f.sheet.width),
    "Sheet height (mm)": n(f.sheet.height),
    "Window width (mm)": n(f.aperture.width),
    "Window height (mm)": n(f.aperture.height),
    "Border top (mm)": n(f.borders.top),
    "Border bottom (mm)": n(f.borders.bottom),
    "Border left (mm)": n(f.borders.left),
    "Border right (mm)": n(f.borders.right),
    "Outer width (mm)": n(f.outer.width),
    "Outer height (mm)": n(f.outer.height),
    "Conservation checks": counts.map(([v, c]) => `${c} ${checkWord(v)}`).join(", ") || "none",
    "Checks not passed": notPassed.length ? notPassed.map((c) => `${c.rule} (${checkWord(c.verdict)}): ${c.reason}`).join(" | ") : null,
  };
}

const EMPTY_PLAN_CELLS: Row = Object.fromEntries(
  [
    "Sheet width (mm)",
    "Sheet height (mm)",
    "Window width (mm)",
    "Window height (mm)",
    "Border top (mm)",
    "Border bottom (mm)",
    "Border left (mm)",
    "Border right (mm)",
    "Outer width (mm)",
    "Outer height (mm)",
  ].map((k) => [k, null]),
);

function conditionRows(db: Db, user: SessionUser, objs: ObjectRow[]): Row[] {
  const [first] = objs;
  if (!first) return [];
  const byId = new Map(objs.map((o) => [o.id, o]));
  // Drafts only to those who may write them, as in the condition service.
  const withDrafts = can(user, "condition:read", { clientId: first.clientId, draft: true });
  const rows = db
    .select({ r: conditionReports, data: conditionRevisions.data })
    .from(conditionReports)
    .innerJoin(conditionRevisions, and(eq(conditionRevisions.reportId, conditionReports.id), eq(conditionRevisions.revision, conditionReports.currentRevision)))
    .where(inArray(conditionReports.objectId, [...byId.keys()]))
    .orderBy(asc(conditionReports.reportDate), asc(conditionReports.id))
    .all()
    .filter((x) => withDrafts || x.r.status !== "draft");
  rows.sort((a, b) => cmp(byId.get(a.r.objectId)!.objectNumber, byId.get(b.r.objectId)!.objectNumber));
  return rows.map(({ r, data }) => {
    const o = byId.get(r.objectId)!;
    const d = data;
    return {
      "Object number": o.objectNumber,
      Title: o.title,
      "Condition check/assessment reference number": r.id,
      "Report status": r.status === "signed" ? "Signed" : "Draft",
      "Condition check date": r.reportDate,
      "Condition check reason": label(CONDITION_CONTEXT_LABELS, r.context),
      "Condition checker/assessor": r.examinerName,
      Condition: label(RATING_LABELS, r.rating),
      "Condition note": text(d.summary),
      "Number of findings": d.findings?.length ?? 0,
      "Unresolved findings": r.unresolvedCount,
      Findings: findingsText(d),
      "Recommendation: display": text(d.recommendations?.display),
      "Recommendation: handling": text(d.recommendations?.handling),
      "Recommendation: environment": text(d.recommendations?.environment),
      "Referral to a conservator": text(d.recommendations?.referral),
      "Light notes": text(d.lightNotes),
      Revision: r.currentRevision,
    };
  });
}

/**
 * A report's findings in one cell, numbered as in the report: "1. Foxing — Lower right — about 3 mm — Slight",
 * one per line. A finding marked on a photo names the photo by its number in the report.
 */
function findingsText(d: ConditionData): string | null {
  if (!d.findings?.length) return null;
  const photoNo = (id: string) => (d.photoIds?.indexOf(id) ?? -1) + 1 || null;
  return d.findings
    .map((f, i) => [`${i + 1}. ${f.term}`, whereWords(f, photoNo), f.extent, SEVERITY_LABELS[f.severity], f.resolved ? "resolved" : null, f.notes].filter(Boolean).join(" — "))
    .join("\n");
}

function custodyRows(db: Db, objs: ObjectRow[]): Row[] {
  if (!objs.length) return [];
  const byId = new Map(objs.map((o) => [o.id, o]));
  const rows: (typeof custodyReceipts.$inferSelect)[] = [];
  const ids = [...byId.keys()];
  for (let i = 0; i < ids.length; i += 500) {
    rows.push(
      ...db
        .select()
        .from(custodyReceipts)
        .where(inArray(custodyReceipts.objectId, ids.slice(i, i + 500)))
        .orderBy(asc(custodyReceipts.date), asc(custodyReceipts.createdAt))
        .all(),
    );
  }
  rows.sort((a, b) => cmp(byId.get(a.objectId)!.objectNumber, byId.get(b.objectId)!.objectNumber) || cmp(a.date, b.date));
  return rows.map((c) => {
    const o = byId.get(c.objectId)!;
    return {
      "Object number": o.objectNumber,
      Title: o.title,
      "Receipt id": c.id,
      Direction: c.direction === "in" ? "Into the studio" : "Out of the studio",
      "Hand-over": label(CUSTODY_KIND_LABELS, c.kind),
      Date: c.date,
      From: c.fromParty,
      To: c.toParty,
      "Condition at hand-over": c.condition,
      "Signed by": c.signedBy,
      Location: text(c.location),
      "Agreed return date": text(c.returnDue),
      Notes: text(c.notes),
    };
  });
}

/** Stable sort key: Array.prototype.sort is stable, so rows keep their date order within an object. */
const cmp = (a: string, b: string) => (a < b ? -1 : a > b ? 1 : 0);

/** Keeps only the columns the user may see, in the declared order. */
function project(rows: Row[], cols: string[]): Row[] {
  return rows.map((r) => Object.fromEntries(cols.map((c) => [c, r[c] ?? null])));
}

export type Table = { dataset: Dataset; columns: string[]; rows: Row[] };

/** The valuations dataset needs "valuation:read" as well as the right to read the client. */
export function assertMayExport(user: SessionUser, client: ClientRecord, dataset: Dataset): void {
  if (dataset === "valuations" && !can(user, "valuation:read", { clientId: client.id }))
    throw new AppError("forbidden", "Valuations are confidential; your role does not allow exporting them.");
}

/**
 * One dataset of one client's records, as the user may see it. The caller has already checked that
 * the user may read the client; the valuations dataset needs "valuation:read" too.
 */
export function buildTable(db: Db, user: SessionUser, client: ClientRecord, dataset: Dataset, filters: ExportFilters = {}, objs?: ObjectRow[]): Table {
  assertMayExport(user, client, dataset);
  const withValuation = can(user, "valuation:read", { clientId: client.id });
  const list = objs ?? clientObjects(db, client.id, filters);
  const columns = columnsFor(dataset, withValuation);
  let rows: Row[];
  switch (dataset) {
    case "objects":
      rows = list.map((o) => objectRow(o, client));
      break;
    case "mountings":
      rows = mountingRows(db, user, list);
      break;
    case "condition":
      rows = conditionRows(db, user, list);
      break;
    case "custody":
      rows = custodyRows(db, list);
      break;
    case "valuations":
      // The current valuation of each object that has one (the record keeps one value; earlier ones are in its history).
      rows = list.filter((o) => o.valuationMinor != null).map((o) => ({ "Object number": o.objectNumber, Title: o.title, ...valuationCells(o) }));
      break;
  }
  return { dataset, columns, rows: project(rows, columns) };
}

/**
 * RFC 4180 CSV: header row, CRLF after every record, fields with commas, quotes or line breaks quoted
 * (quotes doubled), UTF-8 with a byte-order mark so spreadsheets read it as UTF-8.
 * Text beginning with = + - @ or a tab is prefixed with ' so a spreadsheet does not run it as a formula
 * (OWASP "CSV injection"); numbers are written as they are.
 */
export function toCsv(t: Pick<Table, "columns" | "rows">): string {
  return stringify(t.rows, {
    bom: true,
    header: true,
    columns: t.columns,
    record_delimiter: "\r\n",
    // With a record_delimiter given, csv-stringify would otherwise quote only fields holding "\r\n" itself.
    quote_record_delimiter: true,
    escape_formulas: true,
  });
}

/** Columns that CSV writes as exact decimal text and JSON as numbers. */
const DECIMAL_COLUMNS = new Set(["Valuation"]);

/** JSON with the same keys as the CSV; numbers are JSON numbers (an amount such as 12500.5, never "12500.50"). */
export function toJson(t: Table): string {
  const decimals = t.columns.filter((c) => DECIMAL_COLUMNS.has(c));
  const rows = decimals.length ? t.rows.map((r) => ({ ...r, ...Object.fromEntries(decimals.map((c) => [c, typeof r[c] === "string" ? Number(r[c]) : r[c]])) })) : t.rows;
  return JSON.stringify(rows, null, 2);
}
