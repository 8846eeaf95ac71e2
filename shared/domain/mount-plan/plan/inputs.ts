import type { MountPlanParsed } from "../../../schemas/mount-plan.ts";
import { MM_PER_INCH } from "../../units.ts";
import { fineGridMm } from "../figures.ts";
import type { PlanText } from "./text.ts";
import type { Box, PlanContext, Sides } from "./types.ts";

/** What every later step works from: the cutting step, the sheet, the minimum overlap and the sheet's own borders. */
export type PlanBasics = { precision: number; stepMm: number; gridMm: number; sheet: Box; minOverlapMm: number; imageBorders: Sides | null };

/**
 * Step 1: reads the cutting step, the sheet and its own borders, and the minimum overlap. Field
 * errors are collected in `t`; the caller stops once the window has been read as well.
 */
export function readBasics(input: MountPlanParsed, ctx: PlanContext, t: PlanText): PlanBasics {
  const unit = input.unit;
  const fields = t.fields;
  const precision = input.precision ?? (unit === "in" ? 16 : 0.5);
  let stepMm: number;
  if (unit === "in") {
    if (![8, 16, 32].includes(precision)) fields.precision = "For inches, the cutting step is 8, 16 or 32 (1/8, 1/16 or 1/32 in).";
    stepMm = MM_PER_INCH / (precision || 16);
  } else {
    if (![0.1, 0.5, 1].includes(precision)) fields.precision = "For millimetres, the cutting step is 0.1, 0.5 or 1 mm.";
    stepMm = precision || 0.5;
  }
  const gridMm = fineGridMm(unit);

  const sheet = {
    width: t.len(input.sheet.width, "sheet.width", { positive: true, label: "Sheet width" }),
    height: t.len(input.sheet.height, "sheet.height", { positive: true, label: "Sheet height" }),
  };
  const minOverlapMm = input.minOverlap !== undefined ? t.len(input.minOverlap, "minOverlap", { min: 0, label: "Minimum overlap" }) : ctx.minOverlapMm;
  if (input.bottomWeight !== undefined && input.bottomWeightPercent !== undefined) {
    fields.bottomWeightPercent = "Give the bottom weighting either as an amount or as a percentage, not both.";
  }
  let imageBorders: Sides | null = null;
  if (input.imageBorders) {
    const b = input.imageBorders;
    imageBorders = {
      left: t.len(b.left, "imageBorders.left", { min: 0, label: "Left border of the sheet" }),
      top: t.len(b.top, "imageBorders.top", { min: 0, label: "Top border of the sheet" }),
      right: t.len(b.right, "imageBorders.right", { min: 0, label: "Right border of the sheet" }),
      bottom: t.len(b.bottom, "imageBorders.bottom", { min: 0, label: "Bottom border of the sheet" }),
    };
  }
  return { precision, stepMm, gridMm, sheet, minOverlapMm, imageBorders };
}
