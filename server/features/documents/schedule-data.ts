import { format, parseISO } from "date-fns";
import { and, desc, eq, inArray, type SQL } from "drizzle-orm";
import type { Db } from "../../db/client.ts";
import { clients, conditionReports, objects } from "../../db/schema.ts";
import { OBJECT_STATUS_LABELS, OBJECT_TYPE_LABELS, VALUATION_BASIS_LABELS, type ObjectType } from "../../../shared/schemas/objects.ts";
import { ATTACHMENT_METHOD_LABELS, BOARD_GRADE_LABELS, GLAZING_TYPE_LABELS } from "../../../shared/schemas/mountings.ts";
import { packageSize } from "../../../shared/domain/mounting.ts";
import { valuationIsOld } from "../../../shared/domain/valuation.ts";
import { objectFilterWhere, type ObjectFilter } from "../objects/objects.repo.ts";
import { findMounting } from "../mountings/mountings.repo.ts";
import { mountingDetail } from "../mountings/mounting-detail.ts";
import { RATING_LABELS, type Rating } from "../../../shared/schemas/condition.ts";
import { formatSize, type Unit } from "../../../shared/domain/units.ts";
import { getSettings } from "../settings/settings.repo.ts";

/** A day as the schedule prints it: 4 Dec 2026. */
export const day = (iso: string) => {
  const d = parseISO(iso);
  return Number.isNaN(d.getTime()) ? iso : format(d, "d MMM yyyy");
};

export type ScheduleRow = {
  id: string;
  objectNumber: string;
  title: string;
  maker: string | null;
  /** "Print · etching and aquatint": the object type in words and the medium. */
  kind: string;
  /** The sheet, and the object as it leaves the studio (framed outside, or the mount's outer size). */
  dimensions: string;
  packageSize: string | null;
  status: string;
  location: string | null;
  conditionDate: string | null;
  conditionRating: string | null;
  valueMinor: number | null;
  currency: string | null;
  /** The valuation's basis in words ("Market value"), its date, and whether it is past review (trade reference §15). */
  basis: string | null;
  valuedOn: string | null;
  valuationOld: boolean;
};
export type ScheduleTotal = {
  currency: string;
  minor: number;
  count: number;
  /** The bases this total adds, in words; more than one means the total mixes bases. */
  bases: string[];
  /** The total split by basis ("No recorded basis" for values without one): the parts add up to the total. */
  byBasis: { basis: string; minor: number; count: number }[];
  /** Values in this total with no basis, more than VALUATION_REVIEW_YEARS old, or with no date. */
  noBasis: number;
  old: number;
  undated: number;
};
export type ScheduleData = {
  clientName: string;
  rows: ScheduleRow[];
  totals: ScheduleTotal[];
  unvalued: number;
  producedBy: string;
  filterNote: string | null;
};
/** A chosen set of objects, or the register's filter (the same conditions the register's list reads). */
export type ScheduleFilter = ObjectFilter & { objectIds?: string[] };

const CHUNK = 500;
const NO_BASIS = "No recorded basis";

/** The latest signed condition report per object: date and rating. */
function latestSigned(db: Db, ids: string[]): Map<string, { date: string; rating: string }> {
  const out = new Map<string, { date: string; rating: string }>();
  for (let i = 0; i < ids.length; i += CHUNK) {
    const rows = db
      .select({ objectId: conditionReports.objectId, date: conditionReports.reportDate, rating: conditionReports.rating })
      .from(conditionReports)
      .where(and(eq(conditionReports.status, "signed"), inArray(conditionReports.objectId, ids.slice(i, i + CHUNK))))
      .orderBy(desc(conditionReports.reportDate), desc(conditionReports.signedAt))
      .all();
    for (const r of rows) if (!out.has(r.objectId)) out.set(r.objectId, { date: r.date, rating: r.rating });
  }
  return out;
}

/** Sums per currency in integer minor units (exact), sorted by currency code, with the bases and ages each sum adds. */
export function totalsOf(rows: Pick<ScheduleRow, "valueMinor" | "currency" | "basis" | "valuedOn" | "valuationOld">[]): { totals: ScheduleTotal[]; unvalued: number } {
  const by = new Map<string, ScheduleTotal>();
  let unvalued = 0;
  for (const r of rows) {
    if (r.valueMinor == null || !r.currency) {
      unvalued++;
      continue;
    }
    const t = by.get(r.currency) ?? { currency: r.currency, minor: 0, count: 0, bases: [], byBasis: [], noBasis: 0, old: 0, undated: 0 };
    t.minor += r.valueMinor;
    t.count++;
    const label = r.basis ?? NO_BASIS;
    let part = t.byBasis.find((b) => b.basis === label);
    if (!part) {
      part = { basis: label, minor: 0, count: 0 };
      t.byBasis.push(part);
    }
    part.minor += r.valueMinor;
    part.count++;
    if (!r.basis) t.noBasis++;
    else if (!t.bases.includes(r.basis)) t.bases.push(r.basis);
    if (!r.valuedOn) t.undated++;
    else if (r.valuationOld) t.old++;
    by.set(r.currency, t);
  }
  for (const t of by.values()) {
    t.bases.sort();
    t.byBasis.sort((a, b) => (a.basis === NO_BASIS ? 1 : b.basis === NO_BASIS ? -1 : a.basis.localeCompare(b.basis)));
  }
  for (const t of by.values()) if (!Number.isSafeInteger(t.minor)) throw new RangeError(`The ${t.currency} total is too large to add up exactly.`);
  return { totals: [...by.values()].sort((a, b) => a.currency.localeCompare(b.currency)), unvalued };
}

