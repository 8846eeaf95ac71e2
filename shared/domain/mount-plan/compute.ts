import { formatMm, MM_PER_INCH, parseLength, roundTo, type Unit } from "../units.ts";
import type { Check, Finding, MountPlan, MountPlanParsed, Side, SideName, Verdict } from "../../schemas/mount-plan.ts";
import { PLAN_SCHEMA_VERSION, SIDES } from "../../schemas/mount-plan.ts";
import * as K from "./constants.ts";
import { conservationChecks, hingeEdges, worstVerdict, type Formatters } from "./checks.ts";
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

type BorderKind = "fitOuter" | "default" | "all" | "side" | "each";

/** The field a side's border comes from, for messages about it. */
function borderPath(kind: BorderKind, s: SideName): string {
  if (kind === "fitOuter") return AXIS_OF[s] === "width" ? "fitOuter.width" : "fitOuter.height";
  if (kind === "default") return "borders";
  if (kind === "all") return "borders.all";
  if (kind === "side" && AXIS_OF[s] === "width") return "borders.side";
  return `borders.${s}`;
}

/**
 * Reads one plan's lengths into mm, collecting field errors, and shows lengths in the display unit.
 * A class rather than closures inside computePlan: the planner is a hot path, and the server's
 * TypeScript loader names every local function it creates on each call.
 */
class PlanText implements Formatters {
  readonly fields: Record<string, string> = {};
  /** The studio minimum overlap as shown; set once the figures are known. */
  minText = "";
  constructor(
    readonly unit: Unit,
    readonly du: Unit,
  ) {}

  failed(): boolean {
    for (const _ in this.fields) return true;
    return false;
  }

  /** Reads a length into mm; records a field error and returns NaN when it is not one. */
  len(v: string | number | undefined, path: string, opts: { min?: number; positive?: boolean; label: string }): number {
    if (v === undefined) return NaN;
    const r = parseLength(v, this.unit);
    if (!r.ok) {
      this.fields[path] = `${opts.label}: ${r.message}`;
      return NaN;
    }
    if (opts.positive && !(r.mm > 0)) this.fields[path] = `${opts.label} must be greater than 0.`;
    else if (opts.min !== undefined && r.mm < opts.min) this.fields[path] = `${opts.label} cannot be negative.`;
    return r.mm;
  }

  /** Any length in the display unit, on the shown grid: for lengths that are not part of a sum. */
  length(mm: number, rounding: "nearest" | "down" | "up" = "nearest"): string {
    return figureLength(shownLength(mm, this.du, rounding), this.du);
  }

  /** A figure already on the shown grid, with its unit. */
  shown(mm: number): string {
    return figureLength(mm, this.du);
  }

  minimum(): string {
    return this.minText;
  }
}

