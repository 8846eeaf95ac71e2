/**
 * How many blanks of one size a full board sheet gives (docs/trade.md §11): an exact search
 * over guillotine (edge-to-edge) cuts at "normal pattern" positions, bounded by a count of cuts tried.
 */
import { EPS, fitCount, item, requireKerf, requirePositive, type Placement, type Size } from "./common.ts";

/**
 * The guillotine search below is bounded by a count of cut positions tried, not a clock, so the
 * result depends on the input alone; it keeps a call to about 2 ms at most for blanks ≥ 50 mm on
 * sheets up to 1524 × 1016 mm. Mount-sized blanks finish well inside it; only small blanks (under
 * about 100 mm) on large sheets reach it, and then sub-rectangles not yet solved keep their best
 * grid and are not cut further: still a real layout, never worse than the best grid, and in trials
 * (1,000 random blanks 50–750 mm) within 1 % of the unbounded search.
 */
const MAX_CUTS_TRIED = 40_000;
/** Above this many cut positions (only with blanks tiny beside the sheet), cuts fall on whole rows and columns only. */
const MAX_PATTERNS = 1_000;
/**
 * Placements are listed for at most this many blanks (the count is always exact): a layout is only
 * drawn or cut for a batch, and batches are capped at 2,000 boards, so memory stays bounded even
 * for a tiny blank on a large sheet.
 */
export const MAX_PLACEMENTS = 2_000;

/**
 * How many blanks of one size a full board sheet gives with guillotine cuts (edge-to-edge straight cuts), trying both orientations and mixed layouts.
 * Placements carry pieceId "blank", are sorted top to bottom then left to right, and `rotated` means turned a quarter from `blank`.
 * `utilisation` is the blanks' area over the sheet's (0..1).
 */
export function blanksPerSheet(blank: Size, sheet: Size, kerf: number, maxPlacements = MAX_PLACEMENTS): { perSheet: number; placements: Placement[]; utilisation: number } {
  requirePositive("blank.width", blank.width);
  requirePositive("blank.height", blank.height);
  requirePositive("sheet.width", sheet.width);
  requirePositive("sheet.height", sheet.height);
  requireKerf(kerf);

  const bw = blank.width + kerf;
  const bh = blank.height + kerf;
  const sw = sheet.width + kerf;
  const sh = sheet.height + kerf;
  const square = Math.abs(blank.width - blank.height) <= EPS;
  const fitsUpright = bw <= sw + EPS && bh <= sh + EPS;
  const fitsTurned = !square && bh <= sw + EPS && bw <= sh + EPS;
  if (!fitsUpright && !fitsTurned) return { perSheet: 0, placements: [], utilisation: 0 };

  // Every cut can be slid to a "normal pattern" (a sum of grown blank sides) without losing a
  // blank, so those sums are the only cut positions and the only part sizes worth trying.
  const limit = Math.max(sw, sh);
  const patterns = normalPatterns(bw, square ? undefined : bh, limit) ?? wholeRowsAndColumns(bw, bh, limit) ?? gridsOnly(bw, bh, sw, sh);
  /** The largest pattern ≤ length, as an index into `patterns`. */
  const floorIndex = (length: number): number => {
    let lo = 0;
    let hi = patterns.length - 1;
    while (lo < hi) {
      const mid = (lo + hi + 1) >> 1;
      if (item(patterns, mid) <= length + EPS) lo = mid;
      else hi = mid - 1;
    }
    return lo;
  };
  const cellArea = bw * bh;
  const bound = (a: number, b: number) => Math.floor((item(patterns, a) * item(patterns, b)) / cellArea + EPS);
  const grid = (a: number, b: number, rotated: boolean): number =>
    rotated ? fitCount(item(patterns, a), bh) * fitCount(item(patterns, b), bw) : fitCount(item(patterns, a), bw) * fitCount(item(patterns, b), bh);

  const a0 = floorIndex(sw);
  const b0 = floorIndex(sh);
  // Sub-rectangles are (a, b) with a ≤ a0, b ≤ b0. Each holds its best count (−1: not solved yet) and
  // how it was reached: 0 upright grid, 1 turned grid, 2 + 2p a cut down at pattern p, 3 + 2p a cut across.
  const rows = b0 + 1;
  const best = new Int32Array((a0 + 1) * rows).fill(-1);
  const choice = new Int32Array((a0 + 1) * rows);
  let cutsTried = 0;

  const solve = (a: number, b: number): number => {
    const key = a * rows + b;
    const known = item(best, key);
    if (known >= 0) return known;
    let value = grid(a, b, false);
    let pick = 0;
    if (!square) {
      const turned = grid(a, b, true);
      if (turned > value) {
        value = turned;
        pick = 1;
      }
    }
    const upper = bound(a, b);
    if (value < upper && cutsTried < MAX_CUTS_TRIED) {
      // A cut at p and one at (length − p) give the same two parts, so only p ≤ half is tried; from the
      // middle toward the edge, which in trials finds good layouts sooner when the budget runs out.
      cuts: for (let dir = 0; dir < 2; dir++) {
        const vertical = dir === 0;
        const along = vertical ? a : b;
        const half = item(patterns, along) / 2 + EPS;
        const top = floorIndex(half);
        let q = floorIndex(item(patterns, along) - item(patterns, top)); // grows as p shrinks
        for (let p = top; p >= 1; p--) {
          if (++cutsTried > MAX_CUTS_TRIED) break cuts;
          while (q + 1 < patterns.length && item(patterns, q + 1) <= item(patterns, along) - item(patterns, p) + EPS) q++;
          const boundSum = vertical ? bound(p, b) + bound(q, b) : bound(a, p) + bound(a, q);
          if (boundSum <= value) continue;
          const first = vertical ? solve(p, b) : solve(a, p);
          if (first + (vertical ? bound(q, b) : bound(a, q)) <= value) continue;
          const total = first + (vertical ? solve(q, b) : solve(a, q));
          if (total > value) {
            value = total;
            pick = 2 + 2 * p + dir;
            if (value >= upper) break cuts;
          }
        }
      }
    }
    best[key] = value;
    choice[key] = pick;
    return value;
  };

  const perSheet = solve(a0, b0);

  const placements: Placement[] = [];
  const place = (x: number, y: number, a: number, b: number): void => {
    if (placements.length >= maxPlacements) return;
    const pick = item(choice, a * rows + b);
    if (pick < 2) {
      const rotated = pick === 1;
      const cw = rotated ? bh : bw;
      const ch = rotated ? bw : bh;
      const across = fitCount(item(patterns, a), cw);
      const down = fitCount(item(patterns, b), ch);
      for (let j = 0; j < down; j++) {
        for (let i = 0; i < across; i++) {
          if (placements.length >= maxPlacements) return;
          placements.push({
            pieceId: "blank",
            x: x + i * cw,
            y: y + j * ch,
            width: rotated ? blank.height : blank.width,
            height: rotated ? blank.width : blank.height,
            rotated,
          });
        }
      }
      return;
    }
    const at = (pick - 2) >> 1;
    if ((pick & 1) === 0) {
      place(x, y, at, b);
      place(x + item(patterns, at), y, floorIndex(item(patterns, a) - item(patterns, at)), b);
    } else {
      place(x, y, a, at);
      place(x, y + item(patterns, at), a, floorIndex(item(patterns, b) - item(patterns, at)));
    }
  };
  place(0, 0, a0, b0);
  placements.sort((p, q) => p.y - q.y || p.x - q.x);

  return { perSheet, placements, utilisation: (perSheet * blank.width * blank.height) / (sheet.width * sheet.height) };
}

