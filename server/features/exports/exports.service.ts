import fs from "node:fs";
import { inTransaction } from "../../db/client.ts";
import fsp from "node:fs/promises";
import os from "node:os";
import path from "node:path";
import { createHash, randomUUID } from "node:crypto";
import { and, asc, eq, inArray, type SQL } from "drizzle-orm";
import { stringify } from "csv-stringify/sync";
import { ZipArchive } from "archiver";
import type { Db } from "../../db/client.ts";
import { DATASETS, type Dataset, type ExportFilters, type JobStatus } from "../../../shared/schemas/exports.ts";
import type { Config } from "../../lib/config.ts";
import { conditionReports, conditionRevisions, custodyReceipts, exportJobs, mountingRevisions, mountings, objects, photos } from "../../db/schema.ts";
import { can, isStudio } from "../../../shared/permissions.ts";
import type { SessionUser } from "../../../shared/schemas/auth.ts";
import type { ClientRecord } from "../../../shared/schemas/clients.ts";
import {
  OBJECT_STATUS_LABELS,
  OBJECT_TYPE_LABELS,
  PHOTO_PROCESS_LABELS,
  SENSITIVITY_LABELS,
  VALUATION_BASIS_LABELS,
  type ObjectStatus,
  type ObjectType,
} from "../../../shared/schemas/objects.ts";
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
import { PHOTO_KIND_LABELS } from "../../../shared/schemas/photos.ts";
import { minorDigits } from "../../../shared/domain/money.ts";
import { AppError, conflict, forbidden, notFound } from "../../lib/errors.ts";
import { createStorage } from "../../lib/storage.ts";
import { appendEvent } from "../history/history.chain.ts";
import { gatherInWorker } from "./export-pool.ts";
import { issueDossier } from "../documents/dossier.tsx";
import { issueConditionReport, VERDICT_WORDS, whereWords } from "../documents/condition-pdf.tsx";
import { issueCustodyReceipt } from "../documents/custody-receipt.tsx";
import { getSettings } from "../settings/settings.repo.ts";
import { recordPlan, type PlanSettings } from "../../../shared/domain/mounting.ts";
import type { Verdict } from "../../../shared/schemas/mount-plan.ts";

export { DATASETS, FORMATS, type Dataset, type ExportFilters, type Format } from "../../../shared/schemas/exports.ts";

/**
 * The columns of every export, in order: the CSV header and the JSON keys are these names.
 * Where a column matches a unit of information of Spectrum 5.0 (the UK collections management
 * standard, Collections Trust) it carries that unit's name — "Object number", "Object name",
 * "Title", "Production person", "Production date", "Dimension …", "Inscription content",
 * "Current location", "Owner", "Condition", "Condition check date", "Condition note",
 * "Condition checker/assessor", "Valuation", "Valuation currency", "Valuation date", "Valuer".
 * Everything else has a plain name. Lengths are in millimetres, with the unit in the name. Every value
 * is in words ("T-hinge", "Wheat starch paste", "Signed"), never a stored code; the only identifiers are
 * record ids, named as such. docs/exports.md lists every column.
 * Columns marked `valuation` are confidential (docs/trade-reference.md §13) and are left out, header and all, for a
 * user without "valuation:read" on the client.
 */
