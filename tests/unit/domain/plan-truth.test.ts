import { describe, expect, it } from "vitest";
import { computePlan, type PlanContext } from "../../../shared/domain/mount-plan/compute.ts";
import { hingesWanted } from "../../../shared/domain/mount-plan/checks.ts";
import { paperWeightOf, planObjectOf } from "../../../shared/domain/mounting.ts";
import { lightClass } from "../../../shared/domain/light.ts";
import { MountPlanInputSchema, type MountPlanInput } from "../../../shared/schemas/mount-plan.ts";
import { first } from "../../setup/lists.ts";

// Studio defaults 5 mm minimum overlap and 2 mm clearance: common practice (no source). A4 = 210 × 297 mm (ISO 216).
const CTX: PlanContext = { minOverlapMm: 5, rebateClearanceMm: 2 };
const A4: MountPlanInput = { unit: "mm", sheet: { width: 210, height: 297 }, window: { all: { mode: "overlap", overlap: 5 } } };
const run = (input: MountPlanInput, ctx: PlanContext = CTX) => {
  const r = computePlan(MountPlanInputSchema.parse(input), ctx);
  if (!r.ok) throw new Error(JSON.stringify(r.fields));
  return r;
};
const errorsOf = (input: MountPlanInput, code: string) => run(input).plan.findings.filter((f) => f.code === code);

describe("geometry that cannot be built (docs/trade.md §3)", () => {
  it("when the overlap is wider than the border, then the sheet past the outer edge is an error per side at the border's field", () => {
    const f = errorsOf({ ...A4, window: { all: { mode: "overlap", overlap: 30 } }, borders: { top: 40, side: 20, bottom: 40 }, frame: { rebateLip: 1 } }, "sheet-past-outer");
    expect(f.map((x) => [x.side, x.field, x.severity])).toEqual([
      ["left", "borders.side", "error"],
      ["right", "borders.side", "error"],
    ]);
    expect(first(f).message).toContain("Left edge: the sheet reaches 10 mm past the outer edge");
  });

  it("when a fitted outer size is smaller than the sheet, then it is an error at fitOuter", () => {
    const f = errorsOf({ ...A4, window: { all: { mode: "overlap", overlap: 40 } }, fitOuter: { width: 200, height: 400 }, frame: { rebateLip: 1 } }, "sheet-past-outer");
    expect(f.map((x) => x.field)).toEqual(["fitOuter.width", "fitOuter.width"]);
  });

  it("when the sheet's own borders add up to its whole width, then it is an error at imageBorders", () => {
    const f = errorsOf({ ...A4, imageBorders: { left: 110, top: 10, right: 100, bottom: 10 } }, "image-borders-exceed-sheet");
    expect(f.map((x) => [x.field, x.severity])).toEqual([["imageBorders.right", "error"]]);
  });

  it("when hiding the border covers more than 10 % of the image on a side, then that side is warned (Reversa's rule)", () => {
    // Image 210 − 2 × 10 = 190 mm across; 20 mm into it is 10.5 %.
    const f = errorsOf({ ...A4, window: { all: { mode: "hide-border", border: 10, into: 20 } } }, "window-hides-image");
    // Down, 20 mm of 297 − 20 = 277 mm is 7.2 %: no warning there.
    expect(f.map((x) => [x.side, x.severity])).toEqual([
      ["left", "warn"],
      ["right", "warn"],
    ]);
    expect(first(f).field).toBe("window.all.into");
  });

  it("when a double mount's top border is narrower than the lip covers, then the lip error names the top board", () => {
    // 10 mm borders, 6 mm reveal: the top board shows 4 mm; a 6 mm lip less 1 mm clearance covers 5 mm.
    const f = errorsOf({ ...A4, borders: { all: 10 }, doubleMount: { reveal: 6 } }, "lip-covers-window");
    expect(f).toHaveLength(4);
    expect(first(f).message).toContain("top board's 4 mm border");
    expect(errorsOf({ ...A4, borders: { all: 10 } }, "lip-covers-window")).toEqual([]);
  });
});

describe("floats keep their reveal (docs/trade.md §2)", () => {
  it("when an inch float's window is off the 1/16 step, then it rounds up and the reveal shown is at least the one asked", () => {
    // 8 1/64 × 10 in sheet with a 1/4 in reveal: 8 33/64 in rounds up to 8 9/16 in; each reveal 1/4 + 3/128 in.
    const { plan, geometry } = run({ unit: "in", sheet: { width: "8 1/64", height: 10 }, window: { all: { mode: "float", reveal: "1/4" } } });
    expect(plan.aperture.width).toBeCloseTo(8.5625, 9);
    for (const s of ["left", "right"] as const) expect(-geometry.overlap[s]).toBeGreaterThanOrEqual(6.35 - 1e-9);
    expect(plan.findings.filter((f) => f.code === "float").every((f) => !f.message.includes("−"))).toBe(true);
  });

  it("when both forms of bottom weighting are given, then the plan is refused at bottomWeightPercent", () => {
    const r = computePlan(MountPlanInputSchema.parse({ ...A4, bottomWeight: 10, bottomWeightPercent: 10 }), CTX);
    expect(r.ok).toBe(false);
    expect(Object.keys((r as { fields: Record<string, string> }).fields)).toEqual(["bottomWeightPercent"]);
  });
});

describe("hinge count (docs/trade.md §6, common practice, no source)", () => {
  it("when the sheet widens, then the count grows by one for each 350 mm begun past 700 mm", () => {
    expect([350, 700, 701, 1050, 1051].map((w) => hingesWanted({ width: w, height: 500 }).count)).toEqual([2, 2, 3, 3, 4]);
  });
  it("when the paper's weight is known, then a heavy sheet wants one hinge for each 40 g begun", () => {
    // 600 × 800 mm at 300 g/m² = 144 g → 4 hinges; the width alone would want 2.
    expect(hingesWanted({ width: 600, height: 800 }, 300)).toMatchObject({ count: 4, byWidth: 2, byWeight: 4 });
    expect(hingesWanted({ width: 600, height: 800 }, null).count).toBe(2);
  });
  it("when the support names a weight, then it is read in g/m²", () => {
    expect(paperWeightOf("Cotton rag, 300 g/m²")).toBe(300);
    expect(paperWeightOf("Wove paper 250gsm")).toBe(250);
    expect(paperWeightOf("Laid paper")).toBeNull();
    expect(planObjectOf({ objectType: "print", support: "Somerset 300 g/m2" }).paperWeightGsm).toBe(300);
  });
});

describe("light categories (docs/trade.md §7)", () => {
  it("when a work on paper is not flagged, then it is very sensitive and medium responsivity; a watercolour is high", () => {
    // NISO Z39.79 via NEDCC (50 lux); CIE 157:2004 as quoted, from memory (15,000 / 150,000 lux·h a year).
    expect(lightClass({ objectType: "print" })).toMatchObject({ verySensitive: true, maxLux: 50, luxHoursPerYear: 150_000 });
    expect(lightClass({ objectType: "watercolour" })).toMatchObject({ verySensitive: true, maxLux: 50, luxHoursPerYear: 15_000 });
  });
});
