/**
 * The cutting list (docs/trade.md §11): how a batch of blanks packs onto the fewest full
 * sheets with guillotine (edge-to-edge) cuts and blade kerf. Greedy guillotine packers under several
 * rules, the single-size layouts of blanksPerSheet, and an exact search (exact-pack.ts) for small
 * batches and for the emptiest sheets of larger ones; the fewest sheets win.
 */
import { formatMm } from "../../units.ts";
import { blanksPerSheet } from "./blanks-per-sheet.ts";
import { EPS, item, requireKerf, requirePositive, type CutPiece, type CuttingList, type CuttingSheet, type Placement, type Size } from "./common.ts";
import { EXACT_MAX_BLANKS, exactPack, type Packing } from "./exact-pack.ts";

type Rect = { x: number; y: number; w: number; h: number };
type Unit = { id: string; order: number; w: number; h: number };
type Fit = "area" | "short-side";
type Split = "shorter-leftover" | "longer-leftover" | "big-offcut" | "even-offcuts";
type Order = "area" | "long-side" | "perimeter";
/** What the greedy packers may still spend, counted in free rectangles looked at. */
type Work = { left: number };

/**
 * Work for each of the three passes below (the main packer; the single-size layouts; the other
 * rules together), counted in free rectangles looked at: a count, not a clock, so the result
 * depends on the input alone. In trials with mixed 100–800 mm blanks, batches of up to about 1,000
 * try every rule and a few thousand still get the main packer in full. Past its budget the main
 * packer looks only at the newest few open sheets, so even 100,000 blanks (the API's 200 lines ×
 * 500) finish in about a second, at a cost in sheets.
 */
const MAX_PACK_WORK = 4_000_000;
const OPEN_SHEET_WINDOW = 8;

type Rule = { order: Order; fit: Fit; split: Split };
const RULES: Rule[] = (["area", "long-side", "perimeter"] as Order[]).flatMap((order) =>
  (["area", "short-side"] as Fit[]).flatMap((fit) => (["shorter-leftover", "longer-leftover", "big-offcut", "even-offcuts"] as Split[]).map((split) => ({ order, fit, split }))),
);

/** The rule of the main packer, which always finishes: the first of RULES. */
const MAIN_RULE: Rule = { order: "area", fit: "area", split: "shorter-leftover" };

/**
 * Packs a batch of blanks onto the fewest full sheets it can find with guillotine cuts and kerf, rotating pieces when that helps. Pieces larger than the sheet in both orientations are returned in `unplaced` with a sentence naming the piece and the sheet size.
 * Each of a piece's `quantity` copies is one placement with pieceId = id; `rotated` is relative to the piece as given.
 */
export function cuttingList(pieces: CutPiece[], sheet: Size, kerf: number): CuttingList {
  requirePositive("sheet.width", sheet.width);
  requirePositive("sheet.height", sheet.height);
  requireKerf(kerf);
  pieces.forEach((p, i) => {
    requirePositive(`pieces[${i}].width`, p.width);
    requirePositive(`pieces[${i}].height`, p.height);
    if (!Number.isInteger(p.quantity) || p.quantity < 1) {
      throw new RangeError(`pieces[${i}].quantity must be a whole number of at least 1; got ${String(p.quantity)}.`);
    }
  });

  const unplaced: { id: string; reason: string }[] = [];
  const units: Unit[] = [];
  for (const p of pieces) {
    const fits = (p.width <= sheet.width + EPS && p.height <= sheet.height + EPS) || (p.height <= sheet.width + EPS && p.width <= sheet.height + EPS);
    if (!fits) {
      unplaced.push({ id: p.id, reason: tooLargeReason(p, sheet) });
      continue;
    }
    for (let c = 0; c < p.quantity; c++) units.push({ id: p.id, order: units.length, w: p.width, h: p.height });
  }

  // Candidates, all deterministic; the one with the fewest sheets wins, the first on a tie.
  // The first rule always finishes; the single-size layouts, then the other rules, are tried while their work lasts.
  const [first = MAIN_RULE, ...others] = RULES;
  let chosen = guillotinePack(sortUnits(units, first.order), sheet, kerf, first.fit, first.split, { left: MAX_PACK_WORK }, true) ?? [];
  const consider = (packed: Packing | null) => {
    if (packed && packed.length < chosen.length) chosen = packed;
  };
  consider(sizeBySize(units, sheet, kerf, { left: MAX_PACK_WORK }));
  const work: Work = { left: MAX_PACK_WORK };
  for (const rule of others) {
    if (work.left <= 0) break;
    consider(guillotinePack(sortUnits(units, rule.order), sheet, kerf, rule.fit, rule.split, work, false));
  }

  // Small batches: the fewest sheets, exactly. Larger ones: the emptiest sheets repacked exactly.
  if (units.length <= EXACT_MAX_BLANKS) consider(exactPack(units, sheet, kerf));
  else if (chosen.length > 1) consider(repackEmptiest(chosen, units, sheet, kerf));

  const sheetArea = sheet.width * sheet.height;
  const sheets: CuttingSheet[] = chosen.map((placements, index) => ({
    index,
    placements,
    utilisation: placements.reduce((s, p) => s + p.width * p.height, 0) / sheetArea,
  }));
  const placedArea = units.reduce((s, u) => s + u.w * u.h, 0);
  return {
    sheets,
    sheetCount: sheets.length,
    utilisation: sheets.length === 0 ? 0 : placedArea / (sheets.length * sheetArea),
    unplaced,
  };
}