export const EXPORT_COLUMNS = {
  objects: [
    { key: "Object number" },
    { key: "Title" },
    { key: "Object name" },
    { key: "Production person" },
    { key: "Production date" },
    { key: "Medium and technique" },
    { key: "Support" },
    { key: "Photographic process" },
    { key: "Edition number" },
    { key: "Inscription content" },
    { key: "Dimension: sheet width (mm)" },
    { key: "Dimension: sheet height (mm)" },
    { key: "Dimension: image border left (mm)" },
    { key: "Dimension: image border top (mm)" },
    { key: "Dimension: image border right (mm)" },
    { key: "Dimension: image border bottom (mm)" },
    { key: "Thickness and flatness notes" },
    { key: "Sensitivities" },
    { key: "Owner" },
    { key: "Status" },
    { key: "Current location" },
    { key: "Condition check date" },
    { key: "Next condition check due" },
    { key: "Last mounted on" },
    { key: "Valuation", valuation: true },
    { key: "Valuation currency", valuation: true },
    { key: "Valuation date", valuation: true },
    { key: "Valuation basis", valuation: true },
    { key: "Valuer", valuation: true },
  ],
  mountings: [
    { key: "Object number" },
    { key: "Title" },
    { key: "Mounting record id" },
    { key: "Record status" },
    { key: "Reason" },
    { key: "Mounted on" },
    { key: "Framer" },
    { key: "Revision" },
    { key: "Attachment method" },
    { key: "Hinge tissue" },
    { key: "Hinge adhesive" },
    { key: "Number of hinges" },
    { key: "Sheet width (mm)" },
    { key: "Sheet height (mm)" },
    { key: "Window width (mm)" },
    { key: "Window height (mm)" },
    { key: "Border top (mm)" },
    { key: "Border bottom (mm)" },
    { key: "Border left (mm)" },
    { key: "Border right (mm)" },
    { key: "Outer width (mm)" },
    { key: "Outer height (mm)" },
    { key: "Conservation checks" },
    { key: "Checks not passed" },
    { key: "Window board" },
    { key: "Window board batch" },
    { key: "Backing board" },
    { key: "Backing board batch" },
    { key: "Glazing" },
    { key: "Glazing thickness (mm)" },
    { key: "Frame moulding" },
    { key: "How to undo" },
    { key: "Ended on" },
    { key: "End reason" },
  ],
  condition: [
    { key: "Object number" },
    { key: "Title" },
    { key: "Condition check/assessment reference number" },
    { key: "Report status" },
    { key: "Condition check date" },
    { key: "Condition check reason" },
    { key: "Condition checker/assessor" },
    { key: "Condition" },
    { key: "Condition note" },
    { key: "Number of findings" },
    { key: "Unresolved findings" },
    { key: "Findings" },
    { key: "Recommendation: display" },
    { key: "Recommendation: handling" },
    { key: "Recommendation: environment" },
    { key: "Referral to a conservator" },
    { key: "Light notes" },
    { key: "Revision" },
  ],
  custody: [
    { key: "Object number" },
    { key: "Title" },
    { key: "Receipt id" },
    { key: "Direction" },
    { key: "Hand-over" },
    { key: "Date" },
    { key: "From" },
    { key: "To" },
    { key: "Condition at hand-over" },
    { key: "Signed by" },
    { key: "Location" },
    { key: "Agreed return date" },
    { key: "Notes" },
  ],
  valuations: [
    { key: "Object number" },
    { key: "Title" },
    { key: "Valuation", valuation: true },
    { key: "Valuation currency", valuation: true },
    { key: "Valuation date", valuation: true },
    { key: "Valuation basis", valuation: true },
    { key: "Valuer", valuation: true },
  ],
} as const satisfies Record<Dataset, readonly { key: string; valuation?: boolean }[]>;

export type Cell = string | number | null;
export type Row = Record<string, Cell>;

/** The column names a user gets for a dataset. */
export function columnsFor(dataset: Dataset, withValuation: boolean): string[] {
  return (EXPORT_COLUMNS[dataset] as readonly { key: string; valuation?: boolean }[]).filter((c) => withValuation || !c.valuation).map((c) => c.key);
}

/** Integer minor units as an exact decimal string ("12500.00", "-0.05", "1500" for JPY), never through a float. */
export function minorToDecimal(minor: number, currency: string): string {
  const digits = minorDigits(currency);
  if (!Number.isSafeInteger(minor)) throw new Error("money: not an integer number of minor units");
  const sign = minor < 0 ? "-" : "";
  const abs = String(Math.abs(minor));
  if (digits === 0) return sign + abs;
  const padded = abs.padStart(digits + 1, "0");
  return `${sign}${padded.slice(0, -digits)}.${padded.slice(-digits)}`;
}

