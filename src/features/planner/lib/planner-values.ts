import type { MountPlanInput, Side } from "@shared/schemas/mount-plan.ts";
import { formatInches, formatMm, lengthInputValue, parseLength, type Rounding, type Unit } from "@shared/domain/units.ts";

/** What the planner form holds: lengths as typed text in the form's unit. */
export type SideValues = { mode: Side["mode"]; overlap: string; border: string; into: string; reveal: string };
export type PlannerValues = {
  unit: Unit;
  sheetW: string;
  sheetH: string;
  hasImageBorders: boolean;
  ib: { left: string; top: string; right: string; bottom: string };
  windowMode: "all" | "sides" | "custom";
  all: SideValues;
  left: SideValues;
  top: SideValues;
  right: SideValues;
  bottom: SideValues;
  custom: { width: string; height: string; left: string; top: string };
  minOverlap: string;
  bordersMode: "all" | "tsb" | "sides" | "fit";
  b: { all: string; top: string; side: string; bottom: string; left: string; right: string };
  fit: { preset: string; width: string; height: string };
  weightMode: "none" | "amount" | "percent";
  weight: string;
  weightPct: string;
  minBorder: string;
  double: boolean;
  doubleReveal: string;
  glazing: { material: "" | "glass" | "acrylic"; thickness: string; uv: boolean };
  spacer: string;
  frame: { rebateDepth: string; lip: string; faceWidth: string; waste: string };
  board: { preset: string; width: string; height: string; kerf: string };
  materials: { boardGrade: string; buffered: string; pat: string; attachment: string; adhesive: string; hingeCount: string; hingeEdge: string };
  object: { objectType: string; photoProcess: string; sensitivities: string[] };
};

/** Every field that holds a length, so a unit change can convert them all. */
export const LENGTH_FIELDS = [
  "sheetW",
  "sheetH",
  "ib.left",
  "ib.top",
  "ib.right",
  "ib.bottom",
  ...(["all", "left", "top", "right", "bottom"] as const).flatMap((s) => [`${s}.overlap`, `${s}.border`, `${s}.into`, `${s}.reveal`]),
  "custom.width",
  "custom.height",
  "custom.left",
  "custom.top",
  "minOverlap",
  "b.all",
  "b.top",
  "b.side",
  "b.bottom",
  "b.left",
  "b.right",
  "fit.width",
  "fit.height",
  "weight",
  "minBorder",
  "doubleReveal",
  "glazing.thickness",
  "spacer",
  "frame.rebateDepth",
  "frame.lip",
  "frame.faceWidth",
  "board.width",
  "board.height",
  "board.kerf",
] as const;
export type LengthField = (typeof LENGTH_FIELDS)[number];

const side = (overlap: string): SideValues => ({ mode: "overlap", overlap, border: "", into: "", reveal: "" });

export function defaultValues(unit: Unit, minOverlapMm: number): PlannerValues {
  const len = (mm: number) => lengthInputValue(mm, unit);
  return {
    unit,
    sheetW: len(210),
    sheetH: len(297),
    hasImageBorders: false,
    ib: { left: "", top: "", right: "", bottom: "" },
    windowMode: "all",
    all: side(len(minOverlapMm)),
    left: side(len(minOverlapMm)),
    top: side(len(minOverlapMm)),
    right: side(len(minOverlapMm)),
    bottom: side(len(minOverlapMm)),
    custom: { width: "", height: "", left: "", top: "" },
    // Empty means "the studio minimum", used exactly; a converted copy could round it down.
    minOverlap: "",
    bordersMode: "all",
    b: { all: len(unit === "in" ? 50.8 : 50), top: "", side: "", bottom: "", left: "", right: "" },
    fit: { preset: "", width: "", height: "" },
    weightMode: "none",
    weight: "",
    weightPct: "",
    minBorder: "",
    double: false,
    doubleReveal: len(unit === "in" ? 4.7625 : 5),
    glazing: { material: "glass", thickness: len(2), uv: true },
    spacer: "",
    frame: { rebateDepth: "", lip: "", faceWidth: "", waste: "" },
    board: { preset: "", width: "", height: "", kerf: "" },
    materials: { boardGrade: "", buffered: "", pat: "", attachment: "", adhesive: "", hingeCount: "", hingeEdge: "" },
    object: { objectType: "", photoProcess: "", sensitivities: [] },
  };
}

const t = (s: string) => s.trim();
const opt = (s: string) => (t(s) === "" ? undefined : t(s));

function sideInput(v: SideValues): Side {
  if (v.mode === "float") return { mode: "float", reveal: t(v.reveal) };
  if (v.mode === "hide-border") return { mode: "hide-border", border: t(v.border), into: t(v.into) };
  return { mode: "overlap", overlap: t(v.overlap) };
}

