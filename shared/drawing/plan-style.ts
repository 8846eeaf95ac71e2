/**
 * How the plan drawing looks, for both renderers: the screen's SVG (src/components/plan-drawing.tsx)
 * and the PDF's (server/lib/pdf/plan-drawing.tsx) draw the same model (shared/domain/mount-plan/drawing.ts)
 * with this one table of colours, line weights, dashes and text weights, and the same small geometry.
 * Pure: no React, no DOM, no Node.
 */
import type { Role, Shape } from "../domain/mount-plan/drawing.ts";
import { MATERIAL_TONES as T, PALETTE as P } from "./palette.ts";

/** Line weights, in screen px (the screen draws them as non-scaling strokes). */
export const LINE = { hair: 0.5, fine: 0.75, board: 1, window: 1.25 } as const;
/** Dash patterns, in the same units as the line weights. */
export const DASH = { imageEdge: "3 2", hidden: "5 3" } as const;
/** Text weights. */
export const WEIGHT = { label: 500, strong: 600 } as const;

/** The image is hatched on screen; `hatch` gives the pattern's ground and line. */
export type Hatch = { ground: string; line: string };
export type RoleStyle = {
  fill?: string;
  stroke?: string;
  width?: number;
  dash?: string;
  /** Fill opacity. */
  opacity?: number;
  text?: string;
  weight?: number;
  hatch?: Hatch;
  /** What differs on paper: taken over the rest by printStyle. */
  print?: Partial<Omit<RoleStyle, "print">>;
};

/** Each role's style. A fill of none is left out; a hatch replaces the fill on screen. */
export const PLAN_STYLE: Record<Role, RoleStyle> = {
  backing: { fill: T.backing, stroke: P.graphite.light, width: LINE.fine },
  sheet: { fill: T.sheet, stroke: P.graphite.DEFAULT, width: LINE.fine },
  image: { fill: T.imageFlat, hatch: { ground: P.paper.sheet, line: T.hatchLine }, stroke: T.imageEdge, width: LINE.hair, dash: DASH.imageEdge },
  board: { fill: T.board, stroke: P.ink.DEFAULT, width: LINE.board },
  "top-board": { fill: T.topBoard, stroke: P.ink.DEFAULT, width: LINE.board },
  "sheet-hidden": { stroke: P.graphite.DEFAULT, width: LINE.fine, dash: DASH.hidden },
  window: { stroke: P.ink.DEFAULT, width: LINE.window },
  bevel: { stroke: T.bevel, width: LINE.fine },
  "band-pass": { fill: P.pass.DEFAULT, opacity: 0.28 },
  "band-fail": { fill: P.fail.DEFAULT, opacity: 0.4 },
  "band-float": { fill: P.graphite.light, opacity: 0.28 },
  "band-label": { text: P.ink.DEFAULT, weight: WEIGHT.strong },
  "border-label": { text: P.graphite.DEFAULT, weight: WEIGHT.label },
  "dim-line": { stroke: P.graphite.DEFAULT, width: LINE.fine },
  "dim-label": { text: P.ink.soft, weight: WEIGHT.label },
  // On screen the hinge lets a little of the sheet's edge show through while it is dragged; on paper it is solid.
  hinge: { fill: T.hinge, stroke: P.warn.DEFAULT, width: LINE.fine, opacity: 0.95, print: { opacity: undefined } },
};

/** The dimension lines' arrowheads take the dimension line's colour. */
export const ARROW_FILL = P.graphite.DEFAULT;

/** On paper every line is drawn at this share of its screen weight, so it prints as a hairline. */
export const PRINT_LINE_SCALE = 0.8;
/** The PDF embeds Libre Franklin at these weights only (server/lib/pdf/fonts.ts). */
export const PRINT_FONT_WEIGHTS = [400, 600, 700] as const;

/** A role's style on paper: its print differences applied, lines at the print scale, text at an embedded weight. */
export function printStyle(role: Role): RoleStyle {
  const { print, ...st } = PLAN_STYLE[role];
  const out: RoleStyle = { ...st, ...print };
  if (out.width !== undefined) out.width = Math.round(out.width * PRINT_LINE_SCALE * 1000) / 1000;
  if (out.weight !== undefined) out.weight = embeddedWeight(out.weight);
  return out;
}

/** Every role's style on paper, worked out once. */
export const PRINT_STYLE = Object.fromEntries(Object.keys(PLAN_STYLE).map((r) => [r, printStyle(r as Role)])) as Record<Role, RoleStyle>;

/** The heaviest embedded weight not heavier than the one asked for (the lightest when all are heavier). */
export function embeddedWeight(weight: number): number {
  let best: number = PRINT_FONT_WEIGHTS[0];
  for (const w of PRINT_FONT_WEIGHTS) if (w <= weight) best = w;
  return best;
}

// ── Geometry both renderers share ─────────────────────────────────────────

/** A rectangle as drawn: a side that came out negative is drawn as nothing. */
export function drawnRect(s: Extract<Shape, { kind: "rect" }>): { x: number; y: number; width: number; height: number } {
  return { x: s.x, y: s.y, width: Math.max(0, s.width), height: Math.max(0, s.height) };
}

/** A dash pattern at `k` times its size (the PDF draws in mm, with weights given in points). */
export function scaledDash(dash: string, k: number): string {
  return dash
    .split(" ")
    .map((d) => String(Number(d) * k))
    .join(" ");
}

/** A text shape's rotation about its own anchor, as an SVG transform, or undefined. `sep` is what stands between the numbers. */
export function textRotation(s: Extract<Shape, { kind: "text" }>, sep: " " | ", "): string | undefined {
  return s.rotate ? `rotate(${s.rotate}${sep}${s.x}${sep}${s.y})` : undefined;
}

/** The image hatch on screen: the pattern's cell and the width of its line, from the drawing's font size. */
export function hatchSize(fontSize: number): { cell: number; line: number } {
  return { cell: fontSize * 0.6, line: fontSize * 0.08 };
}

/** The screen's arrowhead marker (a 10-unit path) is scaled to the drawing's font size by this. */
export function arrowMarkerScale(fontSize: number): number {
  return fontSize / 12;
}

/** An arrowhead at (x2, y2) pointing away from (x1, y1), as polygon points: half a font size long, 0.4 rad either side. */
export function arrowHeadPoints(x1: number, y1: number, x2: number, y2: number, fontSize: number): string {
  const a = Math.atan2(y2 - y1, x2 - x1);
  const l = fontSize * 0.5;
  const p = (ang: number) => `${x2 - l * Math.cos(a - ang)},${y2 - l * Math.sin(a - ang)}`;
  return `${x2},${y2} ${p(0.4)} ${p(-0.4)}`;
}