const label = <K extends string>(map: Record<K, string>, v: string | null | undefined): string | null => (v == null ? null : (map[v as K] ?? v));
const text = (v: string | null | undefined): string | null => (v == null || v === "" ? null : v);

type ObjectRow = typeof objects.$inferSelect;

export function clientObjects(db: Db, clientId: string, f: ExportFilters): ObjectRow[] {
  const where: SQL[] = [eq(objects.clientId, clientId)];
  if (f.status) where.push(eq(objects.status, f.status));
  if (f.objectType) where.push(eq(objects.objectType, f.objectType));
  return db.select().from(objects).where(and(...where)).orderBy(asc(objects.objectNumber)).all();
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
  if (!objs.length) return [];
  const byId = new Map(objs.map((o) => [o.id, o]));
  // Drafts are studio work: to anyone who may not write them they do not exist (as in the mountings service).
  const withDrafts = can(user, "mounting:read", { clientId: objs[0].clientId, draft: true });
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
 * window add up to the outer size in the export too (docs/trade-reference.md §9).
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
  ["Sheet width (mm)", "Sheet height (mm)", "Window width (mm)", "Window height (mm)", "Border top (mm)", "Border bottom (mm)", "Border left (mm)", "Border right (mm)", "Outer width (mm)", "Outer height (mm)"].map((k) => [k, null]),
);