/** "Print · Etching": the type in words and the medium, the medium left out when it only repeats the type. */
function kindOf(objectType: string, medium: string | null): string {
  const type = OBJECT_TYPE_LABELS[objectType as ObjectType] ?? objectType;
  return medium && medium.trim().toLowerCase() !== type.toLowerCase() ? `${type} · ${medium}` : type;
}

/** The object as it leaves the studio, from its current mounting, in the studio's unit; null when it has none. */
function packageLine(db: Db, mountingId: string | null, unit: Unit): string | null {
  const m = mountingId ? findMounting(db, mountingId) : null;
  const d = m && m.status === "completed" ? mountingDetail(db, m) : null;
  const p = d ? packageSize(d.data, d.result) : null;
  if (!p) return null;
  const size = formatSize(p.widthMm, p.heightMm, unit);
  return p.kind === "framed" ? `Framed ${size}` : p.kind === "framed-no-face-width" ? `Framed; mount ${size}` : `Mount ${size}`;
}

/** Loads the rows of a schedule: a client's objects (the register's filter, or chosen ones), or, with clientId null, the given objects. */
export function loadSchedule(db: Db, clientId: string | null, filter: ScheduleFilter, producedBy: string, on: Date = new Date()): ScheduleData | null {
  const unit: Unit = getSettings(db).unit;
  const where: SQL[] = objectFilterWhere(filter, clientId);
  const cols = {
    id: objects.id,
    objectNumber: objects.objectNumber,
    title: objects.title,
    maker: objects.maker,
    objectType: objects.objectType,
    medium: objects.medium,
    mountingId: objects.currentMountingId,
    w: objects.sheetWidthMm,
    h: objects.sheetHeightMm,
    status: objects.status,
    location: objects.location,
    valueMinor: objects.valuationMinor,
    currency: objects.valuationCurrency,
    valuedOn: objects.valuationDate,
    basis: objects.valuationBasis,
    clientName: clients.name,
  };
  const base = () => db.select(cols).from(objects).innerJoin(clients, eq(clients.id, objects.clientId));
  let raw: ReturnType<ReturnType<typeof base>["all"]>;
  if (filter.objectIds) {
    const wanted = [...new Set(filter.objectIds)];
    raw = [];
    for (let i = 0; i < wanted.length; i += CHUNK)
      raw.push(
        ...base()
          .where(and(...where, inArray(objects.id, wanted.slice(i, i + CHUNK))))
          .all(),
      );
    // One id that is not this client's (or does not exist) answers as not found, like any other record.
    if (raw.length !== wanted.length) return null;
  } else {
    raw = base()
      .where(and(...where))
      .all();
  }
  raw.sort((a, b) => (a.objectNumber < b.objectNumber ? -1 : a.objectNumber > b.objectNumber ? 1 : 0));
  const cond = latestSigned(
    db,
    raw.map((r) => r.id),
  );
  const rows: ScheduleRow[] = raw.map((r) => {
    const c = cond.get(r.id);
    return {
      id: r.id,
      objectNumber: r.objectNumber,
      title: r.title,
      maker: r.maker,
      kind: kindOf(r.objectType, r.medium),
      dimensions: formatSize(r.w, r.h, unit),
      packageSize: packageLine(db, r.mountingId, unit),
      status: OBJECT_STATUS_LABELS[r.status as keyof typeof OBJECT_STATUS_LABELS] ?? r.status,
      location: r.location,
      conditionDate: c?.date ?? null,
      conditionRating: c ? (RATING_LABELS[c.rating as Rating] ?? c.rating) : null,
      valueMinor: r.valueMinor,
      currency: r.currency,
      basis: r.basis ? (VALUATION_BASIS_LABELS[r.basis as keyof typeof VALUATION_BASIS_LABELS] ?? r.basis) : null,
      valuedOn: r.valuedOn,
      valuationOld: !!r.valuedOn && valuationIsOld(r.valuedOn, on),
    };
  });
  const clientName = clientId
    ? (raw[0]?.clientName ?? db.select({ name: clients.name }).from(clients).where(eq(clients.id, clientId)).get()?.name ?? "")
    : [...new Set(raw.map((r) => r.clientName))].join(", ");
  const parts: string[] = [];
  if (filter.objectIds) parts.push(`${rows.length} selected object${rows.length === 1 ? "" : "s"}`);
  if (filter.status) parts.push(`status: ${(OBJECT_STATUS_LABELS[filter.status] ?? filter.status).toLowerCase()}`);
  if (filter.objectType) parts.push(`object type: ${(OBJECT_TYPE_LABELS[filter.objectType] ?? filter.objectType).toLowerCase()}`);
  if (filter.method) parts.push(`held by: ${(ATTACHMENT_METHOD_LABELS[filter.method] ?? filter.method).toLowerCase()}`);
  if (filter.boardGrade) parts.push(`board: ${(BOARD_GRADE_LABELS[filter.boardGrade] ?? filter.boardGrade).toLowerCase()}`);
  if (filter.glazing) parts.push(`glazing: ${(GLAZING_TYPE_LABELS[filter.glazing] ?? filter.glazing).toLowerCase()}`);
  if (filter.checkDueBy) parts.push(`check due by ${day(filter.checkDueBy)}`);
  if (filter.q) parts.push(`matching “${filter.q}”`);
  return { clientName, rows, ...totalsOf(rows), producedBy, filterNote: parts.length ? parts.join(" · ") : null };
}