function tooLargeReason(p: CutPiece, sheet: Size): string {
  const name = p.label ? `"${p.label}" (${p.id})` : `"${p.id}"`;
  const size = (w: number, h: number) => `${formatMm(w, "nearest", 0.1)} × ${formatMm(h, "nearest", 0.1)} mm`;
  return `${name}, ${size(p.width, p.height)}, is larger than the ${size(sheet.width, sheet.height)} sheet whichever way round it is turned, so it cannot be cut from it.`;
}

const sameSize = (u: Unit, w: number, h: number) => (Math.abs(u.w - w) <= EPS && Math.abs(u.h - h) <= EPS) || (Math.abs(u.w - h) <= EPS && Math.abs(u.h - w) <= EPS);

/** A single-size layout's slots filled with these units (at most one per slot). */
function fillSlots(slots: Placement[], units: Unit[]): Placement[] {
  return units.map((u, k) => {
    // A layout lists min(perSheet, batch) slots and a sheet takes at most perSheet units, so every unit has one.
    const slot = item(slots, k);
    // The layout's flag is relative to its own blank; a copy entered the other way round flips it.
    const rotated = !(Math.abs(slot.width - u.w) <= EPS && Math.abs(slot.height - u.h) <= EPS);
    return { ...slot, pieceId: u.id, rotated };
  });
}

/**
 * The way a framer often cuts a batch: whole sheets of one size in that size's best single-sheet
 * layout (blanksPerSheet), then the leftovers either packed together or each size on its own part
 * sheet, whichever takes fewer sheets. For a batch of one size this is exactly ⌈n / perSheet⌉ sheets.
 */
function sizeBySize(units: Unit[], sheet: Size, kerf: number, work: Work): Packing | null {
  const groups: { w: number; h: number; units: Unit[] }[] = [];
  for (const u of units) {
    const g = groups.find((x) => sameSize(u, x.w, x.h));
    if (g) g.units.push(u);
    else groups.push({ w: u.w, h: u.h, units: [u] });
  }
  const full: Packing = [];
  const rest: Unit[] = [];
  const partial: Packing = [];
  const loose: Unit[] = [];
  for (const g of groups) {
    if (g.units.length < 2) {
      rest.push(...g.units);
      loose.push(...g.units);
      continue;
    }
    if (work.left <= 0) return null;
    const layout = blanksPerSheet({ width: g.w, height: g.h }, sheet, kerf, g.units.length);
    work.left -= layout.perSheet + groups.length;
    const n = layout.perSheet;
    const whole = Math.floor(g.units.length / n);
    for (let s = 0; s < whole; s++) full.push(fillSlots(layout.placements, g.units.slice(s * n, (s + 1) * n)));
    const left = g.units.slice(whole * n);
    if (left.length === 0) continue;
    rest.push(...left);
    partial.push(fillSlots(layout.placements, left));
  }
  const together = guillotinePack(sortUnits(rest, "area"), sheet, kerf, "area", "shorter-leftover", work, false);
  const alone = guillotinePack(sortUnits(loose, "area"), sheet, kerf, "area", "shorter-leftover", work, false);
  if (!together || !alone) return null;
  const apart = [...partial, ...alone];
  return [...full, ...(apart.length < together.length ? apart : together)];
}

