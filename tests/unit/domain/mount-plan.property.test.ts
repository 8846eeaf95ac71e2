import { describe, expect, it } from "vitest";
import fc from "fast-check";
import { computePlan, type PlanContext, type PlanGeometry } from "../../../shared/domain/mount-plan/compute.ts";
import { planDrawing } from "../../../shared/domain/mount-plan/drawing.ts";
import { MountPlanInputSchema, SIDES, type MountPlan, type MountPlanInput, type SideName } from "../../../shared/schemas/mount-plan.ts";
import { lengthInputValue, MM_PER_INCH, parseLength, type Unit } from "../../../shared/domain/units.ts";
import { at } from "../../setup/lists.ts";

// 1 in = 25.4 mm exactly (1959 agreement; NIST Handbook 44, Appendix C).
// Studio defaults 5 mm minimum overlap and 2 mm clearance: common practice (no source).
const CTX: PlanContext = { minOverlapMm: 5, rebateClearanceMm: 2 };
const EXACT = 1e-9;
/**
 * roundTo forgives 1e-9 of a step as float noise (so 0.3 / 0.1 still counts as 3 steps), so an
 * aperture can come out up to 1e-9 × step larger than exact: 3.2e-9 mm at 1/8 in. Comparisons
 * after rounding allow that much, and never less than EXACT.
 */
const noise = (stepMm: number) => EXACT * Math.max(1, stepMm);
const PRECISIONS: { mm: readonly number[]; in: readonly number[] } = { mm: [0.1, 0.5, 1], in: [8, 16, 32] };
const stepMmOf = (unit: Unit, precision: number) => (unit === "in" ? MM_PER_INCH / precision : precision);

type Typed = { value: number | string; mm: number };

function mmOf(value: number | string, unit: Unit): number {
  const r = parseLength(value, unit);
  if (!r.ok) throw new Error(`generator made an unreadable length ${JSON.stringify(value)} (${unit}): ${r.message}`);
  return r.mm;
}

function gcd(a: number, b: number): number {
  return b === 0 ? a : gcd(b, a % b);
}

/** Inches as a person types them: 7 5/8, 7-5/8, 5/8, 7.625 or a number. */
function inchText(ticks: number, den: number, style: number): number | string {
  const sign = ticks < 0 ? "-" : "";
  const t = Math.abs(ticks);
  const whole = Math.floor(t / den);
  const rest = t % den;
  if (style === 0 || rest === 0) return ticks / den;
  if (style === 1) return `${sign}${(t / den).toString()}`;
  const g = gcd(rest, den);
  const frac = `${rest / g}/${den / g}`;
  if (whole === 0) return `${sign}${frac}`;
  return style === 2 ? `${sign}${whole} ${frac}` : `${sign}${whole}-${frac}`;
}

/** A length between minMm and maxMm, typed in the plan's unit the ways a framer might type it, with its millimetres. */
function typedLength(unit: Unit, minMm: number, maxMm: number): fc.Arbitrary<Typed> {
  let arb: fc.Arbitrary<number | string>;
  if (unit === "in") {
    const lo = Math.ceil((minMm / MM_PER_INCH) * 64);
    const hi = Math.floor((maxMm / MM_PER_INCH) * 64);
    arb = fc.oneof(
      fc.tuple(fc.integer({ min: lo, max: hi }), fc.integer({ min: 0, max: 3 })).map(([t, style]) => inchText(t, 64, style)),
      fc.double({ min: minMm / MM_PER_INCH, max: maxMm / MM_PER_INCH, noNaN: true, noDefaultInfinity: true }),
    );
  } else {
    arb = fc.oneof(
      fc.integer({ min: Math.ceil(minMm * 10), max: Math.floor(maxMm * 10) }).map((t) => t / 10),
      fc.integer({ min: Math.ceil(minMm * 10), max: Math.floor(maxMm * 10) }).map((t) => String(t / 10)),
      fc.double({ min: minMm, max: maxMm, noNaN: true, noDefaultInfinity: true }),
    );
  }
  return arb.map((value) => ({ value, mm: mmOf(value, unit) })).filter((t) => t.mm >= minMm - EXACT && t.mm <= maxMm + EXACT);
}

