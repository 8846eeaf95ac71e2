/**
 * The mount plan, computed in steps (each in plan/): the cutting step and sheet, the window on each
 * side, the borders and outer size, a double mount's top window, the glazing, package and frame,
 * then the findings, cautions, checks and level, and last the plan as recorded.
 */
import type { Finding, MountPlanParsed } from "../../schemas/mount-plan.ts";
import { formatMm, type Unit } from "../units.ts";
import { figureText, shownFigures } from "./figures.ts";
import { bordersAndOuter, doubleMount } from "./plan/borders.ts";
import { geometryFindings } from "./plan/findings.ts";
import { glazingAndFrame } from "./plan/frame.ts";
import { readBasics } from "./plan/inputs.ts";
import { toPlan } from "./plan/record.ts";
import { PlanText } from "./plan/text.ts";
import type { PlanContext, PlanGeometry, PlanResult } from "./plan/types.ts";
import { cautions, checksAndLevel } from "./plan/verdicts.ts";
import { windowPerSide } from "./plan/window.ts";

export type { PlanContext, PlanGeometry, PlanResult, SideMode } from "./plan/types.ts";
export { LARGE_IMAGE_SHARE, UNBUILDABLE } from "./plan/findings.ts";

/** Computes a mount plan. Pure: the same input and context always give the same plan. */
export function computePlan(input: MountPlanParsed, ctx: PlanContext): PlanResult {
  const unit = input.unit;
  const du: Unit = ctx.displayUnit ?? unit;
  const t = new PlanText(unit, du);
  const findings: Finding[] = [];

  const { precision, stepMm, gridMm, sheet, minOverlapMm, imageBorders } = readBasics(input, ctx, t);
  const win = windowPerSide(input, sheet, stepMm, gridMm, t);
  if (!win) return { ok: false, fields: t.fields };
  const { modes, aperture, overlap, windowOnSheet } = win;
  const bo = bordersAndOuter(input, aperture, stepMm, t, findings);
  if (!bo) return { ok: false, fields: t.fields };
  const { borders, outer } = bo;
  const dm = doubleMount(input, aperture, borders, t);
  if (!dm) return { ok: false, fields: t.fields };
  const { topWindow, doubleReveal } = dm;
  const fr = glazingAndFrame(input, ctx, outer, topWindow, stepMm, t);
  if (!fr) return { ok: false, fields: t.fields };

  const base: Omit<PlanGeometry, "figures"> = {
    unit,
    stepMm,
    minOverlapMm,
    sheet,
    imageBorders,
    modes,
    aperture,
    overlap,
    windowOnSheet,
    borders,
    outer,
    topWindow,
    doubleReveal,
    glazing: fr.glazing,
    rebate: fr.rebate,
    rebateLip: fr.rebateLip,
    sight: fr.sight,
    moulding: fr.moulding,
    package: fr.package,
    yield: fr.yield,
    spacerDepth: fr.spacerDepth,
  };
  const fig = shownFigures(base, du, win.askedReveal);
  // The figures go onto the same object: a copy of it would cost the planner a tenth of its time.
  const geometry = base as PlanGeometry;
  geometry.figures = fig;
  t.minText = du === "in" ? `${figureText(fig.minOverlap, du)} in (${formatMm(minOverlapMm, "up", 0.1)} mm)` : t.shown(fig.minOverlap);

  geometryFindings({ g: geometry, input, win, borderKind: bo.borderKind, minB: bo.minB, clearance: fr.clearance, t }, findings);
  cautions(geometry, input, findings);
  const { checks, level } = checksAndLevel(geometry, input, t, findings);
  return { ok: true, geometry, plan: toPlan(geometry, findings, checks, level, precision) };
}