/** A stable sort, largest first; copies of a piece keep their input order. */
function sortUnits(units: Unit[], order: Order): Unit[] {
  const key = (u: Unit): [number, number] =>
    order === "area" ? [u.w * u.h, Math.max(u.w, u.h)] : order === "long-side" ? [Math.max(u.w, u.h), Math.min(u.w, u.h)] : [u.w + u.h, u.w * u.h];
  return [...units].sort((p, q) => {
    const [p1, p2] = key(p);
    const [q1, q2] = key(q);
    return q1 - p1 || q2 - p2 || p.order - q.order;
  });
}

/**
 * Guillotine packing over free rectangles: each unit goes into the free rectangle (on any open
 * sheet, either way round) that fits it best; the rest of that rectangle is split in two by one
 * straight cut. A new sheet opens only when nothing fits. Spends from `work`; once it is spent,
 * gives up (null) unless `mustFinish`, in which case it looks only at the last few open sheets.
 */
function guillotinePack(units: Unit[], sheet: Size, kerf: number, fit: Fit, split: Split, work: Work, mustFinish: boolean): Packing | null {
  type Sheet = { free: Rect[]; placements: Placement[]; maxW: number; maxH: number; maxShort: number };
  const sheets: Sheet[] = [];
  /** Sheets that still have an offcut some unit to come could use, oldest first. */
  let open: Sheet[] = [];
  // The shortest side among the units still to place: an offcut narrower than that is dropped for good.
  const shortestLeft: number[] = new Array(units.length);
  for (let i = units.length - 1, m = Infinity; i >= 0; i--) {
    const u = item(units, i);
    m = Math.min(m, u.w + kerf, u.h + kerf);
    shortestLeft[i] = m;
  }
  const summarise = (s: Sheet, shortest: number): void => {
    s.free = s.free.filter((f) => Math.min(f.w, f.h) + EPS >= shortest);
    s.maxW = s.maxH = s.maxShort = 0;
    for (const f of s.free) {
      s.maxW = Math.max(s.maxW, f.w);
      s.maxH = Math.max(s.maxH, f.h);
      s.maxShort = Math.max(s.maxShort, Math.min(f.w, f.h));
    }
  };

  for (const [i, u] of units.entries()) {
    if (work.left <= 0 && !mustFinish) return null;
    const shortest = item(shortestLeft, i);
    if (i > 0 && shortest > item(shortestLeft, i - 1) + EPS) {
      for (const s of open) summarise(s, shortest);
      work.left -= open.length;
    }
    // Out of work: from here on only the newest few sheets are looked at; the older ones are closed.
    if (work.left <= 0 && open.length > OPEN_SHEET_WINDOW) open = open.slice(-OPEN_SHEET_WINDOW);
    open = open.filter((s) => s.maxShort + EPS >= shortest);
    const orientations = u.w === u.h ? [false] : [false, true];
    let bestScore: [number, number] | null = null;
    let at: { s: Sheet; r: number; rotated: boolean } | null = null;
    for (const s of open) {
      work.left -= 1;
      // Cheap test first: most sheets late in a batch have no offcut large enough.
      if (!orientations.some((rot) => (rot ? u.h : u.w) + kerf <= s.maxW + EPS && (rot ? u.w : u.h) + kerf <= s.maxH + EPS)) continue;
      work.left -= s.free.length;
      for (let r = 0; r < s.free.length; r++) {
        const f = s.free[r]!; // the loop bound (the hot loop)
        for (const rotated of orientations) {
          const w = (rotated ? u.h : u.w) + kerf;
          const h = (rotated ? u.w : u.h) + kerf;
          if (w > f.w + EPS || h > f.h + EPS) continue;
          const dw = f.w - w;
          const dh = f.h - h;
          const score: [number, number] = fit === "area" ? [f.w * f.h - w * h, Math.min(dw, dh)] : [Math.min(dw, dh), Math.max(dw, dh)];
          if (bestScore === null || score[0] < bestScore[0] - EPS || (Math.abs(score[0] - bestScore[0]) <= EPS && score[1] < bestScore[1] - EPS)) {
            bestScore = score;
            at = { s, r, rotated };
          }
        }
      }
    }
    if (at === null) {
      const s: Sheet = { free: [{ x: 0, y: 0, w: sheet.width + kerf, h: sheet.height + kerf }], placements: [], maxW: 0, maxH: 0, maxShort: 0 };
      sheets.push(s);
      open.push(s);
      const upright = u.w <= sheet.width + EPS && u.h <= sheet.height + EPS;
      at = { s, r: 0, rotated: !upright };
    }
    const target = at.s;
    const f = item(target.free, at.r);
    const w = (at.rotated ? u.h : u.w) + kerf;
    const h = (at.rotated ? u.w : u.h) + kerf;
    target.placements.push({ pieceId: u.id, x: f.x, y: f.y, width: at.rotated ? u.h : u.w, height: at.rotated ? u.w : u.h, rotated: at.rotated });
    target.free.splice(at.r, 1, ...splitFree(f, w, h, split));
    summarise(target, shortestLeft[i + 1] ?? Infinity); // none left to place: Infinity
    work.left -= target.free.length;
  }
  return sheets.map((s) => s.placements);
}

