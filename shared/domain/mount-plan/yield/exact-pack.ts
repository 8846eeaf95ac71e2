/**
 * Fewest sheets: an exact search for small groups of blanks, with guillotine cuts and kerf
 * (docs/trade.md §11). The cutting list (cutting-list.ts) uses it for small batches and to
 * repack the emptiest sheets of larger ones.
 */
import { EPS, item, type Placement, type Size } from "./common.ts";

/** Sheets, each its placements. */
export type Packing = Placement[][];

/**
 * Up to this many blanks, the fewest sheets are found exactly. Every guillotine layout of a set of
 * blanks has a first straight cut that splits the set in two, each part again a guillotine layout,
 * so the smallest boxes (width, height) that hold a set can be built from those of its two parts
 * (side by side, or one above the other). A set fits a sheet when one of its boxes does; the
 * fewest sheets then follow from a search over the subsets. 3^n pairs of subsets: about 60,000 at 10.
 */
export const EXACT_MAX_BLANKS = 10;
/** Box combinations the exact search may make before it gives up (then the heuristics' answer stands). */
const MAX_EXACT_WORK = 3_000_000;

type BoxNode = { w: number; h: number; kind: 0 | 1 | 2; a: number; ai: number; b: number; bi: number; rotated: boolean };

/** The fewest sheets for these units, exactly, or null when the search would cost more than its budget. */
export function exactPack(units: { id: string; w: number; h: number }[], sheet: Size, kerf: number): Packing | null {
  const n = units.length;
  if (n === 0) return [];
  if (n > EXACT_MAX_BLANKS) return null;
  const W = sheet.width + kerf;
  const H = sheet.height + kerf;
  const full = (1 << n) - 1;
  const boxes: BoxNode[][] = new Array(full + 1);
  let work = 0;
  const add = (list: BoxNode[], node: BoxNode) => {
    if (node.w > W + EPS || node.h > H + EPS) return;
    for (const o of list) if (o.w <= node.w + EPS && o.h <= node.h + EPS) return;
    for (let i = list.length - 1; i >= 0; i--) {
      const o = list[i]!; // i counts down from the last index: in range, and this is the hot loop
      if (node.w <= o.w + EPS && node.h <= o.h + EPS) list.splice(i, 1);
    }
    list.push(node);
  };
  // Masks by number of blanks, so both parts of a split are known before the whole.
  const order = Array.from({ length: full }, (_, i) => i + 1).sort((a, b) => popcount(a) - popcount(b) || a - b);
  for (const mask of order) {
    const list: BoxNode[] = [];
    if ((mask & (mask - 1)) === 0) {
      const i = 31 - Math.clz32(mask);
      const u = item(units, i);
      add(list, { w: u.w + kerf, h: u.h + kerf, kind: 0, a: i, ai: 0, b: 0, bi: 0, rotated: false });
      if (Math.abs(u.w - u.h) > EPS) add(list, { w: u.h + kerf, h: u.w + kerf, kind: 0, a: i, ai: 0, b: 0, bi: 0, rotated: true });
    } else {
      const low = mask & -mask;
      // Each split once: the part A holds the lowest blank.
      for (let a = (mask - 1) & mask; a > 0; a = (a - 1) & mask) {
        if ((a & low) === 0) continue;
        const b = mask ^ a;
        // Both parts hold fewer blanks than the mask, so their lists are made already.
        const la = item(boxes, a);
        const lb = item(boxes, b);
        if (!la.length || !lb.length) continue;
        work += la.length * lb.length;
        if (work > MAX_EXACT_WORK) return null;
        for (let ai = 0; ai < la.length; ai++) {
          const p = la[ai]!; // loop bounds (the hot loop)
          for (let bi = 0; bi < lb.length; bi++) {
            const q = lb[bi]!;
            add(list, { w: p.w + q.w, h: Math.max(p.h, q.h), kind: 1, a, ai, b, bi, rotated: false });
            add(list, { w: Math.max(p.w, q.w), h: p.h + q.h, kind: 2, a, ai, b, bi, rotated: false });
          }
        }
      }
    }
    boxes[mask] = list;
  }
  // Fewest sheets over subsets: a sheet takes a set that fits, holding the lowest blank still to place.
  const best = new Int32Array(full + 1).fill(-1);
  const pick = new Int32Array(full + 1);
  best[0] = 0;
  const solve = (mask: number): number => {
    const known = item(best, mask);
    if (known >= 0) return known;
    const low = mask & -mask;
    let value = Infinity;
    let chosen = 0;
    for (let s = mask; s > 0; s = (s - 1) & mask) {
      if ((s & low) === 0 || item(boxes, s).length === 0) continue;
      const v = 1 + solve(mask ^ s);
      if (v < value) {
        value = v;
        chosen = s;
      }
    }
    best[mask] = value;
    pick[mask] = chosen;
    return value;
  };
  solve(full);
  const packing: Packing = [];
  const lay = (mask: number, idx: number, x: number, y: number, out: Placement[]) => {
    const node = item(item(boxes, mask), idx);
    if (node.kind === 0) {
      const u = item(units, node.a);
      out.push({ pieceId: u.id, x, y, width: node.rotated ? u.h : u.w, height: node.rotated ? u.w : u.h, rotated: node.rotated });
      return;
    }
    const first = item(item(boxes, node.a), node.ai);
    lay(node.a, node.ai, x, y, out);
    if (node.kind === 1) lay(node.b, node.bi, x + first.w, y, out);
    else lay(node.b, node.bi, x, y + first.h, out);
  };
  for (let mask = full; mask; ) {
    const s = item(pick, mask);
    const out: Placement[] = [];
    lay(s, 0, 0, 0, out);
    out.sort((p, q) => p.y - q.y || p.x - q.x);
    packing.push(out);
    mask ^= s;
  }
  return packing;
}

function popcount(v: number): number {
  let c = 0;
  for (; v; v &= v - 1) c++;
  return c;
}
