import { z } from "zod";
import { UNITS } from "../domain/units.ts";
import { OBJECT_TYPES, PHOTO_PROCESSES, SENSITIVITIES } from "./objects.ts";

/**
 * The mount plan contract (POST /api/mount-plans/calculate). Lengths are numbers or strings
 * in the plan's `unit` ("7 5/8", "7-5/8", "7.625"); the domain reads them into millimetres.
 */
export const PLAN_SCHEMA_VERSION = 1;

export const LengthSchema = z.union([z.number(), z.string().trim().min(1, { message: "Enter a length." }).max(40)], {
  message: "Enter a length as a number or text such as 7 5/8.",
});
export type Length = z.infer<typeof LengthSchema>;

const SizeSchema = z.object({ width: LengthSchema, height: LengthSchema });

export const SideSchema = z.discriminatedUnion(
  "mode",
  [
    z.object({ mode: z.literal("overlap"), overlap: LengthSchema }),
    z.object({ mode: z.literal("hide-border"), border: LengthSchema, into: LengthSchema }),
    z.object({ mode: z.literal("float"), reveal: LengthSchema }),
  ],
  { message: "Choose overlap, hide-border or float for this side." },
);
export type Side = z.infer<typeof SideSchema>;
export const SIDES = ["left", "top", "right", "bottom"] as const;
export type SideName = (typeof SIDES)[number];

export const WindowSchema = z.union(
  [
    z.object({ mode: z.literal("custom"), width: LengthSchema, height: LengthSchema, left: LengthSchema, top: LengthSchema }),
    z.object({ all: SideSchema }),
    z.object({ left: SideSchema, top: SideSchema, right: SideSchema, bottom: SideSchema }),
  ],
  { message: "Give the window as { all }, one entry per side, or a custom window." },
);

export const BordersSchema = z.union(
  [
    z.object({ all: LengthSchema }),
    z.object({ top: LengthSchema, side: LengthSchema, bottom: LengthSchema }),
    z.object({ left: LengthSchema, top: LengthSchema, right: LengthSchema, bottom: LengthSchema }),
  ],
  { message: "Give the borders as { all }, { top, side, bottom } or one per side." },
);

export const GLAZING_MATERIALS = ["glass", "acrylic"] as const;
export const BOARD_GRADES = ["museum", "conservation", "other"] as const;
export const ATTACHMENT_METHODS = [
  "t-hinge",
  "v-hinge",
  "pendant-hinge",
  "pass-through-hinge",
  "corners",
  "edge-strips",
  "sink-mount",
  "polyester-straps",
  "pressure-sensitive-tape",
] as const;
export const ADHESIVES = ["wheat-starch-paste", "rice-starch-paste", "methyl-cellulose", "none", "pressure-sensitive", "other"] as const;
export const PROHIBITED_MATERIALS = ["foam-board", "kraft-paper", "pressure-sensitive-tape", "self-adhesive-transfer-tape"] as const;
export const HINGE_EDGES = ["top", "top-and-sides", "all-edges"] as const;

export const MaterialsSchema = z.object({
  boardGrade: z.enum(BOARD_GRADES).optional(),
  buffered: z.boolean().optional(),
  /** Board has passed the Photographic Activity Test (ISO 18916). */
  patPassed: z.boolean().optional(),
  attachment: z.enum(ATTACHMENT_METHODS).optional(),
  adhesive: z.enum(ADHESIVES).optional(),
  tissue: z.string().trim().max(120).optional(),
  hingeCount: z.number().int().min(0).max(40).optional(),
  hingeEdge: z.enum(HINGE_EDGES).optional(),
  /** Anything on or near the object that must not be there. */
  present: z.array(z.enum(PROHIBITED_MATERIALS)).max(4).optional(),
});
export type Materials = z.infer<typeof MaterialsSchema>;

export const PlanObjectSchema = z.object({
  objectType: z.enum(OBJECT_TYPES).optional(),
  photoProcess: z.enum(PHOTO_PROCESSES).nullable().optional(),
  sensitivities: z.array(z.enum(SENSITIVITIES)).max(SENSITIVITIES.length).optional(),
});

export const PRECISIONS = { mm: [0.1, 0.5, 1], in: [8, 16, 32] } as const;

