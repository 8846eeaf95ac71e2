import { z } from "zod";
import { MM_PER_INCH, parseLength, UNITS, type Unit } from "../domain/units.ts";
import { OBJECT_TYPES, PHOTO_PROCESSES, SENSITIVITIES } from "./objects.ts";
import { ATTACHMENT_METHODS, BOARD_GRADES } from "./mount-values.ts";

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
export { ATTACHMENT_METHODS, BOARD_GRADES };
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

/** The object's catalogue, as far as the checks need it (docs/trade.md §4). */
export const PlanObjectSchema = z.object({
  objectType: z.enum(OBJECT_TYPES).optional(),
  photoProcess: z.enum(PHOTO_PROCESSES).nullable().optional(),
  sensitivities: z.array(z.enum(SENSITIVITIES)).max(SENSITIVITIES.length).optional(),
  /** Medium and technique as catalogued: friable media are recognised by name too (pastel, charcoal, chalk). */
  medium: z.string().trim().max(300).nullable().optional(),
  /** The paper's weight in g/m², when known: heavier sheets want more hinges. */
  paperWeightGsm: z.number().positive({ message: "Paper weight must be greater than 0." }).max(2000, { message: "Paper weight must be at most 2,000 g/m²." }).nullable().optional(),
});
export type PlanObject = z.infer<typeof PlanObjectSchema>;

export const PRECISIONS = { mm: [0.1, 0.5, 1], in: [8, 16, 32] } as const;

/**
 * Upper bounds on every length, in mm (docs/trade.md §10): a studio's largest board sheet
 * is about 60 × 104 in (1524 × 2642 mm), so no sheet, window, outer size or board sheet goes past
 * 3,000 mm; borders and overlaps past half of that; thicknesses past what a frame holds. Bounds
 * keep every stored plan buildable and every computation small; nothing a studio frames is near them.
 */
export const LENGTH_BOUNDS_MM = {
  size: 3000,
  position: 3000,
  border: 1500,
  overlap: 500,
  minOverlap: 100,
  reveal: 200,
  glazing: 20,
  board: 20,
  spacer: 100,
  clearance: 50,
  lip: 100,
  rebateDepth: 200,
  faceWidth: 300,
  kerf: 10,
} as const;
/** The smallest sheet or board: 5 mm (a stamp-sized sheet is larger), so a yield stays a few hundred blanks per edge. */
export const MIN_SIZE_MM = 5;
type BoundKind = keyof typeof LENGTH_BOUNDS_MM;

const boundText = (mm: number) => `${mm.toLocaleString("en-GB")} mm (${Math.floor((mm / MM_PER_INCH) * 10) / 10} in)`;

