import { describe, expect, it } from "vitest";
import fc from "fast-check";
import { MAX_PLACEMENTS, STANDARD_BOARD_SHEETS, blanksPerSheet, cuttingList, type CutPiece, type Placement, type Size } from "../../../shared/domain/mount-plan/yield.ts";
import { at, first } from "../../setup/lists.ts";

// 1 in = 25.4 mm exactly (1959 agreement; NIST Handbook 44, Appendix C).
const IN = 25.4;
// Full sheets: 32 × 40 in and 40 × 60 in (suppliers' sizes); 1120 × 815 mm (common practice (no source)).
const SHEET_32x40: Size = { width: 32 * IN, height: 40 * IN }; // 812.8 × 1016 mm
const SHEET_40x60: Size = { width: 40 * IN, height: 60 * IN }; // 1016 × 1524 mm
const SHEET_1120x815: Size = { width: 1120, height: 815 };
// 16 × 20 in: a ready-made frame size (docs/trade.md §8); 8 × 10 in: CCI Notes 11/5.
const BLANK_16x20: Size = { width: 16 * IN, height: 20 * IN }; // 406.4 × 508 mm
const BLANK_8x10: Size = { width: 8 * IN, height: 10 * IN }; // 203.2 × 254 mm
// A4 210 × 297 mm: ISO 216.
const A4: Size = { width: 210, height: 297 };

const EPS = 1e-6;

/** The most blanks of width `item` that fit along `length` with `kerf` between neighbours: n·item + (n − 1)·kerf ≤ length. */
function across(length: number, item: number, kerf: number): number {
  return Math.max(0, Math.floor((length + kerf + 1e-9) / (item + kerf)));
}

/** The best plain grid, upright or turned. */
function bestGrid(blank: Size, sheet: Size, kerf: number): number {
  return Math.max(
    across(sheet.width, blank.width, kerf) * across(sheet.height, blank.height, kerf),
    across(sheet.width, blank.height, kerf) * across(sheet.height, blank.width, kerf),
  );
}

/** Every placement lies on the sheet, and any two are apart by at least the kerf along x or along y. */
function expectValidLayout(placements: Placement[], sheet: Size, kerf: number): void {
  for (const p of placements) {
    if (p.x < -EPS || p.y < -EPS || p.x + p.width > sheet.width + EPS || p.y + p.height > sheet.height + EPS) {
      throw new Error(`placement off the ${sheet.width} × ${sheet.height} sheet: ${JSON.stringify(p)}`);
    }
  }
  // Sweep left to right: only placements starting before a's right edge plus the kerf can be too close to it.
  const byX = [...placements].sort((p, q) => p.x - q.x);
  for (let i = 0; i < byX.length; i++) {
    const a = at(byX, i);
    for (let j = i + 1; j < byX.length && at(byX, j).x < a.x + a.width + kerf - EPS; j++) {
      const b = at(byX, j);
      const apart = a.y + a.height + kerf <= b.y + EPS || b.y + b.height + kerf <= a.y + EPS;
      if (!apart) throw new Error(`placements overlap or sit closer than the ${kerf} mm kerf: ${JSON.stringify([a, b])}`);
    }
  }
}

/** Each placement is the blank, upright or turned as its flag says. */
function expectBlankShape(placements: Placement[], blank: Size): void {
  for (const p of placements) {
    const [w, h] = p.rotated ? [blank.height, blank.width] : [blank.width, blank.height];
    expect(p.width).toBeCloseTo(w, 9);
    expect(p.height).toBeCloseTo(h, 9);
  }
}

/**
 * An independent, unpruned guillotine search over whole millimetres: every cut position is tried,
 * a cut removes the kerf, and a layout in a smaller rectangle counts for a larger one. Slow, so
 * for small integer sizes only; with whole-mm blanks and kerf, whole-mm cuts lose nothing.
 */
