import type { MountPlan, MountPlanParsed, PlanObject } from "../schemas/mount-plan.ts";
import { MountPlanInputSchema } from "../schemas/mount-plan.ts";
import { computePlan, type PlanResult } from "./mount-plan/compute.ts";
import type { Unit } from "./units.ts";
import type { Board, MountingData } from "../schemas/mountings.ts";
import { BOARD_GRADE_LABELS, GLAZING_TYPE_LABELS } from "../schemas/mountings.ts";

/** Board thickness by ply, in mm: 4-ply ≈ 1.3–1.5 mm (Saitzyk, Art Hardware); 2, 6 and 8-ply from memory. */
export const PLY_MM: Record<2 | 4 | 6 | 8, number> = { 2: 0.8, 4: 1.4, 6: 2.1, 8: 2.8 };

const HINGE_METHODS = ["t-hinge", "v-hinge", "pendant-hinge", "pass-through-hinge"];
const METHOD_WORDS: Record<string, [string, string]> = {
  "t-hinge": ["T-hinge", "T-hinges"],
  "v-hinge": ["V-hinge", "V-hinges"],
  "pendant-hinge": ["pendant hinge", "pendant hinges"],
  "pass-through-hinge": ["pass-through hinge", "pass-through hinges"],
  corners: ["corners", "corners"],
  "edge-strips": ["edge strips", "edge strips"],
  "sink-mount": ["sink mount", "sink mount"],
  "polyester-straps": ["polyester straps", "polyester straps"],
  "pressure-sensitive-tape": ["pressure-sensitive tape", "pressure-sensitive tape"],
};

/** What the checks need of an object's catalogue record (objects table / ObjectRecord). */
export type CatalogueFacts = {
  objectType: string;
  photoProcess?: string | null;
  sensitivities?: readonly string[] | null;
  medium?: string | null;
  support?: string | null;
  borderLeftMm?: number | null;
  borderTopMm?: number | null;
  borderRightMm?: number | null;
  borderBottomMm?: number | null;
};

/** A paper weight written in the support ("cotton rag, 300 g/m²", "250gsm"), in g/m²; null when none is given. */
export function paperWeightOf(support: string | null | undefined): number | null {
  const m = (support ?? "").match(/(\d{2,4}(?:[.,]\d+)?)\s*(?:g\s*\/\s*m[²2]|gsm\b)/i);
  const digits = m?.[1];
  const v = digits ? Number(digits.replace(",", ".")) : NaN;
  return Number.isFinite(v) && v > 0 && v <= 2000 ? v : null;
}

/** The catalogue as the plan's `object`: the checks for photographs, friable media, light and hinges read it. */
export function planObjectOf(o: CatalogueFacts): PlanObject {
  return {
    objectType: o.objectType as PlanObject["objectType"],
    photoProcess: (o.objectType === "photograph" ? (o.photoProcess ?? null) : null) as PlanObject["photoProcess"],
    sensitivities: [...(o.sensitivities ?? [])] as PlanObject["sensitivities"],
    medium: o.medium ?? null,
    paperWeightGsm: paperWeightOf(o.support),
  };
}

/**
 * The plan input of a mounting record: its saved plan, the object's catalogue (so the checks for
 * photographs, friable media and light see the whole object), the sheet's own borders when the
 * plan has none, and the record's materials (so the checks cover the boards, attachment and
 * glazing actually chosen). Every screen, document and export that shows a record's plan uses this.
 */
export function recordPlanInput(data: MountingData, catalogue: CatalogueFacts): MountPlanParsed {
  const p = planInputFor(data);
  p.object = planObjectOf(catalogue);
  const b = [catalogue.borderLeftMm, catalogue.borderTopMm, catalogue.borderRightMm, catalogue.borderBottomMm];
  if (!p.imageBorders && b.every((v) => typeof v === "number") && b.some((v) => (v as number) > 0)) {
    p.imageBorders = { left: `${b[0]} mm`, top: `${b[1]} mm`, right: `${b[2]} mm`, bottom: `${b[3]} mm` };
  }
  return p;
}

export type PlanSettings = { minOverlapMm: number; rebateClearanceMm: number; unit: Unit };

/** A mounting record's plan, recomputed from what was saved and the catalogue, shown in the studio's unit. */
export function recordPlan(data: MountingData, catalogue: CatalogueFacts, settings: PlanSettings): PlanResult {
  return computePlan(recordPlanInput(data, catalogue), { minOverlapMm: settings.minOverlapMm, rebateClearanceMm: settings.rebateClearanceMm, displayUnit: settings.unit });
}

/** A draft plan saved on an object, recomputed with the object's catalogue in place of whatever the planner was told. */
export function draftPlan(input: MountPlanParsed, catalogue: CatalogueFacts, settings: PlanSettings): PlanResult {
  const p: MountPlanParsed = { ...structuredClone(input), object: planObjectOf(catalogue) };
  return computePlan(p, { minOverlapMm: settings.minOverlapMm, rebateClearanceMm: settings.rebateClearanceMm, displayUnit: settings.unit });
}

