import { z } from "zod";
import { optionalText, requiredText, isoDate as isoDateOf } from "./common.ts";
import { isCurrencyCode } from "../domain/money.ts";
import { ATTACHMENT_METHODS, BOARD_GRADES, GLAZING_TYPES } from "./mount-values.ts";

export const OBJECT_TYPES = ["print", "drawing", "watercolour", "pastel", "photograph", "document", "textile-on-paper", "other"] as const;
export const OBJECT_TYPE_LABELS: Record<(typeof OBJECT_TYPES)[number], string> = {
  print: "Print",
  drawing: "Drawing",
  watercolour: "Watercolour",
  pastel: "Pastel",
  photograph: "Photograph",
  document: "Document",
  "textile-on-paper": "Textile on paper",
  other: "Other",
};

export const PHOTO_PROCESSES = [
  "gelatin-silver",
  "chromogenic",
  "pigment-inkjet",
  "albumen",
  "salted-paper",
  "cyanotype",
  "platinum-palladium",
  "dye-transfer",
  "collodion",
  "other",
] as const;
export const PHOTO_PROCESS_LABELS: Record<(typeof PHOTO_PROCESSES)[number], string> = {
  "gelatin-silver": "Gelatin silver",
  chromogenic: "Chromogenic",
  "pigment-inkjet": "Pigment inkjet",
  albumen: "Albumen",
  "salted-paper": "Salted paper",
  cyanotype: "Cyanotype",
  "platinum-palladium": "Platinum / palladium",
  "dye-transfer": "Dye transfer",
  collodion: "Collodion",
  other: "Other process",
};

export const SENSITIVITIES = ["light-sensitive", "friable-media", "cockled", "fragile"] as const;
export const SENSITIVITY_LABELS: Record<(typeof SENSITIVITIES)[number], string> = {
  "light-sensitive": "Light-sensitive",
  "friable-media": "Friable media",
  cockled: "Cockled",
  fragile: "Fragile",
};

export const OBJECT_STATUSES = ["in-studio", "with-owner", "on-loan", "with-conservator"] as const;
export const OBJECT_STATUS_LABELS: Record<(typeof OBJECT_STATUSES)[number], string> = {
  "in-studio": "In the studio",
  "with-owner": "With the owner",
  "on-loan": "On loan",
  "with-conservator": "With a conservator",
};

export const VALUATION_BASES = ["market", "replacement", "agreed", "other"] as const;
export const VALUATION_BASIS_LABELS: Record<(typeof VALUATION_BASES)[number], string> = {
  market: "Market value",
  replacement: "Replacement value",
  agreed: "Agreed value",
  other: "Other basis",
};

export type ObjectType = (typeof OBJECT_TYPES)[number];
export type ObjectStatus = (typeof OBJECT_STATUSES)[number];

const mm = (label: string, max = 3000) =>
  z
    .number({ message: `${label}: enter a length.` })
    .positive({ message: `${label} must be greater than 0.` })
    .max(max, { message: `${label} must be at most ${max} mm.` });

const borderMm = (label: string) =>
  z
    .number({ message: `${label}: enter a length.` })
    .min(0, { message: `${label} cannot be negative.` })
    .max(1500, { message: `${label} must be at most 1,500 mm.` })
    .nullable()
    .optional()
    .transform((v) => v ?? null);

const isoDate = isoDateOf()
  .nullable()
  .optional()
  .transform((v) => v ?? null);

/** The object number: letters, digits and . - / _ , e.g. 2026-0042. */
export const ObjectNumberSchema = requiredText(40, "Give the object an object number.").regex(/^[A-Za-z0-9][A-Za-z0-9.\-/_ ]*$/, {
  message: "Use letters, digits, spaces and . - / _ only.",
});

const ValuationShape = {
  valuationMinor: z
    .number({ message: "Enter the insured value as a number." })
    .int({ message: "Insured value is kept in whole minor units (e.g. pence or cents)." })
    .min(0, { message: "Insured value cannot be negative." })
    .max(1e13, { message: "Insured value is too large." })
    .nullable()
    .optional()
    .transform((v) => v ?? null),
  valuationCurrency: z
    .string()
    .trim()
    .toUpperCase()
    .refine((c) => c === "" || isCurrencyCode(c), { message: "Use an ISO 4217 currency code such as GBP, EUR or USD." })
    .transform((v) => (v === "" ? null : v))
    .nullable()
    .optional()
    .transform((v) => v ?? null),
  valuationDate: isoDate,
  valuationBasis: z
    .enum(VALUATION_BASES)
    .nullable()
    .optional()
    .transform((v) => v ?? null),
  valuer: optionalText(200),
};

export const ObjectBaseSchema = z.object({
  objectNumber: ObjectNumberSchema,
  title: requiredText(300, "Give the object a title (or a description such as “Untitled landscape”)."),
  maker: optionalText(200),
  dateMade: optionalText(80),
  objectType: z.enum(OBJECT_TYPES, { message: "Choose the object type." }),
  medium: optionalText(300),
  support: optionalText(300),
  photoProcess: z
    .enum(PHOTO_PROCESSES)
    .nullable()
    .optional()
    .transform((v) => v ?? null),
  edition: optionalText(200),
  inscriptions: optionalText(2000),
  sheetWidthMm: mm("Sheet width"),
  sheetHeightMm: mm("Sheet height"),
  borderLeftMm: borderMm("Left border"),
  borderTopMm: borderMm("Top border"),
  borderRightMm: borderMm("Right border"),
  borderBottomMm: borderMm("Bottom border"),
  thicknessNotes: optionalText(500),
  sensitivities: z.array(z.enum(SENSITIVITIES)).max(SENSITIVITIES.length).default([]),
  clientId: z.string({ message: "Choose the owner." }).min(1, { message: "Choose the owner." }),
  status: z.enum(OBJECT_STATUSES, { message: "Choose where the object is." }),
  location: optionalText(200),
  ...ValuationShape,
});

