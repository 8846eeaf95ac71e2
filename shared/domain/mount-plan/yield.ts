/**
 * Board yield and cutting list (docs/trade-reference.md §11): how many blanks a full board sheet gives, and how a
 * batch of blanks packs onto the fewest sheets, with guillotine (edge-to-edge) cuts and blade kerf.
 *
 * One idea carries both: a cut removes `kerf` mm and blanks need no kerf at the sheet's outer edge,
 * so if every blank is grown by `kerf` on its right and bottom and the sheet is grown by `kerf` too,
 * the kerf problem becomes the kerf-free one. n blanks of width w fit across W exactly when
 * n·(w + k) ≤ W + k, i.e. n·w + (n − 1)·k ≤ W. All the packing below works in that grown space;
 * a placement's x, y are the same in both spaces and its width and height are the real blank's.
 */
import { MM_PER_INCH, formatMm } from "../units.ts";

export type Size = { width: number; height: number };
export type Placement = { pieceId: string; x: number; y: number; width: number; height: number; rotated: boolean };
export type CutPiece = { id: string; label?: string; width: number; height: number; quantity: number };
export type CuttingSheet = { index: number; placements: Placement[]; utilisation: number };
/** `utilisation`: area of the pieces cut / (sheetCount × sheet area); unplaced pieces do not count. 0 when no sheet is used. */
export type CuttingList = { sheets: CuttingSheet[]; sheetCount: number; utilisation: number; unplaced: { id: string; reason: string }[] };

/** Float noise allowance on lengths in mm (values here are at most a few thousand mm). */
const EPS = 1e-9;

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

/** Standard full board sheets (docs/trade-reference.md §11). */
export const STANDARD_BOARD_SHEETS: { id: string; label: string; width: number; height: number }[] = [
  // 32 × 40 in and 40 × 60 in: suppliers' sizes; 1 in = 25.4 mm exactly (1959 agreement; NIST HB 44 App. C).
  { id: "32x40in", label: "32 × 40 in", width: 32 * MM_PER_INCH, height: 40 * MM_PER_INCH },
  { id: "40x60in", label: "40 × 60 in", width: 40 * MM_PER_INCH, height: 60 * MM_PER_INCH },
  // 1120 × 815 mm: common practice (no source).
  { id: "1120x815mm", label: "1120 × 815 mm", width: 1120, height: 815 },
];

function requirePositive(name: string, value: number): void {
  if (typeof value !== "number" || !Number.isFinite(value) || value <= 0) {
    throw new RangeError(`${name} must be a positive length in mm; got ${String(value)}.`);
  }
}

function requireKerf(kerf: number): void {
  if (typeof kerf !== "number" || !Number.isFinite(kerf) || kerf < 0) {
    throw new RangeError(`kerf must be zero or a positive length in mm; got ${String(kerf)}.`);
  }
}

/** How many of `item` fit along `length`, both already grown by the kerf. */
function fitCount(length: number, item: number): number {
  return Math.floor((length + EPS) / item);
}

// ── blanksPerSheet ──────────────────────────────────────────────────────────

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
  const patterns = normalPatterns(square ? [bw] : [bw, bh], limit) ?? wholeRowsAndColumns(bw, bh, limit) ?? gridsOnly(bw, bh, sw, sh);
  /** The largest pattern ≤ length, as an index into `patterns`. */
  const floorIndex = (length: number): number => {
    let lo = 0;
    let hi = patterns.length - 1;
    while (lo < hi) {
      const mid = (lo + hi + 1) >> 1;
      if (patterns[mid] <= length + EPS) lo = mid;
      else hi = mid - 1;
    }
    return lo;
  };
  const cellArea = bw * bh;
  const bound = (a: number, b: number) => Math.floor((patterns[a] * patterns[b]) / cellArea + EPS);
  const grid = (a: number, b: number, rotated: boolean): number =>
    rotated ? fitCount(patterns[a], bh) * fitCount(patterns[b], bw) : fitCount(patterns[a], bw) * fitCount(patterns[b], bh);

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
    const known = best[key];
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
        const half = patterns[along] / 2 + EPS;
        const top = floorIndex(half);
        let q = floorIndex(patterns[along] - patterns[top]); // grows as p shrinks
        for (let p = top; p >= 1; p--) {
          if (++cutsTried > MAX_CUTS_TRIED) break cuts;
          while (q + 1 < patterns.length && patterns[q + 1] <= patterns[along] - patterns[p] + EPS) q++;
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
    const pick = choice[a * rows + b];
    if (pick < 2) {
      const rotated = pick === 1;
      const cw = rotated ? bh : bw;
      const ch = rotated ? bw : bh;
      const across = fitCount(patterns[a], cw);
      const down = fitCount(patterns[b], ch);
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
      place(x + patterns[at], y, floorIndex(patterns[a] - patterns[at]), b);
    } else {
      place(x, y, a, at);
      place(x, y + patterns[at], a, floorIndex(patterns[b] - patterns[at]));
    }
  };
  place(0, 0, a0, b0);
  placements.sort((p, q) => p.y - q.y || p.x - q.x);

  return { perSheet, placements, utilisation: (perSheet * blank.width * blank.height) / (sheet.width * sheet.height) };
}

