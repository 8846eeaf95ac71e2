import { at } from "../../../setup/lists.ts";
/**
 * An exhaustive search for the fewest full sheets a batch of boards needs with guillotine cuts,
 * written apart from the product's code so the two can be compared. Small batches only (≤ 8).
 *
 * A set of boards fits a W × H sheet by guillotine cuts when it is one board that fits either way
 * round, or when some straight cut across the sheet splits it into two parts that each fit their
 * side. A cut can always be slid toward the first part until it touches a board, so trying, for each
 * way of splitting the set, the smallest width (or height) the first part fits in is enough.
 * Kerf: each board and the sheet are grown by the kerf (n boards of width w fit across W when
 * n·w + (n − 1)·k ≤ W, i.e. n·(w + k) ≤ W + k).
 */
export type Board = { w: number; h: number };
const EPS = 1e-9;

export function fewestSheets(boards: Board[], sheet: { width: number; height: number }, kerf: number): number {
  const n = boards.length;
  const grown = boards.map((b) => ({ w: b.w + kerf, h: b.h + kerf }));
  const W = sheet.width + kerf;
  const H = sheet.height + kerf;
  const memo = new Map<string, boolean>();

  const sidesMemo = new Map<number, number[]>();
  const sides = (mask: number): number[] => {
    const known = sidesMemo.get(mask);
    if (known) return known;
    // Every sum of one side (or none) of each board in the set: the places a cut can sit.
    let sums = [0];
    for (let i = 0; i < n; i++) {
      if (!(mask & (1 << i))) continue;
      const next = new Set<number>();
      const g = at(grown, i);
      for (const s of sums) for (const add of [0, g.w, g.h]) next.add(Math.round((s + add) * 1e6) / 1e6);
      sums = [...next];
    }
    const out = sums.filter((s) => s > 0).sort((a, b) => a - b);
    sidesMemo.set(mask, out);
    return out;
  };
  /** The narrowest width (of the cut positions) at which a set fits a given height; Infinity if none. */
  const narrowMemo = new Map<string, number>();
  const narrowest = (mask: number, h: number, limit: number, across: boolean): number => {
    const key = `${mask}|${h.toFixed(6)}|${across}`;
    let v = narrowMemo.get(key);
    if (v === undefined) {
      v = Infinity;
      for (const x of sides(mask))
        if (across ? fits(mask, x, h) : fits(mask, h, x)) {
          v = x;
          break;
        }
      narrowMemo.set(key, v);
    }
    return v <= limit + EPS ? v : Infinity;
  };

  const fits = (mask: number, w: number, h: number): boolean => {
    const key = `${mask}|${w.toFixed(6)}|${h.toFixed(6)}`;
    const known = memo.get(key);
    if (known !== undefined) return known;
    let ok = false;
    let area = 0;
    for (let i = 0; i < n; i++) if (mask & (1 << i)) area += at(grown, i).w * at(grown, i).h;
    if (area <= w * h + EPS) {
      if ((mask & (mask - 1)) === 0) {
        const b = at(grown, 31 - Math.clz32(mask));
        ok = (b.w <= w + EPS && b.h <= h + EPS) || (b.h <= w + EPS && b.w <= h + EPS);
      } else {
        const low = mask & -mask;
        for (let a = (mask - 1) & mask; a > 0 && !ok; a = (a - 1) & mask) {
          if (!(a & low)) continue;
          const b = mask ^ a;
          const across = narrowest(a, h, w, true);
          if (across !== Infinity && fits(b, w - across, h)) ok = true;
          if (ok) break;
          const down = narrowest(a, w, h, false);
          if (down !== Infinity && fits(b, w, h - down)) ok = true;
        }
      }
    }
    memo.set(key, ok);
    return ok;
  };

  const full = (1 << n) - 1;
  const best = new Map<number, number>([[0, 0]]);
  const solve = (mask: number): number => {
    const known = best.get(mask);
    if (known !== undefined) return known;
    const low = mask & -mask;
    let v = Infinity;
    for (let s = mask; s > 0; s = (s - 1) & mask) if (s & low && fits(s, W, H)) v = Math.min(v, 1 + solve(mask ^ s));
    best.set(mask, v);
    return v;
  };
  return solve(full);
}