/** Adds an issue naming the field for each length past its bound (or, for sizes, below the smallest). */
export function checkBounds(ctx: z.RefinementCtx, unit: Unit, items: [path: (string | number)[], value: Length | undefined, kind: BoundKind, label: string][]) {
  for (const [path, value, kind, label] of items) {
    if (value === undefined) continue;
    const r = parseLength(value, unit);
    if (!r.ok) continue; // unreadable lengths get their own message from the computation
    const max = LENGTH_BOUNDS_MM[kind];
    if (Math.abs(r.mm) > max) ctx.addIssue({ code: "custom", path, message: `${label} must be at most ${boundText(max)}.` });
    else if (kind === "size" && r.mm > 0 && r.mm < MIN_SIZE_MM) ctx.addIssue({ code: "custom", path, message: `${label} must be at least ${MIN_SIZE_MM} mm.` });
  }
}

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
    glazing: z.object({ material: z.enum(GLAZING_MATERIALS, { message: "Choose glass or acrylic." }), thickness: LengthSchema, uvFiltering: z.boolean().optional() }).optional(),
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
  .strict()
  .superRefine((p, ctx) => {
    const items: Parameters<typeof checkBounds>[2] = [
      [["sheet", "width"], p.sheet.width, "size", "Sheet width"],
      [["sheet", "height"], p.sheet.height, "size", "Sheet height"],
      [["minOverlap"], p.minOverlap, "minOverlap", "Minimum overlap"],
      [["bottomWeight"], p.bottomWeight, "border", "Bottom weighting"],
      [["minBorder"], p.minBorder, "border", "Minimum border"],
      [["doubleMount", "reveal"], p.doubleMount?.reveal, "reveal", "Double mount reveal"],
      [["glazing", "thickness"], p.glazing?.thickness, "glazing", "Glazing thickness"],
      [["spacer", "depth"], p.spacer?.depth, "spacer", "Spacer depth"],
      [["boards", "window"], p.boards?.window, "board", "Window board thickness"],
      [["boards", "backing"], p.boards?.backing, "board", "Backing board thickness"],
      [["boards", "extraBacking"], p.boards?.extraBacking, "board", "Extra backing thickness"],
      [["frame", "clearance"], p.frame?.clearance, "clearance", "Rebate clearance"],
      [["frame", "rebateLip"], p.frame?.rebateLip, "lip", "Rebate lip"],
      [["frame", "rebateDepth"], p.frame?.rebateDepth, "rebateDepth", "Rebate depth"],
      [["frame", "faceWidth"], p.frame?.faceWidth, "faceWidth", "Moulding face width"],
      [["fitOuter", "width"], p.fitOuter?.width, "size", "Outer width"],
      [["fitOuter", "height"], p.fitOuter?.height, "size", "Outer height"],
      [["boardSheet", "width"], p.boardSheet?.width, "size", "Board sheet width"],
      [["boardSheet", "height"], p.boardSheet?.height, "size", "Board sheet height"],
      [["kerf"], p.kerf, "kerf", "Kerf"],
    ];
    for (const s of SIDES) {
      if (p.imageBorders) items.push([["imageBorders", s], p.imageBorders[s], "border", `The sheet's ${s} border`]);
      if (p.borders && s in p.borders) items.push([["borders", s], (p.borders as Record<string, Length>)[s], "border", `The ${s} border`]);
    }
    if (p.borders && "all" in p.borders) items.push([["borders", "all"], p.borders.all, "border", "The border"]);
    if (p.borders && "side" in p.borders) items.push([["borders", "side"], p.borders.side, "border", "The side borders"]);
    const w = p.window;
    if ("mode" in w) {
      items.push([["window", "width"], w.width, "size", "Window width"], [["window", "height"], w.height, "size", "Window height"]);
      items.push([["window", "left"], w.left, "position", "Window position from the left"], [["window", "top"], w.top, "position", "Window position from the top"]);
    } else {
      const entries: [(string | number)[], Side][] = "all" in w ? [[["window", "all"], w.all]] : SIDES.map((s) => [["window", s], w[s]]);
      for (const [path, side] of entries) {
        if (side.mode === "overlap") items.push([[...path, "overlap"], side.overlap, "overlap", "Overlap"]);
        else if (side.mode === "float") items.push([[...path, "reveal"], side.reveal, "reveal", "Reveal"]);
        else items.push([[...path, "border"], side.border, "border", "Border of the sheet"], [[...path, "into"], side.into, "overlap", "Cover into the image"]);
      }
    }
    checkBounds(ctx, p.unit, items);
  });
export type MountPlanInput = z.input<typeof MountPlanInputSchema>;
export type MountPlanParsed = z.infer<typeof MountPlanInputSchema>;

export type Severity = "info" | "warn" | "error";
/** `field` is the input path the finding is about (e.g. "borders.left", "window.all.reveal"), so a form can show it beside that field. */
export type Finding = { code: string; severity: Severity; side?: SideName; field?: string; message: string };
export type Verdict = "pass" | "warn" | "fail";
export type Check = { id: string; rule: string; verdict: Verdict; reason: string; source: string };

type Box = { width: number; height: number };
type Sides = Record<SideName, number>;

/**
 * The computed plan. Numbers are the plan's own, in its unit (decimal inches for "in"); `display`
 * has the figures as shown, in `displayUnit`, rounded once so that they add up (figures.ts).
 */
export type MountPlan = {
  schemaVersion: number;
  unit: "mm" | "in";
  displayUnit: "mm" | "in";
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

export const CuttingListRequestSchema = z
  .object({
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
  })
  .superRefine((r, ctx) => {
    checkBounds(ctx, r.unit, [
      [["boardSheet", "width"], r.boardSheet.width, "size", "Board sheet width"],
      [["boardSheet", "height"], r.boardSheet.height, "size", "Board sheet height"],
      [["kerf"], r.kerf, "kerf", "Kerf"],
      ...r.pieces.flatMap((p, i): Parameters<typeof checkBounds>[2] => [
        [["pieces", i, "width"], p.width, "size", "Board width"],
        [["pieces", i, "height"], p.height, "size", "Board height"],
      ]),
    ]);
  });
export type CuttingListRequest = z.infer<typeof CuttingListRequestSchema>;
