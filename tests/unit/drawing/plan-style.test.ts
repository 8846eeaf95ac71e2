import { describe, expect, it } from "vitest";
import { MATERIAL_TONES, PALETTE } from "../../../shared/drawing/palette.ts";
import { arrowHeadPoints, drawnRect, embeddedWeight, PLAN_STYLE, PRINT_STYLE, scaledDash, textRotation } from "../../../shared/drawing/plan-style.ts";
import { at } from "../../setup/lists.ts";

describe("palette", () => {
  it("when the drawing's styles are read, then every colour in them is a palette token or a material tone", () => {
    const known = new Set([...Object.values(PALETTE).flatMap((t) => Object.values(t)), ...Object.values(MATERIAL_TONES)]);
    for (const [role, st] of Object.entries(PLAN_STYLE)) {
      for (const c of [st.fill, st.stroke, st.text, st.hatch?.ground, st.hatch?.line]) if (c !== undefined) expect(known, `${role}: ${c}`).toContain(c);
    }
  });
});

describe("plan drawing style on paper", () => {
  // The PDF draws lines at 0.8 of the screen's weight, so they print as hairlines (the values it has always used).
  it.each([
    ["image", 0.5, 0.4],
    ["backing", 0.75, 0.6],
    ["board", 1, 0.8],
    ["window", 1.25, 1],
  ] as const)("when a %s line is %s on screen, then it is %s on paper", (role, screen, paper) => {
    expect(PLAN_STYLE[role].width).toBe(screen);
    expect(PRINT_STYLE[role].width).toBe(paper);
  });

  // The PDF embeds Libre Franklin at 400, 600 and 700 only (server/lib/pdf/fonts.ts).
  it.each([
    [400, 400],
    [500, 400],
    [600, 600],
    [700, 700],
    [300, 400],
  ])("when text asks for weight %s, then the PDF sets it at %s", (asked, set) => {
    expect(embeddedWeight(asked)).toBe(set);
  });

  it("when a style is printed, then its colours are the screen's, the image flat instead of hatched and the hinge solid", () => {
    for (const [role, st] of Object.entries(PLAN_STYLE)) {
      const p = PRINT_STYLE[role as keyof typeof PRINT_STYLE];
      expect([p.fill, p.stroke, p.text, p.dash], role).toEqual([st.fill, st.stroke, st.text, st.dash]);
      expect(p.opacity, role).toBe(role === "hinge" ? undefined : st.opacity);
    }
    expect(PRINT_STYLE.image.fill).toBe(MATERIAL_TONES.imageFlat);
  });
});

describe("plan drawing geometry", () => {
  it("when a rectangle's side is negative, then it is drawn as nothing", () => {
    expect(drawnRect({ kind: "rect", role: "window", x: 1, y: 2, width: -3, height: 4 })).toEqual({ x: 1, y: 2, width: 0, height: 4 });
  });

  it("when a dash is scaled, then each of its lengths is", () => {
    expect(scaledDash("5 3", 2)).toBe("10 6");
  });

  it("when a text is turned, then it turns about its own anchor, written as each renderer writes it", () => {
    const s = { kind: "text", role: "dim-label", x: 10, y: 20, text: "x", anchor: "middle", rotate: 90, size: 3 } as const;
    expect(textRotation(s, " ")).toBe("rotate(90 10 20)");
    expect(textRotation(s, ", ")).toBe("rotate(90, 10, 20)");
    expect(textRotation({ ...s, rotate: undefined }, " ")).toBeUndefined();
  });

  it("when an arrowhead is drawn along the x axis, then its tip is the line's end and its barbs half a font size back", () => {
    const points = arrowHeadPoints(0, 0, 10, 0, 4)
      .split(" ")
      .map((p) => p.split(",").map(Number));
    const [tip, a, b] = [at(points, 0), at(points, 1), at(points, 2)];
    expect(tip).toEqual([10, 0]);
    expect(at(a, 0)).toBeCloseTo(10 - 2 * Math.cos(0.4), 9);
    expect(at(a, 1)).toBeCloseTo(2 * Math.sin(0.4), 9);
    expect(at(b, 1)).toBeCloseTo(-2 * Math.sin(0.4), 9);
  });
});