const unitAndPrecision = fc.constantFrom<Unit>("mm", "in").chain((unit) => fc.record({ unit: fc.constant(unit), precision: fc.constantFrom(...PRECISIONS[unit]) }));

type SideSpec = { spec: NonNullable<Extract<MountPlanInput["window"], { all: unknown }>["all"]>; requestedMm: number };

/** One side's window spec in any of the three modes, with the overlap it asks for (negative for a float). */
function sideArb(unit: Unit): fc.Arbitrary<SideSpec> {
  return fc.oneof(
    typedLength(unit, 0, 60).map((o) => ({ spec: { mode: "overlap" as const, overlap: o.value }, requestedMm: o.mm })),
    fc
      .tuple(typedLength(unit, 0, 40), typedLength(unit, -5, 10))
      .map(([b, c]) => ({ spec: { mode: "hide-border" as const, border: b.value, into: c.value }, requestedMm: b.mm + c.mm })),
    typedLength(unit, 0, 40).map((g) => ({ spec: { mode: "float" as const, reveal: g.value }, requestedMm: -g.mm })),
  );
}

type Case = { input: MountPlanInput; unit: Unit; stepMm: number; sheetMm: { width: number; height: number }; requested: Record<SideName, number> };

/** A plan's sheet and window in every window form ({ all }, per side, custom), both units and every precision. */
const windowCase: fc.Arbitrary<Case> = unitAndPrecision.chain(({ unit, precision }) =>
  fc.tuple(typedLength(unit, 150, 1500), typedLength(unit, 150, 1500)).chain(([w, h]) => {
    const base = { unit, precision, sheet: { width: w.value, height: h.value } };
    const make = (window: MountPlanInput["window"], requested: Record<SideName, number>): Case => ({
      input: { ...base, window },
      unit,
      stepMm: stepMmOf(unit, precision),
      sheetMm: { width: w.mm, height: h.mm },
      requested,
    });
    const all = sideArb(unit).map((s) => make({ all: s.spec }, { left: s.requestedMm, top: s.requestedMm, right: s.requestedMm, bottom: s.requestedMm }));
    const perSide = fc
      .tuple(sideArb(unit), sideArb(unit), sideArb(unit), sideArb(unit))
      .map(([l, t, r, b]) =>
        make({ left: l.spec, top: t.spec, right: r.spec, bottom: b.spec }, { left: l.requestedMm, top: t.requestedMm, right: r.requestedMm, bottom: b.requestedMm }),
      );
    const custom = fc
      .tuple(typedLength(unit, 10, w.mm), typedLength(unit, 10, h.mm), typedLength(unit, -20, 60), typedLength(unit, -20, 60))
      .map(([cw, ch, cl, ct]) =>
        make(
          { mode: "custom", width: cw.value, height: ch.value, left: cl.value, top: ct.value },
          { left: cl.mm, top: ct.mm, right: w.mm - cl.mm - cw.mm, bottom: h.mm - ct.mm - ch.mm },
        ),
      );
    return fc.oneof(all, perSide, custom);
  }),
);