function referenceGuillotine(blank: Size, sheet: Size, kerf: number): number {
  const memo = new Map<number, number>();
  const f = (W: number, H: number): number => {
    if (W <= 0 || H <= 0) return 0;
    const key = W * 10_000 + H;
    const known = memo.get(key);
    if (known !== undefined) return known;
    let v = Math.max(bestGrid(blank, { width: W, height: H }, kerf), f(W - 1, H), f(W, H - 1));
    // Cutting at x or at W − x − kerf gives the same two parts.
    for (let x = 1; x <= W - x - kerf; x++) v = Math.max(v, f(x, H) + f(W - x - kerf, H));
    for (let y = 1; y <= H - y - kerf; y++) v = Math.max(v, f(W, y) + f(W, H - y - kerf));
    memo.set(key, v);
    return v;
  };
  return f(sheet.width, sheet.height);
}

// Lengths as a framer types them: tenths of a millimetre, or sixteenths of an inch.
const mmLength = (min: number, max: number) =>
  fc.oneof(
    fc.integer({ min: Math.ceil(min * 10), max: Math.floor(max * 10) }).map((t) => t / 10),
    fc.integer({ min: Math.ceil((min / IN) * 16), max: Math.floor((max / IN) * 16) }).map((s) => (s / 16) * IN),
  );
const blankArb = fc.record({ width: mmLength(50, 900), height: mmLength(50, 900) });
const sheetArb = fc.oneof(
  fc.constantFrom(...STANDARD_BOARD_SHEETS.map((s) => ({ width: s.width, height: s.height }))),
  fc.record({ width: mmLength(300, 1524), height: mmLength(300, 1524) }),
);
const kerfArb = fc.oneof(fc.constantFrom(0, 1, 3), mmLength(0, 5));

describe("STANDARD_BOARD_SHEETS", () => {
  it("when listed, then they are 32 × 40 in and 40 × 60 in at 25.4 mm/in exactly, and 1120 × 815 mm", () => {
    // 32 × 40 in and 40 × 60 in: suppliers' sizes (docs/trade.md §11); 1 in = 25.4 mm (NIST HB 44 App. C).
    // 1120 × 815 mm: common practice (no source).
    const sizes = STANDARD_BOARD_SHEETS.map((s) => [s.width, s.height]);
    expect(sizes).toHaveLength(3);
    expect(first(sizes)[0]).toBeCloseTo(812.8, 9);
    expect(first(sizes)[1]).toBeCloseTo(1016, 9);
    expect(at(sizes, 1)[0]).toBeCloseTo(1016, 9);
    expect(at(sizes, 1)[1]).toBeCloseTo(1524, 9);
    expect(sizes[2]).toEqual([1120, 815]);
    expect(new Set(STANDARD_BOARD_SHEETS.map((s) => s.id)).size).toBe(3);
    for (const s of STANDARD_BOARD_SHEETS) expect(s.label).not.toBe("");
  });
});

