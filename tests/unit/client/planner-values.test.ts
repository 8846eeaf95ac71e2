import { describe, expect, it } from "vitest";
import fc from "fast-check";
import { convertLength, defaultValues, toInput, fromInput } from "../../../src/features/planner/lib/planner-values.ts";
import { parseLength } from "../../../shared/domain/units.ts";

// 1 in = 25.4 mm exactly (1959 agreement; NIST Handbook 44, App. C). Inputs show inches to 1/32 and mm to 0.1.
const IN_STEP_MM = 25.4 / 32;
const MM_STEP = 0.1;

describe("the planner's unit toggle", () => {
  it("when a length goes mm → in → mm any number of times, then it never moves by more than the display step and never drifts", () => {
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 20000 }), fc.integer({ min: 1, max: 6 }), (tenths, toggles) => {
        const original = (tenths / 10).toFixed(1);
        let text = original;
        let unit: "mm" | "in" = "mm";
        let last: { text: string; mm: number } | undefined;
        for (let i = 0; i < toggles * 2; i++) {
          const next: "mm" | "in" = unit === "mm" ? "in" : "mm";
          const r = convertLength(text, unit, next, last);
          const mm = parseLength(r.text, next);
          expect(mm.ok).toBe(true);
          if (mm.ok) expect(Math.abs(mm.mm - tenths / 10)).toBeLessThanOrEqual((next === "in" ? IN_STEP_MM : MM_STEP) / 2 + 1e-9);
          last = { text: r.text, mm: r.mm! };
          text = r.text;
          unit = next;
        }
        expect(Number(text)).toBe(tenths / 10);
      }),
    );
  });

  it("when an overlap is converted with rounding up, then the converted overlap is never smaller", () => {
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 500 }), (tenths) => {
        const r = convertLength((tenths / 10).toFixed(1), "mm", "in", undefined, "up");
        const back = parseLength(r.text, "in");
        expect(back.ok && back.mm >= tenths / 10 - 1e-9).toBe(true);
      }),
    );
  });

  it("when the user types a new value after a toggle, then the new value is converted, not the old exact one", () => {
    const a = convertLength("5", "mm", "in"); // 5 mm → 13/64 rounds to 3/16 at 1/32
    const typed = "7/32";
    const b = convertLength(typed, "in", "mm", { text: a.text, mm: a.mm! });
    expect(Number(b.text)).toBeCloseTo((7 / 32) * 25.4, 1);
  });

  it("when a form is turned into plan input and back, then the values survive", () => {
    const v = defaultValues("in", 5);
    v.sheetW = "11 3/4";
    v.windowMode = "sides";
    v.left = { mode: "float", overlap: "", border: "", into: "", reveal: "1/2" };
    const again = fromInput(toInput(v), defaultValues("in", 5));
    expect(again.sheetW).toBe("11 3/4");
    expect(again.windowMode).toBe("sides");
    expect(again.left.mode).toBe("float");
    expect(again.left.reveal).toBe("1/2");
  });
});
