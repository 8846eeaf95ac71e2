import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { eq } from "drizzle-orm";
import { agentsFor, createTestApp, expectErrorShape, makeObject, makeStudio, type Agent } from "../setup/test-app.ts";
import { mountPlans } from "../../server/db/schema.ts";
import type { MountPlan, MountPlanInput } from "../../shared/schemas/mount-plan.ts";
import type { StudioSettings } from "../../shared/schemas/settings.ts";
import { first } from "../setup/lists.ts";

const t = createTestApp();

type RoleName = "admin" | "framer" | "collector" | "registrar";
let studio: Awaited<ReturnType<typeof makeStudio>>;
let as: Record<RoleName, Agent>;
let ids: { collectors: string; institutions: string; others: string };

// 1 in = 25.4 mm exactly (1959 agreement; NIST Handbook 44, Appendix C).
const IN = 25.4;
// A4 = 210 × 297 mm (ISO 216); 5 mm overlap a side: common practice (no source).
const A4: MountPlanInput = { unit: "mm", sheet: { width: 210, height: 297 }, window: { all: { mode: "overlap", overlap: 5 } } };
// 8 × 10 in: CCI Notes 11/5.
const EIGHT_BY_TEN: MountPlanInput = { unit: "in", sheet: { width: 8, height: 10 }, window: { all: { mode: "overlap", overlap: "3/16" } } };

beforeAll(async () => {
  studio = await makeStudio(t);
  ids = {
    collectors: makeObject(t.db, studio.collectorClient.id, { title: "Estuary at low water" }),
    institutions: makeObject(t.db, studio.institution.id, { title: "Survey of the east meadow" }),
    others: makeObject(t.db, studio.otherInstitution.id, { title: "Parish boundary deed" }),
  };
  as = await agentsFor(t, studio.people);
});

const calculate = (agent: Agent, body: unknown) => agent.post("/api/mount-plans/calculate").send(body as object);
const planBody = (res: { body: unknown }) => res.body as MountPlan;
const rowsFor = (objectId: string) => t.db.select().from(mountPlans).where(eq(mountPlans.objectId, objectId)).all();

