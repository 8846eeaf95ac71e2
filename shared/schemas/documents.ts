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
export type Verification = { valid: true; code: string; kind: DocumentKind; kindLabel: string; objectNumber: string | null; issuedAt: string } | { valid: false; code: string };
