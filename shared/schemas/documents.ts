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
export type IssuedDocument = { id: string; code: string; kind: DocumentKind; title: string; objectId: string | null; clientId: string | null; paperSize: string; issuedAt: string; issuedByName: string };
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