/** The planner's text fields as the shared plan input; the shared domain reads the lengths. */
export function toInput(v: PlannerValues): MountPlanInput {
  const input: MountPlanInput = {
    unit: v.unit,
    sheet: { width: t(v.sheetW), height: t(v.sheetH) },
    window:
      v.windowMode === "custom"
        ? { mode: "custom", width: t(v.custom.width), height: t(v.custom.height), left: t(v.custom.left), top: t(v.custom.top) }
        : v.windowMode === "all"
          ? { all: sideInput(v.all) }
          : { left: sideInput(v.left), top: sideInput(v.top), right: sideInput(v.right), bottom: sideInput(v.bottom) },
  };
  if (v.hasImageBorders) input.imageBorders = { left: t(v.ib.left) || "0", top: t(v.ib.top) || "0", right: t(v.ib.right) || "0", bottom: t(v.ib.bottom) || "0" };
  if (opt(v.minOverlap)) input.minOverlap = t(v.minOverlap);
  if (v.bordersMode === "fit") input.fitOuter = { width: t(v.fit.width), height: t(v.fit.height) };
  else if (v.bordersMode === "all") input.borders = { all: t(v.b.all) };
  else if (v.bordersMode === "tsb") input.borders = { top: t(v.b.top), side: t(v.b.side), bottom: t(v.b.bottom) };
  else input.borders = { left: t(v.b.left), top: t(v.b.top), right: t(v.b.right), bottom: t(v.b.bottom) };
  if (v.weightMode === "amount" && opt(v.weight)) input.bottomWeight = t(v.weight);
  if (v.weightMode === "percent" && opt(v.weightPct)) input.bottomWeightPercent = Number(v.weightPct);
  if (opt(v.minBorder)) input.minBorder = t(v.minBorder);
  if (v.double) input.doubleMount = { reveal: t(v.doubleReveal) };
  if (v.glazing.material) input.glazing = { material: v.glazing.material, thickness: t(v.glazing.thickness), uvFiltering: v.glazing.uv };
  if (opt(v.spacer)) input.spacer = { depth: t(v.spacer) };
  const frame: NonNullable<MountPlanInput["frame"]> = {};
  if (opt(v.frame.rebateDepth)) frame.rebateDepth = t(v.frame.rebateDepth);
  if (opt(v.frame.lip)) frame.rebateLip = t(v.frame.lip);
  if (opt(v.frame.faceWidth)) frame.faceWidth = t(v.frame.faceWidth);
  if (opt(v.frame.waste)) frame.wastePercent = Number(v.frame.waste);
  if (Object.keys(frame).length) input.frame = frame;
  if (opt(v.board.width) && opt(v.board.height)) {
    input.boardSheet = { width: t(v.board.width), height: t(v.board.height) };
    if (opt(v.board.kerf)) input.kerf = t(v.board.kerf);
  }
  const m = v.materials;
  const materials: NonNullable<MountPlanInput["materials"]> = {};
  if (m.boardGrade) materials.boardGrade = m.boardGrade as never;
  if (m.buffered) materials.buffered = m.buffered === "yes";
  if (m.pat) materials.patPassed = m.pat === "yes";
  if (m.attachment) materials.attachment = m.attachment as never;
  if (m.adhesive) materials.adhesive = m.adhesive as never;
  if (opt(m.hingeCount) && /^\d+$/.test(t(m.hingeCount))) materials.hingeCount = Number(m.hingeCount);
  if (m.hingeEdge) materials.hingeEdge = m.hingeEdge as never;
  if (Object.keys(materials).length) input.materials = materials;
  const o = v.object;
  if (o.objectType || o.sensitivities.length) {
    input.object = {
      ...(o.objectType ? { objectType: o.objectType as never } : {}),
      ...(o.photoProcess ? { photoProcess: o.photoProcess as never } : {}),
      sensitivities: o.sensitivities as never,
    };
  }
  return input;
}

