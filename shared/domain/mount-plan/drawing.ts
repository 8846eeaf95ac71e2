import type { SideName } from "../../schemas/mount-plan.ts";
import { SIDES } from "../../schemas/mount-plan.ts";
import type { PlanGeometry } from "./plan/types.ts";
import { figureLength } from "./figures.ts";

/**
 * The plan drawn to scale as plain shapes in millimetres (origin: the board's top-left corner).
 * The screen (SVG) and the PDF render the same model; each role has one style in each renderer.
 */
export type Role =
  | "backing"
  | "board"
  | "top-board"
  | "bevel"
  | "sheet"
  | "sheet-hidden"
  | "image"
  | "window"
  | "band-pass"
  | "band-fail"
  | "band-float"
  | "band-label"
  | "border-label"
  | "dim-line"
  | "dim-label"
  | "hinge";
export type Shape =
  | { kind: "rect"; role: Role; x: number; y: number; width: number; height: number; side?: SideName; hinge?: number }
  | { kind: "path"; role: Role; d: string }
  | { kind: "line"; role: Role; x1: number; y1: number; x2: number; y2: number; arrows?: boolean }
  | { kind: "text"; role: Role; x: number; y: number; text: string; anchor: "start" | "middle" | "end"; rotate?: number; size: number };
export type DrawingModel = { viewBox: [number, number, number, number]; shapes: Shape[]; fontSize: number };

export type HingeMark = { edge: SideName; offset: number; width: number };

const rectPath = (x: number, y: number, w: number, h: number) => `M${x} ${y}h${w}v${h}h${-w}z`;

