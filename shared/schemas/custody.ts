import { z } from "zod";
import { optionalText, requiredText } from "./common.ts";

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

export const CustodyCreateSchema = z.object({
  kind: z.enum(CUSTODY_KINDS, { message: "Choose what kind of hand-over this is." }),
  date: z.string().regex(/^\d{4}-\d{2}-\d{2}$/, { message: "Use a date such as 2026-11-30." }),
  fromParty: requiredText(200, "Say who handed the object over."),
  toParty: requiredText(200, "Say who received the object."),
  condition: requiredText(300, "Note the condition at the hand-over in one line."),
  signedBy: requiredText(200, "Give the name of the person who signed."),
  location: optionalText(200),
  notes: optionalText(2000),
});
export type CustodyCreate = z.infer<typeof CustodyCreateSchema>;

export type CustodyReceipt = CustodyCreate & { id: string; objectId: string; objectNumber: string; objectTitle: string; direction: "in" | "out"; createdAt: string };