/** Borders in each form the contract allows, or a fitted outer size, with optional bottom weighting. */
function withBorders(c: Case): fc.Arbitrary<Case & { fitOuterMm?: { width: number; height: number } }> {
  const L = (min: number, max: number) => typedLength(c.unit, min, max).map((t) => t.value);
  const weight = fc.oneof(
    fc.constant({}),
    L(0, 40).map((v) => ({ bottomWeight: v })),
    fc.double({ min: 0, max: 30, noNaN: true }).map((p) => ({ bottomWeightPercent: p })),
  );
  const borders = fc.oneof(
    fc.constant({}),
    L(0, 150).map((v) => ({ borders: { all: v } })),
    fc.tuple(L(0, 150), L(0, 150), L(0, 150)).map(([top, side, bottom]) => ({ borders: { top, side, bottom } })),
    fc.tuple(L(0, 150), L(0, 150), L(0, 150), L(0, 150)).map(([left, top, right, bottom]) => ({ borders: { left, top, right, bottom } })),
  );
  // The aperture is at most the sheet plus two 40 mm reveals, and the weighting at most 40 mm, so these outers always fit.
  const fit = fc.tuple(fc.double({ min: 90, max: 400, noNaN: true }), fc.double({ min: 130, max: 400, noNaN: true })).map(([ew, eh]) => {
    const mm = { width: c.sheetMm.width + ew, height: c.sheetMm.height + eh };
    const typed = (v: number) => (c.unit === "in" ? v / MM_PER_INCH : v);
    return { fitOuter: { width: typed(mm.width), height: typed(mm.height) }, fitOuterMm: mm };
  });
  return fc.tuple(fc.oneof(borders, fit), weight).map(([b, wgt]) => {
    const { fitOuterMm, ...rest } = b as { fitOuterMm?: { width: number; height: number } };
    return { ...c, input: { ...c.input, ...rest, ...wgt }, fitOuterMm };
  });
}

function compute(input: MountPlanInput): { plan: MountPlan; geometry: PlanGeometry } {
  const r = computePlan(MountPlanInputSchema.parse(input), CTX);
  if (!r.ok) throw new Error(`plan refused: ${JSON.stringify(r.fields)} for ${JSON.stringify(input)}`);
  return r;
}

const isMultipleOf = (v: number, step: number) => Math.abs(v - Math.round(v / step) * step) <= EXACT;

