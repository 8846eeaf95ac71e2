import { z } from "zod";
import { optionalId, optionalText, requiredText, isoDate as isoDateOf } from "./common.ts";
import { revisionedSchemas, type Revision } from "./revisioned.ts";

export const CONDITION_CONTEXTS = ["arrival", "before-mounting", "after-mounting", "periodic-check", "loan-out", "loan-return", "incident", "claim"] as const;
export type ConditionContext = (typeof CONDITION_CONTEXTS)[number];
export const CONDITION_CONTEXT_LABELS: Record<ConditionContext, string> = {
  arrival: "On arrival",
  "before-mounting": "Before mounting",
  "after-mounting": "After mounting",
  "periodic-check": "Periodic check",
  "loan-out": "Loan out",
  "loan-return": "Loan return",
  incident: "Incident",
  claim: "Claim",
};
/** Reports for loans are signed by both parties (docs/trade.md §14). */
export const TWO_PARTY_CONTEXTS: readonly ConditionContext[] = ["loan-out", "loan-return"];

/** Overall rating, best first (Spectrum 5.0 "Condition": the overall rating is the worst finding's). */
export const RATINGS = ["good", "fair", "poor", "unstable"] as const;
export type Rating = (typeof RATINGS)[number];
export const RATING_LABELS: Record<Rating, string> = { good: "Good", fair: "Fair", poor: "Poor", unstable: "Unstable" };

/** A finding's severity, and the best overall rating it allows. */
export const SEVERITIES = ["slight", "moderate", "severe", "critical"] as const;
export type FindingSeverity = (typeof SEVERITIES)[number];
export const SEVERITY_LABELS: Record<FindingSeverity, string> = { slight: "Slight", moderate: "Moderate", severe: "Severe", critical: "Critical" };
export const SEVERITY_CAP: Record<FindingSeverity, Rating> = { slight: "good", moderate: "fair", severe: "poor", critical: "unstable" };

/** Where on the sheet: a 3 × 3 grid, the four edges, or the back. */
export const ZONES = [
  "top-left",
  "top-centre",
  "top-right",
  "middle-left",
  "centre",
  "middle-right",
  "bottom-left",
  "bottom-centre",
  "bottom-right",
  "edge-top",
  "edge-right",
  "edge-bottom",
  "edge-left",
  "verso",
] as const;
export type Zone = (typeof ZONES)[number];
export const ZONE_LABELS: Record<Zone, string> = {
  "top-left": "Top left",
  "top-centre": "Top centre",
  "top-right": "Top right",
  "middle-left": "Middle left",
  centre: "Centre",
  "middle-right": "Middle right",
  "bottom-left": "Bottom left",
  "bottom-centre": "Bottom centre",
  "bottom-right": "Bottom right",
  "edge-top": "Top edge",
  "edge-right": "Right edge",
  "edge-bottom": "Bottom edge",
  "edge-left": "Left edge",
  verso: "Verso (back)",
};

export const FindingLocationSchema = z.discriminatedUnion("kind", [
  z.object({ kind: z.literal("zone"), zone: z.enum(ZONES, { message: "Choose where on the sheet." }) }),
  z.object({
    kind: z.literal("marker"),
    photoId: z.string().min(1).max(64),
    /** Position on the photo as a fraction of its width and height (0 to 1). */
    x: z.number().min(0, { message: "The marker must be on the photo." }).max(1, { message: "The marker must be on the photo." }),
    y: z.number().min(0, { message: "The marker must be on the photo." }).max(1, { message: "The marker must be on the photo." }),
  }),
]);
export type FindingLocation = z.infer<typeof FindingLocationSchema>;

export const FindingSchema = z.object({
  /** Stable across revisions and reports of the same object, so reports can be compared. */
  id: z.string().min(1).max(64),
  term: requiredText(120, "Choose the finding from the list."),
  location: FindingLocationSchema,
  extent: optionalText(200),
  severity: z.enum(SEVERITIES, { message: "Choose how severe it is." }),
  resolved: z.boolean().default(false),
  notes: optionalText(2000),
});
export type Finding = z.infer<typeof FindingSchema>;

const isoDate = isoDateOf();
const Signature = z.object({ name: requiredText(200, "Give the name of the person signing."), date: isoDate, role: optionalText(120) });

