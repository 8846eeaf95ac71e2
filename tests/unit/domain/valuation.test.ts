import { describe, expect, it } from "vitest";
import { valuationIsOld, VALUATION_REVIEW_YEARS } from "../../../shared/domain/valuation.ts";
import { packageSize } from "../../../shared/domain/mounting.ts";

describe("valuations past review (docs/trade.md §15: revaluation every 3 to 5 years is common practice, no source)", () => {
  const on = new Date(2026, 11, 3, 15, 30);
  it(`flags a valuation more than ${VALUATION_REVIEW_YEARS} years before the day, and not one exactly that old`, () => {
    expect(valuationIsOld("2023-12-03", on)).toBe(false);
    expect(valuationIsOld("2023-12-02", on)).toBe(true);
    expect(valuationIsOld("2026-12-03", on)).toBe(false);
    expect(valuationIsOld("2015-04-01", on)).toBe(true);
  });
  it("does not flag a date it cannot read", () => {
    expect(valuationIsOld("not a date", on)).toBe(false);
  });
});

describe("the size as it leaves the studio (docs/trade.md §15)", () => {
  const result = { ok: true, geometry: { sight: { width: 400, height: 500 }, outer: { width: 410, height: 510 } } } as never;
  const data = (frame?: object) => ({ frame }) as never;
  it("is the frame's outside, sight + 2 × face width, when the face width is recorded (common practice, no source)", () => {
    expect(packageSize(data({ moulding: "Oak", faceWidthMm: 25 }), result)).toEqual({ kind: "framed", widthMm: 450, heightMm: 550 });
  });
  it("is the mount's outer size when the frame's face width is not recorded, and says it is framed", () => {
    expect(packageSize(data({ moulding: "Oak", faceWidthMm: null }), result)).toEqual({ kind: "framed-no-face-width", widthMm: 410, heightMm: 510 });
  });
  it("is the mount's outer size when no frame is recorded", () => {
    expect(packageSize(data(undefined), result)).toEqual({ kind: "mount", widthMm: 410, heightMm: 510 });
    expect(packageSize(data({ moulding: null, finish: null, faceWidthMm: null, rebateDepthMm: null }), result)).toEqual({ kind: "mount", widthMm: 410, heightMm: 510 });
  });
  it("is unknown when the plan cannot be built", () => {
    expect(packageSize(data({ faceWidthMm: 25 }), { ok: false, fields: {} } as never)).toBeNull();
  });
});