/** The two rectangles left when a w × h block is taken from the top-left of f, by one straight cut. */
function splitFree(f: Rect, w: number, h: number, split: Split): Rect[] {
  const dw = f.w - w;
  const dh = f.h - h;
  let horizontal: boolean; // true: the cut runs the full width of f below the block
  switch (split) {
    case "shorter-leftover":
      horizontal = dw <= dh;
      break;
    case "longer-leftover":
      horizontal = dw > dh;
      break;
    case "big-offcut": // the larger offcut also takes the corner, leaving one big rectangle
      horizontal = w * dh > dw * h;
      break;
    case "even-offcuts":
      horizontal = w * dh <= dw * h;
      break;
  }
  const right: Rect = { x: f.x + w, y: f.y, w: dw, h: horizontal ? h : f.h };
  const below: Rect = { x: f.x, y: f.y + h, w: horizontal ? f.w : w, h: dh };
  return [below, right].filter((r) => r.w > EPS && r.h > EPS);
}

/**
 * Improves a packing by repacking its emptiest sheets together exactly: the contents of the two,
 * three… least-filled sheets, while they are few enough blanks, are searched for a layout on fewer
 * sheets. Bounded by the exact search's own limits.
 */
function repackEmptiest(packing: Packing, units: Unit[], sheet: Size, kerf: number): Packing {
  let current = packing;
  const byId = new Map<string, Unit>();
  for (const u of units) byId.set(u.id, u);
  for (let round = 0; round < 8; round++) {
    const area = (ps: Placement[]) => ps.reduce((s, p) => s + p.width * p.height, 0);
    const order = current.map((ps, i) => ({ i, a: area(ps), n: ps.length })).sort((p, q) => p.a - q.a);
    let improved = false;
    for (let take = Math.min(order.length, 4); take >= 2 && !improved; take--) {
      const chosen = order.slice(0, take);
      const count = chosen.reduce((s, c) => s + c.n, 0);
      if (count > EXACT_MAX_BLANKS) continue;
      const group = chosen.flatMap((c) => item(current, c.i).map((p) => ({ id: p.pieceId, w: p.rotated ? p.height : p.width, h: p.rotated ? p.width : p.height })));
      const packed = exactPack(group, sheet, kerf);
      if (packed && packed.length < take) {
        const drop = new Set(chosen.map((c) => c.i));
        // Repacked placements are relative to the piece as given; recover `rotated` against the input's own sides.
        const fixed = packed.map((ps) =>
          ps.map((p) => {
            const u = byId.get(p.pieceId);
            const rotated = u ? !(Math.abs(p.width - u.w) <= EPS && Math.abs(p.height - u.h) <= EPS) : p.rotated;
            return { ...p, rotated };
          }),
        );
        current = [...current.filter((_, i) => !drop.has(i)), ...fixed];
        improved = true;
      }
    }
    if (!improved) break;
  }
  return current;
}
