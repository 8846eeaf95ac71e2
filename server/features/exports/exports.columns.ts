import type { Dataset } from "../../../shared/schemas/exports.ts";
import { minorDigits } from "../../../shared/domain/money.ts";

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
 * Columns marked `valuation` are confidential (docs/trade.md §13) and are left out, header and all, for a
 * user without "valuation:read" on the client.
 */
/** The valuation's columns, the same in the objects and the valuations datasets. */
const VALUATION_COLUMNS = [
  { key: "Valuation", valuation: true },
  { key: "Valuation currency", valuation: true },
  { key: "Valuation date", valuation: true },
  { key: "Valuation basis", valuation: true },
  { key: "Valuer", valuation: true },
] as const;

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
    ...VALUATION_COLUMNS,
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
  valuations: [{ key: "Object number" }, { key: "Title" }, ...VALUATION_COLUMNS],
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

export const label = <K extends string>(map: Record<K, string>, v: string | null | undefined): string | null => (v == null ? null : (map[v as K] ?? v));
export const text = (v: string | null | undefined): string | null => (v == null || v === "" ? null : v);