describe("POST /api/mount-plans/calculate", () => {
  it("when any signed-in role asks for a plan, then it answers 200", async () => {
    for (const role of ["admin", "framer", "registrar", "collector"] as const) {
      const res = await calculate(as[role], A4);
      expect(res.status, role).toBe(200);
      expect(planBody(res).aperture, role).toEqual({ width: 200, height: 287 });
    }
  });

  it("when nobody is signed in, then it answers 401", async () => {
    const res = await calculate(t.agent(), A4);
    expect(res.status).toBe(401);
    expectErrorShape(res.body, "unauthenticated");
  });

  it("when an A4 sheet has 5 mm overlap every side, then the aperture is 200 × 287 mm", async () => {
    // ISO 216 A4; 5 mm: common practice (no source).
    const plan = planBody(await calculate(as.framer, A4));
    expect(plan.unit).toBe("mm");
    expect(plan.sheet).toEqual({ width: 210, height: 297 });
    expect(plan.aperture).toEqual({ width: 200, height: 287 });
    expect(plan.overlap).toEqual({ left: 5, top: 5, right: 5, bottom: 5 });
    expect(plan.display.aperture).toBe("200 × 287 mm");
    expect(plan.checks).toHaveLength(8);
  });

  it("when an 8 × 10 in sheet has 3/16 in overlap, then the answer is in decimal inches: 7.625 × 9.625", async () => {
    // 8 − 2 × 3/16 = 7 5/8 in; 10 − 2 × 3/16 = 9 5/8 in (inch = 25.4 mm: NIST HB 44 App. C).
    const plan = planBody(await calculate(as.framer, EIGHT_BY_TEN));
    expect(plan.unit).toBe("in");
    expect(plan.precision).toBe(16);
    expect(plan.sheet).toEqual({ width: 8, height: 10 });
    expect(plan.aperture).toEqual({ width: 7.625, height: 9.625 });
    expect(plan.overlap.left).toBe(0.1875);
    expect(plan.display.aperture).toBe("7 5/8 × 9 5/8 in");
    expect(plan.display.sheet).toBe("8 × 10 in");
  });

  it("when lengths are written 7 5/8, 7-5/8 or 7.625, then they read alike", async () => {
    const bodies = [];
    for (const [w, h] of [
      ["7 5/8", "9 5/8"],
      ["7-5/8", "9-5/8"],
      ["7.625", "9.625"],
      [7.625, 9.625],
    ] as const) {
      const res = await calculate(as.framer, { unit: "in", sheet: { width: w, height: h }, window: { all: { mode: "overlap", overlap: "3/16" } } });
      expect(res.status, `${w} × ${h}`).toBe(200);
      bodies.push(res.body);
    }
    // 7 5/8 − 3/8 = 7 1/4 in.
    expect(planBody({ body: bodies[0] }).aperture).toEqual({ width: 7.25, height: 9.25 });
    for (const b of bodies.slice(1)) expect(b).toEqual(bodies[0]);
  });

  it("when a length carries its own unit, then it wins over the plan's unit", async () => {
    const plan = planBody(await calculate(as.framer, { ...A4, sheet: { width: "8 in", height: '10"' } }));
    expect(plan.sheet.width).toBeCloseTo(8 * IN, 9);
    expect(plan.sheet.height).toBeCloseTo(10 * IN, 9);
  });

  describe("requests the contract refuses", () => {
    it("when the unit is cm, then it answers 422 naming unit", async () => {
      const res = await calculate(as.framer, { ...A4, unit: "cm" });
      expect(res.status).toBe(422);
      expect(expectErrorShape(res.body, "validation_failed").fields).toEqual({ unit: 'Choose "mm" or "in".' });
    });

    it("when the sheet is missing, then it answers 422 naming sheet", async () => {
      const { sheet: _s, ...noSheet } = A4;
      const res = await calculate(as.framer, noSheet);
      expect(res.status).toBe(422);
      expect(Object.keys(expectErrorShape(res.body, "validation_failed").fields ?? {})).toEqual(["sheet"]);
    });

    it("when the body has a key the contract does not know, then it answers 422 naming the key", async () => {
      // The contract is strict: a misspelt field must not be silently dropped.
      const res = await calculate(as.framer, { ...A4, bottomWieght: 10 });
      expect(res.status).toBe(422);
      const fields = expectErrorShape(res.body, "validation_failed").fields ?? {};
      expect(Object.values(fields).join(" ")).toContain("bottomWieght");
    });

    it("when a length is an empty string or a window mode is unknown, then it answers 422 at that path", async () => {
      const empty = await calculate(as.framer, { ...A4, sheet: { width: "", height: 297 } });
      expect(empty.status).toBe(422);
      expect(expectErrorShape(empty.body, "validation_failed").fields).toEqual({ "sheet.width": "Enter a length." });
      const mode = await calculate(as.framer, { ...A4, window: { all: { mode: "hover", overlap: 5 } } });
      expect(mode.status).toBe(422);
      expect(Object.keys(expectErrorShape(mode.body, "validation_failed").fields ?? {})).toEqual(["window"]);
    });
  });

  describe("plans that cannot be made", () => {
    it("when an overlap is negative, then it answers 422 at window.all.overlap", async () => {
      const res = await calculate(as.framer, { ...A4, window: { all: { mode: "overlap", overlap: -3 } } });
      expect(res.status).toBe(422);
      const error = expectErrorShape(res.body, "validation_failed");
      expect(Object.keys(error.fields ?? {})).toEqual(["window.all.overlap"]);
      expect(error.message).toMatch(/^Check window\.all\.overlap: /);
    });

    it("when the fitted outer is smaller than the window, then it answers 422 at fitOuter.width", async () => {
      const res = await calculate(as.framer, { ...A4, fitOuter: { width: 150, height: 400 } });
      expect(res.status).toBe(422);
      expect(Object.keys(expectErrorShape(res.body, "validation_failed").fields ?? {})).toEqual(["fitOuter.width"]);
    });

    it("when a length cannot be read, such as 7 5/x, then it answers 422 at sheet.width", async () => {
      const res = await calculate(as.framer, { ...EIGHT_BY_TEN, sheet: { width: "7 5/x", height: 10 } });
      expect(res.status).toBe(422);
      const fields = expectErrorShape(res.body, "validation_failed").fields ?? {};
      expect(Object.keys(fields)).toEqual(["sheet.width"]);
      expect(fields["sheet.width"]).toContain("7 5/x");
    });

    it("when the sheet width is 0 or the overlaps take the whole sheet, then it answers 422 at that path", async () => {
      const zero = await calculate(as.framer, { ...A4, sheet: { width: 0, height: 297 } });
      expect(zero.status).toBe(422);
      expect(expectErrorShape(zero.body, "validation_failed").fields).toEqual({ "sheet.width": "Sheet width must be greater than 0." });
      const consumed = await calculate(as.framer, { ...A4, window: { all: { mode: "overlap", overlap: 150 } } });
      expect(consumed.status).toBe(422);
      expect(Object.keys(expectErrorShape(consumed.body, "validation_failed").fields ?? {})).toEqual(["window"]);
    });
  });

  describe("findings", () => {
    const FINDINGS: [code: string, input: MountPlanInput][] = [
      ["borders-assumed", A4],
      ["border-below-minimum", { ...A4, borders: { all: 30 }, minBorder: 40 }],
      ["lip-covers-window", { ...A4, borders: { all: 4 } }],
      ["rebate-too-shallow", { ...A4, glazing: { material: "glass", thickness: 2 }, frame: { rebateDepth: 3 } }],
      ["board-too-small", { ...A4, boardSheet: { width: 200, height: 200 } }],
      ["overlap-below-minimum", { ...A4, window: { mode: "custom", width: 200, height: 280, left: 3, top: 8 } }],
      ["window-off-sheet", { ...A4, window: { mode: "custom", width: 200, height: 280, left: -4, top: 8 } }],
      ["sheet-past-outer", { ...A4, borders: { all: 3 } }],
      ["window-hides-image", { ...A4, window: { all: { mode: "hide-border", border: 10, into: 30 } } }],
      ["window-larger-than-sheet", { ...A4, window: { mode: "custom", width: 220, height: 280, left: -5, top: 8 } }],
      ["float", { ...A4, window: { all: { mode: "float", reveal: 10 } } }],
      ["float-needs-float-hinge", { ...A4, window: { all: { mode: "float", reveal: 10 } }, materials: { attachment: "t-hinge" } }],
      ["window-shows-border", { ...A4, imageBorders: { left: 12, top: 12, right: 12, bottom: 12 } }],
      ["window-shows-border", { ...A4, window: { all: { mode: "hide-border", border: 20, into: -2 } } }],
      ["window-covers-image", { ...A4, imageBorders: { left: 2, top: 2, right: 2, bottom: 2 } }],
      ["glass-handling", { ...A4, glazing: { material: "glass", thickness: 2 } }],
      ["hanging", { ...A4, glazing: { material: "acrylic", thickness: 3 } }],
    ];

    it.each(FINDINGS)("when the plan calls for it, then the %s finding comes through the API", async (code, input) => {
      const res = await calculate(as.framer, input);
      expect(res.status).toBe(200);
      const f = planBody(res).findings.find((x) => x.code === code);
      expect(f, JSON.stringify(planBody(res).findings)).toBeDefined();
      expect(["info", "warn", "error"]).toContain(f!.severity);
      expect(f!.message.length).toBeGreaterThan(0);
    });

    it("when a side is short of the minimum, then the finding names that side and the level is fail", async () => {
      const plan = planBody(await calculate(as.framer, { ...A4, window: { mode: "custom", width: 200, height: 280, left: 3, top: 8 } }));
      expect(plan.findings.find((f) => f.code === "overlap-below-minimum")).toMatchObject({ side: "left", severity: "error" });
      expect(plan.checks.find((c) => c.id === "overlap-minimum")!.verdict).toBe("fail");
      expect(plan.level).toBe("fail");
    });

    it("when a 500 × 400 mm outer has 2 mm glass, then the API gives the glass as 1.0 kg", async () => {
      // 0.2 m² × 2 mm × 2.5 kg/m²/mm (EN 572-1 via glass makers' data sheets).
      const plan = planBody(
        await calculate(as.framer, {
          unit: "mm",
          sheet: { width: 310, height: 210 },
          window: { all: { mode: "overlap", overlap: 5 } },
          borders: { all: 100 },
          glazing: { material: "glass", thickness: 2 },
        }),
      );
      expect(plan.outer).toEqual({ width: 500, height: 400 });
      expect(plan.glazing.weightKg).toBe(1);
    });
  });
});