describe("blanksPerSheet: check values", () => {
  it("when a 16 × 20 in blank is cut from a 32 × 40 in sheet with no kerf, then the sheet gives 4 and nothing is wasted", () => {
    // Upright: 812.8 / 406.4 = 2 across, 1016 / 508 = 2 down → 4. Turned: 1 × 2 = 2.
    // Area bound: (812.8 × 1016) / (406.4 × 508) = 4 exactly, so 4 is the most and utilisation is 1.
    const r = blanksPerSheet(BLANK_16x20, SHEET_32x40, 0);
    expect(r.perSheet).toBe(4);
    expect(r.utilisation).toBeCloseTo(1, 9);
    expect(r.placements).toHaveLength(4);
    expectValidLayout(r.placements, SHEET_32x40, 0);
    expectBlankShape(r.placements, BLANK_16x20);
  });

  it("when the same cut has a 3 mm kerf, then the sheet gives only 2, both turned and stacked", () => {
    // Upright: 2 across need 2 × 406.4 + 3 = 815.8 > 812.8, so 1; 2 down need 2 × 508 + 3 = 1019 > 1016, so 1 → 1.
    // Turned (508 wide, 406.4 tall): 1 across (2 would be 1019); 2 down (2 × 406.4 + 3 = 815.8 ≤ 1016; 3 would be 1225.2) → 2.
    // No layout does better: the narrower side is 406.4 and two side by side need 815.8 > 812.8, so every
    // horizontal line meets at most one blank; stacked, each takes ≥ 406.4 of the 1016 height, and a third
    // would need 3 × 406.4 + 2 × 3 = 1225.2. Utilisation 2 × 406.4 × 508 / (812.8 × 1016) = 0.5.
    const r = blanksPerSheet(BLANK_16x20, SHEET_32x40, 3);
    expect(r.perSheet).toBe(2);
    expect(r.utilisation).toBeCloseTo(0.5, 9);
    expect(r.placements.every((p) => p.rotated)).toBe(true);
    expectValidLayout(r.placements, SHEET_32x40, 3);
    expectBlankShape(r.placements, BLANK_16x20);
  });

  it("when an A4 blank is cut from a 1120 × 815 mm sheet with no kerf, then the sheet gives 13 in a mixed layout", () => {
    // A4 210 × 297 (ISO 216). Grids: upright 5 across (1050) × 2 down (594) = 10; turned 3 (891) × 3 (630) = 9.
    // Mixed: two upright rows (2 × 297 = 594 tall, 5 each) and one turned row below (210 tall, 3 across):
    // 594 + 210 = 804 ≤ 815, so 10 + 3 = 13.
    // 14 is impossible for any layout, guillotine or not. Let u be upright, t turned blanks. A vertical line
    // meets a upright and b turned with 297a + 210b ≤ 815, so a ≤ 2 and a + b ≤ 3; summing over the 1120 mm
    // width: 210u + 297t ≤ 3 × 1120 = 3360 and 210u ≤ 2 × 1120, so u ≤ 10. A horizontal line meets c upright
    // and d turned with 210c + 297d ≤ 1120, whose whole solutions (5,0) (3,1) (2,2) (1,3) (0,3) all satisfy
    // 3c + 4d ≤ 15; summing over the 815 mm height: 891u + 840t ≤ 12225. With u + t = 14 the first needs
    // 4158 − 87u ≤ 3360, so u ≥ 10, hence u = 10, t = 4; then 8910 + 3360 = 12270 > 12225. So 13 is the most.
    const r = blanksPerSheet(A4, SHEET_1120x815, 0);
    expect(bestGrid(A4, SHEET_1120x815, 0)).toBe(10);
    expect(r.perSheet).toBe(13);
    expect(r.placements.some((p) => p.rotated)).toBe(true);
    expect(r.placements.some((p) => !p.rotated)).toBe(true);
    expect(r.utilisation).toBeCloseTo((13 * 210 * 297) / (1120 * 815), 12);
    expectValidLayout(r.placements, SHEET_1120x815, 0);
    expectBlankShape(r.placements, A4);
  });

  it("when a 16 × 20 in blank is cut from a 40 × 60 in sheet with a 3 mm kerf, then a mixed layout gives 5 where grids give 4", () => {
    // Upright: 2 across (2 × 406.4 + 3 = 815.8 ≤ 1016), 2 down (3 × 508 + 6 = 1530 > 1524) → 4.
    // Turned: 1 across (2 × 508 + 3 = 1019 > 1016), 3 down (3 × 406.4 + 6 = 1225.2 ≤ 1524) → 3.
    // Mixed: the 2 × 2 upright block is 1019 tall; after a 3 mm cut, 1524 − 1022 = 502 mm is left,
    // which holds one turned blank (406.4 tall, 508 wide; two would need 1019 across) → 5.
    // 6 is out with guillotine cuts. A first cut down the sheet leaves one part ≤ 506.5 wide (upright only,
    // ≤ 2 stacked) and one ≤ 606.6 wide (one column, ≤ 3 stacked) → ≤ 5. A first cut across leaves a smaller
    // part < 815.8 tall: one row, ≤ 2 blanks. If it holds 1, the other part (≤ 1114.6 tall) holds ≤ 4: with each
    // blank and the sheet grown by the kerf, any line across or down meets ≤ 2 blanks, so summing over both
    // directions 920.4 × n ≤ 2 × 1117.6 + 2 × 1019, n ≤ 4. If it holds 2, one of them is upright (two turned
    // need 1019 across), so the other part is ≤ 1013 tall, and any first cut in it leaves pieces holding ≤ 1
    // and ≤ 2 → ≤ 3. Either way ≤ 5.
    const r = blanksPerSheet(BLANK_16x20, SHEET_40x60, 3);
    expect(bestGrid(BLANK_16x20, SHEET_40x60, 3)).toBe(4);
    expect(r.perSheet).toBe(5);
    expectValidLayout(r.placements, SHEET_40x60, 3);
    expectBlankShape(r.placements, BLANK_16x20);
  });

  it("when 8 × 10 in blanks are cut from a 32 × 40 in sheet with no kerf, then the sheet gives 16", () => {
    // 8 × 10 in (CCI Notes 11/5): 812.8 / 203.2 = 4 across, 1016 / 254 = 4 down → 16 = the area bound exactly.
    const r = blanksPerSheet(BLANK_8x10, SHEET_32x40, 0);
    expect(r.perSheet).toBe(16);
    expect(r.utilisation).toBeCloseTo(1, 9);
    expectValidLayout(r.placements, SHEET_32x40, 0);
  });

  it("when a 16 × 20 in blank is cut from a 1120 × 815 mm sheet, then the kerf takes it from 4 to 2", () => {
    // No kerf: turned (508 wide, 406.4 tall) 2 across (1016 ≤ 1120) × 2 down (812.8 ≤ 815) → 4.
    // 3 mm kerf: two turned stacked need 2 × 406.4 + 3 = 815.8 > 815, so no two blanks can share a vertical
    // line; side by side, three need ≥ 3 × 406.4 + 2 × 3 = 1225.2 > 1120 → 2 at most, and 2 upright fit (815.8 ≤ 1120).
    expect(blanksPerSheet(BLANK_16x20, SHEET_1120x815, 0).perSheet).toBe(4);
    const r = blanksPerSheet(BLANK_16x20, SHEET_1120x815, 3);
    expect(r.perSheet).toBe(2);
    expectValidLayout(r.placements, SHEET_1120x815, 3);
  });

  it("when the blank is larger than the sheet either way round, then the sheet gives 0", () => {
    // 900 × 1200 on 812.8 × 1016: 900 > 812.8 upright; turned, 1200 > 812.8.
    const r = blanksPerSheet({ width: 900, height: 1200 }, SHEET_32x40, 0);
    expect(r).toEqual({ perSheet: 0, placements: [], utilisation: 0 });
  });

  it("when the blank fits only turned, then the sheet gives 1 turned blank", () => {
    // 1000 × 500 on 812.8 × 1016: upright 1000 > 812.8; turned 500 wide × 1000 tall fits once.
    const r = blanksPerSheet({ width: 1000, height: 500 }, SHEET_32x40, 0);
    expect(r.perSheet).toBe(1);
    expect(r.placements).toEqual([{ pieceId: "blank", x: 0, y: 0, width: 500, height: 1000, rotated: true }]);
  });

  it("when a blank exactly fills the sheet, then it gives 1, touching all four edges", () => {
    const r = blanksPerSheet(SHEET_32x40, SHEET_32x40, 3);
    expect(r.perSheet).toBe(1);
    expect(r.utilisation).toBeCloseTo(1, 9);
  });

  it("when the same blank is asked for twice, then the layout is the same", () => {
    expect(blanksPerSheet(A4, SHEET_40x60, 2)).toEqual(blanksPerSheet(A4, SHEET_40x60, 2));
  });
});

