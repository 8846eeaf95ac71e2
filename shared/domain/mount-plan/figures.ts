/**
 * The figures a plan shows: every length in one unit, rounded once, so that the parts add up to
 * the whole on each axis (docs/trade.md §9):
 *   sheet  = overlap left + window + overlap right
 *   outer  = border left  + window + border right
 *   sight  = rebate − 2 × lip
 * and so that a side that passes the overlap check never shows less than the shown minimum, a side
 * that fails never shows as much, and a float never shows less reveal than was asked.
 *
 * Shown lengths sit on a fine grid (0.1 mm, or 1/64 in). In the plan's own unit its sizes are
 * already on that grid, so nothing moves. Shown in the other unit (a record made in mm in a studio
 * that works in inches), the window rounds down and the outer size to the nearest cutting step
 * (1/16 in or 0.1 mm), and the derived parts — overlaps and borders — take up the difference.
 */
import type { SideName } from "../../schemas/mount-plan.ts";
import { formatInches, formatMm, MM_PER_INCH, roundTo, type Unit } from "../units.ts";
import type { PlanGeometry } from "./plan/types.ts";

type Box = { width: number; height: number };
type Sides = Record<SideName, number>;

export type Figures = {
  unit: Unit;
  /** The grid every shown length sits on, in mm. */
  gridMm: number;
  sheet: Box;
  aperture: Box;
  overlap: Sides;
  borders: Sides;
  outer: Box;
  topWindow: Box | null;
  rebate: Box;
  lip: number;
  sight: Box;
  moulding: number;
  /** The studio minimum overlap as shown: rounded up to the grid. */
  minOverlap: number;
};

const EPS = 1e-6;

export function fineGridMm(unit: Unit): number {
  return unit === "in" ? MM_PER_INCH / 64 : 0.1;
}

/** A shown length (already on the grid) as text, without its unit: `7 5/8`, `200`, `4.5`. */
export function figureText(mm: number, unit: Unit): string {
  return unit === "in" ? formatInches(mm, 64, "nearest") : formatMm(mm, "nearest", 0.1);
}

/** A shown length with its unit: `7 5/8 in`, `200 mm`. */
export function figureLength(mm: number, unit: Unit): string {
  return `${figureText(mm, unit)} ${unit}`;
}

export function figureSize(b: Box, unit: Unit): string {
  return `${figureText(b.width, unit)} × ${figureText(b.height, unit)} ${unit}`;
}

/** Rounds any length to the shown grid, for figures that are not part of a sum (thicknesses, gaps). */
export function shownLength(mm: number, unit: Unit, rounding: "nearest" | "down" | "up" = "nearest"): number {
  return roundTo(mm, fineGridMm(unit), rounding);
}

/** Any length (a thickness, a hinge position) in the display unit, on the shown grid. */
export function lengthText(mm: number, unit: Unit, rounding: "nearest" | "down" | "up" = "nearest"): string {
  return figureLength(shownLength(mm, unit, rounding), unit);
}

type AxisIn = { sheet: number; aperture: number; oA: number; oB: number; bA: number; bB: number; outer: number; sideA: SideName; sideB: SideName };

/** What every axis of one plan's figures is rounded against. Plain functions over it keep the planner's hot path free of per-call closures. */
type FigureGrid = { g: Omit<PlanGeometry, "figures">; askedReveal: Partial<Sides>; f: number; same: boolean; coarse: number; minShown: number };

/** −1: the shown overlap must grow; +1: it must shrink; 0: it tells the truth. */
function want(c: FigureGrid, side: SideName, trueO: number, shownO: number): -1 | 0 | 1 {
  if (c.g.modes[side] === "float") {
    const asked = c.askedReveal[side];
    if (asked === undefined) return 0;
    // The true reveal is never below the asked one (compute rounds a float's window up); nor is the shown one.
    return -shownO < roundTo(asked, c.f, "nearest") - EPS ? 1 : 0;
  }
  const passes = trueO >= c.g.minOverlapMm - 1e-9;
  if (passes && shownO < c.minShown - EPS) return -1;
  if (!passes && shownO >= c.minShown - EPS) return 1;
  return 0;
}

