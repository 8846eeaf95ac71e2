import { formatMm, MM_PER_INCH, parseLength, roundTo, type Unit } from "../units.ts";
import type { Check, Finding, MountPlan, MountPlanParsed, Side, SideName, Verdict } from "../../schemas/mount-plan.ts";
import { PLAN_SCHEMA_VERSION, SIDES } from "../../schemas/mount-plan.ts";
import * as K from "./constants.ts";
import { conservationChecks, hingeEdges, worstVerdict } from "./checks.ts";
import { blanksPerSheet } from "./yield.ts";
import { figureLength, figureSize, figureText, fineGridMm, shownFigures, shownLength, type Figures } from "./figures.ts";

/**
 * The studio's settings the plan needs. `displayUnit` is the unit every figure and message is
 * shown in (the studio's, or the one the user chose); the plan is computed in its own unit either
 * way, so a record's as-built sizes never change with the display.
 */
export type PlanContext = { minOverlapMm: number; rebateClearanceMm: number; displayUnit?: Unit };
type Box = { width: number; height: number };
type Sides = Record<SideName, number>;
export type SideMode = "overlap" | "hide-border" | "float" | "custom";

/** The plan in millimetres: what the drawing and the checks work from. */
export type PlanGeometry = {
  unit: Unit;
  stepMm: number;
  minOverlapMm: number;
  sheet: Box;
  imageBorders: Sides | null;
  modes: Record<SideName, SideMode>;
  aperture: Box;
  overlap: Sides;
  windowOnSheet: { left: number; top: number };
  borders: Sides;
  outer: Box;
  topWindow: Box | null;
  doubleReveal: number | null;
  glazing: Box & { weightKg?: number; material?: "glass" | "acrylic"; thickness?: number; uvFiltering?: boolean };
  rebate: Box;
  rebateLip: number;
  sight: Box;
  moulding: { length: number; faceWidth: number; wastePercent: number };
  package: { thickness: number; rebateDepth?: number; weightKg?: number };
  yield?: { perSheet: number; sheet: Box; kerf: number; utilisation: number };
  spacerDepth: number;
  /** The figures as shown: one unit, rounded once, adding up (figures.ts). */
  figures: Figures;
};

export type PlanResult =
  | { ok: true; plan: MountPlan; geometry: PlanGeometry }
  | { ok: false; fields: Record<string, string> };

const SIDE_WORD: Record<SideName, string> = { left: "Left edge", top: "Top edge", right: "Right edge", bottom: "Bottom edge" };
const AXIS_OF: Record<SideName, "width" | "height"> = { left: "width", right: "width", top: "height", bottom: "height" };
const OPPOSITE: Record<SideName, SideName> = { left: "right", right: "left", top: "bottom", bottom: "top" };

/**
 * A window that covers more than this share of the image's width or height on one side hides a
 * large part of the picture: Reversa's own threshold (no source), to make the framer look again.
 */
export const LARGE_IMAGE_SHARE = 0.1;

/** Findings that mean the mount cannot be built as planned: a record of work done may not hold them. */
export const UNBUILDABLE = new Set(["sheet-past-outer", "window-off-sheet", "window-larger-than-sheet", "image-borders-exceed-sheet", "lip-covers-window", "board-too-small"]);

