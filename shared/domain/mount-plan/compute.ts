import { formatInches, formatMm, MM_PER_INCH, parseLength, roundTo, type Denominator, type Unit } from "../units.ts";
import type { Check, Finding, MountPlan, MountPlanParsed, Side, SideName, Verdict } from "../../schemas/mount-plan.ts";
import { PLAN_SCHEMA_VERSION, SIDES } from "../../schemas/mount-plan.ts";
import * as K from "./constants.ts";
import { conservationChecks, worstVerdict } from "./checks.ts";
import { blanksPerSheet } from "./yield.ts";

export type PlanContext = { minOverlapMm: number; rebateClearanceMm: number };
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
};

export type PlanResult =
  | { ok: true; plan: MountPlan; geometry: PlanGeometry }
  | { ok: false; fields: Record<string, string> };

const SIDE_WORD: Record<SideName, string> = { left: "Left edge", top: "Top edge", right: "Right edge", bottom: "Bottom edge" };

/** Computes a mount plan. Pure: the same input and context always give the same plan. */
export function computePlan(input: MountPlanParsed, ctx: PlanContext): PlanResult {
  const unit = input.unit;
  const fields: Record<string, string> = {};
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
  const fmt = (mm: number, rounding: "nearest" | "down" | "up" = "nearest") =>
    unit === "in" ? `${formatInches(mm, (precision as Denominator) || 16, rounding)} in` : `${formatMm(mm, rounding, stepMm)} mm`;
  // Overlaps are small: messages about them give inches to 1/64 and the minimum also in mm, so 4.8 mm and 5 mm never read alike.
  const fmtOverlap = (mm: number) => (unit === "in" ? `${formatInches(mm, 64, "down")} in` : `${formatMm(mm, "down", 0.1)} mm`);
  const fmtMin = (mm: number) => (unit === "in" ? `${formatInches(mm, 64, "up")} in (${formatMm(mm, "up", 0.1)} mm)` : `${formatMm(mm, "up", 0.1)} mm`);

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
  } else {
    const specs: Record<SideName, Side> = "all" in w ? { left: w.all, top: w.all, right: w.all, bottom: w.all } : w;
    const base = "all" in w ? "window.all" : "window";
    for (const s of SIDES) {
      const spec = specs[s];
      const path = "all" in w ? base : `${base}.${s}`;
      modes[s] = spec.mode;
      if (spec.mode === "overlap") overlap[s] = len(spec.overlap, `${path}.overlap`, { min: 0, label: `${SIDE_WORD[s]} overlap` });
      else if (spec.mode === "float") overlap[s] = -len(spec.reveal, `${path}.reveal`, { min: 0, label: `${SIDE_WORD[s]} reveal` });
      else {
        const b = len(spec.border, `${path}.border`, { min: 0, label: `${SIDE_WORD[s]} border of the sheet` });
        into[s] = len(spec.into, `${path}.into`, { label: `${SIDE_WORD[s]} cover into the image` });
        overlap[s] = b + (into[s] as number);
      }
    }
  }
  if (Object.keys(fields).length) return { ok: false, fields };

  const exact = { width: sheet.width - overlap.left - overlap.right, height: sheet.height - overlap.top - overlap.bottom };
  // Round toward safety: the aperture rounds down (more overlap). A window narrower than one
  // cutting step rounds to nothing, so the check is on the rounded aperture.
  const aperture = { width: roundTo(exact.width, stepMm, "down"), height: roundTo(exact.height, stepMm, "down") };
  if (!(aperture.width > 0)) fields[custom ? "window.width" : "window"] = `The overlaps leave no window across: the sheet is ${fmt(sheet.width)} wide and the left and right overlaps take ${fmt(overlap.left + overlap.right)}.`;
  if (!(aperture.height > 0)) fields[custom ? "window.height" : "window"] = `The overlaps leave no window down: the sheet is ${fmt(sheet.height)} high and the top and bottom overlaps take ${fmt(overlap.top + overlap.bottom)}.`;
  if (Object.keys(fields).length) return { ok: false, fields };

  // What the aperture loses to rounding goes to the overlaps, half each side.
  const dW = exact.width - aperture.width;
  const dH = exact.height - aperture.height;
  overlap.left += dW / 2;
  overlap.right += dW / 2;
  overlap.top += dH / 2;
  overlap.bottom += dH / 2;
  const windowOnSheet = { left: overlap.left, top: overlap.top };

  // ── Borders and outer size ───────────────────────────────────────────────
  const weightMm = input.bottomWeight !== undefined ? len(input.bottomWeight, "bottomWeight", { min: 0, label: "Bottom weighting" }) : 0;
  const weightPct = input.bottomWeightPercent ?? 0;
  let borders: Sides;
  if (input.fitOuter) {
    const ow = len(input.fitOuter.width, "fitOuter.width", { positive: true, label: "Outer width" });
    const oh = len(input.fitOuter.height, "fitOuter.height", { positive: true, label: "Outer height" });
    if (Object.keys(fields).length) return { ok: false, fields };
    if (ow <= aperture.width) fields["fitOuter.width"] = `The outer width ${fmt(ow)} is not wider than the window (${fmt(aperture.width)}).`;
    const vTotal = oh - aperture.height;
    if (vTotal <= weightMm) fields["fitOuter.height"] = `The outer height ${fmt(oh)} leaves no room for top and bottom borders around a ${fmt(aperture.height)} window${weightMm ? ` with ${fmt(weightMm)} bottom weighting` : ""}.`;
    if (Object.keys(fields).length) return { ok: false, fields };
    const left = roundTo((ow - aperture.width) / 2, stepMm, "nearest");
    const top = roundTo(weightPct ? vTotal / (2 + weightPct / 100) : (vTotal - weightMm) / 2, stepMm, "nearest");
    borders = { left, right: ow - aperture.width - left, top, bottom: vTotal - top };
  } else {
    const b = input.borders;
    if (!b) {
      borders = { left: K.DEFAULT_BORDER_MM, top: K.DEFAULT_BORDER_MM, right: K.DEFAULT_BORDER_MM, bottom: K.DEFAULT_BORDER_MM };
      findings.push({ code: "borders-assumed", severity: "info", message: `No borders were given, so ${fmt(K.DEFAULT_BORDER_MM)} all round is assumed.` });
    } else if ("all" in b) {
      const v = len(b.all, "borders.all", { min: 0, label: "Border" });
      borders = { left: v, top: v, right: v, bottom: v };
    } else if ("side" in b) {
      const side = len(b.side, "borders.side", { min: 0, label: "Side border" });
      borders = { left: side, right: side, top: len(b.top, "borders.top", { min: 0, label: "Top border" }), bottom: len(b.bottom, "borders.bottom", { min: 0, label: "Bottom border" }) };
    } else {
      borders = {
        left: len(b.left, "borders.left", { min: 0, label: "Left border" }),
        top: len(b.top, "borders.top", { min: 0, label: "Top border" }),
        right: len(b.right, "borders.right", { min: 0, label: "Right border" }),
        bottom: len(b.bottom, "borders.bottom", { min: 0, label: "Bottom border" }),
      };
    }
    if (Object.keys(fields).length) return { ok: false, fields };
    borders.bottom += weightMm + (borders.top * weightPct) / 100;
    for (const s of SIDES) borders[s] = roundTo(borders[s], stepMm, "nearest");
  }
  const outer = { width: aperture.width + borders.left + borders.right, height: aperture.height + borders.top + borders.bottom };
  if (input.minBorder !== undefined) {
    const minB = len(input.minBorder, "minBorder", { min: 0, label: "Minimum border" });
    for (const s of SIDES) {
      if (borders[s] < minB - 1e-9) findings.push({ code: "border-below-minimum", severity: "warn", side: s, message: `${SIDE_WORD[s]}: the border comes out at ${fmt(borders[s])}, below the ${fmt(minB)} you asked for.` });
    }
  }

  // ── Double mount ────────────────────────────────────────────────────────
  let topWindow: Box | null = null;
  let doubleReveal: number | null = null;
  if (input.doubleMount) {
    doubleReveal = len(input.doubleMount.reveal, "doubleMount.reveal", { min: 0, label: "Double mount reveal" });
    if (Object.keys(fields).length) return { ok: false, fields };
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
  if (Object.keys(fields).length) return { ok: false, fields };

  // Glazing and boards are cut to the outer size; the rebate takes the clearance, rounded up.
  const glazing: PlanGeometry["glazing"] = { width: outer.width, height: outer.height };
  const rebate = { width: roundTo(outer.width + clearance, stepMm, "up"), height: roundTo(outer.height + clearance, stepMm, "up") };
  const sight = { width: rebate.width - 2 * lip, height: rebate.height - 2 * lip };
  const hidden = lip - clearance / 2;
  for (const s of SIDES) {
    if (borders[s] <= hidden + 1e-9) {
      findings.push({ code: "lip-covers-window", severity: "error", side: s, message: `${SIDE_WORD[s]}: the frame's ${fmt(lip)} rebate lip would cover the ${fmt(borders[s])} border and reach into the window.` });
    }
  }
  const mouldingLength = (2 * (rebate.width + rebate.height) + 8 * faceWidth) * (1 + wastePercent / 100);

  const areaM2 = (outer.width / 1000) * (outer.height / 1000);
  let packageWeight: number | undefined;
  if (gl && glazingThickness !== undefined) {
    const perMm = gl.material === "glass" ? K.GLASS_KG_PER_M2_PER_MM : K.ACRYLIC_KG_PER_M2_PER_MM;
    glazing.weightKg = areaM2 * glazingThickness * perMm;
    glazing.material = gl.material;
    glazing.thickness = glazingThickness;
    glazing.uvFiltering = gl.uvFiltering;
    const boardMm = windowBoard * (topWindow ? 2 : 1) + backingBoard + extraBacking;
    packageWeight = glazing.weightKg + areaM2 * boardMm * K.BOARD_KG_PER_M2_PER_MM;
  }
  const thickness = (glazingThickness ?? 0) + spacerDepth + windowBoard * (topWindow ? 2 : 1) + backingBoard + extraBacking;
  if (rebateDepth !== undefined && rebateDepth + 1e-9 < thickness) {
    findings.push({ code: "rebate-too-shallow", severity: "warn", message: `The rebate is ${fmt(rebateDepth)} deep but the package (glazing, spacer, boards and backing) is ${fmt(thickness, "up")} thick.` });
  }

  // ── Board yield ─────────────────────────────────────────────────────────
  let yieldResult: PlanGeometry["yield"];
  if (input.boardSheet) {
    const bs = {
      width: len(input.boardSheet.width, "boardSheet.width", { positive: true, label: "Board sheet width" }),
      height: len(input.boardSheet.height, "boardSheet.height", { positive: true, label: "Board sheet height" }),
    };
    const kerf = input.kerf !== undefined ? len(input.kerf, "kerf", { min: 0, label: "Kerf" }) : K.DEFAULT_KERF_MM;
    if (Object.keys(fields).length) return { ok: false, fields };
    const y = blanksPerSheet(outer, bs, kerf);
    yieldResult = { perSheet: y.perSheet, sheet: bs, kerf, utilisation: y.utilisation };
    if (y.perSheet === 0) findings.push({ code: "board-too-small", severity: "error", message: `A ${fmt(outer.width)} × ${fmt(outer.height)} board does not fit on a ${fmt(bs.width)} × ${fmt(bs.height)} sheet.` });
  }

  // ── Findings on each side ───────────────────────────────────────────────
  for (const s of SIDES) {
    const o = overlap[s];
    const mode = modes[s];
    const word = SIDE_WORD[s];
    const held = mode !== "float" && !(mode === "custom" && o < 0);
    if (held && o < minOverlapMm - 1e-9) {
      findings.push({
        code: "overlap-below-minimum",
        severity: "error",
        side: s,
        message: `${word}: the window covers ${fmtOverlap(Math.max(0, o))} of the sheet; the studio minimum is ${fmtMin(minOverlapMm)}.`,
      });
    }
    if (mode === "custom" && o < 0) {
      findings.push({ code: "window-past-sheet", severity: "warn", side: s, message: `${word}: the window opens ${fmt(-o, "down")} past the edge of the sheet, so that side is not held by the window.` });
    }
    if (mode === "float") {
      findings.push({ code: "float", severity: "info", side: s, message: `${word}: the sheet floats, with a ${fmt(-o, "down")} reveal between its edge and the window.` });
    }
    if (mode === "hide-border" && (into[s] ?? 0) < 0) {
      findings.push({ code: "window-shows-border", severity: "error", side: s, message: `${word}: the window edge sits ${fmt(-(into[s] as number))} outside the image, so the border shows.` });
    }
    if (imageBorders && held && mode !== "hide-border") {
      const b = imageBorders[s];
      if (o < b - 1e-9) {
        findings.push({ code: "window-shows-border", severity: "info", side: s, message: `${word}: ${fmt(b - o, "down")} of the sheet's border shows inside the window.` });
      } else if (o > b + 1e-9 && b > 0) {
        findings.push({ code: "window-covers-image", severity: "warn", side: s, message: `${word}: the window covers ${fmt(o - b, "up")} of the image itself, past the ${fmt(b)} border.` });
      }
    }
  }
  if (custom && (custom.width > sheet.width || custom.height > sheet.height)) {
    findings.push({
      code: "window-larger-than-sheet",
      severity: "warn",
      message: `The window (${fmt(custom.width)} × ${fmt(custom.height)}) is larger than the sheet (${fmt(sheet.width)} × ${fmt(sheet.height)}) on ${custom.width > sheet.width ? "its width" : "its height"}: the sheet would have to float on that axis.`,
    });
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

  const geometry: PlanGeometry = {
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
  const checks: Check[] = conservationChecks(geometry, input, { length: fmt, overlap: fmtOverlap, minimum: fmtMin });
  if (input.materials?.attachment === "t-hinge") {
    for (const s of SIDES) {
      const floats = modes[s] === "float" || (modes[s] === "custom" && overlap[s] < 0);
      if (floats) {
        const info = findings.findIndex((f) => f.code === "float" && f.side === s);
        if (info >= 0) findings.splice(info, 1);
        findings.push({
          code: "float-needs-float-hinge",
          severity: "error",
          side: s,
          message: `${SIDE_WORD[s]}: the window does not cover the sheet here, and T-hinges need it to; use V-hinges, pass-through hinges or edge strips.`,
        });
      }
    }
  }
  const fromFindings: Verdict[] = findings.map((f) => (f.severity === "error" ? "fail" : f.severity === "warn" ? "warn" : "pass"));
  const level: Verdict = worstVerdict([...checks.map((c) => c.verdict), ...fromFindings]);
  return { ok: true, geometry, plan: toPlan(geometry, findings, checks, level, precision, fmt) };
}

const round6 = (v: number) => Math.round(v * 1e6) / 1e6;

function toPlan(g: PlanGeometry, findings: Finding[], checks: Check[], level: Verdict, precision: number, fmt: (mm: number, r?: "nearest" | "down" | "up") => string): MountPlan {
  const u = (mm: number) => round6(g.unit === "in" ? mm / MM_PER_INCH : mm);
  const box = (b: Box) => ({ width: u(b.width), height: u(b.height) });
  const sides = (s: Sides) => ({ left: u(s.left), top: u(s.top), right: u(s.right), bottom: u(s.bottom) });
  const size = (b: Box, r: "nearest" | "down" | "up" = "nearest") => `${fmt(b.width, r).replace(/ (mm|in)$/, "")} × ${fmt(b.height, r)}`;
  const display: Record<string, string> = {
    sheet: size(g.sheet),
    aperture: size(g.aperture, "down"),
    outer: size(g.outer),
    glazing: size(g.glazing, "down"),
    rebate: size(g.rebate, "up"),
    sight: size(g.sight),
    moulding: fmt(g.moulding.length, "up"),
  };
  for (const s of SIDES) {
    display[`overlap.${s}`] = fmt(g.overlap[s], "down");
    display[`borders.${s}`] = fmt(g.borders[s]);
  }
  if (g.topWindow) display.topWindow = size(g.topWindow, "down");
  return {
    schemaVersion: PLAN_SCHEMA_VERSION,
    unit: g.unit,
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
