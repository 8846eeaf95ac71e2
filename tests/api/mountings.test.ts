import { beforeAll, describe, expect, it } from "vitest";
import { eq } from "drizzle-orm";
import { A4_CORNERS, A4_HINGED } from "../../server/db/factories.ts";
import { accessMatrix, readRow, writeRow, type MatrixRow } from "../setup/access-matrix.ts";
import { agentsFor, createTestApp, expectErrorShape, makeClient, makeObject, makeStudio, type Agent } from "../setup/test-app.ts";
import { events, mountingRevisions, mountings, objects } from "../../server/db/schema.ts";
import type { MountingDataInput, MountingRecord } from "../../shared/schemas/mountings.ts";
import type { Check } from "../../shared/schemas/mount-plan.ts";

const t = createTestApp();

type Role = "admin" | "framer" | "registrar" | "collector";
let studio: Awaited<ReturnType<typeof makeStudio>>;
let as: Record<Role, Agent>;

// The A4 print's two mounts, hinged and then in corners, with their sources beside the values in server/db/factories.ts.
const DATA = A4_HINGED;
const REFRAME = A4_CORNERS;

const with_ = (over: Partial<MountingDataInput>): MountingDataInput => ({ ...DATA, ...over });
const createBody = (data: MountingDataInput = DATA, over: Record<string, unknown> = {}) => ({ reason: "first-mounting", mountedOn: "2026-03-02", data, ...over });

const objectRow = (id: string) =>
  t.db
    .select({
      currentMountingId: objects.currentMountingId,
      currentMethod: objects.currentMethod,
      currentBoardGrade: objects.currentBoardGrade,
      currentGlazing: objects.currentGlazing,
      lastMountedOn: objects.lastMountedOn,
    })
    .from(objects)
    .where(eq(objects.id, id))
    .get();
const mountingRow = (id: string) => t.db.select().from(mountings).where(eq(mountings.id, id)).get();
const mountingsOf = (objectId: string) => t.db.select().from(mountings).where(eq(mountings.objectId, objectId)).all();
const eventsOf = (objectId: string) => t.db.select().from(events).where(eq(events.objectId, objectId)).all();
const check = (r: { body: MountingRecord }, id: string): Check => {
  const c = r.body.current.plan.checks.find((x) => x.id === id);
  if (!c) throw new Error(`No check ${id} in ${JSON.stringify(r.body.current.plan.checks.map((x) => x.id))}`);
  return c;
};

/** Fresh records made by the framer, so each test starts from its own rows. */
async function draftOn(objectId: string, data: MountingDataInput = DATA, over: Record<string, unknown> = {}): Promise<MountingRecord> {
  const res = await as.framer.post(`/api/objects/${objectId}/mountings`).send(createBody(data, over));
  if (res.status !== 201) throw new Error(`Draft answered ${res.status}: ${JSON.stringify(res.body)}`);
  return res.body;
}
async function completedOn(objectId: string, data: MountingDataInput = DATA, over: Record<string, unknown> = {}): Promise<MountingRecord> {
  const d = await draftOn(objectId, data, over);
  const res = await as.framer.post(`/api/mountings/${d.id}/complete`).send({ version: d.version });
  if (res.status !== 200) throw new Error(`Complete answered ${res.status}: ${JSON.stringify(res.body)}`);
  return res.body;
}

let otherPrivate: string;

beforeAll(async () => {
  studio = await makeStudio(t);
  otherPrivate = makeClient(t.db, { kind: "private", name: "Basil Owner" }).id;
  as = await agentsFor(t, studio.people);
});