export const ConditionDataSchema = z
  .object({
    overallRating: z.enum(RATINGS, { message: "Choose the overall rating." }),
    summary: requiredText(4000, "Write a short summary of the object's condition."),
    findings: z.array(FindingSchema).max(200, { message: "At most 200 findings in one report." }).default([]),
    recommendations: z
      .object({ display: optionalText(2000), handling: optionalText(2000), environment: optionalText(2000), referral: optionalText(2000) })
      .default({ display: null, handling: null, environment: null, referral: null }),
    lightNotes: optionalText(2000),
    /** Photos that belong to this report (ids of the object's photos). */
    photoIds: z.array(z.string().min(1).max(64)).max(100).default([]),
    signatures: z.object({ examiner: Signature.optional(), otherParty: Signature.optional() }).default({}),
  })
  .superRefine((d, ctx) => {
    const worst = d.findings.reduce<Rating>((w, f) => (RATINGS.indexOf(SEVERITY_CAP[f.severity]) > RATINGS.indexOf(w) ? SEVERITY_CAP[f.severity] : w), "good");
    if (RATINGS.indexOf(d.overallRating) < RATINGS.indexOf(worst)) {
      ctx.addIssue({
        code: "custom",
        path: ["overallRating"],
        message: `A finding is ${d.findings.find((f) => SEVERITY_CAP[f.severity] === worst)!.severity}, so the overall rating cannot be better than ${RATING_LABELS[worst].toLowerCase()}.`,
      });
    }
    const ids = new Set<string>();
    d.findings.forEach((f, i) => {
      if (ids.has(f.id)) ctx.addIssue({ code: "custom", path: ["findings", i, "id"], message: "Two findings share an id." });
      ids.add(f.id);
      if (f.location.kind === "marker" && !d.photoIds.includes(f.location.photoId)) {
        ctx.addIssue({ code: "custom", path: ["findings", i, "location", "photoId"], message: "The marker is on a photo that is not part of this report." });
      }
    });
  });
export type ConditionData = z.infer<typeof ConditionDataSchema>;
export type ConditionDataInput = z.input<typeof ConditionDataSchema>;

const conditionSchemas = revisionedSchemas(
  ConditionDataSchema,
  {
    context: z.enum(CONDITION_CONTEXTS, { message: "Choose why the object is examined." }),
    reportDate: isoDate,
    mountingId: optionalId(),
  },
  "Say why the report is corrected.",
);

export const ConditionCreateSchema = conditionSchemas.create;
export type ConditionCreate = z.infer<typeof ConditionCreateSchema>;
export const ConditionDraftUpdateSchema = conditionSchemas.draftUpdate;
export const ConditionSignSchema = conditionSchemas.lock;
export const ConditionCorrectionSchema = conditionSchemas.correction;

export const ConditionListQuerySchema = z.object({
  rating: z.enum(RATINGS).optional(),
  context: z.enum(CONDITION_CONTEXTS).optional(),
  from: isoDate.optional(),
  to: isoDate.optional(),
  examinerId: z.string().max(64).optional(),
  unresolved: z
    .enum(["true", "false"])
    .optional()
    .transform((v) => (v === undefined ? undefined : v === "true")),
  /** Objects whose check is due by this date. */
  dueBy: isoDate.optional(),
  page: z.coerce.number().int().min(1).default(1),
  pageSize: z.coerce.number().int().min(1).max(200).default(50),
});
export type ConditionListQuery = z.infer<typeof ConditionListQuerySchema>;

export const TermCreateSchema = z.object({
  list: z.enum(["paper", "photograph"]),
  term: requiredText(120, "Give the term."),
  caution: optionalText(1000),
  active: z.boolean().default(true),
});
export type Term = z.infer<typeof TermCreateSchema> & { id: string; sortOrder: number };

export type ConditionRevision = Revision<ConditionData>;
export type ConditionReport = {
  id: string;
  objectId: string;
  objectNumber: string;
  objectTitle: string;
  status: "draft" | "signed";
  context: ConditionContext;
  reportDate: string;
  examinerName: string;
  mountingId: string | null;
  rating: Rating;
  currentRevision: number;
  signedAt: string | null;
  version: number;
  current: ConditionRevision;
  /** Handling cautions of the findings' terms (mould, insects). */
  cautions: string[];
};

export const TermListQuerySchema = z.object({
  list: z.enum(["paper", "photograph"], { message: "Choose paper or photograph." }).optional(),
  /** Retired terms too: for the admin's vocabulary screen. */
  all: z
    .enum(["true", "false"], { message: "Use true or false." })
    .optional()
    .transform((v) => v === "true"),
});
/** An edit may also move a term within its list. */
export const TermUpdateSchema = TermCreateSchema.extend({ sortOrder: z.number().int().min(0).max(100_000).optional() });

/** Two report ids to compare; which is earlier is decided by their dates, not by the order asked. */
export const ConditionCompareQuerySchema = z.object({
  from: z.string({ message: "Choose the first report." }).min(1, { message: "Choose the first report." }).max(64),
  to: z.string({ message: "Choose the second report." }).min(1, { message: "Choose the second report." }).max(64),
});