describe("POST /api/mount-plans/cutting-list", () => {
  // 32 × 40 in full sheet: suppliers' size. 16 × 20 in blanks: ready-made frame size (docs/trade.md §8); 8 × 10 in: CCI Notes 11/5.
  const BATCH = {
    unit: "in",
    boardSheet: { width: 32, height: 40 },
    pieces: [
      { id: "p1", label: "Heron study", width: 16, height: 20, quantity: 3 },
      { id: "p2", width: "8", height: "10", quantity: 5 },
    ],
  };

  it("when a framer sends a valid batch, then every blank is placed on a sheet and nothing is left over", async () => {
    const res = await as.framer.post("/api/mount-plans/cutting-list").send(BATCH);
    expect(res.status).toBe(200);
    const body = res.body as {
      sheets: { placements: { pieceId: string; x: number; y: number; width: number; height: number }[]; utilisation: number }[];
      sheetCount: number;
      utilisation: number;
      unplaced: unknown[];
    };
    expect(body.unplaced).toEqual([]);
    expect(body.sheetCount).toBe(body.sheets.length);
    // Area: 3 × 320 + 5 × 80 = 1360 in² on 1280 in² sheets, so at least two sheets.
    expect(body.sheetCount).toBeGreaterThanOrEqual(2);
    const placed = body.sheets.flatMap((s) => s.placements);
    expect(placed.filter((p) => p.pieceId === "p1")).toHaveLength(3);
    expect(placed.filter((p) => p.pieceId === "p2")).toHaveLength(5);
    // Placements are in mm and lie on the 812.8 × 1016 mm sheet.
    for (const p of placed) {
      expect(p.x).toBeGreaterThanOrEqual(-1e-9);
      expect(p.y).toBeGreaterThanOrEqual(-1e-9);
      expect(p.x + p.width).toBeLessThanOrEqual(32 * IN + 1e-6);
      expect(p.y + p.height).toBeLessThanOrEqual(40 * IN + 1e-6);
    }
    expect(body.utilisation).toBeGreaterThan(0);
    expect(body.utilisation).toBeLessThanOrEqual(1);
  });

  it("when a collector or registrar uses the cutting list, then it answers 200; signed out, 401", async () => {
    expect((await as.collector.post("/api/mount-plans/cutting-list").send(BATCH)).status).toBe(200);
    expect((await as.registrar.post("/api/mount-plans/cutting-list").send(BATCH)).status).toBe(200);
    const anon = await t.agent().post("/api/mount-plans/cutting-list").send(BATCH);
    expect(anon.status).toBe(401);
    expectErrorShape(anon.body, "unauthenticated");
  });

  it("when a piece has a zero size, then it answers 422 naming that piece's field", async () => {
    const res = await as.framer.post("/api/mount-plans/cutting-list").send({ ...BATCH, pieces: [BATCH.pieces[0], { id: "p3", width: 0, height: 10, quantity: 1 }] });
    expect(res.status).toBe(422);
    expect(expectErrorShape(res.body, "validation_failed").fields).toEqual({ "pieces.1.width": "Board width must be greater than 0." });
  });

  it("when the batch is empty or a quantity is 0, then it answers 422 at that path", async () => {
    const empty = await as.framer.post("/api/mount-plans/cutting-list").send({ ...BATCH, pieces: [] });
    expect(empty.status).toBe(422);
    expect(expectErrorShape(empty.body, "validation_failed").fields).toEqual({ pieces: "Add at least one board to cut." });
    const none = await as.framer.post("/api/mount-plans/cutting-list").send({ ...BATCH, pieces: [{ ...BATCH.pieces[0], quantity: 0 }] });
    expect(none.status).toBe(422);
    expect(expectErrorShape(none.body, "validation_failed").fields).toEqual({ "pieces.0.quantity": "Quantity must be at least 1." });
  });

  it("when a piece is larger than the sheet whichever way round, then it comes back unplaced with a reason naming it", async () => {
    const res = await as.framer
      .post("/api/mount-plans/cutting-list")
      .send({ ...BATCH, pieces: [BATCH.pieces[1], { id: "big", label: "Estate map", width: 36, height: 48, quantity: 1 }] });
    expect(res.status).toBe(200);
    expect(res.body.unplaced).toHaveLength(1);
    expect(res.body.unplaced[0].id).toBe("big");
    expect(res.body.unplaced[0].reason).toContain("Estate map");
    expect(res.body.sheets.flatMap((s: { placements: { pieceId: string }[] }) => s.placements).every((p: { pieceId: string }) => p.pieceId === "p2")).toBe(true);
  });
});