describe("the life cycle of a mounting record", () => {
  let objectId: string;
  let first: MountingRecord;
  let second: MountingRecord;

  beforeAll(() => {
    objectId = makeObject(t.db, studio.collectorClient.id, { title: "Heron at the weir" });
  });

  it("when a framer records a mounting, then it answers 201 with a draft at version 1 whose plan is recomputed", async () => {
    const res = await as.framer.post(`/api/objects/${objectId}/mountings`).send(createBody());
    expect(res.status).toBe(201);
    first = res.body;
    expect(first).toMatchObject({
      objectId,
      status: "draft",
      reason: "first-mounting",
      mountedOn: "2026-03-02",
      framerId: studio.people.framer.id,
      framerName: "Test framer",
      currentRevision: 1,
      version: 1,
      supersededById: null,
      endedOn: null,
    });
    expect(first.current.revision).toBe(1);
    expect(first.current.correctionReason).toBeNull();
    expect(first.current.data.attachment.hinges).toEqual(DATA.attachment.hinges);
    // 210 − 2 × 5 = 200; 297 − 2 × 5 = 287; outer = window + 2 × 60 mm borders.
    expect(first.current.plan.aperture).toEqual({ width: 200, height: 287 });
    expect(first.current.plan.outer).toEqual({ width: 320, height: 407 });
    expect(first.current.plan.checks).toHaveLength(8);
    expect(first.current.plan.level).toBe("pass");
  });

  it("when the record is only a draft, then the object's register columns stay empty and no event is written", () => {
    expect(objectRow(objectId)).toEqual({ currentMountingId: null, currentMethod: null, currentBoardGrade: null, currentGlazing: null, lastMountedOn: null });
    expect(eventsOf(objectId)).toEqual([]);
  });

  it("when the framer saves the draft with its version, then it becomes the next version with the new entries", async () => {
    const hinges = [
      { edge: "top", offsetMm: 35, widthMm: 25 },
      { edge: "top", offsetMm: 150, widthMm: 25 },
    ] as const;
    const res = await as.framer.put(`/api/mountings/${first.id}`).send({ ...createBody(with_({ attachment: { ...DATA.attachment, hinges: [...hinges] } })), version: 1 });
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ id: first.id, status: "draft", version: 2, currentRevision: 1 });
    expect(res.body.current.data.attachment.hinges).toEqual(hinges);
    first = res.body;
  });

  it("when a draft is saved with a stale version, then it answers 409 and the draft is unchanged", async () => {
    const res = await as.framer.put(`/api/mountings/${first.id}`).send({ ...createBody(with_({ notes: "Late edit" })), version: 1 });
    expect(res.status).toBe(409);
    expectErrorShape(res.body, "conflict");
    const get = await as.framer.get(`/api/mountings/${first.id}`);
    expect(get.body.version).toBe(2);
    expect(get.body.current.data.notes).toBeNull();
  });

  it("when the framer completes the draft, then it is the current mount and the object's columns follow it", async () => {
    const res = await as.framer.post(`/api/mountings/${first.id}/complete`).send({ version: 2 });
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ id: first.id, status: "completed", version: 3, currentRevision: 1 });
    first = res.body;
    expect(objectRow(objectId)).toEqual({
      currentMountingId: first.id,
      currentMethod: "t-hinge",
      currentBoardGrade: "museum",
      currentGlazing: "uv-glass",
      lastMountedOn: "2026-03-02",
    });
  });

  it("when someone edits a completed record in place, then it answers 409 and the record is unchanged", async () => {
    const res = await as.framer.put(`/api/mountings/${first.id}`).send({ ...createBody(with_({ notes: "Edited in place" })), version: first.version });
    expect(res.status).toBe(409);
    expect(expectErrorShape(res.body, "conflict").message).toMatch(/locked/);
    const get = await as.admin.get(`/api/mountings/${first.id}`);
    expect(get.body).toEqual(first);
  });

  it("when a completed record is completed again, then it answers 409", async () => {
    const res = await as.framer.post(`/api/mountings/${first.id}/complete`).send({ version: first.version });
    expect(res.status).toBe(409);
    expectErrorShape(res.body, "conflict");
    expect(mountingRow(first.id)!.version).toBe(first.version);
  });

  it("when the database is asked to change a completed record's revision, then it refuses", () => {
    expect(() => t.database.sqlite.prepare("UPDATE mounting_revisions SET data = '{}' WHERE mounting_id = ?").run(first.id)).toThrow(/cannot be changed/);
  });

  it("when a second mounting is completed, then the first becomes superseded by it and the object's columns follow the second", async () => {
    second = await completedOn(objectId, REFRAME, { reason: "reframing", mountedOn: "2027-05-10" });
    expect(second.status).toBe("completed");
    const old = await as.framer.get(`/api/mountings/${first.id}`);
    expect(old.status).toBe(200);
    expect(old.body).toMatchObject({ status: "superseded", supersededById: second.id, endedOn: "2027-05-10" });
    expect(old.body.endReason).toContain("2027-05-10");
    expect(objectRow(objectId)).toEqual({
      currentMountingId: second.id,
      currentMethod: "corners",
      currentBoardGrade: "conservation",
      currentGlazing: "ar-uv-glass",
      lastMountedOn: "2027-05-10",
    });
  });

  it("when the superseded record is opened later, then its plan, materials and hinge positions are all still there", async () => {
    const old = await as.collector.get(`/api/mountings/${first.id}`);
    expect(old.status).toBe(200);
    expect(old.body.current.data.attachment).toMatchObject({ method: "t-hinge", adhesive: "wheat-starch-paste", tissue: "Kozo, Japanese tissue" });
    expect(old.body.current.data.attachment.hinges).toEqual([
      { edge: "top", offsetMm: 35, widthMm: 25 },
      { edge: "top", offsetMm: 150, widthMm: 25 },
    ]);
    expect(old.body.current.data.boards.window.batch).toBe("MB-2291");
    expect(old.body.current.plan.aperture).toEqual({ width: 200, height: 287 });
    const revs = await as.collector.get(`/api/mountings/${first.id}/revisions`);
    expect(revs.status).toBe(200);
    expect(revs.body.items).toHaveLength(1);
    expect(revs.body.items[0].data.attachment.hinges).toHaveLength(2);
    expect(revs.body.items[0].plan.aperture).toEqual({ width: 200, height: 287 });
  });

  it("when the object's records are listed, then both appear, newest mounting first", async () => {
    const res = await as.framer.get(`/api/objects/${objectId}/mountings`);
    expect(res.status).toBe(200);
    expect(res.body.items.map((m: MountingRecord) => [m.id, m.status])).toEqual([
      [second.id, "completed"],
      [first.id, "superseded"],
    ]);
  });

  it("when a completed record is corrected with a reason, then revision 2 holds the correction and the object's columns follow it", async () => {
    const corrected = with_({ ...REFRAME, glazing: { type: "uv-acrylic", thicknessMm: 3 }, notes: "Glazing was acrylic, not glass." });
    const res = await as.framer
      .post(`/api/mountings/${second.id}/corrections`)
      .send({ version: second.version, correctionReason: "Wrong glazing recorded at the bench.", data: corrected });
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ id: second.id, status: "completed", currentRevision: 2, version: second.version + 1 });
    expect(res.body.current).toMatchObject({ revision: 2, correctionReason: "Wrong glazing recorded at the bench.", createdByName: "Test framer" });
    expect(res.body.current.data.glazing).toEqual({ type: "uv-acrylic", thicknessMm: 3 });
    expect(objectRow(objectId)!.currentGlazing).toBe("uv-acrylic");
    second = res.body;
  });

  it("when the revisions are read, then both stay readable and the second lists the changed paths", async () => {
    const res = await as.collector.get(`/api/mountings/${second.id}/revisions`);
    expect(res.status).toBe(200);
    const [r1, r2] = res.body.items;
    expect(res.body.items).toHaveLength(2);
    expect(r1).toMatchObject({ revision: 1, correctionReason: null, changes: [] });
    expect(r1.data.glazing).toEqual({ type: "ar-uv-glass", thicknessMm: 3 });
    expect(r2).toMatchObject({ revision: 2, correctionReason: "Wrong glazing recorded at the bench." });
    expect(r2.changes.map((c: { path: string }) => c.path).sort()).toEqual(["glazing.type", "notes"]);
    expect(r2.changes.find((c: { path: string }) => c.path === "glazing.type")).toEqual({ path: "glazing.type", before: "ar-uv-glass", after: "uv-acrylic" });
    // Each revision carries its own recomputed plan.
    expect(r1.plan.aperture).toEqual({ width: 200, height: 287 });
    expect(r2.plan.aperture).toEqual({ width: 200, height: 287 });
  });

  it("when a superseded record is corrected, then it gets a revision but the object's columns stay on the current mount", async () => {
    const res = await as.framer.post(`/api/mountings/${first.id}/corrections`).send({
      version: (await as.framer.get(`/api/mountings/${first.id}`)).body.version,
      correctionReason: "Tissue weight was 9 g/m².",
      data: with_({ attachment: { ...first.current.data.attachment, tissueWeightGsm: 9 } }),
    });
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ status: "superseded", currentRevision: 2, supersededById: second.id });
    expect(res.body.current.data.attachment.tissueWeightGsm).toBe(9);
    expect(objectRow(objectId)).toMatchObject({ currentMountingId: second.id, currentMethod: "corners", currentGlazing: "uv-acrylic" });
  });

  it("when a correction changes nothing, then it answers 422 and no revision is added", async () => {
    const res = await as.framer.post(`/api/mountings/${second.id}/corrections`).send({ version: second.version, correctionReason: "Checking.", data: second.current.data });
    expect(res.status).toBe(422);
    expect(expectErrorShape(res.body, "validation_failed").fields).toHaveProperty("data");
    expect(t.db.select().from(mountingRevisions).where(eq(mountingRevisions.mountingId, second.id)).all()).toHaveLength(2);
  });

  it("when a correction gives no reason, then it answers 422 naming correctionReason", async () => {
    const res = await as.framer.post(`/api/mountings/${second.id}/corrections`).send({ version: second.version, correctionReason: "  ", data: REFRAME });
    expect(res.status).toBe(422);
    expect(Object.keys(expectErrorShape(res.body, "validation_failed").fields ?? {})).toEqual(["correctionReason"]);
  });

  it("when a correction starts from a stale version, then it answers 409 and no revision is added", async () => {
    const res = await as.admin
      .post(`/api/mountings/${second.id}/corrections`)
      .send({ version: second.version - 1, correctionReason: "Stale tab.", data: with_({ ...REFRAME, notes: "From a stale tab" }) });
    expect(res.status).toBe(409);
    expectErrorShape(res.body, "conflict");
    expect(mountingRow(second.id)!.currentRevision).toBe(2);
  });

  it("when a draft is sent as a correction, then it answers 409: drafts are edited directly", async () => {
    const d = await draftOn(objectId, DATA, { reason: "hinge-repair", mountedOn: "2028-01-01" });
    const res = await as.framer.post(`/api/mountings/${d.id}/corrections`).send({ version: d.version, correctionReason: "Not yet.", data: REFRAME });
    expect(res.status).toBe(409);
    expectErrorShape(res.body, "conflict");
  });

  it("when the current mount is marked as taken out, then it is removed and the object's current columns are cleared", async () => {
    const res = await as.framer.post(`/api/mountings/${second.id}/remove`).send({ version: second.version, endedOn: "2028-02-14", endReason: "Lent unframed for a study day." });
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ id: second.id, status: "removed", endedOn: "2028-02-14", endReason: "Lent unframed for a study day." });
    const row = objectRow(objectId)!;
    expect(row).toMatchObject({ currentMountingId: null, currentMethod: null, currentBoardGrade: null, currentGlazing: null });
    // The date it was last mounted on is still true after it comes out.
    expect(row.lastMountedOn).toBe("2027-05-10");
    // The removed record stays readable, with both revisions.
    expect((await as.collector.get(`/api/mountings/${second.id}/revisions`)).body.items).toHaveLength(2);
  });

  it("when a removed or superseded record is removed again, then it answers 409", async () => {
    const removed = mountingRow(second.id)!;
    const again = await as.framer.post(`/api/mountings/${second.id}/remove`).send({ version: removed.version, endedOn: "2028-02-15", endReason: "Twice." });
    expect(again.status).toBe(409);
    const superseded = mountingRow(first.id)!;
    const old = await as.framer.post(`/api/mountings/${first.id}/remove`).send({ version: superseded.version, endedOn: "2028-02-15", endReason: "Old one." });
    expect(old.status).toBe(409);
    expect(mountingRow(first.id)!.status).toBe("superseded");
  });

  it("when a removal starts from a stale version, then it answers 409 and the record stays current", async () => {
    const m = await completedOn(objectId, DATA, { reason: "remount-after-damage", mountedOn: "2028-06-01" });
    const res = await as.framer.post(`/api/mountings/${m.id}/remove`).send({ version: m.version - 1, endedOn: "2028-06-02", endReason: "Stale." });
    expect(res.status).toBe(409);
    expect(mountingRow(m.id)!.status).toBe("completed");
    expect(objectRow(objectId)!.currentMountingId).toBe(m.id);
  });
});

