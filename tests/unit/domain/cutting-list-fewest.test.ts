import { describe, expect, it } from "vitest";
import fc from "fast-check";
import { cuttingList, type CutPiece } from "../../../shared/domain/mount-plan/yield.ts";
import { fewestSheets } from "./support/guillotine-brute.ts";
import { at } from "../../setup/lists.ts";

// Guillotine cuts (edge to edge) with kerf: docs/trade.md §11. The comparison is with an
// exhaustive search written apart from the product (support/guillotine-brute.ts). Board sizes are
// invented for the test; the 1120 × 815 mm full sheet is common practice (no source).
const SHEET = { width: 1120, height: 815 };

const batch = fc.array(fc.record({ w: fc.integer({ min: 150, max: 800 }), h: fc.integer({ min: 150, max: 800 }) }), { minLength: 1, maxLength: 8 });

function asPieces(boards: { w: number; h: number }[]): CutPiece[] {
  return boards.map((b, i) => ({ id: `b${i}`, width: b.w, height: b.h, quantity: 1 }));
}

describe("the cutting list uses the fewest sheets", () => {
  it("when batches of up to 8 boards are packed, then no batch uses more sheets than an exhaustive search finds", () => {
    fc.assert(
      fc.property(batch, fc.constantFrom(0, 3), (boards, kerf) => {
        const list = cuttingList(asPieces(boards), SHEET, kerf);
        expect(list.unplaced).toEqual([]);
        expect(list.sheetCount, JSON.stringify(boards)).toBe(fewestSheets(boards, SHEET, kerf));
      }),
      { numRuns: 50 },
    );
  });

  it("when four boards fit one sheet only in a layout a first-fit packer misses, then one sheet is used", () => {
    // 2 × (560 × 400) side by side on top, then 2 × (560 × 415) below: exactly 1120 × 815.
    const boards = [
      { w: 400, h: 560 },
      { w: 560, h: 415 },
      { w: 415, h: 560 },
      { w: 560, h: 400 },
    ];
    expect(fewestSheets(boards, SHEET, 0)).toBe(1);
    expect(cuttingList(asPieces(boards), SHEET, 0).sheetCount).toBe(1);
  });

  it("when the exact layouts are drawn, then every board lies on its sheet, none overlaps another and each is its own size", () => {
    fc.assert(
      fc.property(batch, (boards) => {
        const list = cuttingList(asPieces(boards), SHEET, 0);
        const seen: string[] = [];
        for (const s of list.sheets) {
          for (const p of s.placements) {
            expect(p.x).toBeGreaterThanOrEqual(-1e-9);
            expect(p.y).toBeGreaterThanOrEqual(-1e-9);
            expect(p.x + p.width).toBeLessThanOrEqual(SHEET.width + 1e-9);
            expect(p.y + p.height).toBeLessThanOrEqual(SHEET.height + 1e-9);
            const b = at(boards, Number(p.pieceId.slice(1)), "boards");
            expect(p.rotated ? [p.height, p.width] : [p.width, p.height]).toEqual([b.w, b.h]);
            seen.push(p.pieceId);
            for (const q of s.placements) {
              if (q === p) continue;
              const apart = p.x + p.width <= q.x + 1e-9 || q.x + q.width <= p.x + 1e-9 || p.y + p.height <= q.y + 1e-9 || q.y + q.height <= p.y + 1e-9;
              expect(apart).toBe(true);
            }
          }
        }
        expect(seen.sort()).toEqual(boards.map((_, i) => `b${i}`).sort());
      }),
      { numRuns: 80 },
    );
  });
});