function checkCross(o: z.infer<typeof ObjectBaseSchema>, ctx: z.RefinementCtx) {
  const w = o.sheetWidthMm;
  const h = o.sheetHeightMm;
  // Only when the sheet size itself is valid: a zero width already has its own message.
  if (w > 0 && (o.borderLeftMm ?? 0) + (o.borderRightMm ?? 0) >= w) {
    ctx.addIssue({ code: "custom", path: ["borderRightMm"], message: "Left and right borders together must be narrower than the sheet." });
  }
  if (h > 0 && (o.borderTopMm ?? 0) + (o.borderBottomMm ?? 0) >= h) {
    ctx.addIssue({ code: "custom", path: ["borderBottomMm"], message: "Top and bottom borders together must be less than the sheet height." });
  }
  if (o.valuationMinor !== null && !o.valuationCurrency) {
    ctx.addIssue({ code: "custom", path: ["valuationCurrency"], message: "Give the currency of the insured value." });
  }
  if (o.photoProcess && o.objectType !== "photograph") {
    ctx.addIssue({ code: "custom", path: ["photoProcess"], message: "A photographic process only applies to a photograph." });
  }
}

export const ObjectCreateSchema = ObjectBaseSchema.superRefine(checkCross);
export type ObjectCreate = z.infer<typeof ObjectCreateSchema>;
export type ObjectCreateInput = z.input<typeof ObjectCreateSchema>;

/** An update carries the version it was edited from, so a stale edit answers 409 instead of overwriting. */
export const ObjectUpdateSchema = ObjectBaseSchema.extend({ version: z.number().int().min(1) }).superRefine(checkCross);
export type ObjectUpdate = z.infer<typeof ObjectUpdateSchema>;

/** The current mount's values the register filters by: the mounting contract's own lists. */
export const REGISTER_METHODS = ATTACHMENT_METHODS;
export const REGISTER_BOARD_GRADES = BOARD_GRADES;
export const REGISTER_GLAZINGS = GLAZING_TYPES;
export type RegisterMethod = (typeof REGISTER_METHODS)[number];
export type RegisterBoardGrade = (typeof REGISTER_BOARD_GRADES)[number];
export type RegisterGlazing = (typeof REGISTER_GLAZINGS)[number];

export const OBJECT_SORTS = ["objectNumber", "title", "maker", "updatedAt", "status", "lastMountedOn", "checkDueOn"] as const;
export const ObjectListQuerySchema = z.object({
  q: z.string().trim().max(200).optional(),
  clientId: z.string().max(64).optional(),
  status: z.enum(OBJECT_STATUSES).optional(),
  objectType: z.enum(OBJECT_TYPES).optional(),
  /** The current mount's attachment method, window-board grade and glazing. */
  method: z.enum(REGISTER_METHODS).optional(),
  boardGrade: z.enum(REGISTER_BOARD_GRADES).optional(),
  glazing: z.enum(REGISTER_GLAZINGS).optional(),
  /** Objects due for a check on or before this date. The client sends its own today, so the register needs no clock. */
  checkDueBy: isoDateOf().optional(),
  sort: z.enum(OBJECT_SORTS).default("objectNumber"),
  dir: z.enum(["asc", "desc"]).default("asc"),
  page: z.coerce.number().int().min(1).default(1),
  pageSize: z.coerce.number().int().min(1).max(200).default(50),
});
export type ObjectListQuery = z.infer<typeof ObjectListQuerySchema>;
/** The register's filter without its sort and page: what a schedule of values or a label sheet is made for. */
export const RegisterFilterSchema = ObjectListQuerySchema.pick({
  q: true,
  clientId: true,
  status: true,
  objectType: true,
  method: true,
  boardGrade: true,
  glazing: true,
  checkDueBy: true,
});

/**
 * The register page's address: its filter with "due for a check" as a switch (`due=1`; the day is the
 * studio's today, added when the list is asked for), and its sort and page.
 */
export const RegisterAddressSchema = RegisterFilterSchema.omit({ checkDueBy: true }).extend({
  sort: ObjectListQuerySchema.shape.sort,
  dir: ObjectListQuerySchema.shape.dir,
  page: ObjectListQuerySchema.shape.page,
  due: z.literal("1").optional(),
});

/** An object as the API returns it. Valuation fields are null and `valuationVisible` false for those who may not see them. */
export type ObjectRecord = Omit<ObjectCreate, never> & {
  id: string;
  clientName: string;
  version: number;
  createdAt: string;
  updatedAt: string;
  valuationVisible: boolean;
};

export type ObjectListItem = Pick<
  ObjectRecord,
  "id" | "objectNumber" | "title" | "maker" | "objectType" | "status" | "location" | "clientId" | "clientName" | "sheetWidthMm" | "sheetHeightMm" | "updatedAt"
> & {
  /** The current mount (null when the object is not in a mount). */
  currentMethod: RegisterMethod | null;
  currentBoardGrade: RegisterBoardGrade | null;
  currentGlazing: RegisterGlazing | null;
  /** ISO dates. */
  lastMountedOn: string | null;
  checkDueOn: string | null;
};