describe("an earlier mounting recorded afterwards", () => {
  it("when a mounting dated before the current one is completed, then it goes in as superseded and the current mount stays", async () => {
    const objectId = makeObject(t.db, studio.collectorClient.id);
    const current = await completedOn(objectId, DATA, { reason: "first-mounting", mountedOn: "2026-06-01" });
    const earlier = await completedOn(objectId, DATA, { reason: "first-mounting", mountedOn: "2019-04-02" });
    expect(earlier.status).toBe("superseded");
    expect(earlier.supersededById).toBe(current.id);
    expect(mountingRow(current.id)!.status).toBe("completed");
    expect(objectRow(objectId)!.currentMountingId).toBe(current.id);
    expect(objectRow(objectId)!.lastMountedOn).toBe("2026-06-01");
    const recorded = eventsOf(objectId).find((e) => (e.data as { mountingId?: string }).mountingId === earlier.id);
    expect(recorded?.type).toBe("mounted");
    expect(recorded?.summary).toContain("recorded afterwards");
  });
});

describe("the plan's checks cover the record's materials", () => {
  let objectId: string;
  beforeAll(() => {
    objectId = makeObject(t.db, studio.institution.id);
  });

  it("when every material is archival and reversible, then every check passes", async () => {
    const d = await draftOn(objectId);
    expect(d.current.plan.checks.map((c) => [c.id, c.verdict]).filter(([, v]) => v !== "pass")).toEqual([]);
  });

  it("when the window board is of grade other, then the archival-boards check fails (NEDCC leaflet 4.10)", async () => {
    const res = await as.framer
      .post(`/api/objects/${objectId}/mountings`)
      .send(createBody(with_({ boards: { ...DATA.boards, window: { grade: "other", buffered: true, ply: 4 } } })));
    expect(res.status).toBe(201);
    expect(check(res, "archival-boards").verdict).toBe("fail");
    expect(res.body.current.plan.level).toBe("fail");
  });

  it("when the object is held with pressure-sensitive tape, then the archival-boards and reversible-attachment checks fail", async () => {
    const res = await as.framer.post(`/api/objects/${objectId}/mountings`).send(createBody(with_({ attachment: { method: "pressure-sensitive-tape", hinges: [] } })));
    expect(res.status).toBe(201);
    expect(check(res, "archival-boards")).toMatchObject({ verdict: "fail" });
    expect(check(res, "archival-boards").reason).toContain("pressure sensitive tape");
    expect(check(res, "reversible-attachment").verdict).toBe("fail");
  });

  // The catalogue is the object's record, not what a plan says of it: each of these objects is catalogued so.
  const catalogued = (over: Parameters<typeof makeObject>[2]) => makeObject(t.db, studio.institution.id, over);

  it("when a catalogued pastel goes under acrylic, then the friable-glazing check fails (State Archives of Florida)", async () => {
    const pastel = catalogued({ objectType: "pastel" });
    const res = await as.framer.post(`/api/objects/${pastel}/mountings`).send(createBody(with_({ glazing: { type: "uv-acrylic", thicknessMm: 3 } })));
    expect(res.status).toBe(201);
    expect(check(res, "friable-glazing").verdict).toBe("fail");
  });

  it("when a drawing's medium is charcoal, then it counts as friable media and acrylic fails (State Archives of Florida)", async () => {
    const charcoal = catalogued({ objectType: "drawing", medium: "Charcoal and white chalk on laid paper" });
    const res = await as.framer.post(`/api/objects/${charcoal}/mountings`).send(createBody(with_({ glazing: { type: "uv-acrylic", thicknessMm: 3 } })));
    expect(check(res, "friable-glazing").verdict).toBe("fail");
  });

  it("when the same pastel goes under UV glass, then the friable-glazing check does not fail", async () => {
    const pastel = catalogued({ objectType: "pastel" });
    const res = await as.framer.post(`/api/objects/${pastel}/mountings`).send(createBody(DATA));
    expect(res.status).toBe(201);
    expect(check(res, "friable-glazing").verdict).not.toBe("fail");
  });

  it("when the plan claims another object type than the catalogue, then the catalogue's is the one checked", async () => {
    const photo = catalogued({ objectType: "photograph", photoProcess: "cyanotype" });
    const res = await as.framer
      .post(`/api/objects/${photo}/mountings`)
      .send(
        createBody(
          with_({ plan: { ...DATA.plan, object: { objectType: "print" } }, boards: { ...DATA.boards, window: { grade: "museum", buffered: true, ply: 4, patPassed: true } } }),
        ),
      );
    expect(res.status).toBe(201);
    expect(check(res, "photo-board").verdict).toBe("fail");
    expect(check(res, "photo-board").reason).not.toContain("does not apply");
    expect(res.body.current.catalogue).toMatchObject({ objectType: "photograph", photoProcess: "cyanotype" });
  });

  it("when a floated sheet is held with T-hinges, then the hinge-placement check fails", async () => {
    const res = await as.framer.post(`/api/objects/${objectId}/mountings`).send(createBody(with_({ plan: { ...DATA.plan, window: { all: { mode: "float", reveal: 10 } } } })));
    expect(res.status).toBe(201);
    expect(check(res, "hinge-placement").verdict).toBe("fail");
  });

  it("when the hinges are not along the top edge, then the hinge-placement check warns", async () => {
    const res = await as.framer.post(`/api/objects/${objectId}/mountings`).send(
      createBody(
        with_({
          attachment: {
            ...DATA.attachment,
            hinges: [
              { edge: "left", offsetMm: 40, widthMm: 25 },
              { edge: "top", offsetMm: 100, widthMm: 25 },
            ],
          },
        }),
      ),
    );
    expect(res.status).toBe(201);
    expect(check(res, "hinge-placement").verdict).toBe("warn");
  });

  it("when a light-sensitive object has plain float glass, then the uv-glazing check fails (NEDCC leaflet 4.10)", async () => {
    const light = catalogued({ sensitivities: ["light-sensitive"] });
    const res = await as.framer.post(`/api/objects/${light}/mountings`).send(createBody(with_({ glazing: { type: "float-glass", thicknessMm: 2 } })));
    expect(res.status).toBe(201);
    expect(check(res, "uv-glazing").verdict).toBe("fail");
  });

  it("when a watercolour with no flag has plain float glass, then the uv-glazing check fails too (very sensitive by the light guidance)", async () => {
    // Watercolours are very sensitive (NISO Z39.79 via NEDCC; docs/trade.md §7); UV filtering for them: NEDCC 4.10.
    const wc = catalogued({ objectType: "watercolour", sensitivities: [] });
    const res = await as.framer.post(`/api/objects/${wc}/mountings`).send(createBody(with_({ glazing: { type: "float-glass", thicknessMm: 2 } })));
    expect(check(res, "uv-glazing").verdict).toBe("fail");
  });

  it("when a catalogued cyanotype sits on buffered board, then the photo-board check fails (research consensus, via CCAHA)", async () => {
    const cyan = catalogued({ objectType: "photograph", photoProcess: "cyanotype" });
    const res = await as.framer
      .post(`/api/objects/${cyan}/mountings`)
      .send(createBody(with_({ boards: { ...DATA.boards, window: { grade: "museum", buffered: true, ply: 4, patPassed: true } } })));
    expect(res.status).toBe(201);
    expect(check(res, "photo-board").verdict).toBe("fail");
  });

  it("when the plan cannot be built (the sheet past the outer edge), then the draft is kept but completing it is refused naming the field", async () => {
    // 210 mm sheet, 5 mm overlap, 3 mm borders: the sheet reaches 2 mm past the boards on every side.
    const d = await draftOn(objectId, with_({ plan: { ...DATA.plan, borders: { all: 3 }, frame: { rebateLip: 1 } } }));
    expect(d.current.plan.findings.filter((f) => f.code === "sheet-past-outer").map((f) => f.side)).toEqual(["left", "top", "right", "bottom"]);
    const res = await as.framer.post(`/api/mountings/${d.id}/complete`).send({ version: d.version });
    expect(res.status).toBe(422);
    expect(Object.keys(expectErrorShape(res.body, "validation_failed").fields!)).toContain("data.plan.borders.all");
    expect(mountingRow(d.id)!.status).toBe("draft");
  });
});