describe("plan drafts: GET and PUT /api/objects/:id/plan", () => {
  const DRAFT: MountPlanInput = { ...A4, borders: { all: 60 }, materials: { boardGrade: "museum" } };

  it("when no plan has been saved, then GET answers draft null", async () => {
    const res = await as.framer.get(`/api/objects/${ids.collectors}/plan`);
    expect(res.status).toBe(200);
    expect(res.body).toEqual({ draft: null });
  });

  it("when the first plan is impossible, then PUT answers 422 and no draft is written", async () => {
    const res = await as.framer.put(`/api/objects/${ids.collectors}/plan`).send({ input: { ...A4, window: { all: { mode: "overlap", overlap: -1 } } } });
    expect(res.status).toBe(422);
    // Paths name the request body's fields, as the contract's own errors do (input.unit below).
    expect(Object.keys(expectErrorShape(res.body, "validation_failed").fields ?? {})).toEqual(["input.window.all.overlap"]);
    expect(rowsFor(ids.collectors)).toEqual([]);
    expect((await as.framer.get(`/api/objects/${ids.collectors}/plan`)).body).toEqual({ draft: null });
  });

  it("when the body breaks the contract, then PUT answers 422 at input.* and writes nothing", async () => {
    const res = await as.framer.put(`/api/objects/${ids.collectors}/plan`).send({ input: { ...A4, unit: "cm" } });
    expect(res.status).toBe(422);
    expect(Object.keys(expectErrorShape(res.body, "validation_failed").fields ?? {})).toEqual(["input.unit"]);
    expect(rowsFor(ids.collectors)).toEqual([]);
  });

  it("when a framer saves a first plan, then a draft at version 1 is created and GET returns it recomputed", async () => {
    const put = await as.framer.put(`/api/objects/${ids.collectors}/plan`).send({ input: DRAFT });
    expect(put.status).toBe(200);
    expect(put.body).toMatchObject({ objectId: ids.collectors, status: "draft", version: 1, updatedBy: studio.people.framer.id });
    expect(put.body.input).toMatchObject(DRAFT);
    expect(put.body.plan.aperture).toEqual({ width: 200, height: 287 });
    expect(put.body.plan.outer).toEqual({ width: 320, height: 407 });
    expect(rowsFor(ids.collectors)).toHaveLength(1);

    const get = await as.framer.get(`/api/objects/${ids.collectors}/plan`);
    expect(get.status).toBe(200);
    expect(get.body.draft).toEqual(put.body);
    // The stored row keeps the input only; the numbers are computed when it is read.
    expect(first(rowsFor(ids.collectors)).input).not.toHaveProperty("aperture");
  });

  it("when a second save gives no version, then it answers 409 and the draft is unchanged", async () => {
    const res = await as.framer.put(`/api/objects/${ids.collectors}/plan`).send({ input: { ...DRAFT, borders: { all: 70 } } });
    expect(res.status).toBe(409);
    expectErrorShape(res.body, "conflict");
    const get = await as.framer.get(`/api/objects/${ids.collectors}/plan`);
    expect(get.body.draft.version).toBe(1);
    expect(get.body.draft.plan.borders.left).toBe(60);
  });

  it("when a save gives the current version, then it becomes the next version; the old version is then stale (409)", async () => {
    const ok = await as.admin.put(`/api/objects/${ids.collectors}/plan`).send({ input: { ...DRAFT, borders: { all: 70 } }, version: 1 });
    expect(ok.status).toBe(200);
    expect(ok.body).toMatchObject({ version: 2, updatedBy: studio.people.admin.id });
    expect(ok.body.plan.borders.left).toBe(70);

    const stale = await as.framer.put(`/api/objects/${ids.collectors}/plan`).send({ input: { ...DRAFT, borders: { all: 80 } }, version: 1 });
    expect(stale.status).toBe(409);
    expectErrorShape(stale.body, "conflict");
    const get = await as.framer.get(`/api/objects/${ids.collectors}/plan`);
    expect(get.body.draft.version).toBe(2);
    expect(get.body.draft.plan.borders.left).toBe(70);
    expect(rowsFor(ids.collectors)).toHaveLength(1);
  });

  it("when a later plan is impossible, then PUT answers 422 and the saved draft stays as it was", async () => {
    const res = await as.framer.put(`/api/objects/${ids.collectors}/plan`).send({ input: { ...DRAFT, fitOuter: { width: 100, height: 500 } }, version: 2 });
    expect(res.status).toBe(422);
    expect(Object.keys(expectErrorShape(res.body, "validation_failed").fields ?? {})).toEqual(["input.fitOuter.width"]);
    const row = first(rowsFor(ids.collectors));
    expect(row.version).toBe(2);
    expect(row.input).not.toHaveProperty("fitOuter");
  });

  it("when the collector who owns the object opens its plan, then GET answers 200 with the plan", async () => {
    const res = await as.collector.get(`/api/objects/${ids.collectors}/plan`);
    expect(res.status).toBe(200);
    expect(res.body.draft).toMatchObject({ objectId: ids.collectors, version: 2 });
    expect(res.body.draft.plan.aperture).toEqual({ width: 200, height: 287 });
  });

  it("when a registrar or collector saves a plan for their own object, then it answers 403 and nothing is written", async () => {
    const mine = await as.collector.put(`/api/objects/${ids.collectors}/plan`).send({ input: DRAFT, version: 2 });
    expect(mine.status).toBe(403);
    expectErrorShape(mine.body, "forbidden");
    const theirs = await as.registrar.put(`/api/objects/${ids.institutions}/plan`).send({ input: DRAFT });
    expect(theirs.status).toBe(403);
    expectErrorShape(theirs.body, "forbidden");
    expect(rowsFor(ids.institutions)).toEqual([]);
    expect(first(rowsFor(ids.collectors)).version).toBe(2);
  });

  it("when a registrar or collector reaches for another client's object, then GET and PUT answer 404", async () => {
    for (const [agent, id] of [
      [as.registrar, ids.collectors],
      [as.collector, ids.institutions],
      [as.registrar, ids.others],
    ] as const) {
      const get = await agent.get(`/api/objects/${id}/plan`);
      expect(get.status).toBe(404);
      expectErrorShape(get.body, "not_found");
      const put = await agent.put(`/api/objects/${id}/plan`).send({ input: DRAFT });
      expect(put.status).toBe(404);
      expectErrorShape(put.body, "not_found");
    }
    expect(rowsFor(ids.others)).toEqual([]);
  });

  it("when the registrar opens their institution's object before any plan, then GET answers draft null", async () => {
    const res = await as.registrar.get(`/api/objects/${ids.institutions}/plan`);
    expect(res.status).toBe(200);
    expect(res.body).toEqual({ draft: null });
  });

  it("when the object does not exist, then GET and PUT answer 404", async () => {
    expect((await as.framer.get("/api/objects/no-such-object/plan")).status).toBe(404);
    expect((await as.framer.put("/api/objects/no-such-object/plan").send({ input: DRAFT })).status).toBe(404);
  });

  it("when nobody is signed in, then GET and PUT answer 401", async () => {
    const get = await t.agent().get(`/api/objects/${ids.collectors}/plan`);
    expect(get.status).toBe(401);
    expectErrorShape(get.body, "unauthenticated");
    expect((await t.agent().put(`/api/objects/${ids.collectors}/plan`).send({ input: DRAFT })).status).toBe(401);
  });
});

