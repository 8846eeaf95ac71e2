import type { Check, Finding, MountPlan, Verdict } from "../../../schemas/mount-plan.ts";
import { PLAN_SCHEMA_VERSION } from "../../../schemas/mount-plan.ts";
import { MM_PER_INCH } from "../../units.ts";
import { figureLength, figureSize } from "../figures.ts";
import type { Box, PlanGeometry, Sides } from "./types.ts";

const round6 = (v: number) => Math.round(v * 1e6) / 1e6;
function inUnit(mm: number, inch: boolean): number {
  return round6(inch ? mm / MM_PER_INCH : mm);
}
function boxIn(b: Box, inch: boolean): Box {
  return { width: inUnit(b.width, inch), height: inUnit(b.height, inch) };
}
function sidesIn(s: Sides, inch: boolean): Sides {
  return { left: inUnit(s.left, inch), top: inUnit(s.top, inch), right: inUnit(s.right, inch), bottom: inUnit(s.bottom, inch) };
}

/** Step 9: the plan as recorded, in its own unit (rounded to 6 places), with its findings, checks, level and shown figures. */
export function toPlan(g: PlanGeometry, findings: Finding[], checks: Check[], level: Verdict, precision: number): MountPlan {
  const inch = g.unit === "in";
  const f = g.figures;
  const du = f.unit;
  const outerSize = figureSize(f.outer, du);
  const display: Record<string, string> = {
    sheet: figureSize(f.sheet, du),
    aperture: figureSize(f.aperture, du),
    outer: outerSize,
    glazing: outerSize,
    rebate: figureSize(f.rebate, du),
    sight: figureSize(f.sight, du),
    moulding: figureLength(f.moulding, du),
    minOverlap: figureLength(f.minOverlap, du),
    "sheet.width": figureLength(f.sheet.width, du),
    "sheet.height": figureLength(f.sheet.height, du),
    "aperture.width": figureLength(f.aperture.width, du),
    "aperture.height": figureLength(f.aperture.height, du),
    "outer.width": figureLength(f.outer.width, du),
    "outer.height": figureLength(f.outer.height, du),
    // A float's overlap is its reveal, shown as a negative overlap.
    "overlap.left": figureLength(f.overlap.left, du),
    "overlap.top": figureLength(f.overlap.top, du),
    "overlap.right": figureLength(f.overlap.right, du),
    "overlap.bottom": figureLength(f.overlap.bottom, du),
    "borders.left": figureLength(f.borders.left, du),
    "borders.top": figureLength(f.borders.top, du),
    "borders.right": figureLength(f.borders.right, du),
    "borders.bottom": figureLength(f.borders.bottom, du),
  };
  if (f.topWindow) display.topWindow = figureSize(f.topWindow, du);
  return {
    schemaVersion: PLAN_SCHEMA_VERSION,
    unit: g.unit,
    displayUnit: du,
    precision,
    sheet: boxIn(g.sheet, inch),
    aperture: boxIn(g.aperture, inch),
    overlap: sidesIn(g.overlap, inch),
    windowOnSheet: { left: inUnit(g.windowOnSheet.left, inch), top: inUnit(g.windowOnSheet.top, inch) },
    borders: sidesIn(g.borders, inch),
    outer: boxIn(g.outer, inch),
    ...(g.topWindow ? { topWindow: boxIn(g.topWindow, inch) } : {}),
    glazing: {
      ...boxIn(g.glazing, inch),
      ...(g.glazing.weightKg !== undefined ? { weightKg: Math.round(g.glazing.weightKg * 1000) / 1000 } : {}),
      ...(g.glazing.material ? { material: g.glazing.material, thickness: inUnit(g.glazing.thickness!, inch) } : {}),
    },
    rebate: boxIn(g.rebate, inch),
    sight: boxIn(g.sight, inch),
    moulding: { length: inUnit(g.moulding.length, inch), faceWidth: inUnit(g.moulding.faceWidth, inch), wastePercent: g.moulding.wastePercent },
    package: {
      thickness: inUnit(g.package.thickness, inch),
      ...(g.package.rebateDepth !== undefined ? { rebateDepth: inUnit(g.package.rebateDepth, inch) } : {}),
      ...(g.package.weightKg !== undefined ? { weightKg: Math.round(g.package.weightKg * 1000) / 1000 } : {}),
    },
    ...(g.yield
      ? { yield: { perSheet: g.yield.perSheet, sheet: boxIn(g.yield.sheet, inch), kerf: inUnit(g.yield.kerf, inch), utilisation: Math.round(g.yield.utilisation * 1000) / 1000 } }
      : {}),
    findings,
    checks,
    level,
    display,
  };
}