describe("records the contract refuses", () => {
  let objectId: string;
  beforeAll(() => {
    objectId = makeObject(t.db, studio.institution.id);
  });

  const refused = async (body: unknown) => {
    const res = await as.framer.post(`/api/objects/${objectId}/mountings`).send(body as object);
    expect(res.status).toBe(422);
    expect(mountingsOf(objectId)).toEqual([]);
    return expectErrorShape(res.body, "validation_failed").fields ?? {};
  };

  it("when the undo notes are missing, then it answers 422 at data.undoNotes", async () => {
    const { undoNotes: _u, ...noNotes } = DATA;
    expect(Object.keys(await refused(createBody(noNotes as MountingDataInput)))).toEqual(["data.undoNotes"]);
  });

  it("when the undo notes are blank, then it answers 422 at data.undoNotes with the framer's words", async () => {
    const fields = await refused(createBody(with_({ undoNotes: "   " })));
    expect(fields).toEqual({ "data.undoNotes": "Say how to undo this mounting: what to release, and how." });
  });

  it("when a hinged method has no hinges, then it answers 422 at data.attachment.hinges", async () => {
    expect(Object.keys(await refused(createBody(with_({ attachment: { ...DATA.attachment, hinges: [] } }))))).toEqual(["data.attachment.hinges"]);
  });

  it("when a hinged method has no adhesive, then it answers 422 at data.attachment.adhesive", async () => {
    expect(Object.keys(await refused(createBody(with_({ attachment: { ...DATA.attachment, adhesive: null } }))))).toEqual(["data.attachment.adhesive"]);
  });

  it("when a hinge has no width, then it answers 422 at that hinge's widthMm", async () => {
    const fields = await refused(
      createBody(
        with_({
          attachment: {
            ...DATA.attachment,
            hinges: [
              { edge: "top", offsetMm: 40, widthMm: 25 },
              { edge: "top", offsetMm: 100, widthMm: 0 },
            ],
          },
        }),
      ),
    );
    expect(Object.keys(fields)).toEqual(["data.attachment.hinges.1.widthMm"]);
  });

  it("when the plan cannot be made, then it answers 422 with the field under data.plan.*", async () => {
    const fields = await refused(createBody(with_({ plan: { ...DATA.plan, window: { all: { mode: "overlap", overlap: -3 } } } })));
    expect(Object.keys(fields)).toEqual(["data.plan.window.all.overlap"]);
  });

  it("when the fitted outer size is smaller than the window, then it answers 422 at data.plan.fitOuter.width", async () => {
    const fields = await refused(createBody(with_({ plan: { ...DATA.plan, borders: undefined, fitOuter: { width: 150, height: 400 } } })));
    expect(Object.keys(fields)).toEqual(["data.plan.fitOuter.width"]);
  });

  it("when the reason or date is wrong, then it answers 422 naming reason and mountedOn", async () => {
    const fields = await refused(createBody(DATA, { reason: "because", mountedOn: "2 March 2026" }));
    expect(Object.keys(fields).sort()).toEqual(["mountedOn", "reason"]);
  });

  it("when a draft update would make the plan impossible, then it answers 422 and the draft is unchanged", async () => {
    const d = await draftOn(makeObject(t.db, studio.institution.id));
    const res = await as.framer.put(`/api/mountings/${d.id}`).send({ ...createBody(with_({ plan: { ...DATA.plan, sheet: { width: 0, height: 297 } } })), version: d.version });
    expect(res.status).toBe(422);
    expect(Object.keys(expectErrorShape(res.body, "validation_failed").fields ?? {})).toEqual(["data.plan.sheet.width"]);
    expect(mountingRow(d.id)!.version).toBe(d.version);
  });

  it("when a correction would make the plan impossible, then it answers 422 and no revision is added", async () => {
    const m = await completedOn(makeObject(t.db, studio.institution.id));
    const res = await as.framer
      .post(`/api/mountings/${m.id}/corrections`)
      .send({ version: m.version, correctionReason: "Bad numbers.", data: with_({ plan: { ...DATA.plan, window: { all: { mode: "overlap", overlap: 150 } } } }) });
    expect(res.status).toBe(422);
    expect(Object.keys(expectErrorShape(res.body, "validation_failed").fields ?? {})).toEqual(["data.plan.window"]);
    expect(mountingRow(m.id)!.currentRevision).toBe(1);
  });

  it("when the object or the record does not exist, then it answers 404", async () => {
    expect((await as.framer.post("/api/objects/no-such-object/mountings").send(createBody())).status).toBe(404);
    expect((await as.framer.get("/api/objects/no-such-object/mountings")).status).toBe(404);
    for (const path of ["/api/mountings/no-such-record", "/api/mountings/no-such-record/revisions"]) {
      const res = await as.framer.get(path);
      expect(res.status, path).toBe(404);
      expectErrorShape(res.body, "not_found");
    }
  });
});

