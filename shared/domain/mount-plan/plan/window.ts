import type { MountPlanParsed, Side, SideName } from "../../../schemas/mount-plan.ts";
import { SIDES } from "../../../schemas/mount-plan.ts";
import { roundTo } from "../../units.ts";
import { SIDE_WORD, type PlanText } from "./text.ts";
import type { Box, SideMode, Sides } from "./types.ts";

/** The window as cut: each side's mode and overlap (a float's is minus its reveal), and what was asked for on each side. */
export type PlanWindow = {
  modes: Record<SideName, SideMode>;
  overlap: Sides;
  /** Hide-border sides: how far the window edge reaches into the image, and the sheet border it hides. */
  into: Partial<Sides>;
  hideBorder: Partial<Sides>;
  /** Float sides: the reveal asked for. */
  askedReveal: Partial<Sides>;
  /** The field each side's figure comes from, for messages about it. */
  askedPath: Record<SideName, string>;
  /** A custom window as given, or null when the window is set side by side. */
  custom: { width: number; height: number; left: number; top: number } | null;
  aperture: Box;
  windowOnSheet: { left: number; top: number };
};

/**
 * Step 2: the window, from the overlap (or reveal, or hidden border) asked for on each side, cut on
 * the cutting step. Null when a field is wrong, with the reasons in `t.fields`.
 */
export function windowPerSide(input: MountPlanParsed, sheet: Box, stepMm: number, gridMm: number, t: PlanText): PlanWindow | null {
  const fields = t.fields;
  const modes = {} as Record<SideName, SideMode>;
  const overlap = {} as Sides;
  const into = {} as Partial<Sides>;
  const hideBorder = {} as Partial<Sides>;
  const askedReveal = {} as Partial<Sides>;
  const askedPath = {} as Record<SideName, string>;
  const w = input.window;
  let custom: { width: number; height: number; left: number; top: number } | null = null;
  if ("mode" in w) {
    custom = {
      width: t.len(w.width, "window.width", { positive: true, label: "Window width" }),
      height: t.len(w.height, "window.height", { positive: true, label: "Window height" }),
      left: t.len(w.left, "window.left", { label: "Window position from the left" }),
      top: t.len(w.top, "window.top", { label: "Window position from the top" }),
    };
    overlap.left = custom.left;
    overlap.top = custom.top;
    overlap.right = sheet.width - custom.left - custom.width;
    overlap.bottom = sheet.height - custom.top - custom.height;
    for (const s of SIDES) modes[s] = "custom";
    Object.assign(askedPath, { left: "window.left", top: "window.top", right: "window.width", bottom: "window.height" });
  } else {
    const specs: Record<SideName, Side> = "all" in w ? { left: w.all, top: w.all, right: w.all, bottom: w.all } : w;
    for (const s of SIDES) {
      const spec = specs[s];
      const path = "all" in w ? "window.all" : `window.${s}`;
      modes[s] = spec.mode;
      if (spec.mode === "overlap") {
        overlap[s] = t.len(spec.overlap, `${path}.overlap`, { min: 0, label: `${SIDE_WORD[s]} overlap` });
        askedPath[s] = `${path}.overlap`;
      } else if (spec.mode === "float") {
        askedReveal[s] = t.len(spec.reveal, `${path}.reveal`, { min: 0, label: `${SIDE_WORD[s]} reveal` });
        overlap[s] = -(askedReveal[s] as number);
        askedPath[s] = `${path}.reveal`;
      } else {
        hideBorder[s] = t.len(spec.border, `${path}.border`, { min: 0, label: `${SIDE_WORD[s]} border of the sheet` });
        into[s] = t.len(spec.into, `${path}.into`, { label: `${SIDE_WORD[s]} cover into the image` });
        overlap[s] = (hideBorder[s] as number) + (into[s] as number);
        askedPath[s] = `${path}.into`;
      }
    }
  }
  if (t.failed()) return null;

  const exact = { width: sheet.width - overlap.left - overlap.right, height: sheet.height - overlap.top - overlap.bottom };
  if (!(exact.width > 0))
    fields[custom ? "window.width" : "window"] =
      `The overlaps leave no window across: the sheet is ${t.length(sheet.width)} wide and the left and right overlaps take ${t.length(overlap.left + overlap.right)}.`;
  if (!(exact.height > 0))
    fields[custom ? "window.height" : "window"] =
      `The overlaps leave no window down: the sheet is ${t.length(sheet.height)} high and the top and bottom overlaps take ${t.length(overlap.top + overlap.bottom)}.`;
  if (t.failed()) return null;

  // Round toward safety, axis by axis. A held side never loses overlap: the window rounds down and
  // what it loses goes to the held sides (half each, on the shown grid). A float never loses reveal:
  // with both sides floating the window rounds up and the reveals share the gain; with one side
  // floating the window rounds down and the held side takes all of the loss.
  const aperture = { width: 0, height: 0 };
  for (const [a, b, dim] of [
    ["left", "right", "width"],
    ["top", "bottom", "height"],
  ] as const) {
    const floatA = modes[a] === "float";
    const floatB = modes[b] === "float";
    if (floatA && floatB) {
      aperture[dim] = roundTo(exact[dim], stepMm, "up");
      const gain = aperture[dim] - exact[dim];
      const half = halfOnGrid(gain, gridMm);
      overlap[a] -= half;
      overlap[b] -= gain - half;
    } else {
      aperture[dim] = roundTo(exact[dim], stepMm, "down");
      const loss = exact[dim] - aperture[dim];
      if (floatA) overlap[b] += loss;
      else if (floatB) overlap[a] += loss;
      else {
        const half = halfOnGrid(loss, gridMm);
        overlap[a] += half;
        overlap[b] += loss - half;
      }
    }
  }
  if (!(aperture.width > 0)) fields[custom ? "window.width" : "window"] = `The window comes out narrower than one cutting step (${t.length(stepMm)}).`;
  if (!(aperture.height > 0)) fields[custom ? "window.height" : "window"] = `The window comes out shorter than one cutting step (${t.length(stepMm)}).`;
  if (t.failed()) return null;
  const windowOnSheet = { left: overlap.left, top: overlap.top };
  return { modes, overlap, into, hideBorder, askedReveal, askedPath, custom, aperture, windowOnSheet };
}

/** Half of a rounding difference, on the shown grid; a difference that is only float noise is halved as it is. */
function halfOnGrid(d: number, gridMm: number): number {
  return d > 1e-7 ? roundTo(d / 2, gridMm, "down") : d / 2;
}