describe("mount plan properties", () => {
  it("property overlap-bound: when every side overlaps by at least the minimum, then the aperture is never larger than sheet − 2 × minimum on either axis", () => {
    const arb = unitAndPrecision.chain(({ unit, precision }) =>
      fc.tuple(typedLength(unit, 150, 1500), typedLength(unit, 150, 1500), fc.array(typedLength(unit, 0, 60), { minLength: 4, maxLength: 4 })).chain(([w, h, o]) => {
        const least = Math.min(...o.map((x) => x.mm));
        // The minimum is the least overlap itself, or any length below it.
        const min = least >= 1 ? fc.oneof(fc.constant(o.find((x) => x.mm === least)!), typedLength(unit, 0, least)) : fc.constant(o.find((x) => x.mm === least)!);
        return min.map((m) => ({ unit, precision, w, h, o, m }));
      }),
    );
    fc.assert(
      fc.property(arb, ({ unit, precision, w, h, o, m }) => {
        const side = (i: number) => ({ mode: "overlap" as const, overlap: at(o, i).value });
        const { geometry } = compute({
          unit,
          precision,
          sheet: { width: w.value, height: h.value },
          minOverlap: m.value,
          window: { left: side(0), top: side(1), right: side(2), bottom: side(3) },
        });
        expect(o.every((x) => x.mm >= m.mm)).toBe(true);
        const tol = noise(geometry.stepMm);
        expect(geometry.aperture.width).toBeLessThanOrEqual(w.mm - 2 * m.mm + tol);
        expect(geometry.aperture.height).toBeLessThanOrEqual(h.mm - 2 * m.mm + tol);
        expect(geometry.minOverlapMm).toBe(m.mm);
        for (const s of SIDES) expect(geometry.overlap[s]).toBeGreaterThanOrEqual(m.mm - tol);
      }),
      { numRuns: 300 },
    );
  });

  it("property outer-sum: when any plan is computed, then outer = aperture + left + right border and aperture + top + bottom border, exact to 1e-9", () => {
    fc.assert(
      fc.property(windowCase.chain(withBorders), (c) => {
        const { geometry: g } = compute(c.input);
        expect(Math.abs(g.outer.width - (g.aperture.width + g.borders.left + g.borders.right))).toBeLessThanOrEqual(EXACT);
        expect(Math.abs(g.outer.height - (g.aperture.height + g.borders.top + g.borders.bottom))).toBeLessThanOrEqual(EXACT);
        if (c.fitOuterMm) {
          // Fitting a ready-made frame: the outer is the frame's size, whatever the rounding did to the borders.
          expect(Math.abs(g.outer.width - c.fitOuterMm.width)).toBeLessThanOrEqual(1e-6);
          expect(Math.abs(g.outer.height - c.fitOuterMm.height)).toBeLessThanOrEqual(1e-6);
          expect(Math.abs(g.borders.left - g.borders.right)).toBeLessThan(g.stepMm + EXACT);
        }
        for (const s of SIDES) expect(g.borders[s]).toBeGreaterThanOrEqual(-EXACT);
      }),
      { numRuns: 300 },
    );
  });

  it("property unit-round-trip: when a length goes mm → in → mm through the input box text, then it comes back within half the 1/32 in input step, and a second trip changes nothing", () => {
    // Lengths may be negative: a custom window's position and a hide-border cover can be.
    const HALF_32ND = MM_PER_INCH / 32 / 2;
    fc.assert(
      fc.property(fc.double({ min: -3000, max: 3000, noNaN: true }), (mm) => {
        const text = lengthInputValue(mm, "in");
        const back = parseLength(text, "in");
        expect(back.ok, `"${text}" does not read back`).toBe(true);
        if (!back.ok) return;
        expect(Math.abs(back.mm - mm)).toBeLessThanOrEqual(HALF_32ND + EXACT);
        expect(lengthInputValue(back.mm, "in")).toBe(text);
      }),
      { numRuns: 1000 },
    );
  });

  it("property unit-round-trip (mm): when a length is written back as mm text and read again, then it is within 0.05 mm and stable", () => {
    fc.assert(
      fc.property(fc.double({ min: -3000, max: 3000, noNaN: true }), (mm) => {
        const text = lengthInputValue(mm, "mm");
        const back = parseLength(text, "mm");
        expect(back.ok, `"${text}" does not read back`).toBe(true);
        if (!back.ok) return;
        expect(Math.abs(back.mm - mm)).toBeLessThanOrEqual(0.05 + EXACT);
        expect(lengthInputValue(back.mm, "mm")).toBe(text);
      }),
      { numRuns: 1000 },
    );
  });

  it("property overlap-safe-rounding: when any window is rounded to any step in either unit, then no held side's overlap falls below the one asked and no float's reveal below the one asked", () => {
    fc.assert(
      fc.property(windowCase, (c) => {
        const { geometry } = compute(c.input);
        for (const s of SIDES) {
          if (geometry.modes[s] === "float") {
            // A float's overlap is minus its reveal: the reveal never shrinks, and grows by at most one step.
            expect(-geometry.overlap[s], `${s} reveal in ${JSON.stringify(c.input)}`).toBeGreaterThanOrEqual(-c.requested[s] - noise(c.stepMm));
            expect(-geometry.overlap[s]).toBeLessThanOrEqual(-c.requested[s] + c.stepMm + EXACT);
          } else {
            expect(geometry.overlap[s], `${s} in ${JSON.stringify(c.input)}`).toBeGreaterThanOrEqual(c.requested[s] - noise(c.stepMm));
            // …and the rounding takes at most one step across an axis, so no side gains more than that.
            expect(geometry.overlap[s]).toBeLessThanOrEqual(c.requested[s] + c.stepMm + EXACT);
          }
        }
        // The window sits where the overlaps say, and the sheet is what was asked for.
        expect(geometry.windowOnSheet).toEqual({ left: geometry.overlap.left, top: geometry.overlap.top });
        expect(Math.abs(geometry.overlap.left + geometry.aperture.width + geometry.overlap.right - c.sheetMm.width)).toBeLessThanOrEqual(1e-6);
        expect(Math.abs(geometry.overlap.top + geometry.aperture.height + geometry.overlap.bottom - c.sheetMm.height)).toBeLessThanOrEqual(1e-6);
      }),
      { numRuns: 500 },
    );
  });

  it("property aperture-on-step: when any window is computed, then the aperture is a whole number of cutting steps on both axes", () => {
    fc.assert(
      fc.property(windowCase, (c) => {
        const { geometry, plan } = compute(c.input);
        expect(geometry.stepMm).toBeCloseTo(c.stepMm, 12);
        expect(isMultipleOf(geometry.aperture.width, c.stepMm), `width ${geometry.aperture.width} on ${c.stepMm}`).toBe(true);
        expect(isMultipleOf(geometry.aperture.height, c.stepMm), `height ${geometry.aperture.height} on ${c.stepMm}`).toBe(true);
        expect(geometry.aperture.width).toBeGreaterThan(0);
        expect(geometry.aperture.height).toBeGreaterThan(0);
        // The API's numbers are in the plan's unit: for inches, whole steps of 1/precision in.
        if (c.unit === "in") expect(isMultipleOf(plan.aperture.width, 1 / (c.input.precision as number))).toBe(true);
      }),
      { numRuns: 500 },
    );
  });

  it("property yield-area-bound: when a board sheet is given, then the blanks per sheet never exceed sheet area ÷ outer area", () => {
    // Full sheets 32 × 40 in and 40 × 60 in (suppliers' sizes) and 1120 × 815 mm (common practice (no source)), or any other.
    const arb = windowCase.chain(withBorders).chain((c) =>
      fc
        .tuple(
          fc.oneof(
            fc.constantFrom({ width: 32 * MM_PER_INCH, height: 40 * MM_PER_INCH }, { width: 40 * MM_PER_INCH, height: 60 * MM_PER_INCH }, { width: 1120, height: 815 }),
            fc.record({ width: fc.double({ min: 200, max: 1600, noNaN: true }), height: fc.double({ min: 200, max: 1600, noNaN: true }) }),
          ),
          fc.option(fc.double({ min: 0, max: 5, noNaN: true }), { nil: undefined }),
        )
        .map(([sheet, kerf]) => {
          const typed = (v: number) => (c.unit === "in" ? v / MM_PER_INCH : v);
          return { ...c, input: { ...c.input, boardSheet: { width: typed(sheet.width), height: typed(sheet.height) }, ...(kerf === undefined ? {} : { kerf: typed(kerf) }) } };
        }),
    );
    fc.assert(
      fc.property(arb, (c) => {
        const { plan, geometry: g } = compute(c.input);
        const y = plan.yield!;
        expect(y).toBeDefined();
        const sheet = g.yield!.sheet;
        const bound = Math.floor((sheet.width * sheet.height) / (g.outer.width * g.outer.height) + EXACT);
        expect(Number.isInteger(y.perSheet)).toBe(true);
        expect(y.perSheet).toBeGreaterThanOrEqual(0);
        expect(y.perSheet).toBeLessThanOrEqual(bound);
        const fits =
          (g.outer.width <= sheet.width + EXACT && g.outer.height <= sheet.height + EXACT) || (g.outer.height <= sheet.width + EXACT && g.outer.width <= sheet.height + EXACT);
        expect(y.perSheet > 0).toBe(fits);
        expect(plan.findings.some((f) => f.code === "board-too-small")).toBe(!fits);
      }),
      { numRuns: 150 },
    );
  });

  // ── Shown figures (docs/trade.md §9): one unit, rounded once, parts adding up to the whole ──
  const shownCase = windowCase.chain(withBorders).chain((c) =>
    fc
      .record({
        display: fc.constantFrom<Unit>("mm", "in"),
        double: fc.option(typedLength(c.unit, 1, 6), { nil: undefined }),
      })
      .map(({ display, double }) => ({ ...c, display, input: { ...c.input, ...(double ? { doubleMount: { reveal: double.value } } : {}) } })),
  );
  const read = (text: string | undefined, unit: Unit): number => {
    if (text === undefined) throw new Error("no such figure in the plan's display");
    const r = parseLength(text.replace(/ (mm|in)$/, ""), unit);
    if (!r.ok) throw new Error(`unreadable figure ${text}`);
    return r.mm;
  };

  it("property figures-add-up: when any plan is shown in mm or in inches, then overlaps + window = sheet and borders + window = outer exactly, in the one unit shown", () => {
    fc.assert(
      fc.property(shownCase, (c) => {
        const r = computePlan(MountPlanInputSchema.parse(c.input), { ...CTX, displayUnit: c.display });
        if (!r.ok) return; // a top board whose reveal eats a border is refused; nothing is shown
        const d = r.plan.display;
        const u = c.display;
        expect(r.plan.displayUnit).toBe(u);
        const tol = 1e-6;
        const sum = (a: string, b: string, m: string) => read(d[a], u) + read(d[m], u) + read(d[b], u);
        expect(Math.abs(sum("overlap.left", "overlap.right", "aperture.width") - read(d["sheet.width"], u)), JSON.stringify(d)).toBeLessThanOrEqual(tol);
        expect(Math.abs(sum("overlap.top", "overlap.bottom", "aperture.height") - read(d["sheet.height"], u)), JSON.stringify(d)).toBeLessThanOrEqual(tol);
        expect(Math.abs(sum("borders.left", "borders.right", "aperture.width") - read(d["outer.width"], u)), JSON.stringify(d)).toBeLessThanOrEqual(tol);
        expect(Math.abs(sum("borders.top", "borders.bottom", "aperture.height") - read(d["outer.height"], u)), JSON.stringify(d)).toBeLessThanOrEqual(tol);
        // Every length written is in the unit shown (the minimum in inches also gives the studio's mm in brackets).
        const other = u === "in" ? / mm\b/ : / in\b/;
        for (const [k, v] of Object.entries(d)) expect(v, k).not.toMatch(other);
        for (const text of [...r.plan.findings.map((f) => f.message), ...r.plan.checks.map((x) => x.reason)]) {
          expect(text.replace(/\(\d+(\.\d+)? mm\)/g, "")).not.toMatch(u === "in" ? /\d mm\b/ : /\d in\b/);
        }
        // The drawing writes the same figures as the table.
        const labels = planDrawing(r.geometry)
          .shapes.filter((x) => x.kind === "text")
          .map((x) => (x as { text: string }).text);
        expect(labels).toContain(`outer ${d["outer.width"]}`);
        expect(labels).toContain(`window ${d["aperture.height"]}`);
        for (const s of SIDES) expect(labels).toContain(d[`borders.${s}`]);
      }),
      { numRuns: 400 },
    );
  });

  it("property equal-borders-shown-equal: when a side's border equals the opposite one, then they are shown as the same figure in either unit (common practice (no source): a mount cut with equal borders is read back as equal)", () => {
    fc.assert(
      fc.property(shownCase, (c) => {
        const r = computePlan(MountPlanInputSchema.parse(c.input), { ...CTX, displayUnit: c.display });
        if (!r.ok) return;
        const b = r.geometry.borders;
        const d = r.plan.display;
        const u = c.display;
        const grid = u === "in" ? MM_PER_INCH / 64 : 0.1;
        const coarse = u === c.unit ? grid : u === "in" ? MM_PER_INCH / 16 : 0.1;
        for (const [x, y, dim] of [
          ["left", "right", "width"],
          ["top", "bottom", "height"],
        ] as const) {
          if (Math.abs(b[x] - b[y]) >= 1e-9) continue;
          // The one exception: both overlaps on the axis were tight, so the shown window itself gave up a
          // grid step to keep them honest (see shown-overlap-honest); the borders then differ by that step.
          const usual = u === c.unit ? Math.round(r.geometry.aperture[dim] / grid) * grid : Math.floor(r.geometry.aperture[dim] / coarse + 1e-9) * coarse;
          const moved = Math.abs(read(d[`aperture.${dim}`], u) - usual) > 1e-6;
          if (!moved) expect(d[`borders.${x}`], JSON.stringify(d)).toBe(d[`borders.${y}`]);
          else expect(Math.abs(read(d[`borders.${x}`], u) - read(d[`borders.${y}`], u))).toBeLessThanOrEqual(grid + 1e-6);
        }
      }),
      { numRuns: 400 },
    );
  });

  it("property shown-overlap-honest: when a side passes the overlap check, then its shown overlap is at least the shown minimum; when it fails, less; a float never shows less reveal than asked", () => {
    fc.assert(
      fc.property(shownCase, (c) => {
        const r = computePlan(MountPlanInputSchema.parse(c.input), { ...CTX, displayUnit: c.display });
        if (!r.ok) return;
        const u = c.display;
        const d = r.plan.display;
        const min = read(d.minOverlap, u);
        expect(min).toBeGreaterThanOrEqual(CTX.minOverlapMm - 1e-9);
        for (const s of SIDES) {
          const shown = read(d[`overlap.${s}`], u);
          const truth = r.geometry.overlap[s];
          if (r.geometry.modes[s] === "float") {
            expect(-truth, `${s} true reveal`).toBeGreaterThanOrEqual(-c.requested[s] - 1e-9);
            // The asked reveal as shown on the same grid: never more than the reveal shown.
            const grid = u === "in" ? MM_PER_INCH / 64 : 0.1;
            expect(-shown, `${s} shown reveal ${d[`overlap.${s}`]}`).toBeGreaterThanOrEqual(Math.round(-c.requested[s] / grid) * grid - 1e-6);
          } else if (truth >= CTX.minOverlapMm - 1e-9) {
            expect(shown, `${s}: ${d[`overlap.${s}`]} against ${d.minOverlap}`).toBeGreaterThanOrEqual(min - 1e-6);
          } else {
            expect(shown, `${s}: ${d[`overlap.${s}`]} against ${d.minOverlap}`).toBeLessThan(min - 1e-6);
          }
          // Shown within two grid steps of the truth.
          expect(Math.abs(shown - truth)).toBeLessThanOrEqual(2 * (u === "in" ? MM_PER_INCH / 16 : 0.1) + 1e-6);
        }
      }),
      { numRuns: Number(process.env.PROPERTY_RUNS ?? 400) },
    );
  });

  it("an inch plan shown in mm whose window rounds down and whose failing side must show under the minimum spreads the rounding: each overlap within two grid steps of the truth (found by shown-overlap-honest)", () => {
    const input = {
      unit: "in",
      precision: 8,
      sheet: { width: 45.171875, height: 52.33735449311726 },
      window: {
        left: { mode: "hide-border", border: 0, into: 0 },
        top: { mode: "overlap", overlap: 0 },
        right: { mode: "float", reveal: 0.953125 },
        bottom: { mode: "overlap", overlap: "0.15625" },
      },
      borders: { all: "3 63/64" },
    };
    const r = computePlan(MountPlanInputSchema.parse(input), { minOverlapMm: 5, rebateClearanceMm: 2, displayUnit: "mm" });
    if (!r.ok) throw new Error("the plan should compute");
    for (const s of SIDES) expect(Math.abs(read(r.plan.display[`overlap.${s}`], "mm") - r.geometry.overlap[s]), s).toBeLessThanOrEqual(0.2 + 1e-6);
    // The bottom's true 4.997 mm fails the 5 mm minimum, so it shows under it; the parts still add up.
    expect(read(r.plan.display["overlap.bottom"], "mm")).toBeLessThan(5);
    expect(read(r.plan.display["overlap.top"], "mm") + read(r.plan.display["aperture.height"], "mm") + read(r.plan.display["overlap.bottom"], "mm")).toBeCloseTo(
      read(r.plan.display["sheet.height"], "mm"),
      6,
    );
  });

  it("property same-unit-exact: when a plan is shown in its own unit, then its window and outer size are shown exactly as computed", () => {
    fc.assert(
      fc.property(windowCase.chain(withBorders), (c) => {
        const r = computePlan(MountPlanInputSchema.parse(c.input), CTX);
        if (!r.ok) return;
        expect(read(r.plan.display["aperture.width"], c.unit)).toBeCloseTo(r.geometry.aperture.width, 6);
        expect(read(r.plan.display["aperture.height"], c.unit)).toBeCloseTo(r.geometry.aperture.height, 6);
      }),
      { numRuns: 300 },
    );
  });
});