describe("who may do what with mounting records", () => {
  /** Did the request leave any trace (row version, revision, status or event)? */
  const snapshot = (objectId: string) => JSON.stringify({ m: mountingsOf(objectId).map((m) => [m.id, m.version, m.status, m.currentRevision]), e: eventsOf(objectId).length });

  const completed = (objectId: string) => completedOn(objectId);
  const draft = (objectId: string) => draftOn(objectId);
  const OWN_READ = { admin: 200, framer: 200, "registrar-own": 200, "registrar-other": 404, "collector-own": 200, "collector-other": 404, "signed-out": 401 };
  // A client-side user cannot see a draft, so cannot learn that one exists by trying to write to it.
  const STUDIO_DRAFT = { admin: 200, framer: 200, "registrar-own": 404, "registrar-other": 404, "collector-own": 404, "collector-other": 404, "signed-out": 401 };

  const ROWS: MatrixRow[] = [
    readRow("GET /api/objects/:id/mountings", OWN_READ, completed, (agent, _m, objectId) => agent.get(`/api/objects/${objectId}/mountings`)),
    {
      route: "POST /api/objects/:id/mountings",
      expected: { admin: 201, framer: 201, "registrar-own": 403, "registrar-other": 404, "collector-own": 403, "collector-other": 404, "signed-out": 401 },
      run: async (agent, objectId) => {
        const res = await agent.post(`/api/objects/${objectId}/mountings`).send(createBody());
        return { status: res.status, body: res.body, written: () => mountingsOf(objectId).length > 0 };
      },
    },
    readRow("GET /api/mountings/:id (completed)", OWN_READ, completed, (agent, m) => agent.get(`/api/mountings/${m.id}`)),
    readRow("GET /api/mountings/:id/revisions (completed)", OWN_READ, completed, (agent, m) => agent.get(`/api/mountings/${m.id}/revisions`)),
    readRow("GET /api/mountings/:id (draft)", STUDIO_DRAFT, draft, (agent, d) => agent.get(`/api/mountings/${d.id}`)),
    readRow("GET /api/mountings/:id/revisions (draft)", STUDIO_DRAFT, draft, (agent, d) => agent.get(`/api/mountings/${d.id}/revisions`)),
    writeRow("PUT /api/mountings/:id (draft)", STUDIO_DRAFT, snapshot, draft, (agent, d) =>
      agent.put(`/api/mountings/${d.id}`).send({ ...createBody(with_({ notes: "Edited" })), version: d.version }),
    ),
    writeRow(
      "PUT /api/mountings/:id (completed)",
      { admin: 409, framer: 409, "registrar-own": 403, "registrar-other": 404, "collector-own": 403, "collector-other": 404, "signed-out": 401 },
      snapshot,
      completed,
      (agent, m) => agent.put(`/api/mountings/${m.id}`).send({ ...createBody(with_({ notes: "Edited" })), version: m.version }),
    ),
    writeRow("POST /api/mountings/:id/complete", STUDIO_DRAFT, snapshot, draft, (agent, d) => agent.post(`/api/mountings/${d.id}/complete`).send({ version: d.version })),
    writeRow(
      "POST /api/mountings/:id/corrections",
      { admin: 201, framer: 201, "registrar-own": 403, "registrar-other": 404, "collector-own": 403, "collector-other": 404, "signed-out": 401 },
      snapshot,
      completed,
      (agent, m) =>
        agent.post(`/api/mountings/${m.id}/corrections`).send({ version: m.version, correctionReason: "Hinge widths measured again.", data: with_({ notes: "Corrected" }) }),
    ),
    writeRow(
      "POST /api/mountings/:id/remove",
      { admin: 200, framer: 200, "registrar-own": 403, "registrar-other": 404, "collector-own": 403, "collector-other": 404, "signed-out": 401 },
      snapshot,
      completed,
      (agent, m) => agent.post(`/api/mountings/${m.id}/remove`).send({ version: m.version, endedOn: "2026-04-01", endReason: "Taken out for conservation." }),
    ),
  ];

  accessMatrix(t, ROWS, () => ({ studio, as, otherPrivateClientId: otherPrivate }));

  it("when an admin records a mounting, then the record names the admin as framer", async () => {
    const res = await as.admin.post(`/api/objects/${makeObject(t.db, studio.institution.id)}/mountings`).send(createBody());
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ framerId: studio.people.admin.id, framerName: "Test admin" });
  });
});

