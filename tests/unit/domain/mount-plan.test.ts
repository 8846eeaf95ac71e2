import { describe, expect, it } from "vitest";
import { computePlan, type PlanContext, type PlanGeometry } from "../../../shared/domain/mount-plan/compute.ts";
import { planDrawing, type Shape } from "../../../shared/domain/mount-plan/drawing.ts";
import { FRAME_PRESETS, SHEET_PRESETS } from "../../../shared/domain/mount-plan/presets.ts";
import { MountPlanInputSchema, type Check, type MountPlan, type MountPlanInput } from "../../../shared/schemas/mount-plan.ts";
import { MM_PER_INCH } from "../../../shared/domain/units.ts";
import { at, first } from "../../setup/lists.ts";

// The studio defaults: 5 mm minimum overlap a side and 2 mm total rebate clearance, both
// common practice (no source) and studio settings (docs/trade.md §2).
const CTX: PlanContext = { minOverlapMm: 5, rebateClearanceMm: 2 };
// 1 in = 25.4 mm exactly: international yard and pound agreement, 1959; NIST Handbook 44, Appendix C.
const IN = 25.4;

/** Parses with the contract first, as the API and the client do, then computes; fails when the plan is refused. */
function planOf(input: MountPlanInput, ctx: PlanContext = CTX): { plan: MountPlan; geometry: PlanGeometry } {
  const r = computePlan(MountPlanInputSchema.parse(input), ctx);
  if (!r.ok) throw new Error(`expected a plan, got field errors ${JSON.stringify(r.fields)}`);
  return r;
}

/** The field errors of a plan that must be refused. */
function refusalOf(input: MountPlanInput, ctx: PlanContext = CTX): Record<string, string> {
  const r = computePlan(MountPlanInputSchema.parse(input), ctx);
  if (r.ok) throw new Error(`expected the plan to be refused, got aperture ${JSON.stringify(r.plan.aperture)}`);
  return r.fields;
}

const checkOf = (plan: MountPlan, id: string): Check => {
  const c = plan.checks.find((k) => k.id === id);
  if (!c) throw new Error(`no check ${id} among ${plan.checks.map((k) => k.id).join(", ")}`);
  return c;
};
const codes = (plan: MountPlan) => plan.findings.map((f) => f.code);

// A4 = 210 × 297 mm (ISO 216); a 5 mm overlap every side is common practice (no source).
const A4_OVERLAP_5: MountPlanInput = { unit: "mm", sheet: { width: 210, height: 297 }, window: { all: { mode: "overlap", overlap: 5 } } };

/** Materials and glazing that pass every conservation check for a print on an A4 sheet. */
const GOOD: Pick<MountPlanInput, "materials" | "glazing" | "object"> = {
  object: { objectType: "print" },
  glazing: { material: "glass", thickness: 2, uvFiltering: true },
  materials: { boardGrade: "museum", buffered: true, attachment: "t-hinge", adhesive: "wheat-starch-paste", hingeEdge: "top", hingeCount: 2 },
};

