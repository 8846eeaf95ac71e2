/**
 * What the two board-yield algorithms share (docs/trade.md §11): sizes and placements,
 * the float allowance, input checks, and the kerf trick both pack in.
 *
 * A cut removes `kerf` mm and blanks need no kerf at the sheet's outer edge,
 * so if every blank is grown by `kerf` on its right and bottom and the sheet is grown by `kerf` too,
 * the kerf problem becomes the kerf-free one. n blanks of width w fit across W exactly when
 * n·(w + k) ≤ W + k, i.e. n·w + (n − 1)·k ≤ W. All the packing works in that grown space;
 * a placement's x, y are the same in both spaces and its width and height are the real blank's.
 */
import { MM_PER_INCH } from "../../units.ts";

export type Size = { width: number; height: number };
export type Placement = { pieceId: string; x: number; y: number; width: number; height: number; rotated: boolean };
export type CutPiece = { id: string; label?: string; width: number; height: number; quantity: number };
export type CuttingSheet = { index: number; placements: Placement[]; utilisation: number };
/** `utilisation`: area of the pieces cut / (sheetCount × sheet area); unplaced pieces do not count. 0 when no sheet is used. */
export type CuttingList = { sheets: CuttingSheet[]; sheetCount: number; utilisation: number; unplaced: { id: string; reason: string }[] };

/** Float noise allowance on lengths in mm (values here are at most a few thousand mm). */
export const EPS = 1e-9;

/** A full board sheet as sold. */
export type BoardSheet = { id: string; label: string; width: number; height: number };
/** Standard full board sheets (docs/trade.md §11); never empty, the first is the default. */
export const STANDARD_BOARD_SHEETS: [BoardSheet, ...BoardSheet[]] = [
  // 32 × 40 in and 40 × 60 in: suppliers' sizes; 1 in = 25.4 mm exactly (1959 agreement; NIST HB 44 App. C).
  { id: "32x40in", label: "32 × 40 in", width: 32 * MM_PER_INCH, height: 40 * MM_PER_INCH },
  { id: "40x60in", label: "40 × 60 in", width: 40 * MM_PER_INCH, height: 60 * MM_PER_INCH },
  // 1120 × 815 mm: common practice (no source).
  { id: "1120x815mm", label: "1120 × 815 mm", width: 1120, height: 815 },
];

export function requirePositive(name: string, value: number): void {
  if (typeof value !== "number" || !Number.isFinite(value) || value <= 0) {
    throw new RangeError(`${name} must be a positive length in mm; got ${String(value)}.`);
  }
}

export function requireKerf(kerf: number): void {
  if (typeof kerf !== "number" || !Number.isFinite(kerf) || kerf < 0) {
    throw new RangeError(`kerf must be zero or a positive length in mm; got ${String(kerf)}.`);
  }
}

/** How many of `item` fit along `length`, both already grown by the kerf. */
export function fitCount(length: number, item: number): number {
  return Math.floor((length + EPS) / item);
}

/**
 * `xs[i]` for an index the search keeps in range (a loop bound, an index into the same list): the
 * packers' arrays are read this way instead of `xs[i]!`, so a wrong index is an error at once
 * rather than an `undefined` or a NaN further on.
 */
export function item<T>(xs: ArrayLike<T>, i: number): T {
  const x = xs[i];
  if (x === undefined) throw new RangeError(`Index ${i} is outside a list of ${xs.length}.`);
  return x;
}
