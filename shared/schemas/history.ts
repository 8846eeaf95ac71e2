import { z } from "zod";

export const EVENT_TYPES = [
  "created",
  "catalogue-changed",
  "valued",
  "plan-saved",
  "mounted",
  "reframed",
  "mounting-corrected",
  "mounting-removed",
  "condition-reported",
  "custody-in",
  "custody-out",
  "loan-out",
  "loan-return",
  "shared",
  "exported",
  "document-issued",
] as const;
export type EventType = (typeof EVENT_TYPES)[number];
export const EVENT_TYPE_LABELS: Record<EventType, string> = {
  created: "Recorded",
  "catalogue-changed": "Catalogue changed",
  valued: "Valued",
  "plan-saved": "Plan saved",
  mounted: "Mounted",
  reframed: "Reframed",
  "mounting-corrected": "Mounting record corrected",
  "mounting-removed": "Taken out of mount",
  "condition-reported": "Condition reported",
  "custody-in": "Received",
  "custody-out": "Released",
  "loan-out": "Lent",
  "loan-return": "Returned from loan",
  shared: "Shared",
  exported: "Exported",
  "document-issued": "Document issued",
};

export const HistoryQuerySchema = z.object({
  types: z
    .string()
    .optional()
    .transform((v) => (v ? v.split(",").filter(Boolean) : []))
    .pipe(z.array(z.enum(EVENT_TYPES, { message: "Unknown event type." }))),
  /** Return events older than this sequence number (for paging back through time). */
  before: z.coerce.number().int().min(1).optional(),
  limit: z.coerce.number().int().min(1).max(200).default(50),
});
export type HistoryQuery = z.infer<typeof HistoryQuerySchema>;

export type HistoryEvent = {
  seq: number;
  objectId: string;
  type: EventType;
  at: string;
  actorName: string;
  summary: string;
  /** What changed: for edits, `{ changes: [{ path, before, after }] }`; otherwise the ids involved. */
  data: Record<string, unknown>;
  hash: string;
};

export type ChainVerdict = { ok: true; checked: number } | { ok: false; checked: number; brokenAt: { seq: number; objectId: string; reason: string } };