describe("blanksPerSheet: wrong arguments", () => {
  it("when a size is zero, negative or not a number, or the kerf is negative, then a RangeError names the argument", () => {
    expect(() => blanksPerSheet({ width: 0, height: 10 }, SHEET_32x40, 0)).toThrow(/blank\.width/);
    expect(() => blanksPerSheet({ width: 10, height: -1 }, SHEET_32x40, 0)).toThrow(/blank\.height/);
    expect(() => blanksPerSheet(A4, { width: Number.NaN, height: 10 }, 0)).toThrow(/sheet\.width/);
    expect(() => blanksPerSheet(A4, { width: 10, height: Number.POSITIVE_INFINITY }, 0)).toThrow(/sheet\.height/);
    expect(() => blanksPerSheet(A4, SHEET_32x40, -0.5)).toThrow(/kerf/);
    expect(() => blanksPerSheet(A4, SHEET_32x40, -0.5)).toThrow(RangeError);
  });
});

describe("blanksPerSheet: properties", () => {
  it("when any blank is cut, then it never gives more than the sheet area over the blank area", () => {
    fc.assert(
      fc.property(blankArb, sheetArb, kerfArb, (blank, sheet, kerf) => {
        const r = blanksPerSheet(blank, sheet, kerf);
        expect(r.perSheet).toBeLessThanOrEqual(Math.floor((sheet.width * sheet.height) / (blank.width * blank.height) + 1e-9));
      }),
    );
  });

  it("when any blank is cut, then it gives at least the best plain grid of either orientation", () => {
    fc.assert(
      fc.property(blankArb, sheetArb, kerfArb, (blank, sheet, kerf) => {
        expect(blanksPerSheet(blank, sheet, kerf).perSheet).toBeGreaterThanOrEqual(bestGrid(blank, sheet, kerf));
      }),
    );
  });

  it("when any blank is cut, then its placements are the blank, inside the sheet, kerf apart, one per blank counted", () => {
    fc.assert(
      fc.property(blankArb, sheetArb, kerfArb, (blank, sheet, kerf) => {
        const r = blanksPerSheet(blank, sheet, kerf);
        expect(r.placements).toHaveLength(r.perSheet);
        expectValidLayout(r.placements, sheet, kerf);
        expectBlankShape(r.placements, blank);
        expect(r.utilisation).toBeCloseTo((r.perSheet * blank.width * blank.height) / (sheet.width * sheet.height), 12);
        expect(r.utilisation).toBeLessThanOrEqual(1 + 1e-9);
      }),
    );
  });

  it("when sizes are small whole millimetres, then it finds as many as an unpruned search over every cut", () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 2, max: 9 }),
        fc.integer({ min: 2, max: 9 }),
        fc.integer({ min: 4, max: 28 }),
        fc.integer({ min: 4, max: 28 }),
        fc.integer({ min: 0, max: 2 }),
        (w, h, W, H, kerf) => {
          const blank = { width: w, height: h };
          const sheet = { width: W, height: H };
          expect(blanksPerSheet(blank, sheet, kerf).perSheet).toBe(referenceGuillotine(blank, sheet, kerf));
        },
      ),
      { numRuns: 200 },
    );
  });

  it("when a whole-mm analogue of the 40 × 60 in case is cut, then the unpruned search agrees on 5", () => {
    // 16 × 20 in on 40 × 60 in with 3 mm kerf at about 1/4 scale: blank 102 × 127, sheet 254 × 381, kerf 1. The
    // same fits hold: 2 upright across (2 × 102 + 1 = 205 ≤ 254), not 2 turned (255 > 254), not 3 upright down
    // (3 × 127 + 2 = 383 > 381), and a turned blank below the 2 × 2 block (381 − 256 = 125 ≥ 102).
    const blank = { width: 102, height: 127 };
    const sheet = { width: 254, height: 381 };
    expect(referenceGuillotine(blank, sheet, 1)).toBe(5);
    expect(blanksPerSheet(blank, sheet, 1).perSheet).toBe(5);
  });

  it("when blanks are tiny beside the sheet, then the bounded search still gives a real layout at least as good as the best grid", () => {
    // Too many cut positions for the full search: 1 × 1.5 mm cuts on whole rows and columns only;
    // 0.3 × 0.4 mm tries the grids alone. Not trade sizes; they only exercise the fallbacks.
    const small = { width: 1, height: 1.5 };
    const r = blanksPerSheet(small, { width: 200, height: 200 }, 0.2);
    expect(r.perSheet).toBeGreaterThanOrEqual(bestGrid(small, { width: 200, height: 200 }, 0.2));
    // The count is exact; placements are listed for at most MAX_PLACEMENTS blanks, so memory stays bounded.
    expect(r.placements).toHaveLength(Math.min(r.perSheet, MAX_PLACEMENTS));
    expectValidLayout(r.placements, { width: 200, height: 200 }, 0.2);
    const tiny = { width: 0.3, height: 0.4 };
    const t = blanksPerSheet(tiny, { width: 200, height: 200 }, 0);
    expect(t.perSheet).toBe(bestGrid(tiny, { width: 200, height: 200 }, 0));
    expect(t.placements).toHaveLength(Math.min(t.perSheet, MAX_PLACEMENTS));
    // Asked for no placements (the planner only counts), none are built.
    expect(blanksPerSheet(tiny, { width: 3000, height: 3000 }, 0, 0).placements).toHaveLength(0);
  });

  it("when 30 typical blanks are sized against sheets up to 1524 × 1016 mm, then each returns a layout", () => {
    // No timing assertion: the search is bounded by a count of cuts tried, so it always finishes.
    const samples = fc.sample(
      fc.tuple(fc.record({ width: mmLength(50, 1016), height: mmLength(50, 1016) }), fc.record({ width: mmLength(500, 1524), height: mmLength(500, 1016) }), kerfArb),
      { numRuns: 30, seed: 20240 },
    );
    expect(samples).toHaveLength(30);
    for (const [blank, sheet, kerf] of samples) {
      const r = blanksPerSheet(blank, sheet, kerf);
      expect(r.placements).toHaveLength(r.perSheet);
    }
  });
});