function axisFigures(c: FigureGrid, a: AxisIn) {
  const { f, same, coarse } = c;
  let S = roundTo(a.sheet, f, "nearest");
  let A = same ? roundTo(a.aperture, f, "nearest") : roundTo(a.aperture, coarse, "down");
  let T = same ? roundTo(a.outer, f, "nearest") : roundTo(a.outer, coarse, "nearest");
  const equalBorders = Math.abs(a.bA - a.bB) < 1e-6;
  // Equal borders shown in the other unit: the outer takes the neighbouring step on the truth's side
  // when the window and outer would differ by an odd number of grid steps (only possible on a 0.1 mm grid).
  if (!same && equalBorders && Math.round((T - A) / f) % 2 !== 0) T += a.outer >= T ? f : -f;
  // Equal overlaps are shown as near equal as the grid allows; the loop below then keeps each side truthful.
  let OA = Math.abs(a.oA - a.oB) < 1e-6 ? roundTo((S - A) / 2, f, "nearest") : roundTo(a.oA, f, "nearest");
  let OB = S - A - OA;
  // At most a few grid steps ever move; the bound keeps a contradictory case from looping.
  for (let i = 0; i < 8; i++) {
    const nA = want(c, a.sideA, a.oA, OA);
    const nB = want(c, a.sideB, a.oB, OB);
    if (nA === 0 && nB === 0) break;
    // The measured sheet may be shown one grid step the other way when it lies between two (it is a measurement, not a cut).
    if (nA === -1 || nB === -1) {
      const growA = nA === -1;
      const [other, nOther, otherSide] = growA ? [a.oB, OB, a.sideB] : [a.oA, OA, a.sideA];
      // The step goes to the other side unless that would carry it far from its truth and the sheet can take it instead.
      const sheetCanGrow = Math.abs(S + f - a.sheet) < f - 1e-9;
      if (want(c, otherSide, other, nOther - f) === 0 && !(sheetCanGrow && Math.abs(nOther - f - other) > 1.5 * f)) {
        if (growA) [OA, OB] = [OA + f, OB - f];
        else [OA, OB] = [OA - f, OB + f];
      } else if (sheetCanGrow) {
        S += f;
        if (growA) OA += f;
        else OB += f;
      } else {
        // Both sides are tight: the shown window gives up a step (it is shown rounded down anyway).
        A -= f;
        if (growA) OA += f;
        else OB += f;
      }
    } else {
      const shrinkA = nA === 1;
      const otherSide = shrinkA ? a.sideB : a.sideA;
      const other = shrinkA ? a.oB : a.oA;
      const nOther = shrinkA ? OB : OA;
      const sheetCanShrink = Math.abs(S - f - a.sheet) < f - 1e-9;
      if (want(c, otherSide, other, nOther + f) === 0 && !(sheetCanShrink && Math.abs(nOther + f - other) > 1.5 * f)) {
        if (shrinkA) [OA, OB] = [OA - f, OB + f];
        else [OA, OB] = [OA + f, OB - f];
      } else if (sheetCanShrink) {
        S -= f;
        if (shrinkA) OA -= f;
        else OB -= f;
      } else {
        A += f;
        if (shrinkA) OA -= f;
        else OB -= f;
      }
    }
  }
  // Equal borders stay equal when shown: the outer and the window are on the coarse step, so half their difference is on the grid.
  const BA = equalBorders ? roundTo((T - A) / 2, f, "nearest") : roundTo(a.bA, f, "nearest");
  return { S, A, T, OA, OB, BA, BB: T - A - BA };
}

export function shownFigures(g: Omit<PlanGeometry, "figures">, unit: Unit, askedReveal: Partial<Sides>): Figures {
  const f = fineGridMm(unit);
  const same = unit === g.unit;
  const coarse = same ? f : unit === "in" ? MM_PER_INCH / 16 : 0.1;
  const c: FigureGrid = { g, askedReveal, f, same, coarse, minShown: roundTo(g.minOverlapMm, f, "up") };
  const x = axisFigures(c, {
    sheet: g.sheet.width,
    aperture: g.aperture.width,
    oA: g.overlap.left,
    oB: g.overlap.right,
    bA: g.borders.left,
    bB: g.borders.right,
    outer: g.outer.width,
    sideA: "left",
    sideB: "right",
  });
  const y = axisFigures(c, {
    sheet: g.sheet.height,
    aperture: g.aperture.height,
    oA: g.overlap.top,
    oB: g.overlap.bottom,
    bA: g.borders.top,
    bB: g.borders.bottom,
    outer: g.outer.height,
    sideA: "top",
    sideB: "bottom",
  });
  const reveal = g.doubleReveal !== null ? roundTo(g.doubleReveal, f, "nearest") : null;
  const rebate = {
    width: Math.max(x.T, same ? roundTo(g.rebate.width, f, "nearest") : roundTo(g.rebate.width, coarse, "up")),
    height: Math.max(y.T, same ? roundTo(g.rebate.height, f, "nearest") : roundTo(g.rebate.height, coarse, "up")),
  };
  const lip = roundTo(g.rebateLip, f, "nearest");
  return {
    unit,
    gridMm: f,
    sheet: { width: x.S, height: y.S },
    aperture: { width: x.A, height: y.A },
    overlap: { left: x.OA, right: x.OB, top: y.OA, bottom: y.OB },
    borders: { left: x.BA, right: x.BB, top: y.BA, bottom: y.BB },
    outer: { width: x.T, height: y.T },
    topWindow: reveal !== null ? { width: x.A + 2 * reveal, height: y.A + 2 * reveal } : null,
    rebate,
    lip,
    sight: { width: rebate.width - 2 * lip, height: rebate.height - 2 * lip },
    moulding: roundTo(g.moulding.length, same ? f : coarse, "up"),
    minOverlap: c.minShown,
  };
}