/** Computes a mount plan. Pure: the same input and context always give the same plan. */
export function computePlan(input: MountPlanParsed, ctx: PlanContext): PlanResult {
  const unit = input.unit;
  const du: Unit = ctx.displayUnit ?? unit;
  const fields: Record<string, string> = {};
  const findings: Finding[] = [];
  const failed = () => Object.keys(fields).length > 0;

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
  /** Any length in the display unit, on the shown grid: for lengths that are not part of a sum. */
  const fmt = (mm: number, rounding: "nearest" | "down" | "up" = "nearest") => figureLength(shownLength(mm, du, rounding), du);

  /** Reads a length into mm; records a field error and returns NaN when it is not one. */
  function len(v: string | number | undefined, path: string, opts: { min?: number; positive?: boolean; label: string }): number {
    if (v === undefined) return NaN;
    const r = parseLength(v, unit);
    if (!r.ok) {
      fields[path] = `${opts.label}: ${r.message}`;
      return NaN;
    }
    if (opts.positive && !(r.mm > 0)) fields[path] = `${opts.label} must be greater than 0.`;
    else if (opts.min !== undefined && r.mm < opts.min) fields[path] = `${opts.label} cannot be negative.`;
    return r.mm;
  }

  const sheet = {
    width: len(input.sheet.width, "sheet.width", { positive: true, label: "Sheet width" }),
    height: len(input.sheet.height, "sheet.height", { positive: true, label: "Sheet height" }),
  };
  const minOverlapMm = input.minOverlap !== undefined ? len(input.minOverlap, "minOverlap", { min: 0, label: "Minimum overlap" }) : ctx.minOverlapMm;
  if (input.bottomWeight !== undefined && input.bottomWeightPercent !== undefined) {
    fields.bottomWeightPercent = "Give the bottom weighting either as an amount or as a percentage, not both.";
  }
  let imageBorders: Sides | null = null;
  if (input.imageBorders) {
    const b = input.imageBorders;
    imageBorders = {
      left: len(b.left, "imageBorders.left", { min: 0, label: "Left border of the sheet" }),
      top: len(b.top, "imageBorders.top", { min: 0, label: "Top border of the sheet" }),
      right: len(b.right, "imageBorders.right", { min: 0, label: "Right border of the sheet" }),
      bottom: len(b.bottom, "imageBorders.bottom", { min: 0, label: "Bottom border of the sheet" }),
    };
  }

  // ── Window: the overlap over the sheet on each side ──────────────────────
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
      width: len(w.width, "window.width", { positive: true, label: "Window width" }),
      height: len(w.height, "window.height", { positive: true, label: "Window height" }),
      left: len(w.left, "window.left", { label: "Window position from the left" }),
      top: len(w.top, "window.top", { label: "Window position from the top" }),
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
        overlap[s] = len(spec.overlap, `${path}.overlap`, { min: 0, label: `${SIDE_WORD[s]} overlap` });
        askedPath[s] = `${path}.overlap`;
      } else if (spec.mode === "float") {
        askedReveal[s] = len(spec.reveal, `${path}.reveal`, { min: 0, label: `${SIDE_WORD[s]} reveal` });
        overlap[s] = -(askedReveal[s] as number);
        askedPath[s] = `${path}.reveal`;
      } else {
        hideBorder[s] = len(spec.border, `${path}.border`, { min: 0, label: `${SIDE_WORD[s]} border of the sheet` });
        into[s] = len(spec.into, `${path}.into`, { label: `${SIDE_WORD[s]} cover into the image` });
        overlap[s] = (hideBorder[s] as number) + (into[s] as number);
        askedPath[s] = `${path}.into`;
      }
    }
  }
  if (failed()) return { ok: false, fields };

  const exact = { width: sheet.width - overlap.left - overlap.right, height: sheet.height - overlap.top - overlap.bottom };
  if (!(exact.width > 0)) fields[custom ? "window.width" : "window"] = `The overlaps leave no window across: the sheet is ${fmt(sheet.width)} wide and the left and right overlaps take ${fmt(overlap.left + overlap.right)}.`;
  if (!(exact.height > 0)) fields[custom ? "window.height" : "window"] = `The overlaps leave no window down: the sheet is ${fmt(sheet.height)} high and the top and bottom overlaps take ${fmt(overlap.top + overlap.bottom)}.`;
  if (failed()) return { ok: false, fields };

  // Round toward safety, axis by axis. A held side never loses overlap: the window rounds down and
  // what it loses goes to the held sides (half each, on the shown grid). A float never loses reveal:
  // with both sides floating the window rounds up and the reveals share the gain; with one side
  // floating the window rounds down and the held side takes all of the loss.
  const aperture = { width: 0, height: 0 };
  for (const [a, b, dim] of [["left", "right", "width"], ["top", "bottom", "height"]] as const) {
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
  if (!(aperture.width > 0)) fields[custom ? "window.width" : "window"] = `The window comes out narrower than one cutting step (${fmt(stepMm)}).`;
  if (!(aperture.height > 0)) fields[custom ? "window.height" : "window"] = `The window comes out shorter than one cutting step (${fmt(stepMm)}).`;
  if (failed()) return { ok: false, fields };
  const windowOnSheet = { left: overlap.left, top: overlap.top };

  // ── Borders and outer size ───────────────────────────────────────────────
  const weightMm = input.bottomWeight !== undefined ? len(input.bottomWeight, "bottomWeight", { min: 0, label: "Bottom weighting" }) : 0;
  const weightPct = input.bottomWeightPercent ?? 0;
  let borders: Sides;
  /** Where a side's border comes from, for messages about it. */
  let borderPath: (s: SideName) => string;
  if (input.fitOuter) {
    const ow = len(input.fitOuter.width, "fitOuter.width", { positive: true, label: "Outer width" });
    const oh = len(input.fitOuter.height, "fitOuter.height", { positive: true, label: "Outer height" });
    if (failed()) return { ok: false, fields };
    if (ow <= aperture.width) fields["fitOuter.width"] = `The outer width ${fmt(ow)} is not wider than the window (${fmt(aperture.width, "down")}).`;
    const vTotal = oh - aperture.height;
    if (vTotal <= weightMm) fields["fitOuter.height"] = `The outer height ${fmt(oh)} leaves no room for top and bottom borders around a ${fmt(aperture.height, "down")} window${weightMm ? ` with ${fmt(weightMm)} bottom weighting` : ""}.`;
    if (failed()) return { ok: false, fields };
    const left = roundTo((ow - aperture.width) / 2, stepMm, "nearest");
    // The same rule as with given borders: bottom = top + amount, or bottom = top × (1 + percentage).
    const top = roundTo(weightPct ? vTotal / (2 + weightPct / 100) : (vTotal - weightMm) / 2, stepMm, "nearest");
    borders = { left, right: ow - aperture.width - left, top, bottom: vTotal - top };
    borderPath = (s) => (AXIS_OF[s] === "width" ? "fitOuter.width" : "fitOuter.height");
  } else {
    const b = input.borders;
    if (!b) {
      borders = { left: K.DEFAULT_BORDER_MM, top: K.DEFAULT_BORDER_MM, right: K.DEFAULT_BORDER_MM, bottom: K.DEFAULT_BORDER_MM };
      findings.push({ code: "borders-assumed", severity: "info", message: `No borders were given, so ${fmt(K.DEFAULT_BORDER_MM)} all round is assumed.` });
      borderPath = () => "borders";
    } else if ("all" in b) {
      const v = len(b.all, "borders.all", { min: 0, label: "Border" });
      borders = { left: v, top: v, right: v, bottom: v };
      borderPath = () => "borders.all";
    } else if ("side" in b) {
      const side = len(b.side, "borders.side", { min: 0, label: "Side border" });
      borders = { left: side, right: side, top: len(b.top, "borders.top", { min: 0, label: "Top border" }), bottom: len(b.bottom, "borders.bottom", { min: 0, label: "Bottom border" }) };
      borderPath = (s) => (AXIS_OF[s] === "width" ? "borders.side" : `borders.${s}`);
    } else {
      borders = {
        left: len(b.left, "borders.left", { min: 0, label: "Left border" }),
        top: len(b.top, "borders.top", { min: 0, label: "Top border" }),
        right: len(b.right, "borders.right", { min: 0, label: "Right border" }),
        bottom: len(b.bottom, "borders.bottom", { min: 0, label: "Bottom border" }),
      };
      borderPath = (s) => `borders.${s}`;
    }
    if (failed()) return { ok: false, fields };
    borders.bottom += weightMm + (borders.top * weightPct) / 100;
    for (const s of SIDES) borders[s] = roundTo(borders[s], stepMm, "nearest");
  }
  const outer = { width: aperture.width + borders.left + borders.right, height: aperture.height + borders.top + borders.bottom };
  const minB = input.minBorder !== undefined ? len(input.minBorder, "minBorder", { min: 0, label: "Minimum border" }) : undefined;

  // ── Double mount ────────────────────────────────────────────────────────
  let topWindow: Box | null = null;
  let doubleReveal: number | null = null;
  if (input.doubleMount) {
    doubleReveal = len(input.doubleMount.reveal, "doubleMount.reveal", { min: 0, label: "Double mount reveal" });
    if (failed()) return { ok: false, fields };
    topWindow = { width: aperture.width + 2 * doubleReveal, height: aperture.height + 2 * doubleReveal };
    if (SIDES.some((s) => borders[s] <= doubleReveal!)) {
      fields["doubleMount.reveal"] = `The ${fmt(doubleReveal)} reveal is as wide as a border; the top board would have no border left.`;
      return { ok: false, fields };
    }
  }

  // ── Glazing, package and frame ──────────────────────────────────────────
  const fr = input.frame ?? {};
  const clearance = fr.clearance !== undefined ? len(fr.clearance, "frame.clearance", { min: 0, label: "Rebate clearance" }) : ctx.rebateClearanceMm;
  const lip = fr.rebateLip !== undefined ? len(fr.rebateLip, "frame.rebateLip", { min: 0, label: "Rebate lip" }) : K.DEFAULT_REBATE_LIP_MM;
  const faceWidth = fr.faceWidth !== undefined ? len(fr.faceWidth, "frame.faceWidth", { positive: true, label: "Moulding face width" }) : K.DEFAULT_FACE_WIDTH_MM;
  const wastePercent = fr.wastePercent ?? K.DEFAULT_WASTE_PERCENT;
  const rebateDepth = fr.rebateDepth !== undefined ? len(fr.rebateDepth, "frame.rebateDepth", { positive: true, label: "Rebate depth" }) : undefined;
  const gl = input.glazing;
  const glazingThickness = gl ? len(gl.thickness, "glazing.thickness", { positive: true, label: "Glazing thickness" }) : undefined;
  const spacerDepth = input.spacer ? len(input.spacer.depth, "spacer.depth", { min: 0, label: "Spacer depth" }) : 0;
  const bd = input.boards ?? {};
  const windowBoard = bd.window !== undefined ? len(bd.window, "boards.window", { positive: true, label: "Window board thickness" }) : K.FOUR_PLY_MM;
  const backingBoard = bd.backing !== undefined ? len(bd.backing, "boards.backing", { positive: true, label: "Backing board thickness" }) : K.FOUR_PLY_MM;
  const extraBacking = bd.extraBacking !== undefined ? len(bd.extraBacking, "boards.extraBacking", { min: 0, label: "Extra backing thickness" }) : 0;
  let boardSheet: Box | null = null;
  let kerf = K.DEFAULT_KERF_MM;
  if (input.boardSheet) {
    boardSheet = {
      width: len(input.boardSheet.width, "boardSheet.width", { positive: true, label: "Board sheet width" }),
      height: len(input.boardSheet.height, "boardSheet.height", { positive: true, label: "Board sheet height" }),
    };
    if (input.kerf !== undefined) kerf = len(input.kerf, "kerf", { min: 0, label: "Kerf" });
  }
  if (failed()) return { ok: false, fields };

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
  let yieldResult: PlanGeometry["yield"];
  if (boardSheet) {
    const y = blanksPerSheet(outer, boardSheet, kerf, 0);
    yieldResult = { perSheet: y.perSheet, sheet: boardSheet, kerf, utilisation: y.utilisation };
  }

  const partial: Omit<PlanGeometry, "figures"> = {
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
    glazing,
    rebate,
    rebateLip: lip,
    sight,
    moulding: { length: mouldingLength, faceWidth, wastePercent },
    package: { thickness, rebateDepth, weightKg: packageWeight },
    yield: yieldResult,
    spacerDepth,
  };
  const fig = shownFigures(partial as PlanGeometry, du, askedReveal);
  const geometry: PlanGeometry = { ...partial, figures: fig };
  const L = (mm: number) => figureLength(mm, du);
  const fmtMin = () => (du === "in" ? `${figureText(fig.minOverlap, du)} in (${formatMm(minOverlapMm, "up", 0.1)} mm)` : L(fig.minOverlap));
  const shownImage = imageBorders ? (Object.fromEntries(SIDES.map((s) => [s, shownLength(imageBorders![s], du)])) as Sides) : null;

  // ── Geometry that cannot be built: errors that name the side and the field ──
  if (imageBorders) {
    for (const [a, b, dim] of [["left", "right", "width"], ["top", "bottom", "height"]] as const) {
      if (imageBorders[a] + imageBorders[b] >= sheet[dim] - 1e-9) {
        findings.push({
          code: "image-borders-exceed-sheet",
          severity: "error",
          side: b,
          field: `imageBorders.${b}`,
          message: `The sheet's ${a} and ${b} borders (${L(shownImage![a])} + ${L(shownImage![b])}) add up to the sheet's whole ${dim} (${L(fig.sheet[dim])}) or more, leaving no image: correct the borders on the object record.`,
        });
      }
    }
  }
  for (const s of SIDES) {
    // The sheet must lie inside the boards: an overlap wider than the border puts its edge past the outer edge.
    if (overlap[s] > borders[s] + 1e-9) {
      findings.push({
        code: "sheet-past-outer",
        severity: "error",
        side: s,
        field: borderPath(s),
        message: `${SIDE_WORD[s]}: the sheet reaches ${fmt(overlap[s] - borders[s], "up")} past the outer edge of the boards (it runs ${L(fig.overlap[s])} under a ${L(fig.borders[s])} border), so it would stand proud of the boards and glazing. Widen the border or choose a larger outer size.`,
      });
    }
  }
  if (custom) {
    const offLeft = custom.left + custom.width <= 0 || custom.left >= sheet.width;
    const offTop = custom.top + custom.height <= 0 || custom.top >= sheet.height;
    if (offLeft || offTop) {
      findings.push({ code: "window-off-sheet", severity: "error", field: offLeft ? "window.left" : "window.top", message: "The window lies wholly off the sheet: its position puts it clear of the sheet's edge. Place it over the sheet." });
    } else {
      for (const s of SIDES) {
        if (overlap[s] < -1e-9) {
          findings.push({
            code: "window-off-sheet",
            severity: "error",
            side: s,
            field: askedPath[s],
            message: `${SIDE_WORD[s]}: the window runs ${fmt(-overlap[s], "up")} past the edge of the sheet, off the sheet. A custom window must lie within the sheet; to show the whole sheet, float it instead.`,
          });
        }
      }
    }
    for (const dim of ["width", "height"] as const) {
      if (custom[dim] > sheet[dim] + 1e-9) {
        findings.push({ code: "window-larger-than-sheet", severity: "error", field: `window.${dim}`, message: `The window's ${dim} (${fmt(custom[dim])}) is larger than the sheet's (${L(fig.sheet[dim])}): it cannot hold the sheet on that axis.` });
      }
    }
  }
  // The frame's lip must not reach the window of any board: the top board's border is narrower by the reveal.
  const hidden = lip - clearance / 2;
  for (const s of SIDES) {
    const visible = topWindow ? borders[s] - (doubleReveal as number) : borders[s];
    if (visible <= hidden + 1e-9) {
      const shownVisible = topWindow ? fig.borders[s] - shownLength(doubleReveal as number, du) : fig.borders[s];
      findings.push({
        code: "lip-covers-window",
        severity: "error",
        side: s,
        field: fr.rebateLip !== undefined ? "frame.rebateLip" : borderPath(s),
        message: topWindow
          ? `${SIDE_WORD[s]}: the frame's ${fmt(lip)} rebate lip would cover the top board's ${L(shownVisible)} border and reach into its window.`
          : `${SIDE_WORD[s]}: the frame's ${fmt(lip)} rebate lip would cover the ${L(fig.borders[s])} border and reach into the window.`,
      });
    }
  }
  if (yieldResult && yieldResult.perSheet === 0) {
    findings.push({ code: "board-too-small", severity: "error", field: "boardSheet", message: `A ${figureSize(fig.outer, du)} board does not fit on a ${fmt(yieldResult.sheet.width)} × ${fmt(yieldResult.sheet.height)} sheet.` });
  }

  // ── Findings on each side ───────────────────────────────────────────────
  if (minB !== undefined) {
    for (const s of SIDES) {
      if (borders[s] < minB - 1e-9) findings.push({ code: "border-below-minimum", severity: "warn", side: s, field: borderPath(s), message: `${SIDE_WORD[s]}: the border comes out at ${L(fig.borders[s])}, below the ${fmt(minB)} you asked for.` });
    }
  }
  if (rebateDepth !== undefined && rebateDepth + 1e-9 < thickness) {
    findings.push({ code: "rebate-too-shallow", severity: "warn", field: "frame.rebateDepth", message: `The rebate is ${fmt(rebateDepth)} deep but the package (glazing, spacer, boards and backing) is ${fmt(thickness, "up")} thick.` });
  }
  for (const s of SIDES) {
    const o = overlap[s];
    const mode = modes[s];
    const word = SIDE_WORD[s];
    if (mode !== "float" && o >= -1e-9 && o < minOverlapMm - 1e-9) {
      findings.push({
        code: "overlap-below-minimum",
        severity: "error",
        side: s,
        field: askedPath[s],
        message: `${word}: the window covers ${L(Math.max(0, fig.overlap[s]))} of the sheet; the studio minimum is ${fmtMin()}.`,
      });
    }
    if (mode === "float") {
      findings.push({ code: "float", severity: "info", side: s, message: `${word}: the sheet floats, with a ${L(-fig.overlap[s])} reveal between its edge and the window.` });
    }
    if (mode === "hide-border") {
      const c = into[s] as number;
      if (c < 0) {
        findings.push({ code: "window-shows-border", severity: "error", side: s, field: askedPath[s], message: `${word}: the window edge sits ${fmt(-c, "up")} outside the image, so the border shows.` });
      } else {
        // How much of the image this side's window edge hides, against the image's size on that axis.
        const dim = AXIS_OF[s];
        const borderOf = (side: SideName) => hideBorder[side] ?? imageBorders?.[side] ?? 0;
        const image = sheet[dim] - borderOf(s) - borderOf(OPPOSITE[s]);
        if (image > 0 && c > LARGE_IMAGE_SHARE * image + 1e-9) {
          findings.push({
            code: "window-hides-image",
            severity: "warn",
            side: s,
            field: askedPath[s],
            message: `${word}: hiding the border, the window also covers ${fmt(c, "up")} of the image, ${Math.round((c / image) * 100)} % of its ${dim}. Check that this is the crop you want.`,
          });
        }
      }
    }
    if (imageBorders && shownImage && mode !== "float" && mode !== "hide-border" && o >= -1e-9) {
      const b = imageBorders[s];
      if (o < b - 1e-9) {
        findings.push({ code: "window-shows-border", severity: "info", side: s, message: `${word}: ${L(Math.max(0, shownImage[s] - fig.overlap[s]))} of the sheet's border shows inside the window.` });
      } else if (o > b + 1e-9 && b > 0) {
        findings.push({ code: "window-covers-image", severity: "warn", side: s, message: `${word}: the window covers ${L(Math.max(0, fig.overlap[s] - shownImage[s]))} of the image itself, past the ${L(shownImage[s])} border.` });
      }
    }
  }

  // ── Cautions ────────────────────────────────────────────────────────────
  if (gl?.material === "glass") {
    findings.push({ code: "glass-handling", severity: "info", message: "Glass cuts: wear cut-resistant gloves and eye protection when handling and cutting it, and put offcuts in a glass bin." });
  }
  if (packageWeight !== undefined) {
    const heavy = packageWeight >= K.HEAVY_PACKAGE_KG;
    findings.push({
      code: "hanging",
      severity: heavy ? "warn" : "info",
      message:
        `The glazing and boards weigh about ${packageWeight.toFixed(1)} kg before the frame is added. ` +
        (heavy ? "Lift it with two people and never by the top rail. " : "") +
        "Hang it from two wall points with hardware and fixings rated well above the framed weight, D-rings rather than screw eyes, and multi-strand wire; follow the hardware maker's ratings and local building codes.",
    });
  }

  const checks: Check[] = conservationChecks(geometry, input, { length: fmt, shown: L, minimum: fmtMin });
  // A hinge that shows or cannot hold where the sheet floats: the check says why; the finding puts it on the side.
  const hingeCheck = checks.find((c) => c.id === "hinge-placement");
  if (hingeCheck && hingeCheck.verdict === "fail" && input.materials?.attachment === "t-hinge") {
    for (const s of SIDES) {
      if (modes[s] === "float" && hingeEdges(input).includes(s)) {
        const info = findings.findIndex((f) => f.code === "float" && f.side === s);
        if (info >= 0) findings.splice(info, 1);
        findings.push({
          code: "float-needs-float-hinge",
          severity: "error",
          side: s,
          field: "materials.attachment",
          message: `${SIDE_WORD[s]}: the sheet floats here, so T-hinges on this edge would show and the window does not cover them; use V-hinges, pass-through hinges or edge strips.`,
        });
      }
    }
  }
  const fromFindings: Verdict[] = findings.map((f) => (f.severity === "error" ? "fail" : f.severity === "warn" ? "warn" : "pass"));
  const level: Verdict = worstVerdict([...checks.map((c) => c.verdict), ...fromFindings]);
  return { ok: true, geometry, plan: toPlan(geometry, findings, checks, level, precision) };
}