describe("the studio's minimum overlap setting", () => {
  // 4 mm overlap: below the 5 mm default (common practice (no source)) but above a 3 mm studio minimum (some studios work to 3–6 mm).
  const FOUR_MM: MountPlanInput = { ...A4, window: { all: { mode: "overlap", overlap: 4 } } };
  let original: StudioSettings;

  beforeAll(async () => {
    original = (await as.admin.get("/api/settings")).body;
  });
  afterAll(async () => {
    await as.admin.put("/api/settings").send(original);
  });

  const overlapCheck = (plan: MountPlan) => plan.checks.find((c) => c.id === "overlap-minimum")!;

  it("when the admin lowers the minimum overlap to 3 mm, then a 4 mm overlap passes the overlap check, in plans and saved drafts alike", async () => {
    const before = planBody(await calculate(as.framer, FOUR_MM));
    expect(overlapCheck(before).verdict).toBe("fail");
    expect(before.findings.filter((f) => f.code === "overlap-below-minimum")).toHaveLength(4);
    const saved = await as.framer.put(`/api/objects/${ids.institutions}/plan`).send({ input: FOUR_MM });
    expect(saved.status).toBe(200);
    expect(overlapCheck(saved.body.plan).verdict).toBe("fail");

    const put = await as.admin.put("/api/settings").send({ ...original, minOverlapMm: 3 });
    expect(put.status).toBe(200);
    expect(put.body.minOverlapMm).toBe(3);

    const after = planBody(await calculate(as.framer, FOUR_MM));
    expect(overlapCheck(after).verdict).toBe("pass");
    expect(after.findings.filter((f) => f.code === "overlap-below-minimum")).toEqual([]);
    // A saved draft is recomputed when it is read, so it follows the setting too.
    const draft = (await as.registrar.get(`/api/objects/${ids.institutions}/plan`)).body.draft;
    expect(overlapCheck(draft.plan).verdict).toBe("pass");
  });

  it("when the admin raises the minimum to 6 mm, then a 5 mm overlap fails and the finding gives the new minimum", async () => {
    expect((await as.admin.put("/api/settings").send({ ...original, minOverlapMm: 6 })).status).toBe(200);
    const plan = planBody(await calculate(as.framer, A4));
    expect(overlapCheck(plan).verdict).toBe("fail");
    expect(plan.findings.find((f) => f.code === "overlap-below-minimum")!.message).toContain("6 mm");
  });

  it("when a framer tries to change the minimum, then it answers 403 and plans keep the admin's setting", async () => {
    const res = await as.framer.put("/api/settings").send({ ...original, minOverlapMm: 1 });
    expect(res.status).toBe(403);
    expect(overlapCheck(planBody(await calculate(as.framer, A4))).verdict).toBe("fail");
  });
});