describe("collectors never see drafts", () => {
  let objectId: string;
  let current: MountingRecord;
  let draft: MountingRecord;

  beforeAll(async () => {
    objectId = makeObject(t.db, studio.collectorClient.id);
    current = await completedOn(objectId);
    draft = await draftOn(objectId, REFRAME, { reason: "reframing", mountedOn: "2026-09-01" });
  });

  it("when the studio lists the object's records, then the draft is among them", async () => {
    const res = await as.framer.get(`/api/objects/${objectId}/mountings`);
    expect(res.body.items.map((m: MountingRecord) => m.id).sort()).toEqual([current.id, draft.id].sort());
  });

  it("when the owning collector lists the object's records, then only the completed one is there", async () => {
    const res = await as.collector.get(`/api/objects/${objectId}/mountings`);
    expect(res.status).toBe(200);
    expect(res.body.items.map((m: MountingRecord) => [m.id, m.status])).toEqual([[current.id, "completed"]]);
  });

  it("when the owning collector opens the draft's id, then it answers 404 as if it did not exist", async () => {
    const res = await as.collector.get(`/api/mountings/${draft.id}`);
    expect(res.status).toBe(404);
    const missing = await as.collector.get("/api/mountings/no-such-record");
    expect(expectErrorShape(res.body, "not_found").message).toBe(expectErrorShape(missing.body, "not_found").message);
  });

  it("when the owning collector opens the current record, then the current mount is there in full", async () => {
    const res = await as.collector.get(`/api/mountings/${current.id}`);
    expect(res.status).toBe(200);
    expect(res.body.current.data.attachment.hinges).toEqual(DATA.attachment.hinges);
    expect(res.body.current.plan.aperture).toEqual({ width: 200, height: 287 });
  });

  it("when the draft is completed, then the collector sees it as current and the old one as superseded", async () => {
    const done = await as.framer.post(`/api/mountings/${draft.id}/complete`).send({ version: draft.version });
    expect(done.status).toBe(200);
    const res = await as.collector.get(`/api/objects/${objectId}/mountings`);
    expect(res.body.items.map((m: MountingRecord) => [m.id, m.status])).toEqual([
      [draft.id, "completed"],
      [current.id, "superseded"],
    ]);
  });
});

describe("nobody deletes a mounting record", () => {
  it("when anyone sends DELETE for a record, then there is no such route (404) and the record stays", async () => {
    const m = await completedOn(makeObject(t.db, studio.institution.id));
    for (const agent of [as.admin, as.framer]) {
      const res = await agent.delete(`/api/mountings/${m.id}`);
      expect(res.status).toBe(404);
      expectErrorShape(res.body, "not_found");
    }
    expect(mountingRow(m.id)!.status).toBe("completed");
  });

  it("when the database is asked to delete a completed record, then its revisions hold it in place", () => {
    // Revisions reference their record with ON DELETE RESTRICT: no cascade can take the details with it.
    const m = t.db.select().from(mountings).where(eq(mountings.status, "completed")).get()!;
    expect(() => t.database.sqlite.prepare("DELETE FROM mountings WHERE id = ?").run(m.id)).toThrow(/FOREIGN KEY/);
    expect(mountingRow(m.id)).toBeDefined();
  });
});