function conditionRows(db: Db, user: SessionUser, objs: ObjectRow[]): Row[] {
  if (!objs.length) return [];
  const byId = new Map(objs.map((o) => [o.id, o]));
  // Drafts only to those who may write them, as in the condition service.
  const withDrafts = can(user, "condition:read", { clientId: objs[0].clientId, draft: true });
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
    rows.push(...db.select().from(custodyReceipts).where(inArray(custodyReceipts.objectId, ids.slice(i, i + 500))).orderBy(asc(custodyReceipts.date), asc(custodyReceipts.createdAt)).all());
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
  if (dataset === "valuations" && !can(user, "valuation:read", { clientId: client.id })) throw new AppError("forbidden", "Valuations are confidential; your role does not allow exporting them.");
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

// ── Bulk ZIP of one client's records, as an in-memory background job ──────────

export type { JobState, JobStatus } from "../../../shared/schemas/exports.ts";

type Job = JobStatus & {
  id: string;
  ownerId: string;
  clientId: string;
  createdAt: number;
  dir: string;
  file: string;
  filename: string;
  timer: NodeJS.Timeout;
  /** Whether studio staff asked for the photos' original files (with their metadata) instead of the stripped copies. */
  originals: boolean;
  /** Why a failed job failed, for the server's eyes only. */
  error?: unknown;
};

export const JOB_TTL_MS = 60 * 60 * 1000;
const EVENTS_PER_TRANSACTION = 200;

const safeSegment = (s: string) => s.replace(/[\\/:*?"<>|\u0000-\u001f]/g, "_").replace(/^\.+/, "_") || "_";
const slug = (s: string, fallback = "client") => s.normalize("NFKD").replace(/[^\w\s-]/g, "").trim().replace(/\s+/g, "-").toLowerCase().slice(0, 60) || fallback;

/** One line of the archive's manifest. */
export type ManifestEntry = { file: string; kind: string; objectNumber: string | null; caption: string | null; bytes: number; sha256: string };
export const MANIFEST_COLUMNS = ["File", "Kind", "Object number", "Caption", "Bytes", "SHA-256"] as const;
const DATASET_CAPTIONS: Record<Dataset, string> = {
  objects: "Catalogue data of every object",
  mountings: "Every mounting record, with its plan figures in mm and its checks",
  condition: "Every condition report, with its findings and recommendations",
  custody: "Every hand-over into and out of the studio",
  valuations: "The current valuation of each valued object",
};

export function createExportsService(db: Db, config: Pick<Config, "uploadsDir">, clock: () => Date) {
  const storage = createStorage(config.uploadsDir);
  /** The jobs this process is building now; every job's state is also in export_jobs, so a restart finds it. */
  const building = new Map<string, Job>();

  const save = (job: Pick<Job, "id" | "state" | "progress" | "message">) =>
    db.update(exportJobs).set({ state: job.state, progress: job.progress, message: job.message }).where(eq(exportJobs.id, job.id)).run();

  async function expire(row: { id: string; dir: string }) {
    const timer = building.get(row.id)?.timer;
    if (timer) clearTimeout(timer);
    building.delete(row.id);
    db.delete(exportJobs).where(eq(exportJobs.id, row.id)).run();
    await fsp.rm(row.dir, { recursive: true, force: true });
  }

  // At start: a job that was running when the process stopped cannot be resumed from half a ZIP; it is
  // marked failed (its owner sees why and starts again) and its partial file removed. Expired jobs go.
  for (const row of db.select().from(exportJobs).all()) {
    if (clock().getTime() - row.createdAtMs > JOB_TTL_MS) {
      void expire(row);
    } else if (row.state === "running") {
      save({ id: row.id, state: "failed", progress: row.progress, message: "Reversa restarted while this archive was being built, so it was not finished. Start it again." });
      fs.rmSync(row.dir, { recursive: true, force: true });
    }
  }

  /** A job the user may see: only its owner, and only within the hour; anyone else gets 404 as for no job. */
  function ownJob(user: SessionUser, jobId: string) {
    const row = db.select().from(exportJobs).where(eq(exportJobs.id, jobId)).get();
    if (!row || row.ownerId !== user.id) throw notFound("That export");
    if (clock().getTime() - row.createdAtMs > JOB_TTL_MS) {
      void expire(row);
      throw notFound("That export");
    }
    return row;
  }

  async function run(job: Job, user: SessionUser, client: ClientRecord) {
    const withValuation = can(user, "valuation:read", { clientId: client.id });
    const datasets = DATASETS.filter((d) => d !== "valuations" || withValuation);
    // The datasets are gathered and written out in a worker thread (export.worker.ts), in one read transaction.
    const gathered = await gatherInWorker(db, { user, clientId: client.id, datasets, formats: ["csv", "json"], filters: {} });
    const objs = gathered.objects;
    const byId = new Map(objs.map((o) => [o.id, o]));
    const ids = [...byId.keys()];
    const inChunks = <T,>(read: (part: string[]) => T[]): T[] => {
      const out: T[] = [];
      for (let i = 0; i < ids.length; i += 500) out.push(...read(ids.slice(i, i + 500)));
      return out;
    };
    // Photos of draft reports only to those who may see drafts (as the photos service); originals, which may
    // carry GPS, camera and owner metadata, only to studio staff who asked for them; everyone else gets the
    // full-size copy with its metadata stripped.
    const withDrafts = can(user, "condition:read", { clientId: client.id, draft: true });
    const draftReports = new Set(
      inChunks((part) => db.select({ id: conditionReports.id }).from(conditionReports).where(and(inArray(conditionReports.objectId, part), eq(conditionReports.status, "draft"))).all()).map((r) => r.id),
    );
    const originals = job.originals && isStudio(user);
    const photoRows = inChunks((part) =>
      db.select({ id: photos.id, objectId: photos.objectId, originalKey: photos.originalKey, fullKey: photos.fullKey, reportId: photos.reportId, kind: photos.kind, caption: photos.caption }).from(photos).where(inArray(photos.objectId, part)).orderBy(asc(photos.createdAt), asc(photos.id)).all(),
    ).filter((p) => withDrafts || !p.reportId || !draftReports.has(p.reportId));
    // Signed reports only: a draft can still change, and a document is issued only for a signed report.
    const reportRows = inChunks((part) =>
      db.select({ id: conditionReports.id, objectId: conditionReports.objectId, date: conditionReports.reportDate }).from(conditionReports).where(and(inArray(conditionReports.objectId, part), eq(conditionReports.status, "signed"))).orderBy(asc(conditionReports.reportDate), asc(conditionReports.id)).all(),
    );
    const receiptRows = inChunks((part) =>
      db.select({ id: custodyReceipts.id, objectId: custodyReceipts.objectId, date: custodyReceipts.date, kind: custodyReceipts.kind }).from(custodyReceipts).where(inArray(custodyReceipts.objectId, part)).orderBy(asc(custodyReceipts.date), asc(custodyReceipts.createdAt)).all(),
    );

    // Photos named so a person can tell them apart: object number, its order on the object, kind and caption.
    const files: { file: string; name: string; objectId: string; caption: string | null }[] = [];
    const perObject = new Map<string, number>();
    let missing = 0;
    for (const p of photoRows) {
      const n = (perObject.get(p.objectId) ?? 0) + 1;
      perObject.set(p.objectId, n);
      const key = originals ? p.originalKey : p.fullKey;
      let file: string;
      try {
        file = storage.path(key);
      } catch {
        missing++;
        continue;
      }
      if (!fs.existsSync(file)) {
        missing++;
        continue;
      }
      const number = safeSegment(byId.get(p.objectId)!.objectNumber);
      const ext = path.extname(key).slice(1) || "bin";
      const words = [label(PHOTO_KIND_LABELS, p.kind), p.caption].filter(Boolean).map((w) => slug(w!, "")).filter(Boolean).join("-").slice(0, 60);
      files.push({ file, name: `photos/${number}/${number}-${String(n).padStart(2, "0")}${words ? `-${words}` : ""}.${ext}`, objectId: p.objectId, caption: p.caption });
    }

    let total = gathered.files.length + files.length + objs.length + reportRows.length + receiptRows.length + 2;
    let added = 0;
    const out = fs.createWriteStream(job.file, { mode: 0o600 });
    const archive = new ZipArchive({ zlib: { level: 6 } });
    const closed = new Promise<void>((resolve, reject) => {
      out.on("close", resolve);
      out.on("error", reject);
      archive.on("error", reject);
      archive.on("warning", reject);
    });
    archive.on("entry", () => {
      added++;
      // Held just under 1 until the file is closed, so "1" always means the ZIP can be downloaded.
      job.progress = Math.min(0.99, added / total);
      job.message = `Added ${added} of ${total} files.`;
      save(job);
    });
    archive.pipe(out);

    // Every file with its SHA-256, for the manifest: a reader can check each file against it.
    const manifest: ManifestEntry[] = [];
    const put = (data: Buffer | string, entry: Omit<ManifestEntry, "sha256" | "bytes">) => {
      const buf = typeof data === "string" ? Buffer.from(data, "utf8") : data;
      archive.append(buf, { name: entry.file });
      manifest.push({ ...entry, bytes: buf.length, sha256: createHash("sha256").update(buf).digest("hex") });
    };
    for (const f of gathered.files) {
      put(f.text, { file: `${f.dataset}.${f.format}`, kind: f.format === "csv" ? "dataset (CSV)" : "dataset (JSON)", objectNumber: null, caption: DATASET_CAPTIONS[f.dataset] });
    }
    for (const f of files) {
      const hash = createHash("sha256");
      let bytes = 0;
      for await (const chunk of fs.createReadStream(f.file)) {
        hash.update(chunk as Buffer);
        bytes += (chunk as Buffer).length;
      }
      archive.file(f.file, { name: f.name });
      manifest.push({ file: f.name, kind: originals ? "photo (original file, with its metadata)" : "photo (full size, metadata removed)", objectNumber: byId.get(f.objectId)!.objectNumber, caption: f.caption, bytes, sha256: hash.digest("hex") });
    }

    // Documents rendered by the documents feature, each an issued document with its own verification code.
    // They are issued without a history event each: the one "archive exported" event per object names them.
    // A document that fails to render is left out and said so; the rest of the ZIP still builds.
    const issued = new Map<string, { kind: string; code: string; file: string }[]>();
    const failed: string[] = [];
    const issue = async (objectId: string, what: string, file: string, kind: string, caption: string, make: () => Promise<{ pdf: Buffer; code: string }>) => {
      try {
        const { pdf, code } = await make();
        put(pdf, { file, kind, objectNumber: byId.get(objectId)!.objectNumber, caption: `${caption} · verification code ${code}` });
        issued.set(objectId, [...(issued.get(objectId) ?? []), { kind, code, file }]);
      } catch {
        failed.push(what);
        total--;
      }
    };
    const quiet = { inHistory: false };
    for (const o of objs) {
      const n = safeSegment(o.objectNumber);
      await issue(o.id, `the dossier of ${o.objectNumber}`, `dossiers/${n}.pdf`, "object dossier", `Object dossier of ${o.objectNumber}`, () => issueDossier(db, config, clock, user, o.id, quiet));
    }
    const seq = (m: Map<string, number>, key: string) => {
      const v = (m.get(key) ?? 0) + 1;
      m.set(key, v);
      return v > 1 ? `-${v}` : "";
    };
    const reportSeq = new Map<string, number>();
    for (const r of reportRows) {
      const n = safeSegment(byId.get(r.objectId)!.objectNumber);
      const file = `condition-reports/${n}-${r.date}${seq(reportSeq, `${n}-${r.date}`)}.pdf`;
      await issue(r.objectId, `the condition report of ${byId.get(r.objectId)!.objectNumber} of ${r.date}`, file, "condition report", `Condition report of ${r.date}`, () => issueConditionReport(db, config, clock, user, r.id, quiet));
    }
    const receiptSeq = new Map<string, number>();
    for (const c of receiptRows) {
      const n = safeSegment(byId.get(c.objectId)!.objectNumber);
      const file = `custody-receipts/${n}-${c.date}-${c.kind}${seq(receiptSeq, `${n}-${c.date}-${c.kind}`)}.pdf`;
      const what = label(CUSTODY_KIND_LABELS, c.kind) ?? c.kind;
      await issue(c.objectId, `the custody receipt of ${byId.get(c.objectId)!.objectNumber} of ${c.date}`, file, "custody receipt", `Custody receipt: ${what}, ${c.date}`, () => issueCustodyReceipt(db, clock, config.uploadsDir, user, c.id, quiet));
    }

    // The manifest lists every other file; it cannot hold its own hash.
    const manifestTable = { columns: [...MANIFEST_COLUMNS], rows: manifest.map((m) => ({ File: m.file, Kind: m.kind, "Object number": m.objectNumber, Caption: m.caption, Bytes: m.bytes, "SHA-256": m.sha256 })) };
    archive.append(toCsv(manifestTable), { name: "manifest.csv" });
    archive.append(JSON.stringify(manifest, null, 2), { name: "manifest.json" });
    await archive.finalize();
    await closed;

    // One "archive exported" event per object in the ZIP, written once the ZIP is whole, naming what of the
    // object went in. Single CSV/JSON downloads write none: one event per object for every spreadsheet
    // download would bury the history.
    // Written 200 objects to a transaction, letting other requests in between: 5,000 events in one
    // transaction hold the request thread for over half a second.
    const at = clock();
    const photosOf = new Map<string, number>();
    for (const f of files) photosOf.set(f.objectId, (photosOf.get(f.objectId) ?? 0) + 1);
    for (let i = 0; i < objs.length; i += EVENTS_PER_TRANSACTION) {
      if (i > 0) await new Promise((resume) => setImmediate(resume));
      inTransaction(db, (tx) => {
        for (const o of objs.slice(i, i + EVENTS_PER_TRANSACTION)) {
          const docs = issued.get(o.id) ?? [];
          const photoCount = photosOf.get(o.id) ?? 0;
          const parts = [
            ...(["object dossier", "condition report", "custody receipt"] as const).map((k) => {
              const of = docs.filter((d) => d.kind === k);
              return of.length === 0 ? null : of.length === 1 ? `${k} ${of[0].code}` : `${of.length} ${k}s (${of.map((d) => d.code).join(", ")})`;
            }),
            photoCount ? `${photoCount} photo${photoCount === 1 ? "" : "s"}` : null,
          ].filter(Boolean);
          appendEvent(tx, {
            objectId: o.id,
            type: "exported",
            actor: { id: user.id, name: user.name },
            at,
            summary: `Included in an archive of ${client.name}'s records: ${parts.length ? parts.join(", ") : "its catalogue data"}.`,
            data: { jobId: job.id, datasets: [...datasets], photos: photoCount, documents: docs },
          });
        }
      });
    }
    const count = (k: string) => [...issued.values()].flat().filter((d) => d.kind === k).length;
    job.state = "done";
    job.progress = 1;
    building.delete(job.id);
    job.message =
      `Ready: ${objs.length} objects, ${files.length} photos, ${count("object dossier")} dossiers, ${count("condition report")} condition reports, ${count("custody receipt")} custody receipts, and a manifest with each file's SHA-256.` +
      (missing ? ` ${missing} photo file${missing === 1 ? " was" : "s were"} missing from storage and left out.` : "") +
      (failed.length ? ` Left out because it could not be made: ${failed.join("; ")}.` : "");
    save(job);
  }

  return {
    startArchive(user: SessionUser, client: ClientRecord, opts: { originals?: boolean } = {}): string {
      if (opts.originals && !isStudio(user)) throw forbidden("Original photo files, with their camera and place metadata, go only to studio staff. Leave out originals to get the full-size copies.");
      // One archive at a time per client: a second would only compete with the first for the same files.
      const busy = db.select({ id: exportJobs.id }).from(exportJobs).where(and(eq(exportJobs.clientId, client.id), eq(exportJobs.state, "running"))).get();
      if (busy) throw conflict(`An archive of ${client.name}'s records is being built already. Wait for it to finish (it is kept for an hour), then start another if you need one.`);
      const id = randomUUID();
      const dir = fs.mkdtempSync(path.join(os.tmpdir(), "reversa-export-"));
      const job: Job = {
        id,
        ownerId: user.id,
        clientId: client.id,
        originals: !!opts.originals,
        state: "running",
        progress: 0,
        message: "Starting.",
        createdAt: clock().getTime(),
        dir,
        file: path.join(dir, "export.zip"),
        filename: `${slug(client.name)}-records-${clock().toISOString().slice(0, 10)}.zip`,
        // Removes the job and its file after an hour; unref'd so it never holds the process open.
        timer: setTimeout(() => void expire({ id, dir }), JOB_TTL_MS).unref(),
      };
      db.insert(exportJobs).values({ id, ownerId: user.id, clientId: client.id, state: "running", progress: 0, message: job.message, originals: job.originals, dir, file: job.file, filename: job.filename, createdAtMs: job.createdAt }).run();
      building.set(id, job);
      setImmediate(() => {
        run(job, user, client).catch(async (err: unknown) => {
          job.state = "failed";
          job.message = "The export could not be built. Try again; if it fails again, tell the studio's administrator.";
          job.error = err;
          building.delete(job.id);
          save(job);
          await fsp.rm(job.file, { force: true }).catch(() => {});
        });
      });
      return id;
    },

    status(user: SessionUser, jobId: string): JobStatus {
      const { state, progress, message } = ownJob(user, jobId);
      return { state, progress, message };
    },

    download(user: SessionUser, jobId: string): { file: string; filename: string } {
      const job = ownJob(user, jobId);
      if (job.state !== "done") throw conflict(job.state === "failed" ? "This export failed; start a new one." : "This export is still being built; try again when it is done.");
      return { file: job.file, filename: job.filename };
    },

    /** For shutdown and tests: removes every job and its file. */
    async clear() {
      await Promise.all(db.select().from(exportJobs).all().map(expire));
    },
  };
}
