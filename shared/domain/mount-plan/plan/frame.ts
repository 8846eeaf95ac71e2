import type { MountPlanParsed } from "../../../schemas/mount-plan.ts";
import { roundTo } from "../../units.ts";
import * as K from "../constants.ts";
import { blanksPerSheet } from "../yield/blanks-per-sheet.ts";
import type { PlanText } from "./text.ts";
import type { Box, PlanContext, PlanGeometry } from "./types.ts";

/** The glazing, frame and package for a mount of a given outer size. */
export type PlanFrame = Pick<PlanGeometry, "glazing" | "rebate" | "rebateLip" | "sight" | "moulding" | "package" | "yield" | "spacerDepth"> & {
  /** The total rebate clearance, for the lip check. */
  clearance: number;
};

/**
 * Step 5: glazing, package and frame. The glazing and boards are cut to the outer size, the rebate
 * and sight size follow from the clearance and the lip, and the package weight from the glazing and
 * the boards. Null when a field is wrong.
 */
export function glazingAndFrame(input: MountPlanParsed, ctx: PlanContext, outer: Box, topWindow: Box | null, stepMm: number, t: PlanText): PlanFrame | null {
  const fr = input.frame ?? {};
  const clearance = fr.clearance !== undefined ? t.len(fr.clearance, "frame.clearance", { min: 0, label: "Rebate clearance" }) : ctx.rebateClearanceMm;
  const lip = fr.rebateLip !== undefined ? t.len(fr.rebateLip, "frame.rebateLip", { min: 0, label: "Rebate lip" }) : K.DEFAULT_REBATE_LIP_MM;
  const faceWidth = fr.faceWidth !== undefined ? t.len(fr.faceWidth, "frame.faceWidth", { positive: true, label: "Moulding face width" }) : K.DEFAULT_FACE_WIDTH_MM;
  const wastePercent = fr.wastePercent ?? K.DEFAULT_WASTE_PERCENT;
  const rebateDepth = fr.rebateDepth !== undefined ? t.len(fr.rebateDepth, "frame.rebateDepth", { positive: true, label: "Rebate depth" }) : undefined;
  const gl = input.glazing;
  const glazingThickness = gl ? t.len(gl.thickness, "glazing.thickness", { positive: true, label: "Glazing thickness" }) : undefined;
  const spacerDepth = input.spacer ? t.len(input.spacer.depth, "spacer.depth", { min: 0, label: "Spacer depth" }) : 0;
  const bd = input.boards ?? {};
  const windowBoard = bd.window !== undefined ? t.len(bd.window, "boards.window", { positive: true, label: "Window board thickness" }) : K.FOUR_PLY_MM;
  const backingBoard = bd.backing !== undefined ? t.len(bd.backing, "boards.backing", { positive: true, label: "Backing board thickness" }) : K.FOUR_PLY_MM;
  const extraBacking = bd.extraBacking !== undefined ? t.len(bd.extraBacking, "boards.extraBacking", { min: 0, label: "Extra backing thickness" }) : 0;
  let boardSheet: Box | null = null;
  let kerf = K.DEFAULT_KERF_MM;
  if (input.boardSheet) {
    boardSheet = {
      width: t.len(input.boardSheet.width, "boardSheet.width", { positive: true, label: "Board sheet width" }),
      height: t.len(input.boardSheet.height, "boardSheet.height", { positive: true, label: "Board sheet height" }),
    };
    if (input.kerf !== undefined) kerf = t.len(input.kerf, "kerf", { min: 0, label: "Kerf" });
  }
  if (t.failed()) return null;

  // Glazing and boards are cut to the outer size; the rebate takes the clearance, rounded up.
  const glazing: PlanGeometry["glazing"] = { width: outer.width, height: outer.height };
  const rebate = { width: roundTo(outer.width + clearance, stepMm, "up"), height: roundTo(outer.height + clearance, stepMm, "up") };
  const sight = { width: rebate.width - 2 * lip, height: rebate.height - 2 * lip };
  const mouldingLength = (2 * (rebate.width + rebate.height) + 8 * faceWidth) * (1 + wastePercent / 100);

  const areaM2 = (outer.width / 1000) * (outer.height / 1000);
  let packageWeight: number | undefined;
  const boardsMm = windowBoard * (topWindow ? 2 : 1) + backingBoard + extraBacking;
  if (gl && glazingThickness !== undefined) {
    const perMm = gl.material === "glass" ? K.GLASS_KG_PER_M2_PER_MM : K.ACRYLIC_KG_PER_M2_PER_MM;
    glazing.weightKg = areaM2 * glazingThickness * perMm;
    glazing.material = gl.material;
    glazing.thickness = glazingThickness;
    glazing.uvFiltering = gl.uvFiltering;
    packageWeight = glazing.weightKg + areaM2 * boardsMm * K.BOARD_KG_PER_M2_PER_MM;
  }
  const thickness = (glazingThickness ?? 0) + spacerDepth + boardsMm;

  // ── Board yield ─────────────────────────────────────────────────────────
  const yieldResult = boardSheet ? boardYield(outer, boardSheet, kerf) : undefined;
  return {
    glazing,
    rebate,
    rebateLip: lip,
    sight,
    moulding: { length: mouldingLength, faceWidth, wastePercent },
    package: { thickness, rebateDepth, weightKg: packageWeight },
    yield: yieldResult,
    spacerDepth,
    clearance,
  };
}

/** How many outer-size boards a full board sheet gives (yield.ts). */
function boardYield(outer: Box, boardSheet: Box, kerf: number): NonNullable<PlanGeometry["yield"]> {
  const y = blanksPerSheet(outer, boardSheet, kerf, 0);
  return { perSheet: y.perSheet, sheet: boardSheet, kerf, utilisation: y.utilisation };
}
