import { z } from "zod";
import { STANDARD_BOARD_SHEETS } from "../domain/mount-plan/index.ts";
import { RegisterFilterSchema } from "./objects.ts";
export const DOCUMENT_KINDS = ["dossier", "condition-report", "schedule-of-values", "custody-receipt", "workshop-sheet", "back-label", "label-sheet"] as const;
export type DocumentKind = (typeof DOCUMENT_KINDS)[number];
export const DOCUMENT_KIND_LABELS: Record<DocumentKind, string> = {
  dossier: "Object dossier",
  "condition-report": "Condition report",
  "schedule-of-values": "Schedule of values",
  "custody-receipt": "Custody receipt",
  "workshop-sheet": "Workshop sheet",
  "back-label": "Back label",
  "label-sheet": "Sheet of back labels",
};
export type IssuedDocument = {
  id: string;
  code: string;
  kind: DocumentKind;
  title: string;
  objectId: string | null;
  clientId: string | null;
  paperSize: string;
  issuedAt: string;
  issuedByName: string;
};
/** What GET /api/verify/:code tells anyone, signed in or not. */
/**
 * What the public check of a code tells: the kind, the object number, the day, and the issued file's
 * fingerprint (SHA-256 and page count, null for documents issued before they were kept) so a reader
 * can tell an altered copy from the issued one. Nothing else about the object.
 */
export type Verification =
  | { valid: true; code: string; kind: DocumentKind; kindLabel: string; objectNumber: string | null; issuedAt: string; sha256: string | null; pages: number | null }
  | { valid: false; code: string };

/** A code as printed (XXXX-XXXX-XXXX), from what was typed: case, spaces and dashes do not matter. */
export function normaliseCode(typed: string): string {
  const hex = typed.toUpperCase().replace(/[^0-9A-F]/g, "");
  return hex.length === 12 ? `${hex.slice(0, 4)}-${hex.slice(4, 8)}-${hex.slice(8)}` : typed.trim().toUpperCase();
}

/** The most back labels one sheet prints at once. */
export const LABEL_SHEET_MAX = 400;

const Ids = (max: number, what: string) =>
  z
    .array(z.string().min(1).max(64), { message: `Give the ${what} as a list of ids.` })
    .min(1, { message: `Choose at least one ${what.replace(/s$/, "")}.` })
    .max(max, { message: `At most ${max} ${what} at once.` });

/** Chosen objects, or the register's filter as the register screen holds it (the owner is the route's client). */
export const ScheduleBodySchema = RegisterFilterSchema.omit({ clientId: true })
  .extend({ objectIds: Ids(5000, "objects").optional() })
  .strict()
  .default({});
export const WorkshopBodySchema = z.object({
  mountingIds: Ids(200, "mountings"),
  boardSheetId: z
    .enum(STANDARD_BOARD_SHEETS.map((b) => b.id) as [string, ...string[]], { message: `Choose a board sheet: ${STANDARD_BOARD_SHEETS.map((b) => b.label).join(", ")}.` })
    .optional(),
});
/** Chosen objects, or the register's filter as the register screen holds it (with its owner, if one is chosen). */
export const LabelSheetBodySchema = RegisterFilterSchema.extend({ objectIds: Ids(LABEL_SHEET_MAX, "objects").optional() }).strict();

export const ReceiptParamsSchema = z.object({ receiptId: z.string().min(1).max(64) });

/** A verification code as typed: case, spaces and dashes do not matter (normaliseCode). */
export const VerifyCodeParamsSchema = z.object({ code: z.string().trim().min(4, { message: "Enter the verification code printed on the document." }).max(40) });