/** Shapes are placed at the plan's true sizes; every label is the plan's shown figure, so the drawing and the table agree. */
export function planDrawing(g: PlanGeometry, hinges: HingeMark[] = []): DrawingModel {
  const { outer, aperture, borders, overlap, sheet } = g;
  const fig = g.figures;
  const shown = (mm: number) => figureLength(mm, fig.unit);
  const size = Math.max(outer.width, outer.height);
  const font = size * 0.028;
  const gap = font * 1.4;
  const shapes: Shape[] = [];
  const wx = borders.left;
  const wy = borders.top;
  // The sheet, positioned so that the window edge sits `overlap` inside its edge.
  const sx = wx - overlap.left;
  const sy = wy - overlap.top;

  shapes.push({ kind: "rect", role: "backing", x: 0, y: 0, width: outer.width, height: outer.height });
  shapes.push({ kind: "rect", role: "sheet", x: sx, y: sy, width: sheet.width, height: sheet.height });
  if (g.imageBorders) {
    const b = g.imageBorders;
    shapes.push({ kind: "rect", role: "image", x: sx + b.left, y: sy + b.top, width: sheet.width - b.left - b.right, height: sheet.height - b.top - b.bottom });
  }
  // The window board: the outer edge with the window cut out of it.
  const boardOpening = g.topWindow ? { x: wx, y: wy, w: aperture.width, h: aperture.height } : { x: wx, y: wy, w: aperture.width, h: aperture.height };
  shapes.push({ kind: "path", role: "board", d: rectPath(0, 0, outer.width, outer.height) + rectPath(boardOpening.x, boardOpening.y, boardOpening.w, boardOpening.h) });
  if (g.topWindow && g.doubleReveal !== null) {
    const r = g.doubleReveal;
    shapes.push({ kind: "path", role: "top-board", d: rectPath(0, 0, outer.width, outer.height) + rectPath(wx - r, wy - r, aperture.width + 2 * r, aperture.height + 2 * r) });
  }
  // The sheet's edge where it runs under the board, as a hidden line.
  shapes.push({ kind: "rect", role: "sheet-hidden", x: sx, y: sy, width: sheet.width, height: sheet.height });
  shapes.push({ kind: "rect", role: "window", x: wx, y: wy, width: aperture.width, height: aperture.height });
  const bevel = Math.min(1.5, aperture.width / 20);
  shapes.push({ kind: "rect", role: "bevel", x: wx - bevel, y: wy - bevel, width: aperture.width + 2 * bevel, height: aperture.height + 2 * bevel });

  // Overlap bands: between the window edge and the sheet edge, coloured by verdict; a reveal for a float.
  for (const s of SIDES) {
    const o = overlap[s];
    if (Math.abs(o) < 1e-6) continue;
    const role: Role = g.modes[s] === "float" ? "band-float" : o < g.minOverlapMm - 1e-9 ? "band-fail" : "band-pass";
    const t = Math.abs(o);
    let r: { x: number; y: number; width: number; height: number };
    if (s === "left") r = o > 0 ? { x: wx - t, y: wy, width: t, height: aperture.height } : { x: wx, y: wy, width: t, height: aperture.height };
    else if (s === "right")
      r = o > 0 ? { x: wx + aperture.width, y: wy, width: t, height: aperture.height } : { x: wx + aperture.width - t, y: wy, width: t, height: aperture.height };
    else if (s === "top") r = o > 0 ? { x: wx, y: wy - t, width: aperture.width, height: t } : { x: wx, y: wy, width: aperture.width, height: t };
    else r = o > 0 ? { x: wx, y: wy + aperture.height, width: aperture.width, height: t } : { x: wx, y: wy + aperture.height - t, width: aperture.width, height: t };
    shapes.push({ kind: "rect", role, side: s, ...r });
    const text = o < 0 ? `reveal ${shown(-fig.overlap[s])}` : `overlap ${shown(fig.overlap[s])}`;
    const inset = font * 0.9;
    if (s === "left") shapes.push({ kind: "text", role: "band-label", x: wx + inset, y: wy + aperture.height / 2, text, anchor: "middle", rotate: -90, size: font * 0.8 });
    else if (s === "right")
      shapes.push({ kind: "text", role: "band-label", x: wx + aperture.width - inset, y: wy + aperture.height / 2, text, anchor: "middle", rotate: 90, size: font * 0.8 });
    else if (s === "top") shapes.push({ kind: "text", role: "band-label", x: wx + aperture.width / 2, y: wy + inset * 1.3, text, anchor: "middle", size: font * 0.8 });
    else shapes.push({ kind: "text", role: "band-label", x: wx + aperture.width / 2, y: wy + aperture.height - inset * 0.6, text, anchor: "middle", size: font * 0.8 });
  }

  // Hinges, where they really sit: on the sheet's edge, half on the sheet and half on the backing.
  hinges.forEach((h, i) => {
    const depth = Math.max(6, font * 0.8);
    if (h.edge === "top") shapes.push({ kind: "rect", role: "hinge", hinge: i, x: sx + h.offset, y: sy - depth / 2, width: h.width, height: depth });
    else if (h.edge === "bottom") shapes.push({ kind: "rect", role: "hinge", hinge: i, x: sx + h.offset, y: sy + sheet.height - depth / 2, width: h.width, height: depth });
    else if (h.edge === "left") shapes.push({ kind: "rect", role: "hinge", hinge: i, x: sx - depth / 2, y: sy + h.offset, width: depth, height: h.width });
    else shapes.push({ kind: "rect", role: "hinge", hinge: i, x: sx + sheet.width - depth / 2, y: sy + h.offset, width: depth, height: h.width });
  });

  // Border widths, written in each border.
  shapes.push({ kind: "text", role: "border-label", x: outer.width / 2, y: borders.top / 2 + font * 0.35, text: shown(fig.borders.top), anchor: "middle", size: font });
  shapes.push({
    kind: "text",
    role: "border-label",
    x: outer.width / 2,
    y: outer.height - borders.bottom / 2 + font * 0.35,
    text: shown(fig.borders.bottom),
    anchor: "middle",
    size: font,
  });
  shapes.push({ kind: "text", role: "border-label", x: borders.left / 2, y: outer.height / 2, text: shown(fig.borders.left), anchor: "middle", rotate: -90, size: font });
  shapes.push({
    kind: "text",
    role: "border-label",
    x: outer.width - borders.right / 2,
    y: outer.height / 2,
    text: shown(fig.borders.right),
    anchor: "middle",
    rotate: 90,
    size: font,
  });

  // Dimension lines outside the drawing: outer size above and left, window below and right.
  const top = -gap;
  shapes.push({ kind: "line", role: "dim-line", x1: 0, y1: top, x2: outer.width, y2: top, arrows: true });
  shapes.push({ kind: "text", role: "dim-label", x: outer.width / 2, y: top - font * 0.45, text: `outer ${shown(fig.outer.width)}`, anchor: "middle", size: font });
  const left = -gap;
  shapes.push({ kind: "line", role: "dim-line", x1: left, y1: 0, x2: left, y2: outer.height, arrows: true });
  shapes.push({ kind: "text", role: "dim-label", x: left - font * 0.45, y: outer.height / 2, text: `outer ${shown(fig.outer.height)}`, anchor: "middle", rotate: -90, size: font });
  const bottom = outer.height + gap;
  shapes.push({ kind: "line", role: "dim-line", x1: wx, y1: bottom, x2: wx + aperture.width, y2: bottom, arrows: true });
  shapes.push({ kind: "line", role: "dim-line", x1: wx, y1: outer.height + font * 0.3, x2: wx, y2: bottom + font * 0.3 });
  shapes.push({ kind: "line", role: "dim-line", x1: wx + aperture.width, y1: outer.height + font * 0.3, x2: wx + aperture.width, y2: bottom + font * 0.3 });
  shapes.push({ kind: "text", role: "dim-label", x: wx + aperture.width / 2, y: bottom + font * 1.25, text: `window ${shown(fig.aperture.width)}`, anchor: "middle", size: font });
  const right = outer.width + gap;
  shapes.push({ kind: "line", role: "dim-line", x1: right, y1: wy, x2: right, y2: wy + aperture.height, arrows: true });
  shapes.push({ kind: "line", role: "dim-line", x1: outer.width + font * 0.3, y1: wy, x2: right + font * 0.3, y2: wy });
  shapes.push({ kind: "line", role: "dim-line", x1: outer.width + font * 0.3, y1: wy + aperture.height, x2: right + font * 0.3, y2: wy + aperture.height });
  shapes.push({
    kind: "text",
    role: "dim-label",
    x: right + font * 1.15,
    y: wy + aperture.height / 2,
    text: `window ${shown(fig.aperture.height)}`,
    anchor: "middle",
    rotate: 90,
    size: font,
  });

  // Everything drawn, including a sheet that floats past the board, fits in the view box.
  const minX = Math.min(0, sx) - gap - font * 2;
  const minY = Math.min(0, sy) - gap - font * 2;
  const maxX = Math.max(outer.width, sx + sheet.width) + gap + font * 2;
  const maxY = Math.max(outer.height, sy + sheet.height) + gap + font * 2;
  return { viewBox: [minX, minY, maxX - minX, maxY - minY], shapes, fontSize: font };
}
