import { z } from "zod";
import { optionalText, PageQuerySchema, requiredText, isoDate as isoDateOf } from "./common.ts";

export const CUSTODY_KINDS = ["intake", "return-to-owner", "loan-out", "loan-return", "to-conservator", "from-conservator"] as const;
export type CustodyKind = (typeof CUSTODY_KINDS)[number];
export const CUSTODY_KIND_LABELS: Record<CustodyKind, string> = {
  intake: "Received from the owner",
  "return-to-owner": "Returned to the owner",
  "loan-out": "Lent out",
  "loan-return": "Returned from loan",
  "to-conservator": "Sent to a conservator",
  "from-conservator": "Back from a conservator",
};
/** Which way each kind moves the object, and where it then is. */
export const CUSTODY_KIND_EFFECT: Record<CustodyKind, { direction: "in" | "out"; status: "in-studio" | "with-owner" | "on-loan" | "with-conservator" }> = {
  intake: { direction: "in", status: "in-studio" },
  "return-to-owner": { direction: "out", status: "with-owner" },
  "loan-out": { direction: "out", status: "on-loan" },
  "loan-return": { direction: "in", status: "in-studio" },
  "to-conservator": { direction: "out", status: "with-conservator" },
  "from-conservator": { direction: "in", status: "in-studio" },
};

/** The hand-overs that send an object away for a while and so carry an agreed return date. */
export const RETURN_DUE_KINDS: readonly CustodyKind[] = ["loan-out", "to-conservator"];

export const CustodyCreateSchema = z
  .object({
    kind: z.enum(CUSTODY_KINDS, { message: "Choose what kind of hand-over this is." }),
    date: isoDateOf(),
    fromParty: requiredText(200, "Say who handed the object over."),
    toParty: requiredText(200, "Say who received the object."),
    condition: requiredText(300, "Note the condition at the hand-over in one line."),
    signedBy: requiredText(200, "Give the name of the person who signed."),
    location: optionalText(200),
    notes: optionalText(2000),
    /** For a loan or a stay with a conservator: the day it is agreed to come back. */
    returnDue: z.preprocess((v) => (v === "" || v === undefined ? null : v), isoDateOf("2027-03-31").nullable()).optional(),
  })
  .superRefine((d, ctx) => {
    if (d.returnDue && !RETURN_DUE_KINDS.includes(d.kind))
      ctx.addIssue({ code: "custom", path: ["returnDue"], message: "Only a loan or a stay with a conservator has a return date." });
    else if (d.returnDue && d.returnDue < d.date) ctx.addIssue({ code: "custom", path: ["returnDue"], message: "The agreed return date is before the hand-over date." });
  });
export type CustodyCreate = z.infer<typeof CustodyCreateSchema>;

export type CustodyReceipt = CustodyCreate & { id: string; objectId: string; objectNumber: string; objectTitle: string; direction: "in" | "out"; createdAt: string };

// ── The list queries (GET /api/custody/in-studio, GET /api/custody/receipts) ──
const blankIsUnset = <T extends z.ZodType>(schema: T) => z.preprocess((v) => (v === "" ? undefined : v), schema.optional());
const dateParam = (example: string) => blankIsUnset(isoDateOf(example));

export const InStudioQuerySchema = PageQuerySchema;
export type InStudioQuery = z.infer<typeof InStudioQuerySchema>;

export const ReceiptListQuerySchema = PageQuerySchema.extend({
  direction: blankIsUnset(z.enum(["in", "out"], { message: "Choose in or out." })),
  kind: blankIsUnset(z.enum(CUSTODY_KINDS, { message: "Choose a kind of hand-over from the list." })),
  from: dateParam("2026-11-01"),
  to: dateParam("2026-11-30"),
}).refine((q) => !q.from || !q.to || q.from <= q.to, { path: ["to"], message: "The end date is before the start date." });
export type ReceiptListQuery = z.infer<typeof ReceiptListQuerySchema>;

/**
 * The custody page's address: two lists on one page, the in-studio list's page (`page`) and the receipts'
 * filter and page (`rpage`), each field read as the API reads it.
 */
export const CustodyPageSearchSchema = z.object({
  page: PageQuerySchema.shape.page,
  rpage: PageQuerySchema.shape.page,
  direction: ReceiptListQuerySchema.shape.direction,
  kind: ReceiptListQuerySchema.shape.kind,
  from: ReceiptListQuerySchema.shape.from,
  to: ReceiptListQuerySchema.shape.to,
});

export type InStudioItem = {
  objectId: string;
  objectNumber: string;
  title: string;
  clientId: string;
  clientName: string;
  location: string | null;
  /** The latest receipt that brought the object in; null when it was recorded as in the studio without one. */
  receipt: { id: string; date: string; fromParty: string; condition: string } | null;
  /** The day it came in: the receipt's date, or the day the object was recorded. */
  since: string;
  daysInStudio: number;
};