export const MountPlanInputSchema = z
  .object({
    schemaVersion: z.literal(PLAN_SCHEMA_VERSION).default(PLAN_SCHEMA_VERSION),
    unit: z.enum(UNITS, { message: 'Choose "mm" or "in".' }),
    /** The cutting step: 0.1, 0.5 or 1 mm; or 8, 16 or 32 (fractions of an inch). Default 0.5 mm or 1/16 in. */
    precision: z.number().optional(),
    sheet: SizeSchema,
    /** The sheet's own border around the image on each side, if it has one (from the object record). */
    imageBorders: z.object({ left: LengthSchema, top: LengthSchema, right: LengthSchema, bottom: LengthSchema }).optional(),
    window: WindowSchema,
    minOverlap: LengthSchema.optional(),
    borders: BordersSchema.optional(),
    /** Extra added to the bottom border (an amount), or… */
    bottomWeight: LengthSchema.optional(),
    /** …the bottom border larger than the top by this percentage. */
    bottomWeightPercent: z.number().min(0, { message: "Bottom weighting cannot be negative." }).max(100, { message: "Keep bottom weighting at most 100 %." }).optional(),
    fitOuter: SizeSchema.optional(),
    /** Borders narrower than this are reported. */
    minBorder: LengthSchema.optional(),
    doubleMount: z.object({ reveal: LengthSchema }).optional(),
    glazing: z
      .object({ material: z.enum(GLAZING_MATERIALS, { message: "Choose glass or acrylic." }), thickness: LengthSchema, uvFiltering: z.boolean().optional() })
      .optional(),
    spacer: z.object({ depth: LengthSchema }).optional(),
    /** Thickness of the boards in the package; default 4-ply, about 1.4 mm. */
    boards: z.object({ window: LengthSchema.optional(), backing: LengthSchema.optional(), extraBacking: LengthSchema.optional() }).optional(),
    frame: z
      .object({
        /** Total clearance added to the package for the rebate; default: the studio setting (2 mm). */
        clearance: LengthSchema.optional(),
        rebateLip: LengthSchema.optional(),
        rebateDepth: LengthSchema.optional(),
        faceWidth: LengthSchema.optional(),
        wastePercent: z.number().min(0).max(100).optional(),
      })
      .optional(),
    boardSheet: SizeSchema.optional(),
    kerf: LengthSchema.optional(),
    object: PlanObjectSchema.optional(),
    materials: MaterialsSchema.optional(),
  })
  .strict();
export type MountPlanInput = z.input<typeof MountPlanInputSchema>;
export type MountPlanParsed = z.infer<typeof MountPlanInputSchema>;

export type Severity = "info" | "warn" | "error";
export type Finding = { code: string; severity: Severity; side?: SideName; message: string };
export type Verdict = "pass" | "warn" | "fail";
export type Check = { id: string; rule: string; verdict: Verdict; reason: string; source: string };

type Box = { width: number; height: number };
type Sides = Record<SideName, number>;

/** The computed plan. Numbers are in the plan's unit (decimal inches for "in"); `display` has the same values as text with fractions. */
export type MountPlan = {
  schemaVersion: number;
  unit: "mm" | "in";
  precision: number;
  sheet: Box;
  aperture: Box;
  /** Overlap of the window over the sheet, per side; negative for a float (the reveal). */
  overlap: Sides;
  /** Where the window sits on the sheet: its offset from the sheet's top-left corner. */
  windowOnSheet: { left: number; top: number };
  borders: Sides;
  outer: Box;
  /** Double mount: the top board's window. */
  topWindow?: Box;
  glazing: Box & { weightKg?: number; material?: "glass" | "acrylic"; thickness?: number };
  rebate: Box;
  sight: Box;
  moulding: { length: number; faceWidth: number; wastePercent: number };
  package: { thickness: number; rebateDepth?: number; weightKg?: number };
  yield?: { perSheet: number; sheet: Box; kerf: number; utilisation: number };
  findings: Finding[];
  checks: Check[];
  level: Verdict;
  display: Record<string, string>;
};

export const SavePlanSchema = z.object({
  input: MountPlanInputSchema,
  /** The draft version the edit started from; omit when saving the first draft. */
  version: z.number().int().min(1).optional(),
});
export type SavePlan = z.infer<typeof SavePlanSchema>;

export type SavedPlan = {
  id: string;
  objectId: string;
  status: "draft";
  version: number;
  input: MountPlanInput;
  plan: MountPlan;
  updatedAt: string;
  updatedBy: string | null;
};

export const CuttingListRequestSchema = z.object({
  unit: z.enum(UNITS, { message: 'Choose "mm" or "in".' }),
  boardSheet: SizeSchema,
  kerf: LengthSchema.optional(),
  pieces: z
    .array(
      z.object({
        id: z.string().trim().min(1).max(80),
        label: z.string().trim().max(200).optional(),
        width: LengthSchema,
        height: LengthSchema,
        quantity: z.number().int().min(1, { message: "Quantity must be at least 1." }).max(500, { message: "Keep each quantity at most 500." }),
      }),
    )
    .min(1, { message: "Add at least one board to cut." })
    .max(200, { message: "Keep a batch to at most 200 lines." })
    .refine((pieces) => pieces.reduce((n, p) => n + p.quantity, 0) <= 2000, { message: "Keep a batch to at most 2,000 boards in all; split larger orders." }),
});
export type CuttingListRequest = z.infer<typeof CuttingListRequestSchema>;