/** Half of a rounding difference, on the shown grid; a difference that is only float noise is halved as it is. */
function halfOnGrid(d: number, gridMm: number): number {
  return d > 1e-7 ? roundTo(d / 2, gridMm, "down") : d / 2;
}

const round6 = (v: number) => Math.round(v * 1e6) / 1e6;

function toPlan(g: PlanGeometry, findings: Finding[], checks: Check[], level: Verdict, precision: number): MountPlan {
  const u = (mm: number) => round6(g.unit === "in" ? mm / MM_PER_INCH : mm);
  const box = (b: Box) => ({ width: u(b.width), height: u(b.height) });
  const sides = (s: Sides) => ({ left: u(s.left), top: u(s.top), right: u(s.right), bottom: u(s.bottom) });
  const f = g.figures;
  const du = f.unit;
  const size = (b: Box) => figureSize(b, du);
  const L = (mm: number) => figureLength(mm, du);
  const display: Record<string, string> = {
    sheet: size(f.sheet),
    aperture: size(f.aperture),
    outer: size(f.outer),
    glazing: size(f.outer),
    rebate: size(f.rebate),
    sight: size(f.sight),
    moulding: L(f.moulding),
    minOverlap: L(f.minOverlap),
  };
  for (const dim of ["width", "height"] as const) {
    display[`sheet.${dim}`] = L(f.sheet[dim]);
    display[`aperture.${dim}`] = L(f.aperture[dim]);
    display[`outer.${dim}`] = L(f.outer[dim]);
  }
  for (const s of SIDES) {
    // A float's overlap is its reveal, shown as a negative overlap.
    display[`overlap.${s}`] = L(f.overlap[s]);
    display[`borders.${s}`] = L(f.borders[s]);
  }
  if (f.topWindow) display.topWindow = size(f.topWindow);
  return {
    schemaVersion: PLAN_SCHEMA_VERSION,
    unit: g.unit,
    displayUnit: du,
    precision,
    sheet: box(g.sheet),
    aperture: box(g.aperture),
    overlap: sides(g.overlap),
    windowOnSheet: { left: u(g.windowOnSheet.left), top: u(g.windowOnSheet.top) },
    borders: sides(g.borders),
    outer: box(g.outer),
    ...(g.topWindow ? { topWindow: box(g.topWindow) } : {}),
    glazing: {
      ...box(g.glazing),
      ...(g.glazing.weightKg !== undefined ? { weightKg: Math.round(g.glazing.weightKg * 1000) / 1000 } : {}),
      ...(g.glazing.material ? { material: g.glazing.material, thickness: u(g.glazing.thickness!) } : {}),
    },
    rebate: box(g.rebate),
    sight: box(g.sight),
    moulding: { length: u(g.moulding.length), faceWidth: u(g.moulding.faceWidth), wastePercent: g.moulding.wastePercent },
    package: {
      thickness: u(g.package.thickness),
      ...(g.package.rebateDepth !== undefined ? { rebateDepth: u(g.package.rebateDepth) } : {}),
      ...(g.package.weightKg !== undefined ? { weightKg: Math.round(g.package.weightKg * 1000) / 1000 } : {}),
    },
    ...(g.yield ? { yield: { perSheet: g.yield.perSheet, sheet: box(g.yield.sheet), kerf: u(g.yield.kerf), utilisation: Math.round(g.yield.utilisation * 1000) / 1000 } } : {}),
    findings,
    checks,
    level,
    display,
  };
}