describe("cuttingList: check values", () => {
  it("when eight 16 × 20 in blanks are cut from 32 × 40 in sheets with no kerf, then they take 2 full sheets", () => {
    // 4 a sheet (see blanksPerSheet above), so 8 take 2 sheets at utilisation 1.
    const list = cuttingList([{ id: "m1", label: "16 × 20 in mount", width: BLANK_16x20.width, height: BLANK_16x20.height, quantity: 8 }], SHEET_32x40, 0);
    expect(list.sheetCount).toBe(2);
    expect(list.utilisation).toBeCloseTo(1, 9);
    expect(list.unplaced).toEqual([]);
    expect(list.sheets.map((s) => s.placements.length)).toEqual([4, 4]);
    expect(list.sheets.map((s) => s.index)).toEqual([0, 1]);
  });

  it("when A4 blanks are batched on 1120 × 815 mm sheets, then the list uses the 13-a-sheet layout", () => {
    // 13 a sheet (the A4 check above): 26 fill 2 sheets, 27 need a third.
    const a4 = (quantity: number): CutPiece[] => [{ id: "a4", width: 210, height: 297, quantity }];
    expect(cuttingList(a4(26), SHEET_1120x815, 0).sheetCount).toBe(2);
    expect(cuttingList(a4(27), SHEET_1120x815, 0).sheetCount).toBe(3);
  });

  it("when the same size is entered both ways round, then it is cut as one size and each flag is relative to its own entry", () => {
    // 13 portrait + 13 landscape A4 are 26 of one blank: 2 sheets at 13 a sheet (the A4 check above).
    const portrait: CutPiece = { id: "portrait", width: 210, height: 297, quantity: 13 };
    const landscape: CutPiece = { id: "landscape", width: 297, height: 210, quantity: 13 };
    const list = cuttingList([portrait, landscape], SHEET_1120x815, 0);
    expect(list.sheetCount).toBe(2);
    const all = list.sheets.flatMap((s) => s.placements);
    expectBlankShape(
      all.filter((p) => p.pieceId === "portrait"),
      portrait,
    );
    expectBlankShape(
      all.filter((p) => p.pieceId === "landscape"),
      landscape,
    );
  });

  it("when two 16 × 20 in and four 8 × 10 in blanks are batched on one 32 × 40 in sheet, then one sheet at 75 % holds them", () => {
    // Areas: 2 × (406.4 × 508) = half the sheet, 4 × (203.2 × 254) = a quarter → 0.75 of one 812.8 × 1016 sheet.
    const list = cuttingList(
      [
        { id: "small", width: BLANK_8x10.width, height: BLANK_8x10.height, quantity: 4 },
        { id: "large", width: BLANK_16x20.width, height: BLANK_16x20.height, quantity: 2 },
      ],
      SHEET_32x40,
      0,
    );
    expect(list.sheetCount).toBe(1);
    expect(list.utilisation).toBeCloseTo(0.75, 9);
    expect(first(list.sheets).utilisation).toBeCloseTo(0.75, 9);
    expectValidLayout(first(list.sheets).placements, SHEET_32x40, 0);
  });

  it("when a piece is larger than the sheet either way round, then it is unplaced with a sentence naming it and the sheet, and the rest are cut", () => {
    const list = cuttingList(
      [
        { id: "big", label: "Atlas plate", width: 900, height: 1200, quantity: 2 },
        { id: "ok", width: 300, height: 400, quantity: 1 },
      ],
      SHEET_32x40,
      2,
    );
    expect(list.unplaced).toHaveLength(1);
    expect(first(list.unplaced).id).toBe("big");
    expect(first(list.unplaced).reason).toContain("Atlas plate");
    expect(first(list.unplaced).reason).toContain("900 × 1200 mm");
    expect(first(list.unplaced).reason).toContain("812.8 × 1016 mm");
    expect(list.sheetCount).toBe(1);
    expect(first(list.sheets).placements.map((p) => p.pieceId)).toEqual(["ok"]);
  });

  it("when there are no pieces, then there are no sheets and utilisation is 0", () => {
    expect(cuttingList([], SHEET_32x40, 1)).toEqual({ sheets: [], sheetCount: 0, utilisation: 0, unplaced: [] });
  });

  it("when a size, the kerf or a quantity is wrong, then a RangeError names the argument", () => {
    const ok: CutPiece = { id: "p", width: 100, height: 100, quantity: 1 };
    expect(() => cuttingList([ok, { ...ok, height: 0 }], SHEET_32x40, 0)).toThrow(/pieces\[1\]\.height/);
    expect(() => cuttingList([{ ...ok, width: -3 }], SHEET_32x40, 0)).toThrow(/pieces\[0\]\.width/);
    expect(() => cuttingList([{ ...ok, quantity: 0 }], SHEET_32x40, 0)).toThrow(/pieces\[0\]\.quantity/);
    expect(() => cuttingList([{ ...ok, quantity: 1.5 }], SHEET_32x40, 0)).toThrow(/pieces\[0\]\.quantity/);
    expect(() => cuttingList([ok], { width: 0, height: 10 }, 0)).toThrow(/sheet\.width/);
    expect(() => cuttingList([ok], SHEET_32x40, -1)).toThrow(RangeError);
    expect(() => cuttingList([ok], SHEET_32x40, -1)).toThrow(/kerf/);
  });
});