/** Computes a mount plan. Pure: the same input and context always give the same plan. */
export function computePlan(input: MountPlanParsed, ctx: PlanContext): PlanResult {
  const unit = input.unit;
  const du: Unit = ctx.displayUnit ?? unit;
  const t = new PlanText(unit, du);
  const fields = t.fields;
  const findings: Finding[] = [];

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
  if (t.failed()) return { ok: false, fields };

  const exact = { width: sheet.width - overlap.left - overlap.right, height: sheet.height - overlap.top - overlap.bottom };
  if (!(exact.width > 0)) fields[custom ? "window.width" : "window"] = `The overlaps leave no window across: the sheet is ${t.length(sheet.width)} wide and the left and right overlaps take ${t.length(overlap.left + overlap.right)}.`;
  if (!(exact.height > 0)) fields[custom ? "window.height" : "window"] = `The overlaps leave no window down: the sheet is ${t.length(sheet.height)} high and the top and bottom overlaps take ${t.length(overlap.top + overlap.bottom)}.`;
  if (t.failed()) return { ok: false, fields };

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
  if (!(aperture.width > 0)) fields[custom ? "window.width" : "window"] = `The window comes out narrower than one cutting step (${t.length(stepMm)}).`;
  if (!(aperture.height > 0)) fields[custom ? "window.height" : "window"] = `The window comes out shorter than one cutting step (${t.length(stepMm)}).`;
  if (t.failed()) return { ok: false, fields };
  const windowOnSheet = { left: overlap.left, top: overlap.top };

  // ── Borders and outer size ───────────────────────────────────────────────
  const weightMm = input.bottomWeight !== undefined ? t.len(input.bottomWeight, "bottomWeight", { min: 0, label: "Bottom weighting" }) : 0;
  const weightPct = input.bottomWeightPercent ?? 0;
  let borders: Sides;
  /** Where the borders come from, for messages about a side's border. */
  let borderKind: BorderKind;
  if (input.fitOuter) {
    const ow = t.len(input.fitOuter.width, "fitOuter.width", { positive: true, label: "Outer width" });
    const oh = t.len(input.fitOuter.height, "fitOuter.height", { positive: true, label: "Outer height" });
    if (t.failed()) return { ok: false, fields };
    if (ow <= aperture.width) fields["fitOuter.width"] = `The outer width ${t.length(ow)} is not wider than the window (${t.length(aperture.width, "down")}).`;
    const vTotal = oh - aperture.height;
    if (vTotal <= weightMm) fields["fitOuter.height"] = `The outer height ${t.length(oh)} leaves no room for top and bottom borders around a ${t.length(aperture.height, "down")} window${weightMm ? ` with ${t.length(weightMm)} bottom weighting` : ""}.`;
    if (t.failed()) return { ok: false, fields };
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
      borders = { left: side, right: side, top: t.len(b.top, "borders.top", { min: 0, label: "Top border" }), bottom: t.len(b.bottom, "borders.bottom", { min: 0, label: "Bottom border" }) };
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
    if (t.failed()) return { ok: false, fields };
    borders.bottom += weightMm + (borders.top * weightPct) / 100;
    for (const s of SIDES) borders[s] = roundTo(borders[s], stepMm, "nearest");
  }
  const outer = { width: aperture.width + borders.left + borders.right, height: aperture.height + borders.top + borders.bottom };
  const minB = input.minBorder !== undefined ? t.len(input.minBorder, "minBorder", { min: 0, label: "Minimum border" }) : undefined;

  // ── Double mount ────────────────────────────────────────────────────────
  let topWindow: Box | null = null;
  let doubleReveal: number | null = null;
  if (input.doubleMount) {
    doubleReveal = t.len(input.doubleMount.reveal, "doubleMount.reveal", { min: 0, label: "Double mount reveal" });
    if (t.failed()) return { ok: false, fields };
    topWindow = { width: aperture.width + 2 * doubleReveal, height: aperture.height + 2 * doubleReveal };
    if (SIDES.some((s) => borders[s] <= doubleReveal!)) {
      fields["doubleMount.reveal"] = `The ${t.length(doubleReveal)} reveal is as wide as a border; the top board would have no border left.`;
      return { ok: false, fields };
    }
  }

  // ── Glazing, package and frame ──────────────────────────────────────────
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
  if (t.failed()) return { ok: false, fields };

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
    glazing,
    rebate,
    rebateLip: lip,
    sight,
    moulding: { length: mouldingLength, faceWidth, wastePercent },
    package: { thickness, rebateDepth, weightKg: packageWeight },
    yield: yieldResult,
    spacerDepth,
  };
  const fig = shownFigures(base, du, askedReveal);
  // The figures go onto the same object: a copy of it would cost the planner a tenth of its time.
  const geometry = base as PlanGeometry;
  geometry.figures = fig;
  t.minText = du === "in" ? `${figureText(fig.minOverlap, du)} in (${formatMm(minOverlapMm, "up", 0.1)} mm)` : t.shown(fig.minOverlap);
  const shownImage: Sides | null = imageBorders
    ? { left: shownLength(imageBorders.left, du), top: shownLength(imageBorders.top, du), right: shownLength(imageBorders.right, du), bottom: shownLength(imageBorders.bottom, du) }
    : null;

  // ── Geometry that cannot be built: errors that name the side and the field ──
  if (imageBorders) {
    for (const [a, b, dim] of [["left", "right", "width"], ["top", "bottom", "height"]] as const) {
      if (imageBorders[a] + imageBorders[b] >= sheet[dim] - 1e-9) {
        findings.push({
          code: "image-borders-exceed-sheet",
          severity: "error",
          side: b,
          field: `imageBorders.${b}`,
          message: `The sheet's ${a} and ${b} borders (${t.shown(shownImage![a])} + ${t.shown(shownImage![b])}) add up to the sheet's whole ${dim} (${t.shown(fig.sheet[dim])}) or more, leaving no image: correct the borders on the object record.`,
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
        field: borderPath(borderKind, s),
        message: `${SIDE_WORD[s]}: the sheet reaches ${t.length(overlap[s] - borders[s], "up")} past the outer edge of the boards (it runs ${t.shown(fig.overlap[s])} under a ${t.shown(fig.borders[s])} border), so it would stand proud of the boards and glazing. Widen the border or choose a larger outer size.`,
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
            message: `${SIDE_WORD[s]}: the window runs ${t.length(-overlap[s], "up")} past the edge of the sheet, off the sheet. A custom window must lie within the sheet; to show the whole sheet, float it instead.`,
          });
        }
      }
    }
    for (const dim of ["width", "height"] as const) {
      if (custom[dim] > sheet[dim] + 1e-9) {
        findings.push({ code: "window-larger-than-sheet", severity: "error", field: `window.${dim}`, message: `The window's ${dim} (${t.length(custom[dim])}) is larger than the sheet's (${t.shown(fig.sheet[dim])}): it cannot hold the sheet on that axis.` });
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
        field: fr.rebateLip !== undefined ? "frame.rebateLip" : borderPath(borderKind, s),
        message: topWindow
          ? `${SIDE_WORD[s]}: the frame's ${t.length(lip)} rebate lip would cover the top board's ${t.shown(shownVisible)} border and reach into its window.`
          : `${SIDE_WORD[s]}: the frame's ${t.length(lip)} rebate lip would cover the ${t.shown(fig.borders[s])} border and reach into the window.`,
      });
    }
  }
  if (yieldResult && yieldResult.perSheet === 0) {
    findings.push({ code: "board-too-small", severity: "error", field: "boardSheet", message: `A ${figureSize(fig.outer, du)} board does not fit on a ${t.length(yieldResult.sheet.width)} × ${t.length(yieldResult.sheet.height)} sheet.` });
  }

  // ── Findings on each side ───────────────────────────────────────────────
  if (minB !== undefined) {
    for (const s of SIDES) {
      if (borders[s] < minB - 1e-9) findings.push({ code: "border-below-minimum", severity: "warn", side: s, field: borderPath(borderKind, s), message: `${SIDE_WORD[s]}: the border comes out at ${t.shown(fig.borders[s])}, below the ${t.length(minB)} you asked for.` });
    }
  }
  if (rebateDepth !== undefined && rebateDepth + 1e-9 < thickness) {
    findings.push({ code: "rebate-too-shallow", severity: "warn", field: "frame.rebateDepth", message: `The rebate is ${t.length(rebateDepth)} deep but the package (glazing, spacer, boards and backing) is ${t.length(thickness, "up")} thick.` });
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
        message: `${word}: the window covers ${t.shown(Math.max(0, fig.overlap[s]))} of the sheet; the studio minimum is ${t.minimum()}.`,
      });
    }
    if (mode === "float") {
      findings.push({ code: "float", severity: "info", side: s, message: `${word}: the sheet floats, with a ${t.shown(-fig.overlap[s])} reveal between its edge and the window.` });
    }
    if (mode === "hide-border") {
      const c = into[s] as number;
      if (c < 0) {
        findings.push({ code: "window-shows-border", severity: "error", side: s, field: askedPath[s], message: `${word}: the window edge sits ${t.length(-c, "up")} outside the image, so the border shows.` });
      } else {
        // How much of the image this side's window edge hides, against the image's size on that axis.
        const dim = AXIS_OF[s];
        const o = OPPOSITE[s];
        const image = sheet[dim] - (hideBorder[s] ?? imageBorders?.[s] ?? 0) - (hideBorder[o] ?? imageBorders?.[o] ?? 0);
        if (image > 0 && c > LARGE_IMAGE_SHARE * image + 1e-9) {
          findings.push({
            code: "window-hides-image",
            severity: "warn",
            side: s,
            field: askedPath[s],
            message: `${word}: hiding the border, the window also covers ${t.length(c, "up")} of the image, ${Math.round((c / image) * 100)} % of its ${dim}. Check that this is the crop you want.`,
          });
        }
      }
    }
    if (imageBorders && shownImage && mode !== "float" && mode !== "hide-border" && o >= -1e-9) {
      const b = imageBorders[s];
      if (o < b - 1e-9) {
        findings.push({ code: "window-shows-border", severity: "info", side: s, message: `${word}: ${t.shown(Math.max(0, shownImage[s] - fig.overlap[s]))} of the sheet's border shows inside the window.` });
      } else if (o > b + 1e-9 && b > 0) {
        findings.push({ code: "window-covers-image", severity: "warn", side: s, message: `${word}: the window covers ${t.shown(Math.max(0, fig.overlap[s] - shownImage[s]))} of the image itself, past the ${t.shown(shownImage[s])} border.` });
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

  const checks: Check[] = conservationChecks(geometry, input, t);
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
function inUnit(mm: number, inch: boolean): number {
  return round6(inch ? mm / MM_PER_INCH : mm);
}
function boxIn(b: Box, inch: boolean): Box {
  return { width: inUnit(b.width, inch), height: inUnit(b.height, inch) };
}
function sidesIn(s: Sides, inch: boolean): Sides {
  return { left: inUnit(s.left, inch), top: inUnit(s.top, inch), right: inUnit(s.right, inch), bottom: inUnit(s.bottom, inch) };
}

function toPlan(g: PlanGeometry, findings: Finding[], checks: Check[], level: Verdict, precision: number): MountPlan {
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
    ...(g.yield ? { yield: { perSheet: g.yield.perSheet, sheet: boxIn(g.yield.sheet, inch), kerf: inUnit(g.yield.kerf, inch), utilisation: Math.round(g.yield.utilisation * 1000) / 1000 } } : {}),
    findings,
    checks,
    level,
    display,
  };
}