/** All sums i·s₀ + j·s₁ ≤ limit (0 included; s₁ absent: multiples of s₀), sorted, with float twins merged; null when there are too many. */
function normalPatterns(s0: number, s1: number | undefined, limit: number): number[] | null {
  const values: number[] = [];
  for (let i = 0; i * s0 <= limit + EPS; i++) {
    if (s1 === undefined) values.push(i * s0);
    else {
      for (let j = 0; i * s0 + j * s1 <= limit + EPS; j++) {
        values.push(i * s0 + j * s1);
        if (values.length > MAX_PATTERNS) return null;
      }
    }
    if (values.length > MAX_PATTERNS) return null;
  }
  return mergeSorted(values);
}

/** Multiples of either side alone: fewer cut positions, still every grid; null when there are too many. */
function wholeRowsAndColumns(s0: number, s1: number, limit: number): number[] | null {
  if (fitCount(limit, s0) + fitCount(limit, s1) > MAX_PATTERNS) return null;
  const values: number[] = [];
  for (let i = 0; i * s0 <= limit + EPS; i++) values.push(i * s0);
  for (let j = 1; j * s1 <= limit + EPS; j++) values.push(j * s1);
  return mergeSorted(values);
}

/** Just the lengths the two full-sheet grids need: no cuts worth trying (blanks minute beside the sheet). */
function gridsOnly(s0: number, s1: number, sw: number, sh: number): number[] {
  return mergeSorted([0, ...[sw, sh].flatMap((l) => [fitCount(l, s0) * s0, fitCount(l, s1) * s1])]);
}

function mergeSorted(values: number[]): number[] {
  values.sort((x, y) => x - y);
  const out: number[] = [];
  for (const v of values) {
    const last = out.at(-1);
    if (last === undefined || v - last > EPS) out.push(v);
  }
  return out;
}
