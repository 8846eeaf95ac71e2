import { z } from "zod";
import { ADHESIVES, ATTACHMENT_METHODS, MountPlanInputSchema, SIDES, type MountPlan } from "./mount-plan.ts";
import { GLAZING_TYPES } from "./mount-values.ts";
import { optionalText, requiredText, isoDate as isoDateOf } from "./common.ts";
import type { CatalogueFacts } from "../domain/mounting.ts";
import { revisionedSchemas, VersionSchema, type Revision } from "./revisioned.ts";

export const MOUNTING_REASONS = ["first-mounting", "reframing", "remount-after-damage", "hinge-repair", "glazing-change", "taken-out-of-frame", "other"] as const;
export const MOUNTING_REASON_LABELS: Record<(typeof MOUNTING_REASONS)[number], string> = {
  "first-mounting": "First mounting",
  reframing: "Reframing",
  "remount-after-damage": "Remount after damage",
  "hinge-repair": "Hinge repair",
  "glazing-change": "Glazing change",
  "taken-out-of-frame": "Taken out of frame",
  other: "Other",
};

export const MOUNTING_STATUSES = ["draft", "completed", "superseded", "removed"] as const;
export type MountingStatus = (typeof MOUNTING_STATUSES)[number];
export const MOUNTING_STATUS_LABELS: Record<MountingStatus, string> = {
  draft: "Draft",
  completed: "Current",
  superseded: "Superseded",
  removed: "Removed",
};

export const BOARD_GRADE_LABELS = { museum: "Museum (cotton)", conservation: "Conservation (purified pulp)", other: "Other" } as const;
export const PLIES = [2, 4, 6, 8] as const;
export { GLAZING_TYPES };
export const GLAZING_TYPE_LABELS: Record<(typeof GLAZING_TYPES)[number], string> = {
  "float-glass": "Float glass",
  "uv-glass": "UV-filtering glass",
  "ar-uv-glass": "Anti-reflective UV glass",
  acrylic: "Acrylic",
  "uv-acrylic": "UV-filtering acrylic",
  none: "No glazing",
};
export const BACKING_TYPES = ["archival-corrugated", "fluted-polypropylene", "cotton-board", "other"] as const;
export const BACKING_TYPE_LABELS: Record<(typeof BACKING_TYPES)[number], string> = {
  "archival-corrugated": "Archival corrugated board",
  "fluted-polypropylene": "Fluted polypropylene",
  "cotton-board": "Cotton board",
  other: "Other",
};
export const SEALING_TYPES = ["barrier-film", "gummed-tape", "none", "other"] as const;
export const SEALING_TYPE_LABELS: Record<(typeof SEALING_TYPES)[number], string> = {
  "barrier-film": "Barrier film",
  "gummed-tape": "Gummed tape",
  none: "Not sealed",
  other: "Other",
};

const mm = (label: string, max = 3000) =>
  z
    .number({ message: `${label}: enter a length in mm.` })
    .min(0, { message: `${label} cannot be negative.` })
    .max(max, { message: `${label} must be at most ${max} mm.` });

export const BoardSchema = z.object({
  grade: z.enum(["museum", "conservation", "other"], { message: "Choose the board grade." }),
  buffered: z.boolean({ message: "Say whether the board is buffered." }),
  ply: z.union([z.literal(2), z.literal(4), z.literal(6), z.literal(8)], { message: "Choose 2, 4, 6 or 8 ply." }),
  patPassed: z.boolean().optional(),
  colour: optionalText(80),
  maker: optionalText(120),
  batch: optionalText(80),
});
export type Board = z.infer<typeof BoardSchema>;

export const HingeSchema = z.object({
  edge: z.enum(SIDES),
  /** From the sheet's left corner (top and bottom edges) or top corner (left and right edges), in mm. */
  offsetMm: mm("Hinge position"),
  widthMm: mm("Hinge width", 500).refine((v) => v > 0, { message: "Hinge width must be greater than 0." }),
});
export type Hinge = z.infer<typeof HingeSchema>;

export const MountingDataSchema = z
  .object({
    plan: MountPlanInputSchema,
    boards: z.object({ window: BoardSchema, backing: BoardSchema, top: BoardSchema.optional() }),
    attachment: z.object({
      method: z.enum(ATTACHMENT_METHODS, { message: "Choose how the object is attached." }),
      tissue: optionalText(120),
      tissueWeightGsm: z
        .number()
        .positive({ message: "Tissue weight must be greater than 0." })
        .max(200)
        .nullable()
        .optional()
        .transform((v) => v ?? null),
      adhesive: z
        .enum(ADHESIVES)
        .nullable()
        .optional()
        .transform((v) => v ?? null),
      hinges: z.array(HingeSchema).max(40, { message: "At most 40 hinges." }).default([]),
    }),
    glazing: z.object({
      type: z.enum(GLAZING_TYPES, { message: "Choose the glazing." }),
      thicknessMm: mm("Glazing thickness", 20)
        .nullable()
        .optional()
        .transform((v) => v ?? null),
    }),
    spacer: z
      .object({
        type: optionalText(120),
        depthMm: mm("Spacer depth", 100)
          .nullable()
          .optional()
          .transform((v) => v ?? null),
      })
      .optional(),
    frame: z
      .object({
        moulding: optionalText(200),
        finish: optionalText(120),
        faceWidthMm: mm("Moulding face width", 300)
          .nullable()
          .optional()
          .transform((v) => v ?? null),
        rebateDepthMm: mm("Rebate depth", 200)
          .nullable()
          .optional()
          .transform((v) => v ?? null),
      })
      .optional(),
    backing: z.object({ type: z.enum(BACKING_TYPES), notes: optionalText(300) }).optional(),
    sealing: z.object({ type: z.enum(SEALING_TYPES), notes: optionalText(300) }).optional(),
    hanging: z.object({ hardware: optionalText(200), wire: optionalText(200), notes: optionalText(300) }).optional(),
    undoNotes: requiredText(4000, "Say how to undo this mounting: what to release, and how."),
    notes: optionalText(4000),
  })
  .superRefine((d, ctx) => {
    const hinged = ["t-hinge", "v-hinge", "pendant-hinge", "pass-through-hinge"].includes(d.attachment.method);
    if (hinged && d.attachment.hinges.length === 0) ctx.addIssue({ code: "custom", path: ["attachment", "hinges"], message: "Place at least one hinge on the drawing." });
    if (hinged && !d.attachment.adhesive) ctx.addIssue({ code: "custom", path: ["attachment", "adhesive"], message: "Give the hinge adhesive." });
  });