/** The record's own plan with its materials filled in (no catalogue): use recordPlanInput. */
function planInputFor(data: MountingData): MountPlanParsed {
  const p: MountPlanParsed = structuredClone(data.plan);
  const wb = data.boards.window;
  const hinges = data.attachment.hinges;
  const edges = new Set(hinges.map((h) => h.edge));
  p.materials = {
    ...(p.materials ?? {}),
    boardGrade: wb.grade,
    buffered: wb.buffered,
    ...(wb.patPassed !== undefined ? { patPassed: wb.patPassed } : {}),
    attachment: data.attachment.method,
    ...(data.attachment.adhesive ? { adhesive: data.attachment.adhesive } : {}),
    ...(data.attachment.tissue ? { tissue: data.attachment.tissue } : {}),
    ...(HINGE_METHODS.includes(data.attachment.method)
      ? {
          hingeCount: hinges.length,
          hingeEdge: edges.size === 0 || (edges.size === 1 && edges.has("top")) ? "top" : edges.has("top") && !edges.has("bottom") ? "top-and-sides" : "all-edges",
        }
      : {}),
  } as MountPlanParsed["materials"];
  const g = data.glazing;
  if (g.type === "none") delete p.glazing;
  else {
    const material = g.type === "acrylic" || g.type === "uv-acrylic" ? "acrylic" : "glass";
    // The record's own thickness (mm) wins; otherwise the plan's, in the plan's unit; otherwise 2 mm (common practice).
    const thickness = g.thicknessMm != null ? `${g.thicknessMm} mm` : (data.plan.glazing?.thickness ?? "2 mm");
    p.glazing = { material, thickness, uvFiltering: g.type !== "float-glass" && g.type !== "acrylic" };
  }
  if (data.spacer?.depthMm) p.spacer = { depth: `${data.spacer.depthMm} mm` };
  p.boards = { ...(p.boards ?? {}), window: `${PLY_MM[wb.ply]} mm`, backing: `${PLY_MM[data.boards.backing.ply]} mm` };
  if (data.frame?.rebateDepthMm || data.frame?.faceWidthMm) {
    p.frame = {
      ...(p.frame ?? {}),
      ...(data.frame.rebateDepthMm ? { rebateDepth: `${data.frame.rebateDepthMm} mm` } : {}),
      ...(data.frame.faceWidthMm ? { faceWidth: `${data.frame.faceWidthMm} mm` } : {}),
    };
  }
  return MountPlanInputSchema.parse(p);
}

function boardWords(b: Board): string {
  const grade = b.grade === "museum" ? "museum cotton" : b.grade === "conservation" ? "conservation" : "other board";
  return `${grade} ${b.ply}-ply, ${b.buffered ? "buffered" : "unbuffered"}`;
}

/** The current mount in one line, as the object's header shows it. */
export function mountSummary(data: MountingData, plan: Pick<MountPlan, "display">, words: { window: string } = { window: "window" }): string {
  const parts = [`${words.window} ${plan.display.aperture}`, boardWords(data.boards.window)];
  const [one, many] = METHOD_WORDS[data.attachment.method] ?? [data.attachment.method, data.attachment.method];
  const n = data.attachment.hinges.length;
  const method = HINGE_METHODS.includes(data.attachment.method) ? `${n} ${n === 1 ? one : many}` : many;
  parts.push(data.attachment.adhesive && data.attachment.adhesive !== "none" ? `${method}, ${data.attachment.adhesive.replace(/-/g, " ")}` : method);
  parts.push(data.glazing.type === "none" ? "no glazing" : GLAZING_TYPE_LABELS[data.glazing.type].replace("UV-filtering", "UV"));
  return parts.join(" · ");
}

/** Maker's batch numbers of a record's boards, by role. */
export function boardBatches(data: MountingData): { role: string; batch: string }[] {
  const out: { role: string; batch: string }[] = [];
  for (const role of ["window", "backing", "top"] as const) {
    const b = data.boards[role];
    if (b?.batch) out.push({ role, batch: b.batch });
  }
  return out;
}

export { BOARD_GRADE_LABELS };

/**
 * How big the object is as it leaves the studio (trade reference §15): the frame's outside, sight size
 * + 2 × moulding face width, when a frame with its face width is recorded; otherwise the mount's outer
 * size (a frame recorded without its face width says so rather than guess the moulding).
 */
export type PackageSize = { kind: "framed" | "framed-no-face-width" | "mount"; widthMm: number; heightMm: number };
export function packageSize(data: MountingData, result: PlanResult): PackageSize | null {
  if (!result.ok) return null;
  const g = result.geometry;
  const f = data.frame;
  const framed = !!f && !!(f.moulding || f.finish || f.faceWidthMm || f.rebateDepthMm);
  if (framed && f.faceWidthMm) return { kind: "framed", widthMm: g.sight.width + 2 * f.faceWidthMm, heightMm: g.sight.height + 2 * f.faceWidthMm };
  return { kind: framed ? "framed-no-face-width" : "mount", widthMm: g.outer.width, heightMm: g.outer.height };
}