/** All sums i·s₀ + j·s₁ ≤ limit (0 included), sorted, with float twins merged; null when there are too many. */
function normalPatterns(sides: number[], limit: number): number[] | null {
  const values: number[] = [];
  const [s0, s1] = sides;
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
  for (const v of values) if (out.length === 0 || v - out[out.length - 1] > EPS) out.push(v);
  return out;
}

// ── cuttingList ─────────────────────────────────────────────────────────────

type Rect = { x: number; y: number; w: number; h: number };
type Unit = { id: string; order: number; w: number; h: number };
type Fit = "area" | "short-side";
type Split = "shorter-leftover" | "longer-leftover" | "big-offcut" | "even-offcuts";
type Order = "area" | "long-side" | "perimeter";
/** Sheets, each its placements. */
type Packing = Placement[][];
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

const RULES: { order: Order; fit: Fit; split: Split }[] = (["area", "long-side", "perimeter"] as Order[]).flatMap((order) =>
  (["area", "short-side"] as Fit[]).flatMap((fit) =>
    (["shorter-leftover", "longer-leftover", "big-offcut", "even-offcuts"] as Split[]).map((split) => ({ order, fit, split })),
  ),
);

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
  const [first, ...others] = RULES;
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
    const slot = slots[k];
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
  for (let i = units.length - 1, m = Infinity; i >= 0; i--) shortestLeft[i] = m = Math.min(m, units[i].w + kerf, units[i].h + kerf);
  const summarise = (s: Sheet, shortest: number): void => {
    s.free = s.free.filter((f) => Math.min(f.w, f.h) + EPS >= shortest);
    s.maxW = s.maxH = s.maxShort = 0;
    for (const f of s.free) {
      s.maxW = Math.max(s.maxW, f.w);
      s.maxH = Math.max(s.maxH, f.h);
      s.maxShort = Math.max(s.maxShort, Math.min(f.w, f.h));
    }
  };

  for (let i = 0; i < units.length; i++) {
    const u = units[i];
    if (work.left <= 0 && !mustFinish) return null;
    if (i > 0 && shortestLeft[i] > shortestLeft[i - 1] + EPS) {
      for (const s of open) summarise(s, shortestLeft[i]);
      work.left -= open.length;
    }
    // Out of work: from here on only the newest few sheets are looked at; the older ones are closed.
    if (work.left <= 0 && open.length > OPEN_SHEET_WINDOW) open = open.slice(-OPEN_SHEET_WINDOW);
    open = open.filter((s) => s.maxShort + EPS >= shortestLeft[i]);
    const orientations = u.w === u.h ? [false] : [false, true];
    let bestScore: [number, number] | null = null;
    let at: { s: Sheet; r: number; rotated: boolean } | null = null;
    for (let o = 0; o < open.length; o++) {
      const s = open[o];
      work.left -= 1;
      // Cheap test first: most sheets late in a batch have no offcut large enough.
      if (!orientations.some((rot) => (rot ? u.h : u.w) + kerf <= s.maxW + EPS && (rot ? u.w : u.h) + kerf <= s.maxH + EPS)) continue;
      work.left -= s.free.length;
      for (let r = 0; r < s.free.length; r++) {
        const f = s.free[r];
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
    const f = target.free[at.r];
    const w = (at.rotated ? u.h : u.w) + kerf;
    const h = (at.rotated ? u.w : u.h) + kerf;
    target.placements.push({ pieceId: u.id, x: f.x, y: f.y, width: at.rotated ? u.h : u.w, height: at.rotated ? u.w : u.h, rotated: at.rotated });
    target.free.splice(at.r, 1, ...splitFree(f, w, h, split));
    summarise(target, i + 1 < units.length ? shortestLeft[i + 1] : Infinity);
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

// ── Fewest sheets: an exact search for small groups ─────────────────────────

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
    for (let i = list.length - 1; i >= 0; i--) if (node.w <= list[i].w + EPS && node.h <= list[i].h + EPS) list.splice(i, 1);
    list.push(node);
  };
  // Masks by number of blanks, so both parts of a split are known before the whole.
  const order = Array.from({ length: full }, (_, i) => i + 1).sort((a, b) => popcount(a) - popcount(b) || a - b);
  for (const mask of order) {
    const list: BoxNode[] = [];
    if ((mask & (mask - 1)) === 0) {
      const i = 31 - Math.clz32(mask);
      const u = units[i];
      add(list, { w: u.w + kerf, h: u.h + kerf, kind: 0, a: i, ai: 0, b: 0, bi: 0, rotated: false });
      if (Math.abs(u.w - u.h) > EPS) add(list, { w: u.h + kerf, h: u.w + kerf, kind: 0, a: i, ai: 0, b: 0, bi: 0, rotated: true });
    } else {
      const low = mask & -mask;
      // Each split once: the part A holds the lowest blank.
      for (let a = (mask - 1) & mask; a > 0; a = (a - 1) & mask) {
        if ((a & low) === 0) continue;
        const b = mask ^ a;
        const la = boxes[a];
        const lb = boxes[b];
        if (!la.length || !lb.length) continue;
        work += la.length * lb.length;
        if (work > MAX_EXACT_WORK) return null;
        for (let ai = 0; ai < la.length; ai++) {
          for (let bi = 0; bi < lb.length; bi++) {
            const p = la[ai];
            const q = lb[bi];
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
    if (best[mask] >= 0) return best[mask];
    const low = mask & -mask;
    let value = Infinity;
    let chosen = 0;
    for (let s = mask; s > 0; s = (s - 1) & mask) {
      if ((s & low) === 0 || boxes[s].length === 0) continue;
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
    const node = boxes[mask][idx];
    if (node.kind === 0) {
      const u = units[node.a];
      out.push({ pieceId: u.id, x, y, width: node.rotated ? u.h : u.w, height: node.rotated ? u.w : u.h, rotated: node.rotated });
      return;
    }
    const first = boxes[node.a][node.ai];
    lay(node.a, node.ai, x, y, out);
    if (node.kind === 1) lay(node.b, node.bi, x + first.w, y, out);
    else lay(node.b, node.bi, x, y + first.h, out);
  };
  for (let mask = full; mask; ) {
    const s = pick[mask];
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
      const group = chosen.flatMap((c) => current[c.i].map((p) => ({ id: p.pieceId, w: p.rotated ? p.height : p.width, h: p.rotated ? p.width : p.height })));
      const packed = exactPack(group, sheet, kerf);
      if (packed && packed.length < take) {
        const drop = new Set(chosen.map((c) => c.i));
        // Repacked placements are relative to the piece as given; recover `rotated` against the input's own sides.
        const fixed = packed.map((ps) => ps.map((p) => {
          const u = byId.get(p.pieceId);
          const rotated = u ? !(Math.abs(p.width - u.w) <= EPS && Math.abs(p.height - u.h) <= EPS) : p.rotated;
          return { ...p, rotated };
        }));
        current = [...current.filter((_, i) => !drop.has(i)), ...fixed];
        improved = true;
      }
    }
    if (!improved) break;
  }
  return current;
}
