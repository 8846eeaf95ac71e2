import { z } from "zod";
import { requiredText, optionalText } from "./common.ts";
import { UNITS } from "../domain/units.ts";
import { isCurrencyCode } from "../domain/money.ts";

export const VOCABULARIES = ["mount", "mat"] as const;
export const PAPER_SIZES = ["A4", "Letter"] as const;

/** A check interval: whole months, 1 to 120. */
const months = () =>
  z.number({ message: "Enter a number of months." }).int({ message: "Use whole months." }).min(1, { message: "At least 1 month." }).max(120, { message: "At most 120 months." });

export const StudioSettingsSchema = z.object({
  studioName: requiredText(200, "Give the studio's name."),
  studioAddress: optionalText(500),
  studioContact: optionalText(200),
  unit: z.enum(UNITS, { message: "Choose mm or inches." }),
  vocabulary: z.enum(VOCABULARIES, { message: "Choose mount or mat." }),
  paperSize: z.enum(PAPER_SIZES, { message: "Choose A4 or US Letter." }),
  currency: z.string().trim().toUpperCase().refine(isCurrencyCode, { message: "Use an ISO 4217 currency code such as GBP." }),
  minOverlapMm: z
    .number({ message: "Enter the minimum overlap in mm." })
    .min(1, { message: "Minimum overlap must be at least 1 mm." })
    .max(25, { message: "Minimum overlap must be at most 25 mm." }),
  rebateClearanceMm: z
    .number({ message: "Enter the rebate clearance in mm." })
    .min(0, { message: "Rebate clearance cannot be negative." })
    .max(10, { message: "Rebate clearance must be at most 10 mm." }),
  checkIntervalMonths: months().default(24),
  checkIntervalOnLoanMonths: months().default(12),
  framePresets: z
    .array(
      z.object({
        label: z.string().trim().min(1, { message: "Name the size." }).max(60, { message: "Keep the name under 60 characters." }),
        widthMm: z.number({ message: "Enter the width." }).positive({ message: "Width must be greater than 0." }).max(5000),
        heightMm: z.number({ message: "Enter the height." }).positive({ message: "Height must be greater than 0." }).max(5000),
      }),
    )
    .max(30, { message: "Keep at most 30 sizes." })
    .optional(),
});
/** Settings as stored and returned: the frame sizes are always there. */
export type StudioSettingsRecord = Omit<z.infer<typeof StudioSettingsSchema>, "framePresets"> & {
  framePresets: NonNullable<z.infer<typeof StudioSettingsSchema>["framePresets"]>;
  /** Whether a logo is set (PUT/DELETE /api/settings/logo); it is not part of the settings body. */
  hasLogo: boolean;
};
/** An update: leaving out `framePresets` keeps the stored ones. */
export type StudioSettings = z.infer<typeof StudioSettingsSchema>;

/** Words that change with the studio's vocabulary (UK mount / US mat). */
export function vocab(v: (typeof VOCABULARIES)[number]) {
  return v === "mat"
    ? { mount: "mat", Mount: "Mat", mountBoard: "mat board", rebate: "rabbet", Rebate: "Rabbet" }
    : { mount: "mount", Mount: "Mount", mountBoard: "mount board", rebate: "rebate", Rebate: "Rebate" };
}
