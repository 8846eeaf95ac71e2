import type { Finding, MountPlanParsed } from "../../../schemas/mount-plan.ts";
import { SIDES } from "../../../schemas/mount-plan.ts";
import { roundTo } from "../../units.ts";
import * as K from "../constants.ts";
import type { BorderKind, PlanText } from "./text.ts";
import type { Box, Sides } from "./types.ts";

export type PlanBorders = {
  borders: Sides;
  /** Where the borders come from, for messages about a side's border. */
  borderKind: BorderKind;
  outer: Box;
  /** The smallest border asked for, if any (a field error in `t` when it is not a length). */
  minB: number | undefined;
};

/**
 * Step 3: the borders round the window, from an outer size to fit or from the borders given (with
 * any bottom weighting), on the cutting step, and the outer size they make. Null when a field is wrong.
 */
export function bordersAndOuter(input: MountPlanParsed, aperture: Box, stepMm: number, t: PlanText, findings: Finding[]): PlanBorders | null {
  const fields = t.fields;
  const weightMm = input.bottomWeight !== undefined ? t.len(input.bottomWeight, "bottomWeight", { min: 0, label: "Bottom weighting" }) : 0;
  const weightPct = input.bottomWeightPercent ?? 0;
  let borders: Sides;
  /** Where the borders come from, for messages about a side's border. */
  let borderKind: BorderKind;
  if (input.fitOuter) {
    const ow = t.len(input.fitOuter.width, "fitOuter.width", { positive: true, label: "Outer width" });
    const oh = t.len(input.fitOuter.height, "fitOuter.height", { positive: true, label: "Outer height" });
    if (t.failed()) return null;
    if (ow <= aperture.width) fields["fitOuter.width"] = `The outer width ${t.length(ow)} is not wider than the window (${t.length(aperture.width, "down")}).`;
    const vTotal = oh - aperture.height;
    if (vTotal <= weightMm)
      fields["fitOuter.height"] =
        `The outer height ${t.length(oh)} leaves no room for top and bottom borders around a ${t.length(aperture.height, "down")} window${weightMm ? ` with ${t.length(weightMm)} bottom weighting` : ""}.`;
    if (t.failed()) return null;
    const left = roundTo((ow - aperture.width) / 2, stepMm, "nearest");
    // The same rule as with given borders: bottom = top + amount, or bottom = top × (1 + percentage).
    const top = roundTo(weightPct ? vTotal / (2 + weightPct / 100) : (vTotal - weightMm) / 2, stepMm, "nearest");
    borders = { left, right: ow - aperture.width - left, top, bottom: vTotal - top };
    borderKind = "fitOuter";
  } else {
    const b = input.borders;
    if (!b) {
      borders = { left: K.DEFAULT_BORDER_MM, top: K.DEFAULT_BORDER_MM, right: K.DEFAULT_BORDER_MM, bottom: K.DEFAULT_BORDER_MM };
      findings.push({ code: "borders-assumed", severity: "info", message: `No borders were given, so ${t.length(K.DEFAULT_BORDER_MM)} all round is assumed.` });
      borderKind = "default";
    } else if ("all" in b) {
      const v = t.len(b.all, "borders.all", { min: 0, label: "Border" });
      borders = { left: v, top: v, right: v, bottom: v };
      borderKind = "all";
    } else if ("side" in b) {
      const side = t.len(b.side, "borders.side", { min: 0, label: "Side border" });
      borders = {
        left: side,
        right: side,
        top: t.len(b.top, "borders.top", { min: 0, label: "Top border" }),
        bottom: t.len(b.bottom, "borders.bottom", { min: 0, label: "Bottom border" }),
      };
      borderKind = "side";
    } else {
      borders = {
        left: t.len(b.left, "borders.left", { min: 0, label: "Left border" }),
        top: t.len(b.top, "borders.top", { min: 0, label: "Top border" }),
        right: t.len(b.right, "borders.right", { min: 0, label: "Right border" }),
        bottom: t.len(b.bottom, "borders.bottom", { min: 0, label: "Bottom border" }),
      };
      borderKind = "each";
    }
    if (t.failed()) return null;
    borders.bottom += weightMm + (borders.top * weightPct) / 100;
    for (const s of SIDES) borders[s] = roundTo(borders[s], stepMm, "nearest");
  }
  const outer = { width: aperture.width + borders.left + borders.right, height: aperture.height + borders.top + borders.bottom };
  const minB = input.minBorder !== undefined ? t.len(input.minBorder, "minBorder", { min: 0, label: "Minimum border" }) : undefined;
  return { borders, borderKind, outer, minB };
}

/** Step 4: a double mount's top window, `reveal` wider than the window all round. Null when the reveal is wrong or leaves no border. */
export function doubleMount(input: MountPlanParsed, aperture: Box, borders: Sides, t: PlanText): { topWindow: Box | null; doubleReveal: number | null } | null {
  const fields = t.fields;
  let topWindow: Box | null = null;
  let doubleReveal: number | null = null;
  if (input.doubleMount) {
    doubleReveal = t.len(input.doubleMount.reveal, "doubleMount.reveal", { min: 0, label: "Double mount reveal" });
    if (t.failed()) return null;
    topWindow = { width: aperture.width + 2 * doubleReveal, height: aperture.height + 2 * doubleReveal };
    if (SIDES.some((s) => borders[s] <= doubleReveal!)) {
      fields["doubleMount.reveal"] = `The ${t.length(doubleReveal)} reveal is as wide as a border; the top board would have no border left.`;
      return null;
    }
  }
  return { topWindow, doubleReveal };
}
