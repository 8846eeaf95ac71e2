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
  exported: "Archive exported",
  "document-issued": "Document issued",
};

export const HistoryQuerySchema = z.object({
  types: z
    .string()
    .optional()
    .transform((v) => (v ? v.split(",").filter(Boolean) : []))
    .pipe(z.array(z.enum(EVENT_TYPES, { message: "Unknown event type." }))),
  /** The cursor from the previous page ("YYYY-MM-DD:seq"): events that come after it, newest first. */
  before: z
    .string()
    .regex(/^\d{4}-\d{2}-\d{2}:\d{1,12}$/, { message: "Use the nextBefore value of the previous page." })
    .transform((v) => [v.slice(0, 10), Number(v.slice(11))] as const)
    .optional(),
  limit: z.coerce.number().int().min(1).max(200).default(50),
});
export type HistoryQuery = z.infer<typeof HistoryQuerySchema>;

export type HistoryEvent = {
  seq: number;
  objectId: string;
  type: EventType;
  /** When the event was entered. */
  at: string;
  /** The day the thing happened (ISO date): the timeline orders and shows by this. */
  occurredOn: string;
  actorName: string;
  summary: string;
  /** What changed: for edits, `{ changes: [{ path, before, after }] }`; otherwise the ids involved. */
  data: Record<string, unknown>;
  hash: string;
};

export type ChainVerdict = { ok: true; checked: number } | { ok: false; checked: number; brokenAt: { seq: number; objectId: string; reason: string } };