describe("cuttingList: properties", () => {
  const piecesArb = fc
    .array(fc.record({ width: mmLength(50, 1300), height: mmLength(50, 1300), quantity: fc.integer({ min: 1, max: 4 }) }), { minLength: 1, maxLength: 12 })
    .map((rows) => rows.map((r, i): CutPiece => ({ id: `p${i}`, ...r })));

  it("when any batch is packed, then every piece that fits is cut exactly its quantity, on valid sheets, and only the others are unplaced", () => {
    fc.assert(
      fc.property(piecesArb, sheetArb, kerfArb, (pieces, sheet, kerf) => {
        const list = cuttingList(pieces, sheet, kerf);
        const fits = (p: CutPiece) => (p.width <= sheet.width + 1e-9 && p.height <= sheet.height + 1e-9) || (p.height <= sheet.width + 1e-9 && p.width <= sheet.height + 1e-9);
        const all = list.sheets.flatMap((s) => s.placements);
        for (const p of pieces) {
          const mine = all.filter((q) => q.pieceId === p.id);
          expect(mine).toHaveLength(fits(p) ? p.quantity : 0);
          expectBlankShape(mine, p);
        }
        expect(list.unplaced.map((u) => u.id)).toEqual(pieces.filter((p) => !fits(p)).map((p) => p.id));
        expect(list.sheetCount).toBe(list.sheets.length);
        list.sheets.forEach((s, i) => {
          expect(s.index).toBe(i);
          expect(s.placements.length).toBeGreaterThan(0);
          expectValidLayout(s.placements, sheet, kerf);
        });
      }),
      { numRuns: 60 },
    );
  });

  it("when any batch is packed, then it takes at least the area bound of sheets and utilisation lies in (0, 1]", () => {
    fc.assert(
      fc.property(piecesArb, sheetArb, kerfArb, (pieces, sheet, kerf) => {
        const list = cuttingList(pieces, sheet, kerf);
        const placedArea = list.sheets.flatMap((s) => s.placements).reduce((a, p) => a + p.width * p.height, 0);
        const sheetArea = sheet.width * sheet.height;
        expect(list.sheetCount).toBeGreaterThanOrEqual(Math.ceil(placedArea / sheetArea - 1e-9));
        if (list.sheetCount === 0) {
          expect(list.utilisation).toBe(0);
          return;
        }
        expect(list.utilisation).toBeGreaterThan(0);
        expect(list.utilisation).toBeLessThanOrEqual(1 + 1e-9);
        expect(list.utilisation).toBeCloseTo(placedArea / (list.sheetCount * sheetArea), 12);
        for (const s of list.sheets) expect(s.utilisation).toBeLessThanOrEqual(1 + 1e-9);
      }),
      { numRuns: 60 },
    );
  });

  it("when the same batch is packed twice, then the cutting list is the same", () => {
    fc.assert(
      fc.property(piecesArb, sheetArb, kerfArb, (pieces, sheet, kerf) => {
        expect(cuttingList(pieces, sheet, kerf)).toEqual(cuttingList(pieces, sheet, kerf));
      }),
      { numRuns: 20 },
    );
  });

  it("when a batch is far larger than a studio's (8,000 blanks), then every blank is still cut once on valid sheets", () => {
    // Past its work budget the packer looks only at the newest open sheets; the list must stay complete and real.
    const pieces: CutPiece[] = Array.from({ length: 80 }, (_, i) => ({ id: `p${i}`, width: 100 + ((i * 137) % 700), height: 100 + ((i * 251) % 700), quantity: 100 }));
    const list = cuttingList(pieces, SHEET_40x60, 1);
    expect(list.unplaced).toEqual([]);
    expect(list.sheets.reduce((n, s) => n + s.placements.length, 0)).toBe(8000);
    for (const s of list.sheets) expectValidLayout(s.placements, SHEET_40x60, 1);
  });

  it("when a batch is all one size, then it takes no more sheets than the single-sheet yield implies", () => {
    fc.assert(
      fc.property(blankArb, sheetArb, kerfArb, fc.integer({ min: 1, max: 40 }), (blank, sheet, kerf, quantity) => {
        const per = blanksPerSheet(blank, sheet, kerf).perSheet;
        fc.pre(per > 0);
        const list = cuttingList([{ id: "b", width: blank.width, height: blank.height, quantity }], sheet, kerf);
        expect(list.sheetCount).toBeLessThanOrEqual(Math.ceil(quantity / per));
      }),
      { numRuns: 50 },
    );
  });
});
