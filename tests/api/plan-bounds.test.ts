import { beforeAll, describe, expect, it } from "vitest";
import { agentFor, createTestApp, expectErrorShape, makeObject, makeStudio, type Agent } from "../setup/test-app.ts";
import { mountings } from "../../server/db/schema.ts";

// Bounds: docs/trade.md §10 (a studio's largest board, about 60 × 104 in, sets the 3,000 mm size bound).
const t = createTestApp();
let framer: Agent;
let objectId: string;

// A4 = 210 × 297 mm (ISO 216); 5 mm overlap: common practice (no source).
const A4 = { unit: "mm", sheet: { width: 210, height: 297 }, window: { all: { mode: "overlap", overlap: 5 } } };
const MOUNTING = {
  reason: "first-mounting",
  mountedOn: "2026-03-02",
  data: {
    plan: A4,
    boards: { window: { grade: "museum", buffered: false, ply: 4 }, backing: { grade: "museum", buffered: false, ply: 4 } },
    attachment: { method: "corners", hinges: [] },
    glazing: { type: "uv-glass", thicknessMm: 2 },
    undoNotes: "Slide the sheet out of the corners.",
  },
};

beforeAll(async () => {
  const studio = await makeStudio(t);
  framer = await agentFor(t, studio.people.framer);
  objectId = makeObject(t.db, studio.institution.id);
});

/** Each length the plan takes, set past its bound, in the plan's own shape. */
const PAST: [string, Record<string, unknown>][] = [
  ["sheet.width", { sheet: { width: 3001, height: 297 } }],
  ["sheet.height", { unit: "in", sheet: { width: 8, height: "118 1/2" } }],
  ["window.all.overlap", { window: { all: { mode: "overlap", overlap: 501 } } }],
  ["window.all.reveal", { window: { all: { mode: "float", reveal: 201 } } }],
  ["window.width", { window: { mode: "custom", width: 3001, height: 100, left: 5, top: 5 } }],
  ["borders.all", { borders: { all: 1501 } }],
  ["fitOuter.width", { fitOuter: { width: 9000, height: 500 } }],
  ["glazing.thickness", { glazing: { material: "glass", thickness: 21 } }],
  ["spacer.depth", { spacer: { depth: 101 } }],
  ["frame.rebateDepth", { frame: { rebateDepth: 201 } }],
  ["boardSheet.width", { boardSheet: { width: 1e15, height: 800 } }],
  ["kerf", { boardSheet: { width: 1000, height: 800 }, kerf: 11 }],
  ["doubleMount.reveal", { doubleMount: { reveal: 250 } }],
  ["minOverlap", { minOverlap: "1e308" }],
];

describe("lengths past their bounds, and numbers that are not numbers", () => {
  it.each(PAST)("when %s is past its bound, then calculate answers 422 naming that field", async (field, over) => {
    const res = await framer.post("/api/mount-plans/calculate").send({ ...A4, ...over });
    expect(res.status, JSON.stringify(res.body)).toBe(422);
    expect(Object.keys(expectErrorShape(res.body, "validation_failed").fields ?? {})).toContain(field);
  });

  it.each(PAST)("when %s is past its bound in a saved plan, then saving the draft answers 422 and nothing is saved", async (field, over) => {
    const res = await framer.put(`/api/objects/${objectId}/plan`).send({ input: { ...A4, ...over } });
    expect(res.status).toBe(422);
    expect(Object.keys(expectErrorShape(res.body, "validation_failed").fields ?? {})).toContain(`input.${field}`);
    expect((await framer.get(`/api/objects/${objectId}/plan`)).body).toEqual({ draft: null });
  });

  it.each(PAST)("when %s is past its bound in a mounting record, then the record is refused naming data.plan and the field", async (field, over) => {
    const before = t.db.select().from(mountings).all().length;
    const res = await framer.post(`/api/objects/${objectId}/mountings`).send({ ...MOUNTING, data: { ...MOUNTING.data, plan: { ...A4, ...over } } });
    expect(res.status).toBe(422);
    expect(Object.keys(expectErrorShape(res.body, "validation_failed").fields ?? {})).toContain(`data.plan.${field}`);
    expect(t.db.select().from(mountings).all().length).toBe(before);
  });

  it("when a length is Infinity, NaN-like text or a huge inch value, then it is 422 naming the field, never 500", async () => {
    for (const sheet of [
      { width: "Infinity", height: 297 },
      { width: "NaN", height: 297 },
      { width: "1e999", height: 297 },
      { width: "99999999999999999999 1/2", height: 297 },
    ]) {
      const res = await framer.post("/api/mount-plans/calculate").send({ ...A4, unit: "in", sheet });
      expect(res.status, JSON.stringify(sheet)).toBe(422);
      expect(Object.keys(expectErrorShape(res.body, "validation_failed").fields ?? {})[0]).toMatch(/^sheet/);
    }
  });

  it("when a cutting-list board or board sheet is past its bound, then it answers 422 naming it", async () => {
    const base = { unit: "mm", boardSheet: { width: 1120, height: 815 }, pieces: [{ id: "a", width: 300, height: 400, quantity: 1 }] };
    for (const [field, body] of [
      ["pieces.0.width", { ...base, pieces: [{ id: "a", width: 1e12, height: 400, quantity: 1 }] }],
      ["pieces.0.height", { ...base, pieces: [{ id: "a", width: 300, height: 0.001, quantity: 1 }] }],
      ["boardSheet.height", { ...base, boardSheet: { width: 1120, height: 1e9 } }],
      ["kerf", { ...base, kerf: 50 }],
    ] as const) {
      const res = await framer.post("/api/mount-plans/cutting-list").send(body);
      expect(res.status, field).toBe(422);
      expect(Object.keys(expectErrorShape(res.body, "validation_failed").fields ?? {}), field).toContain(field);
    }
  });

  it("when the smallest board allowed is yielded from the largest sheet, then the answer is quick to build and the count exact", async () => {
    // 5 × 5 mm blanks on a 3,000 × 3,000 mm sheet: 360,000 blanks; the server counts them without listing each.
    const res = await framer
      .post("/api/mount-plans/calculate")
      .send({ ...A4, sheet: { width: 5, height: 5 }, window: { all: { mode: "float", reveal: 0 } }, borders: { all: 0 }, boardSheet: { width: 3000, height: 3000 } });
    expect(res.status).toBe(200);
    expect(res.body.yield.perSheet).toBeGreaterThan(100_000);
  });
});