/** Back from a saved input to the form (for a saved draft). */
export function fromInput(input: MountPlanInput, base: PlannerValues): PlannerValues {
  const s = (x: string | number | undefined) => (x === undefined ? "" : String(x));
  const v: PlannerValues = structuredClone(base);
  v.unit = input.unit;
  v.sheetW = s(input.sheet.width);
  v.sheetH = s(input.sheet.height);
  if (input.imageBorders) {
    v.hasImageBorders = true;
    v.ib = { left: s(input.imageBorders.left), top: s(input.imageBorders.top), right: s(input.imageBorders.right), bottom: s(input.imageBorders.bottom) };
  }
  const toSide = (x: Side): SideValues => ({
    mode: x.mode,
    overlap: x.mode === "overlap" ? s(x.overlap) : "",
    border: x.mode === "hide-border" ? s(x.border) : "",
    into: x.mode === "hide-border" ? s(x.into) : "",
    reveal: x.mode === "float" ? s(x.reveal) : "",
  });
  const w = input.window;
  if ("mode" in w) {
    v.windowMode = "custom";
    v.custom = { width: s(w.width), height: s(w.height), left: s(w.left), top: s(w.top) };
  } else if ("all" in w) {
    v.windowMode = "all";
    v.all = toSide(w.all);
  } else {
    v.windowMode = "sides";
    v.left = toSide(w.left);
    v.top = toSide(w.top);
    v.right = toSide(w.right);
    v.bottom = toSide(w.bottom);
  }
  v.minOverlap = s(input.minOverlap) || v.minOverlap;
  if (input.fitOuter) {
    v.bordersMode = "fit";
    v.fit = { preset: "", width: s(input.fitOuter.width), height: s(input.fitOuter.height) };
  } else if (input.borders) {
    const b = input.borders;
    if ("all" in b) {
      v.bordersMode = "all";
      v.b.all = s(b.all);
    } else if ("side" in b) {
      v.bordersMode = "tsb";
      Object.assign(v.b, { top: s(b.top), side: s(b.side), bottom: s(b.bottom) });
    } else {
      v.bordersMode = "sides";
      Object.assign(v.b, { left: s(b.left), top: s(b.top), right: s(b.right), bottom: s(b.bottom) });
    }
  }
  if (input.bottomWeight !== undefined) {
    v.weightMode = "amount";
    v.weight = s(input.bottomWeight);
  }
  if (input.bottomWeightPercent !== undefined) {
    v.weightMode = "percent";
    v.weightPct = s(input.bottomWeightPercent);
  }
  v.minBorder = s(input.minBorder);
  v.double = !!input.doubleMount;
  if (input.doubleMount) v.doubleReveal = s(input.doubleMount.reveal);
  v.glazing = input.glazing
    ? { material: input.glazing.material, thickness: s(input.glazing.thickness), uv: !!input.glazing.uvFiltering }
    : { material: "", thickness: "", uv: false };
  v.spacer = s(input.spacer?.depth);
  v.frame = { rebateDepth: s(input.frame?.rebateDepth), lip: s(input.frame?.rebateLip), faceWidth: s(input.frame?.faceWidth), waste: s(input.frame?.wastePercent) };
  v.board = { preset: input.boardSheet ? "custom" : "", width: s(input.boardSheet?.width), height: s(input.boardSheet?.height), kerf: s(input.kerf) };
  const m = input.materials ?? {};
  v.materials = {
    boardGrade: m.boardGrade ?? "",
    buffered: m.buffered === undefined ? "" : m.buffered ? "yes" : "no",
    pat: m.patPassed === undefined ? "" : m.patPassed ? "yes" : "no",
    attachment: m.attachment ?? "",
    adhesive: m.adhesive ?? "",
    hingeCount: s(m.hingeCount),
    hingeEdge: m.hingeEdge ?? "",
  };
  if (input.object) v.object = { objectType: input.object.objectType ?? "", photoProcess: input.object.photoProcess ?? "", sensitivities: input.object.sensitivities ?? [] };
  return v;
}

/** Maps a plan error path (sheet.width, window.left.overlap…) to the form field that shows it. */
export function fieldForPath(path: string, v: PlannerValues): string {
  const map: Record<string, string> = {
    "sheet.width": "sheetW",
    "sheet.height": "sheetH",
    "fitOuter.width": "fit.width",
    "fitOuter.height": "fit.height",
    bottomWeight: "weight",
    "doubleMount.reveal": "doubleReveal",
    "spacer.depth": "spacer",
    "frame.rebateLip": "frame.lip",
    "frame.rebateDepth": "frame.rebateDepth",
    "frame.faceWidth": "frame.faceWidth",
    "boardSheet.width": "board.width",
    "boardSheet.height": "board.height",
    kerf: "board.kerf",
    "glazing.thickness": "glazing.thickness",
  };
  if (map[path]) return map[path];
  if (path.startsWith("imageBorders.")) return `ib.${path.split(".")[1]}`;
  if (path.startsWith("borders.")) return `b.${path.split(".")[1]}`;
  if (path.startsWith("window.all.")) return `all.${path.split(".")[2]}`;
  if (path === "window") return v.windowMode === "custom" ? "custom.width" : v.windowMode === "all" ? "all.overlap" : "left.overlap";
  if (v.windowMode === "custom" && path.startsWith("window.")) return `custom.${path.split(".")[1]}`;
  if (path.startsWith("window.")) return path.slice("window.".length);
  return path;
}

/**
 * Converts a length text from one unit to the other. `last` is what the previous conversion wrote into the field and
 * the exact mm it stood for: while the text is still that, the exact mm is used, so toggling back and forth never drifts.
 * Overlaps convert rounding up, so a conversion never weakens them.
 */
export function convertLength(text: string, from: Unit, to: Unit, last?: { text: string; mm: number }, rounding: Rounding = "nearest"): { text: string; mm: number | null } {
  if (text.trim() === "") return { text, mm: null };
  const r = parseLength(text, from);
  if (!r.ok) return { text, mm: null };
  const mm = last && last.text === text ? last.mm : r.mm;
  const out = rounding === "nearest" ? lengthInputValue(mm, to) : to === "in" ? formatInches(mm, 32, rounding) : formatMm(mm, rounding, 0.1);
  return { text: out, mm };
}

/** Fields whose conversion must not make them smaller. */
export const ROUND_UP_FIELDS: readonly string[] = [
  "minOverlap",
  "all.overlap",
  "left.overlap",
  "top.overlap",
  "right.overlap",
  "bottom.overlap",
  "all.into",
  "left.into",
  "top.into",
  "right.into",
  "bottom.into",
];