describe("window in overlap mode", () => {
  it("when an A4 sheet has 5 mm overlap every side, then the aperture is exactly 200 × 287 mm", () => {
    // A4 210 × 297 mm: ISO 216. 5 mm overlap: common practice (no source). 210 − 2 × 5 = 200; 297 − 2 × 5 = 287.
    const { plan, geometry } = planOf(A4_OVERLAP_5);
    expect(plan.aperture).toEqual({ width: 200, height: 287 });
    expect(geometry.aperture).toEqual({ width: 200, height: 287 });
    expect(plan.overlap).toEqual({ left: 5, top: 5, right: 5, bottom: 5 });
    expect(plan.windowOnSheet).toEqual({ left: 5, top: 5 });
    expect(plan.display.aperture).toBe("200 × 287 mm");
    expect(checkOf(plan, "overlap-minimum").verdict).toBe("pass");
  });

  it("when an 8 × 10 in sheet has 3/16 in overlap every side, then the aperture is 7 5/8 × 9 5/8 in", () => {
    // 8 × 10 in: CCI Notes 11/5. 1 in = 25.4 mm exactly (1959 agreement; NIST HB 44 App. C).
    // 8 − 2 × 3/16 = 7 5/8 in = 193.675 mm; 10 − 2 × 3/16 = 9 5/8 in = 244.475 mm.
    const { plan, geometry } = planOf({ unit: "in", sheet: { width: 8, height: 10 }, window: { all: { mode: "overlap", overlap: "3/16" } } });
    expect(plan.aperture).toEqual({ width: 7.625, height: 9.625 });
    expect(geometry.aperture.width).toBeCloseTo(7.625 * IN, 9);
    expect(geometry.aperture.height).toBeCloseTo(9.625 * IN, 9);
    expect(plan.display.aperture).toBe("7 5/8 × 9 5/8 in");
    expect(plan.display["overlap.left"]).toBe("3/16 in");
    // 3/16 in = 4.7625 mm is below the 5 mm studio minimum, so that check refuses it.
    expect(checkOf(plan, "overlap-minimum").verdict).toBe("fail");
  });

  it("when each side has its own overlap, then each side is decided on its own", () => {
    const { plan } = planOf({
      unit: "mm",
      sheet: { width: 210, height: 297 },
      window: { left: { mode: "overlap", overlap: 6 }, top: { mode: "overlap", overlap: 7 }, right: { mode: "overlap", overlap: 10 }, bottom: { mode: "overlap", overlap: 12 } },
    });
    expect(plan.aperture).toEqual({ width: 194, height: 278 });
    expect(plan.overlap).toEqual({ left: 6, top: 7, right: 10, bottom: 12 });
  });

  it("when the exact aperture is not a multiple of the cutting step, then it rounds down and both overlaps grow, on the shown 0.1 mm grid", () => {
    // 210 − 2 × 5.2 = 199.6 mm → 199.5 mm at the 0.5 mm step; the 0.1 mm lost goes to the two sides on the
    // shown grid (0.0 to the left, 0.1 to the right), so every shown figure is exact and the sheet adds up.
    const { geometry, plan } = planOf({ ...A4_OVERLAP_5, window: { all: { mode: "overlap", overlap: 5.2 } } });
    expect(geometry.aperture.width).toBe(199.5);
    expect(geometry.overlap.left).toBeCloseTo(5.2, 9);
    expect(geometry.overlap.right).toBeCloseTo(5.3, 9);
    expect(geometry.overlap.left).toBeGreaterThanOrEqual(5.2);
    expect([plan.display["overlap.left"], plan.display["aperture.width"], plan.display["overlap.right"]]).toEqual(["5.2 mm", "199.5 mm", "5.3 mm"]);
  });

  it("when the sheet's own border is wider than the overlap, then the plan says the border shows", () => {
    const { plan } = planOf({ ...A4_OVERLAP_5, imageBorders: { left: 12, top: 12, right: 12, bottom: 12 } });
    const shows = plan.findings.filter((f) => f.code === "window-shows-border");
    expect(shows.map((f) => f.side)).toEqual(["left", "top", "right", "bottom"]);
    expect(shows.every((f) => f.severity === "info")).toBe(true);
    expect(first(shows).message).toMatch(/^Left edge: 7 mm of the sheet's border shows/);
  });

  it("when the sheet's own border is narrower than the overlap, then the plan says the window covers the image", () => {
    const { plan } = planOf({ ...A4_OVERLAP_5, imageBorders: { left: 2, top: 5, right: 5, bottom: 5 } });
    const covers = plan.findings.filter((f) => f.code === "window-covers-image");
    expect(covers).toHaveLength(1);
    expect(covers[0]).toMatchObject({ side: "left", severity: "warn" });
    expect(first(covers).message).toContain("3 mm of the image");
  });
});

describe("size presets", () => {
  it("when listing the A sizes A5–A1, then they are the ISO 216 sizes in mm, portrait", () => {
    // ISO 216.
    const iso: Record<string, [number, number]> = { A5: [148, 210], A4: [210, 297], A3: [297, 420], A2: [420, 594], A1: [594, 841] };
    expect(SHEET_PRESETS.map((p) => p.id)).toEqual(Object.keys(iso));
    for (const p of SHEET_PRESETS) expect([p.width, p.height]).toEqual(iso[p.id]);
  });

  it("when listing frame sizes, then the CCI Notes 11/5 sizes are there, exact in mm", () => {
    // CCI Notes 11/5 "Matting Works on Paper"; 1 in = 25.4 mm exactly (1959 agreement; NIST HB 44 App. C).
    for (const [w, h] of [
      [8, 10],
      [10, 12],
      [14, 18],
      [16, 22],
      [22, 28],
      [28, 36],
    ] as const) {
      const p = FRAME_PRESETS.find((f) => f.id === `${w}x${h}in`);
      expect(p, `${w}×${h} in`).toBeDefined();
      expect(p!.width).toBeCloseTo(w * IN, 9);
      expect(p!.height).toBeCloseTo(h * IN, 9);
      expect(p!.label).toBe(`${w} × ${h} in`);
    }
  });
});

describe("window in hide-border mode", () => {
  it("when the window sits 3 mm inside the image on a 20 mm border, then each overlap is 23 mm", () => {
    const side = { mode: "hide-border" as const, border: 20, into: 3 };
    const { plan } = planOf({ unit: "mm", sheet: { width: 210, height: 297 }, window: { all: side } });
    expect(plan.overlap).toEqual({ left: 23, top: 23, right: 23, bottom: 23 });
    expect(plan.aperture).toEqual({ width: 164, height: 251 });
    expect(codes(plan)).not.toContain("window-shows-border");
  });

  it("when the window edge sits outside the image on a hide-border side, then that side is an error naming it", () => {
    const { plan } = planOf({
      unit: "mm",
      sheet: { width: 210, height: 297 },
      window: {
        left: { mode: "hide-border", border: 20, into: 3 },
        top: { mode: "hide-border", border: 20, into: 3 },
        right: { mode: "hide-border", border: 20, into: -2 },
        bottom: { mode: "hide-border", border: 20, into: 3 },
      },
    });
    const f = plan.findings.filter((x) => x.code === "window-shows-border");
    expect(f).toHaveLength(1);
    expect(f[0]).toMatchObject({ side: "right", severity: "error" });
    expect(first(f).message).toContain("Right edge");
    expect(first(f).message).toContain("2 mm");
    expect(plan.level).toBe("fail");
  });
});

describe("window in float mode", () => {
  const FLOAT_10: MountPlanInput = { unit: "mm", sheet: { width: 210, height: 297 }, window: { all: { mode: "float", reveal: 10 } } };

  it("when the sheet floats with a 10 mm reveal, then the overlap is −10 mm a side and the aperture is larger than the sheet", () => {
    const { plan } = planOf(FLOAT_10);
    expect(plan.overlap).toEqual({ left: -10, top: -10, right: -10, bottom: -10 });
    expect(plan.aperture).toEqual({ width: 230, height: 317 });
    const floats = plan.findings.filter((f) => f.code === "float");
    expect(floats.map((f) => f.side)).toEqual(["left", "top", "right", "bottom"]);
    expect(floats.every((f) => f.severity === "info")).toBe(true);
    expect(first(floats).message).toContain("10 mm reveal");
    expect(checkOf(plan, "overlap-minimum")).toMatchObject({ verdict: "pass", reason: "The sheet floats on every side; no side is held by the window." });
  });

  it("when a floated sheet is to be T-hinged along the top, then the top edge is an error and the hinge check fails", () => {
    // T-hinges hide under a window that covers the edge they sit on; on a float they show (LoC guide; common practice).
    const { plan } = planOf({ ...FLOAT_10, materials: { attachment: "t-hinge", adhesive: "wheat-starch-paste" } });
    const errors = plan.findings.filter((f) => f.code === "float-needs-float-hinge");
    expect(errors.map((f) => f.side)).toEqual(["top"]);
    expect(errors.every((f) => f.severity === "error" && f.field === "materials.attachment")).toBe(true);
    expect(plan.findings.filter((f) => f.code === "float").map((f) => f.side)).toEqual(["left", "right", "bottom"]);
    expect(checkOf(plan, "hinge-placement").verdict).toBe("fail");
    expect(checkOf(plan, "hinge-placement").reason).toContain("where the T-hinges sit");
    expect(plan.level).toBe("fail");
  });

  it("when the window covers the top edge and only the bottom floats, then T-hinges along the top are right", () => {
    // Common practice (no source): T-hinges wherever the window covers the hinged (top) edge.
    const { plan } = planOf({
      unit: "mm",
      sheet: { width: 210, height: 297 },
      window: { left: { mode: "overlap", overlap: 6 }, top: { mode: "overlap", overlap: 6 }, right: { mode: "overlap", overlap: 6 }, bottom: { mode: "float", reveal: 8 } },
      materials: { attachment: "t-hinge", adhesive: "wheat-starch-paste", hingeEdge: "top", hingeCount: 2 },
    });
    expect(codes(plan)).not.toContain("float-needs-float-hinge");
    expect(checkOf(plan, "hinge-placement").verdict).toBe("pass");
  });

  it("when a sheet floats on every side with pendant hinges, then the hinge check warns that they show above the sheet", () => {
    // A pendant hinge stands up past the top edge: on a float it is in view (common practice, no source).
    const { plan } = planOf({ ...FLOAT_10, materials: { attachment: "pendant-hinge", adhesive: "wheat-starch-paste", hingeEdge: "top", hingeCount: 2 } });
    expect(checkOf(plan, "hinge-placement").verdict).toBe("warn");
    expect(checkOf(plan, "hinge-placement").reason).toContain("pendant hinges would show above the sheet");
  });

  it("when a floated sheet is V-hinged, then there is no hinge error", () => {
    const { plan } = planOf({ ...FLOAT_10, materials: { attachment: "v-hinge", adhesive: "wheat-starch-paste", hingeEdge: "top" } });
    expect(codes(plan)).not.toContain("float-needs-float-hinge");
    expect(checkOf(plan, "hinge-placement").verdict).toBe("pass");
  });

  it("when only the bottom floats, then the other sides are still held and checked against the minimum", () => {
    const { plan } = planOf({
      unit: "mm",
      sheet: { width: 210, height: 297 },
      window: { left: { mode: "overlap", overlap: 5 }, top: { mode: "overlap", overlap: 5 }, right: { mode: "overlap", overlap: 4 }, bottom: { mode: "float", reveal: 8 } },
    });
    expect(plan.overlap).toEqual({ left: 5, top: 5, right: 4, bottom: -8 });
    expect(plan.aperture).toEqual({ width: 201, height: 300 });
    expect(plan.findings.filter((f) => f.code === "float").map((f) => f.side)).toEqual(["bottom"]);
    expect(plan.findings.filter((f) => f.code === "overlap-below-minimum").map((f) => f.side)).toEqual(["right"]);
  });
});

describe("custom window", () => {
  it("when a custom window leaves 3 mm over the left edge with a 5 mm minimum, then the overlap check fails naming the left edge", () => {
    // 5 mm minimum: common practice (no source).
    const { plan } = planOf({ unit: "mm", sheet: { width: 210, height: 297 }, window: { mode: "custom", width: 200, height: 280, left: 3, top: 8 } });
    expect(plan.overlap).toEqual({ left: 3, top: 8, right: 7, bottom: 9 });
    expect(checkOf(plan, "overlap-minimum").verdict).toBe("fail");
    expect(checkOf(plan, "overlap-minimum").reason).toContain("3 mm on the left");
    const below = plan.findings.filter((f) => f.code === "overlap-below-minimum");
    expect(below).toHaveLength(1);
    expect(first(below).side).toBe("left");
    expect(first(below).severity).toBe("error");
    expect(first(below).message).toContain("Left edge");
    expect(first(below).message).toContain("3 mm");
    expect(plan.level).toBe("fail");
  });

  it("when a custom window runs past the sheet's edge, then that side is an error naming the side and the field, never a warning", () => {
    // A custom window must lie on the sheet; showing the whole sheet is a float (docs/trade.md §3).
    const { plan } = planOf({ unit: "mm", sheet: { width: 210, height: 297 }, window: { mode: "custom", width: 200, height: 280, left: -4, top: 8 } });
    expect(plan.overlap.left).toBe(-4);
    const off = plan.findings.filter((f) => f.code === "window-off-sheet");
    expect(off.map((f) => [f.side, f.field, f.severity])).toEqual([["left", "window.left", "error"]]);
    expect(first(off).message).toContain("Left edge: the window runs 4 mm past the edge of the sheet");
    expect(plan.level).toBe("fail");
  });

  it("when a custom window lies wholly off the sheet, then it is an error at the window's position", () => {
    const { plan } = planOf({ unit: "mm", sheet: { width: 210, height: 297 }, window: { mode: "custom", width: 100, height: 100, left: 220, top: 8 } });
    const off = plan.findings.filter((f) => f.code === "window-off-sheet");
    expect(off).toHaveLength(1);
    expect(off[0]).toMatchObject({ severity: "error", field: "window.left" });
    expect(first(off).message).toContain("wholly off the sheet");
  });

  it("when a custom window is wider than the sheet, then it is an error at window.width", () => {
    const { plan } = planOf({ unit: "mm", sheet: { width: 210, height: 297 }, window: { mode: "custom", width: 220, height: 280, left: -5, top: 8 } });
    const big = plan.findings.find((f) => f.code === "window-larger-than-sheet")!;
    expect(big).toMatchObject({ severity: "error", field: "window.width" });
    expect(big.message).toContain("The window's width (220 mm) is larger than the sheet's (210 mm)");
  });

  it("when the custom window is not a multiple of the step, then it rounds down and the lost width goes to both overlaps, on the shown grid", () => {
    const { geometry } = planOf({ unit: "mm", sheet: { width: 210, height: 297 }, window: { mode: "custom", width: 190.3, height: 280, left: 10, top: 8 } });
    expect(geometry.aperture.width).toBe(190);
    expect(geometry.overlap.left).toBeCloseTo(10.1, 9);
    expect(geometry.overlap.right).toBeCloseTo(9.9, 9);
  });
});

describe("borders and outer size", () => {
  it("when no borders are given, then 50 mm all round is assumed and said", () => {
    const { plan } = planOf(A4_OVERLAP_5);
    expect(plan.borders).toEqual({ left: 50, top: 50, right: 50, bottom: 50 });
    expect(plan.outer).toEqual({ width: 300, height: 387 });
    expect(plan.findings.find((f) => f.code === "borders-assumed")).toMatchObject({ severity: "info" });
  });

  it("when borders are top, side and bottom, then outer = aperture + left + right and aperture + top + bottom", () => {
    const { plan } = planOf({ ...A4_OVERLAP_5, borders: { top: 60, side: 55, bottom: 75 } });
    expect(plan.borders).toEqual({ left: 55, top: 60, right: 55, bottom: 75 });
    expect(plan.outer).toEqual({ width: 200 + 55 + 55, height: 287 + 60 + 75 });
    expect(codes(plan)).not.toContain("borders-assumed");
  });

  it("when the bottom is weighted by an amount, then the bottom border is that much larger", () => {
    // Bottom weighting of 10–20 mm: common practice (no source).
    const { plan } = planOf({ ...A4_OVERLAP_5, borders: { all: 60 }, bottomWeight: 15 });
    expect(plan.borders).toEqual({ left: 60, top: 60, right: 60, bottom: 75 });
  });

  it("when the bottom is weighted by a percentage, then it is that much larger than the top, rounded to the step", () => {
    // Bottom weighting of about 10–15 %: common practice (no source). 60 × 1.12 = 67.2 → 67 at the 0.5 mm step.
    const { plan } = planOf({ ...A4_OVERLAP_5, borders: { all: 60 }, bottomWeightPercent: 12 });
    expect(plan.borders.bottom).toBe(67);
    expect(plan.borders.top).toBe(60);
  });

  it("when a border comes out below the chosen minimum, then that side is reported", () => {
    const { plan } = planOf({ ...A4_OVERLAP_5, borders: { left: 40, top: 60, right: 60, bottom: 60 }, minBorder: 50 });
    const low = plan.findings.filter((f) => f.code === "border-below-minimum");
    expect(low.map((f) => f.side)).toEqual(["left"]);
    expect(low[0]).toMatchObject({ severity: "warn" });
    expect(first(low).message).toContain("40 mm");
  });

  // 16 × 20 in ready-made frame (docs/trade.md §8); 8 × 10 in sheet (CCI Notes 11/5); 1 in = 25.4 mm (NIST HB 44 App. C).
  const FIT_16x20: MountPlanInput = {
    unit: "in",
    sheet: { width: 8, height: 10 },
    window: { all: { mode: "overlap", overlap: "3/16" } },
    fitOuter: { width: 16, height: 20 },
  };

  it("when fitting a 16 × 20 in outer with 1/2 in bottom weighting, then the sides are equal and the borders add up to the outer size", () => {
    // (16 − 7 5/8) / 2 = 4 3/16 a side; 20 − 9 5/8 = 10 3/8 down: top (10 3/8 − 1/2) / 2 = 4 15/16, bottom 5 7/16.
    const { plan, geometry } = planOf({ ...FIT_16x20, bottomWeight: "1/2" });
    expect(plan.borders).toEqual({ left: 4.1875, right: 4.1875, top: 4.9375, bottom: 5.4375 });
    expect(geometry.outer.width).toBeCloseTo(16 * IN, 9);
    expect(geometry.outer.height).toBeCloseTo(20 * IN, 9);
    expect(geometry.borders.bottom - geometry.borders.top).toBeCloseTo(0.5 * IN, 9);
    expect(plan.display.outer).toBe("16 × 20 in");
  });

  it("when fitting a 16 × 20 in outer with 10 % bottom weighting, then the bottom is about 10 % larger and the borders add up", () => {
    // 10 3/8 in split so bottom = 1.1 × top: top = 10.375 / 2.1 = 4.940… → 4 15/16 at 1/16 in; bottom takes the rest, 5 7/16.
    const { plan, geometry } = planOf({ ...FIT_16x20, bottomWeightPercent: 10 });
    expect(plan.borders.left).toBe(plan.borders.right);
    expect(plan.borders.top).toBe(4.9375);
    expect(plan.borders.bottom).toBe(5.4375);
    expect(Math.abs(geometry.borders.bottom - 1.1 * geometry.borders.top)).toBeLessThan(geometry.stepMm * 1.1);
    expect(geometry.aperture.height + geometry.borders.top + geometry.borders.bottom).toBeCloseTo(20 * IN, 9);
  });

  it("when fitting an inch frame in a mm studio, then the borders still add up to the frame and the sides differ by less than one step", () => {
    // A4 (ISO 216) in a 16 × 20 in frame: (406.4 − 200) / 2 = 103.2 mm, not a multiple of the 0.5 mm step.
    const { geometry } = planOf({ ...A4_OVERLAP_5, fitOuter: { width: "16 in", height: "20 in" } });
    expect(geometry.aperture.width + geometry.borders.left + geometry.borders.right).toBeCloseTo(16 * IN, 9);
    expect(geometry.aperture.height + geometry.borders.top + geometry.borders.bottom).toBeCloseTo(20 * IN, 9);
    expect(Math.abs(geometry.borders.left - geometry.borders.right)).toBeLessThan(geometry.stepMm);
  });
});

describe("double mount", () => {
  it("when a double mount has a 4 mm reveal, then the top window is the aperture plus 2 × 4 mm and the inner window stays the aperture", () => {
    // Reveal of 3–6 mm a side: common practice (no source).
    const { plan } = planOf({ ...A4_OVERLAP_5, doubleMount: { reveal: 4 } });
    expect(plan.aperture).toEqual({ width: 200, height: 287 });
    expect(plan.topWindow).toEqual({ width: 208, height: 295 });
    expect(plan.display.topWindow).toBe("208 × 295 mm");
    // Two window boards in the package: 2 × 1.4 + 1.4 backing (4-ply ≈ 1.3–1.5 mm, Saitzyk, Art Hardware).
    expect(plan.package.thickness).toBeCloseTo(4.2, 9);
  });

  it("when a single mount is planned, then there is no top window", () => {
    expect(planOf(A4_OVERLAP_5).plan.topWindow).toBeUndefined();
  });
});

describe("frame: rebate, sight and moulding", () => {
  it("when the outer is 300 × 387 mm with the 2 mm clearance, then the rebate is 302 × 389 mm and the sight 290 × 377 mm", () => {
    // Clearance 2 mm and rebate lip 6 mm: common practice (no source). Sight = rebate − 2 × lip.
    const { plan } = planOf(A4_OVERLAP_5);
    expect(plan.rebate).toEqual({ width: 302, height: 389 });
    expect(plan.sight).toEqual({ width: 290, height: 377 });
  });

  it("when outer plus clearance is not a multiple of the step, then the rebate rounds up", () => {
    const { plan } = planOf({ ...A4_OVERLAP_5, frame: { clearance: 2.3, rebateLip: 8 } });
    expect(plan.rebate).toEqual({ width: 302.5, height: 389.5 });
    expect(plan.sight).toEqual({ width: 302.5 - 16, height: 389.5 - 16 });
  });

  it("when the studio clearance setting changes, then the rebate follows it", () => {
    const { plan } = planOf(A4_OVERLAP_5, { minOverlapMm: 5, rebateClearanceMm: 3 });
    expect(plan.rebate).toEqual({ width: 303, height: 390 });
  });

  it("when an inch plan's outer plus clearance falls between sixteenths, then the rebate rounds up to the next sixteenth", () => {
    // Outer 11 1/2 × 13 1/2 in (default 50 mm borders rounded to 1 15/16 in); + 2 mm = 11.579 in → 11 5/8 in.
    const { plan } = planOf({ unit: "in", sheet: { width: 8, height: 10 }, window: { all: { mode: "overlap", overlap: "3/16" } } });
    expect(plan.outer).toEqual({ width: 11.5, height: 13.5 });
    expect(plan.rebate).toEqual({ width: 11.625, height: 13.625 });
  });

  it("when the moulding is ordered, then it is 2 × (rebate W + rebate H) + 8 × face width, times (1 + waste)", () => {
    // Formula, 20 mm face and 10 % waste: common practice (no source). (2 × (302 + 389) + 8 × 20) × 1.1 = 1696.2 mm.
    expect(planOf(A4_OVERLAP_5).plan.moulding).toEqual({ length: 1696.2, faceWidth: 20, wastePercent: 10 });
    // (2 × 691 + 8 × 30) × 1.0 = 1622 mm.
    expect(planOf({ ...A4_OVERLAP_5, frame: { faceWidth: 30, wastePercent: 0 } }).plan.moulding.length).toBe(1622);
  });

  it("when the rebate is shallower than the package, then the plan warns", () => {
    // 2 mm glass + 1.4 mm window + 1.4 mm backing = 4.8 mm.
    const shallow = planOf({ ...A4_OVERLAP_5, glazing: { material: "glass", thickness: 2 }, frame: { rebateDepth: 4 } }).plan;
    expect(shallow.package.thickness).toBeCloseTo(4.8, 9);
    expect(shallow.findings.find((f) => f.code === "rebate-too-shallow")).toMatchObject({ severity: "warn" });
    const deep = planOf({ ...A4_OVERLAP_5, glazing: { material: "glass", thickness: 2 }, frame: { rebateDepth: 5 } }).plan;
    expect(codes(deep)).not.toContain("rebate-too-shallow");
  });

  it("when the rebate lip is wider than a border, then the lip would reach into the window on that side", () => {
    // Border 4 mm; the lip (6 mm) less half the 2 mm clearance hides 5 mm of the board.
    const { plan } = planOf({ ...A4_OVERLAP_5, ...GOOD, borders: { left: 4, top: 50, right: 50, bottom: 50 } });
    const lip = plan.findings.filter((f) => f.code === "lip-covers-window");
    expect(lip.map((f) => f.side)).toEqual(["left"]);
    expect(lip[0]).toMatchObject({ severity: "error" });
    expect(first(lip).message).toContain("Left edge");
    expect(plan.level).toBe("fail");
    expect(codes(planOf({ ...A4_OVERLAP_5, borders: { all: 50 } }).plan)).not.toContain("lip-covers-window");
  });
});

describe("glazing weight and hanging", () => {
  // 310 × 210 mm sheet, 5 mm overlap → 300 × 200 mm window; 100 mm borders → 500 × 400 mm outer = 0.2 m².
  const OUTER_500x400: MountPlanInput = { unit: "mm", sheet: { width: 310, height: 210 }, window: { all: { mode: "overlap", overlap: 5 } }, borders: { all: 100 } };

  it("when a 500 × 400 mm outer has 2 mm float glass, then the glass weighs 0.2 m² × 2 mm × 2.5 kg/m²/mm = 1.0 kg", () => {
    // Float glass 2,500 kg/m³ = 2.5 kg/m² per mm (EN 572-1, as quoted in glass makers' data sheets).
    const { plan } = planOf({ ...OUTER_500x400, glazing: { material: "glass", thickness: 2 } });
    expect(plan.outer).toEqual({ width: 500, height: 400 });
    expect(plan.glazing).toMatchObject({ width: 500, height: 400, material: "glass", thickness: 2, weightKg: 1 });
    // Package: + 0.2 m² × (1.4 + 1.4) mm × 0.75 kg/m²/mm board (board density from memory) = 1.42 kg.
    expect(plan.package.weightKg).toBeCloseTo(1.42, 9);
    expect(plan.findings.find((f) => f.code === "hanging")).toMatchObject({ severity: "info" });
    expect(plan.findings.find((f) => f.code === "hanging")!.message).toContain("two wall points");
    expect(codes(plan)).toContain("glass-handling");
  });

  it("when the glazing is 2 mm acrylic, then it weighs 0.2 m² × 2 mm × 1.19 kg/m²/mm", () => {
    // Acrylic (PMMA) about 1,190 kg/m³ (from memory, docs/trade.md §8).
    const { plan } = planOf({ ...OUTER_500x400, glazing: { material: "acrylic", thickness: 2 } });
    expect(plan.glazing.weightKg).toBeCloseTo(0.476, 9);
    expect(codes(plan)).not.toContain("glass-handling");
  });

  it("when the package weighs 10 kg or more, then the hanging caution becomes a warning to lift with two people", () => {
    // 1000 × 1000 mm outer with 4 mm glass: 1 m² × 4 × 2.5 = 10 kg of glass alone. 10 kg threshold: common practice (no source).
    const { plan } = planOf({
      unit: "mm",
      sheet: { width: 810, height: 810 },
      window: { all: { mode: "overlap", overlap: 5 } },
      borders: { all: 100 },
      glazing: { material: "glass", thickness: 4 },
    });
    expect(plan.glazing.weightKg).toBe(10);
    const hanging = plan.findings.find((f) => f.code === "hanging")!;
    expect(hanging.severity).toBe("warn");
    expect(hanging.message).toContain("two people");
  });

  it("when no glazing is chosen, then no weight is given", () => {
    const { plan } = planOf(OUTER_500x400);
    expect(plan.glazing.weightKg).toBeUndefined();
    expect(plan.package.weightKg).toBeUndefined();
    expect(codes(plan)).not.toContain("hanging");
  });
});

describe("board yield", () => {
  it("when the outer does not fit on the board sheet, then the plan says so", () => {
    const { plan } = planOf({ ...A4_OVERLAP_5, boardSheet: { width: 250, height: 250 } });
    expect(plan.yield?.perSheet).toBe(0);
    expect(plan.findings.find((f) => f.code === "board-too-small")).toMatchObject({ severity: "error" });
  });

  it("when the outer fits, then the yield is at least one blank a sheet", () => {
    // 32 × 40 in full sheet: suppliers' size.
    const { plan } = planOf({ ...A4_OVERLAP_5, boardSheet: { width: "32in", height: "40in" } });
    expect(plan.yield?.perSheet).toBeGreaterThanOrEqual(1);
    expect(codes(plan)).not.toContain("board-too-small");
  });
});

describe("conservation checks", () => {
  const base = (over: Partial<MountPlanInput>): MountPlan => planOf({ ...A4_OVERLAP_5, ...GOOD, ...over }).plan;
  const verdict = (id: string, over: Partial<MountPlanInput>) => checkOf(base(over), id).verdict;
  const mat = (m: NonNullable<MountPlanInput["materials"]>) => ({ materials: { ...GOOD.materials, ...m } });

  it("when the plan is computed, then it carries the eight named rules, each with a reason and a source", () => {
    const plan = base({});
    expect(plan.checks.map((c) => c.id)).toEqual([
      "overlap-minimum",
      "glazing-separation",
      "archival-boards",
      "photo-board",
      "friable-glazing",
      "reversible-attachment",
      "hinge-placement",
      "uv-glazing",
    ]);
    for (const c of plan.checks) {
      expect(c.reason.length, c.id).toBeGreaterThan(0);
      expect(c.source.length, c.id).toBeGreaterThan(0);
    }
    expect(plan.checks.every((c) => c.verdict === "pass")).toBe(true);
    expect(plan.level).toBe("pass");
  });

  it("when every overlapped side meets the minimum, then check 1 passes; when one is short, then it fails", () => {
    expect(verdict("overlap-minimum", {})).toBe("pass");
    expect(verdict("overlap-minimum", { window: { all: { mode: "overlap", overlap: 4.5 } } })).toBe("fail");
  });

  it("when the studio minimum is 3 mm, then a 4 mm overlap passes check 1 (the minimum is a studio setting)", () => {
    const input = { ...A4_OVERLAP_5, window: { all: { mode: "overlap" as const, overlap: 4 } } };
    expect(checkOf(planOf(input, { minOverlapMm: 3, rebateClearanceMm: 2 }).plan, "overlap-minimum").verdict).toBe("pass");
    expect(checkOf(planOf(input).plan, "overlap-minimum").verdict).toBe("fail");
    // A minimum given in the plan wins over the studio's.
    expect(checkOf(planOf({ ...input, minOverlap: 3 }).plan, "overlap-minimum").verdict).toBe("pass");
  });

  it("when a window board is present, then check 2 passes (NEDCC 4.10), naming a spacer when there is one", () => {
    // The planner always plans a window mount, so this rule has no other verdict.
    expect(checkOf(base({}), "glazing-separation")).toMatchObject({ verdict: "pass", source: "NEDCC Preservation Leaflet 4.10" });
    expect(checkOf(base({ spacer: { depth: 3 } }), "glazing-separation").reason).toContain("3 mm spacer");
  });

  it("when the board is museum or conservation grade, then check 3 passes; not chosen warns; 'other' fails", () => {
    // NEDCC Preservation Leaflet 4.10; docs/trade.md §5: "other" fails check 3.
    expect(verdict("archival-boards", mat({ boardGrade: "museum" }))).toBe("pass");
    expect(verdict("archival-boards", mat({ boardGrade: "conservation" }))).toBe("pass");
    expect(verdict("archival-boards", mat({ boardGrade: undefined }))).toBe("warn");
    expect(verdict("archival-boards", mat({ boardGrade: "other" }))).toBe("fail");
  });

  it("when foam board, kraft paper, pressure-sensitive tape or transfer tape is near the object, then check 3 fails naming it", () => {
    for (const bad of ["foam-board", "kraft-paper", "pressure-sensitive-tape", "self-adhesive-transfer-tape"] as const) {
      const c = checkOf(base(mat({ present: [bad] })), "archival-boards");
      expect(c.verdict, bad).toBe("fail");
      expect(c.reason).toContain(bad.replace(/-/g, " "));
    }
  });

  describe("check 4, photographs (ISO 18916 PAT; ISO 18902; CCAHA)", () => {
    const photo = (process: NonNullable<MountPlanInput["object"]>["photoProcess"], m: NonNullable<MountPlanInput["materials"]>) =>
      verdict("photo-board", { object: { objectType: "photograph", photoProcess: process }, ...mat(m) });

    it("when the object is not a photograph, then the rule does not apply and passes", () => {
      expect(checkOf(base({}), "photo-board")).toMatchObject({ verdict: "pass", reason: "Not a photograph: this rule does not apply." });
    });

    it("when the board has passed the PAT, then a gelatin silver print passes", () => {
      expect(photo("gelatin-silver", { patPassed: true })).toBe("pass");
    });

    it("when the PAT is not recorded, then it warns; when the board failed it, then it fails", () => {
      expect(photo("gelatin-silver", { patPassed: undefined })).toBe("warn");
      expect(photo("gelatin-silver", { patPassed: false })).toBe("fail");
    });

    it("when a cyanotype goes on buffered board, then it fails even with a PAT-passed board", () => {
      // Unbuffered board for cyanotype: research consensus (docs/trade.md §5).
      expect(photo("cyanotype", { patPassed: true, buffered: true })).toBe("fail");
      expect(photo("cyanotype", { patPassed: true, buffered: false })).toBe("pass");
      expect(photo("cyanotype", { patPassed: true, buffered: undefined })).toBe("warn");
    });

    it("when an albumen print goes on buffered board, then it warns (unbuffered is often chosen)", () => {
      // CCAHA, "ISO standards for housing photographs".
      for (const p of ["albumen", "salted-paper", "platinum-palladium", "dye-transfer", "collodion"] as const)
        expect(photo(p, { patPassed: true, buffered: true }), p).toBe("warn");
    });
  });

  describe("check 5, friable media (State Archives of Florida)", () => {
    const friable = { object: { objectType: "drawing" as const, sensitivities: ["friable-media" as const] } };

    it("when friable media goes under acrylic, then it fails; a pastel object type counts as friable", () => {
      expect(verdict("friable-glazing", { ...friable, glazing: { material: "acrylic", thickness: 3, uvFiltering: true } })).toBe("fail");
      expect(verdict("friable-glazing", { object: { objectType: "pastel" }, glazing: { material: "acrylic", thickness: 3, uvFiltering: true } })).toBe("fail");
    });

    it("when friable media is under glass without deeper spacing, then it warns; with a spacer or a double mount, then it passes", () => {
      expect(verdict("friable-glazing", friable)).toBe("warn");
      expect(verdict("friable-glazing", { ...friable, spacer: { depth: 3 } })).toBe("pass");
      expect(verdict("friable-glazing", { ...friable, doubleMount: { reveal: 4 } })).toBe("pass");
    });

    it("when no glazing is chosen for friable media, then it warns; with no friable media, then it passes", () => {
      expect(verdict("friable-glazing", { ...friable, glazing: undefined })).toBe("warn");
      expect(verdict("friable-glazing", { glazing: { material: "acrylic", thickness: 3 } })).toBe("pass");
    });
  });

  describe("check 6, reversible attachment (Library of Congress, Matting and Hinging)", () => {
    it("when hinges are pasted with wheat, rice starch or methyl cellulose, then it passes", () => {
      for (const a of ["wheat-starch-paste", "rice-starch-paste", "methyl-cellulose"] as const) expect(verdict("reversible-attachment", mat({ adhesive: a })), a).toBe("pass");
      expect(checkOf(base({}), "reversible-attachment").reason).toContain("1/8 in");
    });

    it("when pressure-sensitive tape is the attachment or the adhesive, then it fails", () => {
      expect(verdict("reversible-attachment", mat({ attachment: "pressure-sensitive-tape", adhesive: undefined }))).toBe("fail");
      expect(verdict("reversible-attachment", mat({ adhesive: "pressure-sensitive" }))).toBe("fail");
    });

    it("when a hinge adhesive is another kind, then it fails; when it is not recorded, then it warns", () => {
      expect(verdict("reversible-attachment", mat({ adhesive: "other" }))).toBe("fail");
      expect(verdict("reversible-attachment", mat({ adhesive: undefined }))).toBe("warn");
    });

    it("when no attachment is chosen, then it warns; corners pass without adhesive", () => {
      expect(verdict("reversible-attachment", mat({ attachment: undefined }))).toBe("warn");
      expect(verdict("reversible-attachment", mat({ attachment: "corners", adhesive: undefined }))).toBe("pass");
    });
  });

  describe("check 7, hinge placement (common practice; Library of Congress)", () => {
    it("when T-hinges run along the top of an A4 sheet under a window, then it passes", () => {
      expect(verdict("hinge-placement", {})).toBe("pass");
    });

    it("when hinges run along more than the top edge, or are too few for the size, then it warns", () => {
      expect(verdict("hinge-placement", mat({ hingeEdge: "all-edges" }))).toBe("warn");
      // An 841 mm wide A1 sheet on its side (ISO 216) wants three or more hinges: two, plus one per further
      // 350 mm or so of top edge (common practice (no source)).
      const c = checkOf(base({ sheet: { width: 841, height: 594 }, ...mat({ hingeCount: 2 }) }), "hinge-placement");
      expect(c.verdict).toBe("warn");
      expect(c.reason).toContain("3 or more");
      expect(checkOf(base({ sheet: { width: 420, height: 594 }, ...mat({ hingeCount: 2 }) }), "hinge-placement").verdict).toBe("pass");
    });

    it("when a sheet floats on T-hinges, then it fails; on corners, then it warns; on edge strips, then it passes", () => {
      const float = { window: { all: { mode: "float" as const, reveal: 10 } } };
      expect(verdict("hinge-placement", { ...float })).toBe("fail");
      expect(verdict("hinge-placement", { ...float, ...mat({ attachment: "corners", adhesive: undefined }) })).toBe("warn");
      expect(verdict("hinge-placement", { ...float, ...mat({ attachment: "edge-strips", adhesive: undefined }) })).toBe("pass");
    });

    it("when no attachment is chosen, then it warns", () => {
      expect(verdict("hinge-placement", mat({ attachment: undefined }))).toBe("warn");
    });
  });

  describe("check 8, UV-filtering glazing (NEDCC 4.10)", () => {
    const light = { object: { objectType: "print" as const, sensitivities: ["light-sensitive" as const] } };

    it("when a light-sensitive object has UV-filtering glazing, then it passes; without UV filtering, then it fails", () => {
      expect(verdict("uv-glazing", light)).toBe("pass");
      expect(verdict("uv-glazing", { ...light, glazing: { material: "glass", thickness: 2, uvFiltering: false } })).toBe("fail");
      expect(verdict("uv-glazing", { ...light, glazing: { material: "glass", thickness: 2 } })).toBe("fail");
    });

    it("when no glazing is chosen for a light-sensitive object, then it warns", () => {
      expect(verdict("uv-glazing", { ...light, glazing: undefined })).toBe("warn");
    });

    it("when an unflagged work on paper or a very sensitive medium is under plain glass, then it fails too", () => {
      // An unflagged work on paper is very sensitive, the cautious default; watercolours and colour photographs
      // are very sensitive too (NISO Z39.79 via NEDCC Preservation 101; docs/trade.md §7). UV filtering for them: NEDCC 4.10.
      const plain = { glazing: { material: "glass" as const, thickness: 2 } };
      expect(verdict("uv-glazing", { ...plain, object: { objectType: "print" } })).toBe("fail");
      expect(verdict("uv-glazing", { ...plain, object: { objectType: "watercolour" } })).toBe("fail");
      expect(verdict("uv-glazing", { ...plain, object: { objectType: "photograph", photoProcess: "chromogenic" } })).toBe("fail");
      expect(verdict("uv-glazing", plain)).toBe("fail");
      expect(verdict("uv-glazing", { glazing: { material: "glass", thickness: 2, uvFiltering: true }, object: { objectType: "watercolour" } })).toBe("pass");
    });
  });

  describe("level", () => {
    it("when every check passes, then the level is pass", () => {
      expect(base({}).level).toBe("pass");
    });

    it("when the worst check warns, then the level is warn", () => {
      const plan = base(mat({ boardGrade: undefined }));
      expect(plan.checks.filter((c) => c.verdict !== "pass").map((c) => [c.id, c.verdict])).toEqual([["archival-boards", "warn"]]);
      expect(plan.level).toBe("warn");
    });

    it("when any check fails, then the level is fail whatever the others say", () => {
      const plan = base({ ...mat({ boardGrade: undefined }), object: { objectType: "print", sensitivities: ["light-sensitive"] }, glazing: { material: "glass", thickness: 2 } });
      expect(plan.checks.map((c) => c.verdict)).toContain("warn");
      expect(plan.level).toBe("fail");
    });

    it("when every check passes but a finding is an error, then the level is fail", () => {
      const plan = base({ borders: { all: 4 } });
      expect(plan.checks.every((c) => c.verdict === "pass")).toBe(true);
      expect(plan.findings.some((f) => f.severity === "error")).toBe(true);
      expect(plan.level).toBe("fail");
    });
  });
});

describe("impossible plans", () => {
  it("when an overlap is negative, then it is refused at window.all.overlap", () => {
    expect(Object.keys(refusalOf({ ...A4_OVERLAP_5, window: { all: { mode: "overlap", overlap: -2 } } }))).toEqual(["window.all.overlap"]);
  });

  it("when one side's overlap is negative, then the path names that side", () => {
    const fields = refusalOf({
      ...A4_OVERLAP_5,
      window: { left: { mode: "overlap", overlap: 5 }, top: { mode: "overlap", overlap: 5 }, right: { mode: "overlap", overlap: "-1" }, bottom: { mode: "overlap", overlap: 5 } },
    });
    expect(Object.keys(fields)).toEqual(["window.right.overlap"]);
    expect(fields["window.right.overlap"]).toContain("Right edge");
  });

  it("when the sheet width is 0, then it is refused at sheet.width", () => {
    const fields = refusalOf({ ...A4_OVERLAP_5, sheet: { width: 0, height: 297 } });
    expect(fields).toEqual({ "sheet.width": "Sheet width must be greater than 0." });
  });

  it("when the overlaps take the whole sheet, then it is refused at window", () => {
    const fields = refusalOf({ ...A4_OVERLAP_5, window: { all: { mode: "overlap", overlap: 105 } } });
    expect(Object.keys(fields)).toEqual(["window"]);
    expect(fields.window).toContain("no window across");
  });

  it("when the overlaps leave less than one cutting step, then it is refused rather than giving a 0 mm window", () => {
    // 210 − 2 × 104.9 = 0.2 mm, which rounds down to 0 at the 0.5 mm step.
    const fields = refusalOf({ ...A4_OVERLAP_5, window: { all: { mode: "overlap", overlap: 104.9 } } });
    expect(Object.keys(fields)).toEqual(["window"]);
    // A custom window narrower than the smallest size (5 mm) is refused by the contract, at its field.
    const custom = MountPlanInputSchema.safeParse({ ...A4_OVERLAP_5, window: { mode: "custom", width: 0.3, height: 100, left: 10, top: 10 } });
    expect(custom.success).toBe(false);
    expect(custom.error!.issues.map((i) => i.path.join("."))).toEqual(["window.width"]);
  });

  it("when the fitted outer is narrower than the window, then it is refused at fitOuter.width", () => {
    const fields = refusalOf({ ...A4_OVERLAP_5, fitOuter: { width: 150, height: 400 } });
    expect(Object.keys(fields)).toEqual(["fitOuter.width"]);
    expect(fields["fitOuter.width"]).toContain("200 mm");
  });

  it("when the fitted outer leaves no room for the bottom weighting, then it is refused at fitOuter.height", () => {
    expect(Object.keys(refusalOf({ ...A4_OVERLAP_5, fitOuter: { width: 300, height: 297 }, bottomWeight: 10 }))).toEqual(["fitOuter.height"]);
  });

  it("when a length cannot be read, such as 7 5/x, then it is refused at that field", () => {
    const fields = refusalOf({ unit: "in", sheet: { width: "7 5/x", height: 10 }, window: { all: { mode: "overlap", overlap: "3/16" } } });
    expect(Object.keys(fields)).toEqual(["sheet.width"]);
    expect(fields["sheet.width"]).toContain("7 5/x");
  });

  it("when the cutting step does not suit the unit, then it is refused at precision", () => {
    expect(Object.keys(refusalOf({ ...A4_OVERLAP_5, precision: 0.25 }))).toEqual(["precision"]);
    expect(Object.keys(refusalOf({ unit: "in", precision: 10, sheet: { width: 8, height: 10 }, window: { all: { mode: "overlap", overlap: "1/4" } } }))).toEqual(["precision"]);
  });

  it("when the double mount reveal is as wide as a border, then it is refused at doubleMount.reveal", () => {
    expect(Object.keys(refusalOf({ ...A4_OVERLAP_5, borders: { all: 20 }, doubleMount: { reveal: 20 } }))).toEqual(["doubleMount.reveal"]);
  });
});

describe("the drawing model", () => {
  const numbersOf = (s: Shape): number[] => Object.values(s).filter((v): v is number => typeof v === "number");
  const drawingOf = (input: MountPlanInput) => {
    const { geometry } = planOf(input);
    return { geometry, drawing: planDrawing(geometry, [{ edge: "top", offset: 20, width: 25 }]) };
  };
  const band = (shapes: Shape[], side: string) =>
    shapes.find((s) => s.kind === "rect" && s.role.startsWith("band-") && s.side === side) as Extract<Shape, { kind: "rect" }> | undefined;

  const CASES: [string, MountPlanInput][] = [
    ["A4 with overlap", A4_OVERLAP_5],
    ["8 × 10 in with a double mount", { unit: "in", sheet: { width: 8, height: 10 }, window: { all: { mode: "overlap", overlap: "1/4" } }, doubleMount: { reveal: "3/16" } }],
    ["a float", { ...A4_OVERLAP_5, window: { all: { mode: "float", reveal: 10 } } }],
    [
      "a custom window past the sheet",
      { ...A4_OVERLAP_5, window: { mode: "custom", width: 200, height: 280, left: -4, top: 8 }, imageBorders: { left: 10, top: 10, right: 10, bottom: 10 } },
    ],
  ];

  it.each(CASES)("when drawing %s, then no shape has a NaN or infinite number and the view box is finite", (_name, input) => {
    const { drawing } = drawingOf(input);
    expect(drawing.shapes.length).toBeGreaterThan(0);
    for (const s of drawing.shapes) for (const n of numbersOf(s)) expect(Number.isFinite(n), JSON.stringify(s)).toBe(true);
    for (const s of drawing.shapes) if (s.kind === "path") expect(s.d).not.toMatch(/NaN|Infinity/);
    expect(drawing.viewBox.every(Number.isFinite)).toBe(true);
    expect(drawing.viewBox[2]).toBeGreaterThan(0);
    expect(drawing.viewBox[3]).toBeGreaterThan(0);
  });

  it.each(CASES)("when drawing %s, then the window rectangle is the aperture and sits at the top and left borders", (_name, input) => {
    const { geometry, drawing } = drawingOf(input);
    const win = drawing.shapes.find((s) => s.kind === "rect" && s.role === "window");
    expect(win).toEqual({ kind: "rect", role: "window", x: geometry.borders.left, y: geometry.borders.top, width: geometry.aperture.width, height: geometry.aperture.height });
    const sheet = drawing.shapes.find((s) => s.kind === "rect" && s.role === "sheet") as Extract<Shape, { kind: "rect" }>;
    expect(sheet.x).toBeCloseTo(geometry.borders.left - geometry.overlap.left, 9);
    expect(sheet.y).toBeCloseTo(geometry.borders.top - geometry.overlap.top, 9);
    const backing = drawing.shapes.find((s) => s.kind === "rect" && s.role === "backing");
    expect(backing).toMatchObject({ x: 0, y: 0, width: geometry.outer.width, height: geometry.outer.height });
  });

  it("when every overlap meets the minimum, then all four bands pass and are as wide as the overlap", () => {
    const { drawing } = drawingOf(A4_OVERLAP_5);
    for (const side of ["left", "top", "right", "bottom"]) {
      const b = band(drawing.shapes, side)!;
      expect(b.role, side).toBe("band-pass");
      expect(side === "left" || side === "right" ? b.width : b.height).toBeCloseTo(5, 9);
    }
  });

  it("when the left overlap is short, then the left band is a fail band and the others pass", () => {
    const { drawing } = drawingOf({ ...A4_OVERLAP_5, window: { mode: "custom", width: 200, height: 280, left: 3, top: 8 } });
    expect(band(drawing.shapes, "left")!.role).toBe("band-fail");
    expect(band(drawing.shapes, "left")!.x).toBeCloseTo(50 - 3, 9);
    for (const side of ["top", "right", "bottom"]) expect(band(drawing.shapes, side)!.role, side).toBe("band-pass");
  });

  it("when the sheet floats, then every band is a float band drawn inside the window", () => {
    const { geometry, drawing } = drawingOf({ ...A4_OVERLAP_5, window: { all: { mode: "float", reveal: 10 } } });
    for (const side of ["left", "top", "right", "bottom"]) expect(band(drawing.shapes, side)!.role, side).toBe("band-float");
    expect(band(drawing.shapes, "left")).toMatchObject({ x: geometry.borders.left, width: 10 });
    expect(drawing.shapes.some((s) => s.kind === "text" && s.text === "reveal 10 mm")).toBe(true);
  });

  it("when there is a double mount, then the top board is drawn; when there is none, then it is not", () => {
    expect(drawingOf(at(CASES, 1)[1]).drawing.shapes.some((s) => s.role === "top-board")).toBe(true);
    expect(drawingOf(A4_OVERLAP_5).drawing.shapes.some((s) => s.role === "top-board")).toBe(false);
  });

  it("when a hinge is marked on the top edge, then it straddles the sheet's top edge at its offset", () => {
    const { geometry, drawing } = drawingOf(A4_OVERLAP_5);
    const hinge = drawing.shapes.find((s) => s.role === "hinge") as Extract<Shape, { kind: "rect" }>;
    const sheetTop = geometry.borders.top - geometry.overlap.top;
    expect(hinge.x).toBeCloseTo(geometry.borders.left - geometry.overlap.left + 20, 9);
    expect(hinge.width).toBe(25);
    expect(hinge.y + hinge.height / 2).toBeCloseTo(sheetTop, 9);
  });
});

describe("units of the computed plan", () => {
  it("when the plan is in inches, then its numbers are decimal inches and the mm geometry is exact", () => {
    const { plan, geometry } = planOf({ unit: "in", precision: 8, sheet: { width: "8", height: "10" }, window: { all: { mode: "overlap", overlap: "1/4" } }, borders: { all: 2 } });
    expect(plan.unit).toBe("in");
    expect(plan.precision).toBe(8);
    expect(geometry.stepMm).toBe(MM_PER_INCH / 8);
    expect(plan.aperture).toEqual({ width: 7.5, height: 9.5 });
    expect(plan.outer).toEqual({ width: 11.5, height: 13.5 });
    expect(plan.display.outer).toBe("11 1/2 × 13 1/2 in");
  });
});

describe("the plan's level and cross-checks", () => {
  it("when a warning finding is the worst thing, then the plan's level is warn", () => {
    // A 6 mm overlap over a 4 mm white border covers 2 mm of the image (common practice (no source): warn, not fail).
    const { plan } = planOf({
      unit: "mm",
      sheet: { width: 210, height: 297 },
      imageBorders: { left: 4, top: 4, right: 4, bottom: 4 },
      window: { all: { mode: "overlap", overlap: 6 } },
      glazing: { material: "glass", thickness: 2, uvFiltering: true },
      materials: { boardGrade: "museum", attachment: "t-hinge", adhesive: "wheat-starch-paste", hingeCount: 2, hingeEdge: "top" },
    });
    expect(plan.findings.some((f) => f.code === "window-covers-image" && f.severity === "warn")).toBe(true);
    expect(plan.checks.every((c) => c.verdict === "pass")).toBe(true);
    expect(plan.level).toBe("warn");
  });

  it("when a custom window opens past the sheet, then that side is an error whatever the hinges", () => {
    const { plan } = planOf({
      unit: "mm",
      sheet: { width: 210, height: 297 },
      window: { mode: "custom", width: 210, height: 280, left: 5, top: 8 },
      materials: { attachment: "t-hinge", adhesive: "wheat-starch-paste" },
    });
    expect(plan.findings.filter((f) => f.code === "window-off-sheet").map((f) => f.side)).toEqual(["right"]);
    expect(plan.level).toBe("fail");
  });

  it("when the attachment is pressure-sensitive tape, then the archival check fails too (NEDCC leaflet 4.10)", () => {
    const { plan } = planOf({
      unit: "mm",
      sheet: { width: 210, height: 297 },
      window: { all: { mode: "overlap", overlap: 5 } },
      materials: { boardGrade: "museum", attachment: "pressure-sensitive-tape" },
    });
    expect(plan.checks.find((c) => c.id === "archival-boards")?.verdict).toBe("fail");
    expect(plan.checks.find((c) => c.id === "reversible-attachment")?.verdict).toBe("fail");
  });
});