export type MountingData = z.infer<typeof MountingDataSchema>;
export type MountingDataInput = z.input<typeof MountingDataSchema>;

const isoDate = isoDateOf();

const mountingSchemas = revisionedSchemas(
  MountingDataSchema,
  { reason: z.enum(MOUNTING_REASONS, { message: "Choose why the object is being mounted." }), mountedOn: isoDate },
  "Say why the record is corrected.",
);

export const MountingCreateSchema = mountingSchemas.create;
export type MountingCreate = z.infer<typeof MountingCreateSchema>;

export const MountingDraftUpdateSchema = mountingSchemas.draftUpdate;
export type MountingDraftUpdate = z.infer<typeof MountingDraftUpdateSchema>;

export const MountingCorrectionSchema = mountingSchemas.correction;
export type MountingCorrection = z.infer<typeof MountingCorrectionSchema>;

export const MountingCompleteSchema = mountingSchemas.lock;
export const MountingRemoveSchema = z.object({
  version: VersionSchema,
  endedOn: isoDate,
  endReason: requiredText(1000, "Say why the object was taken out of this mount."),
});

export const MountingListQuerySchema = z.object({
  framerId: z.string().max(64).optional(),
  from: isoDate.optional(),
  to: isoDate.optional(),
  method: z.enum(ATTACHMENT_METHODS).optional(),
  batch: z.string().trim().max(80).optional(),
  status: z.enum(MOUNTING_STATUSES).optional(),
  page: z.coerce.number().int().min(1).default(1),
  pageSize: z.coerce.number().int().min(1).max(200).default(50),
});
export type MountingListQuery = z.infer<typeof MountingListQuerySchema>;

export type MountingRevision = Revision<
  MountingData,
  {
    /** The plan recomputed from this revision's saved input, the object's catalogue and the materials' checks (recordPlan). */
    plan: MountPlan;
    /** The object's catalogue facts the plan was computed with, so a screen recomputes the same plan. */
    catalogue: CatalogueFacts;
  }
>;

export type MountingRecord = {
  id: string;
  objectId: string;
  objectNumber: string;
  objectTitle: string;
  status: MountingStatus;
  reason: (typeof MOUNTING_REASONS)[number];
  mountedOn: string;
  framerId: string | null;
  framerName: string;
  currentRevision: number;
  supersededById: string | null;
  endedOn: string | null;
  endReason: string | null;
  version: number;
  updatedAt: string;
  /** The current revision in full; earlier revisions come from GET …/revisions. */
  current: MountingRevision;
};

export type MountingListItem = {
  id: string;
  objectId: string;
  objectNumber: string;
  objectTitle: string;
  status: MountingStatus;
  reason: string;
  mountedOn: string;
  framerName: string;
  method: string | null;
  boardGrade: string | null;
  glazing: string | null;
  batches: string[];
};

/** How the object is held, in the framer's words: the registers' columns and filters use these. */
export const ATTACHMENT_METHOD_LABELS: Record<(typeof ATTACHMENT_METHODS)[number], string> = {
  "t-hinge": "T-hinges",
  "v-hinge": "V-hinges (folded)",
  "pendant-hinge": "Pendant hinges",
  "pass-through-hinge": "Pass-through (S-) hinges",
  corners: "Corners",
  "edge-strips": "Edge strips",
  "sink-mount": "Sink mount",
  "polyester-straps": "Polyester straps",
  "pressure-sensitive-tape": "Pressure-sensitive tape",
};

export const ADHESIVE_LABELS: Record<(typeof ADHESIVES)[number], string> = {
  "wheat-starch-paste": "Wheat starch paste",
  "rice-starch-paste": "Rice starch paste",
  "methyl-cellulose": "Methyl cellulose",
  none: "None",
  "pressure-sensitive": "Pressure-sensitive",
  other: "Other",
};

/** The answer of GET /api/mountings: one page of the register and the framers it can be filtered by. */
export type MountingListPage = { items: MountingListItem[]; total: number; page: number; pageSize: number; framers: { id: string; name: string }[] };
