import { createHmac } from "node:crypto";
import { beforeAll, describe, expect, it } from "vitest";
import { asc, eq } from "drizzle-orm";
import { A4_CORNERS, A4_HINGED } from "../../server/db/factories.ts";
import { agentFor, agentsFor, createTestApp, expectErrorShape, makeClient, makePerson, makeStudio, type Agent, type TestApp } from "../setup/test-app.ts";
import { events } from "../../server/db/schema.ts";
import { canonicalJson, eventHash } from "../../server/features/history/history.chain.ts";
import type { ObjectCreateInput, ObjectRecord } from "../../shared/schemas/objects.ts";
import type { HistoryEvent } from "../../shared/schemas/history.ts";
import type { MountingDataInput, MountingRecord } from "../../shared/schemas/mountings.ts";
import { at, first as firstOf } from "../setup/lists.ts";

const t = createTestApp();

let studio: Awaited<ReturnType<typeof makeStudio>>;
let as: { admin: Agent; framer: Agent; registrar: Agent; collector: Agent };
let n = 0;

// A4 = 210 × 297 mm (ISO 216).
const objectBody = (clientId: string, over: Partial<ObjectCreateInput> = {}): ObjectCreateInput => ({
  objectNumber: `H-${String(++n).padStart(4, "0")}`,
  title: "Heron, ink study",
  maker: "Hollis Dray",
  objectType: "drawing",
  sheetWidthMm: 210,
  sheetHeightMm: 297,
  clientId,
  status: "in-studio",
  ...over,
});

// The A4 print hinged, then reframed in corners (sources beside the values in server/db/factories.ts).
const DATA = A4_HINGED;
const REFRAME = A4_CORNERS;

async function createObject(agent: Agent, body: ObjectCreateInput): Promise<ObjectRecord> {
  const res = await agent.post("/api/objects").send(body);
  if (res.status !== 201) throw new Error(`Create answered ${res.status}: ${JSON.stringify(res.body)}`);
  return res.body;
}
function editable(r: ObjectRecord) {
  const { id: _i, clientName: _c, createdAt: _ca, updatedAt: _u, valuationVisible: _v, ...rest } = r;
  return rest;
}
async function edit(agent: Agent, o: ObjectRecord, over: Partial<ObjectCreateInput>): Promise<ObjectRecord> {
  const res = await agent.put(`/api/objects/${o.id}`).send({ ...editable(o), ...over });
  if (res.status !== 200) throw new Error(`Edit answered ${res.status}: ${JSON.stringify(res.body)}`);
  return res.body;
}
async function mount(objectId: string, data: MountingDataInput, reason: string, mountedOn: string): Promise<MountingRecord> {
  const d = await as.framer.post(`/api/objects/${objectId}/mountings`).send({ reason, mountedOn, data });
  if (d.status !== 201) throw new Error(`Draft answered ${d.status}: ${JSON.stringify(d.body)}`);
  const c = await as.framer.post(`/api/mountings/${d.body.id}/complete`).send({ version: d.body.version });
  if (c.status !== 200) throw new Error(`Complete answered ${c.status}: ${JSON.stringify(c.body)}`);
  return c.body;
}
const history = async (agent: Agent, objectId: string, query = ""): Promise<{ items: HistoryEvent[]; nextBefore: string | null }> => {
  const res = await agent.get(`/api/objects/${objectId}/history${query}`);
  if (res.status !== 200) throw new Error(`History answered ${res.status}: ${JSON.stringify(res.body)}`);
  return res.body;
};
const rowsOf = (app: TestApp, objectId: string) => app.db.select().from(events).where(eq(events.objectId, objectId)).orderBy(asc(events.seq)).all();
/** The part of a stored event its hash covers, written out here as the history chain defines it. */
const hashedContent = (r: ReturnType<typeof rowsOf>[number]) => ({
  objectId: r.objectId,
  type: r.type,
  at: r.at.getTime(),
  actorId: r.actorId,
  actorName: r.actorName,
  summary: r.summary,
  data: r.data,
  prevHash: r.prevHash,
  occurredOn: r.occurredOn ?? undefined,
});

/** Every action of the journey on one object, in order, so each test below can read its event. */
let obj: ObjectRecord;
let first: MountingRecord;
let second: MountingRecord;

beforeAll(async () => {
  studio = await makeStudio(t);
  as = await agentsFor(t, studio.people);
  obj = await createObject(as.framer, objectBody(studio.collectorClient.id, { objectNumber: "H-JOURNEY" }));
  obj = await edit(as.framer, obj, { title: "Heron at the weir, ink study", medium: "Iron gall ink" });
  obj = await edit(as.framer, obj, { valuationMinor: 1_234_500, valuationCurrency: "GBP", valuationDate: "2026-02-01", valuationBasis: "market" });
  const plan = await as.framer.put(`/api/objects/${obj.id}/plan`).send({ input: DATA.plan });
  if (plan.status !== 200) throw new Error(`Plan answered ${plan.status}`);
  first = await mount(obj.id, DATA, "first-mounting", "2026-03-02");
  second = await mount(obj.id, REFRAME, "reframing", "2027-05-10");
  const corr = await as.framer
    .post(`/api/mountings/${second.id}/corrections`)
    .send({ version: second.version, correctionReason: "Glazing was UV acrylic.", data: { ...REFRAME, glazing: { type: "uv-acrylic", thicknessMm: 3 } } });
  if (corr.status !== 201) throw new Error(`Correction answered ${corr.status}`);
  second = corr.body;
  const rem = await as.framer.post(`/api/mountings/${second.id}/remove`).send({ version: second.version, endedOn: "2028-01-10", endReason: "Lent unframed." });
  if (rem.status !== 200) throw new Error(`Remove answered ${rem.status}`);
});

describe("the events each action writes", () => {
  let items: HistoryEvent[];
  beforeAll(async () => {
    items = (await history(as.framer, obj.id)).items;
  });
  const one = (type: string) => {
    const found = items.filter((e) => e.type === type);
    expect(found, type).toHaveLength(1);
    return firstOf(found, type);
  };

  it("when the journey is read back, then every action is there, newest first by the day it happened, then by entry", () => {
    expect([...items.map((e) => e.type)].sort()).toEqual(["catalogue-changed", "created", "mounted", "mounting-corrected", "mounting-removed", "plan-saved", "reframed", "valued"]);
    const keys = items.map((e) => `${e.occurredOn}:${String(e.seq).padStart(9, "0")}`);
    expect(keys).toEqual([...keys].sort().reverse());
    for (const e of items) expect(e.objectId).toBe(obj.id);
  });

  it("when a thing happened on another day than it was entered, then the event carries that day and when it was entered", () => {
    // Mounted on 2026-03-02, reframed on 2027-05-10, taken out on 2028-01-10, valued on 2026-02-01: all entered today.
    expect(one("mounted").occurredOn).toBe("2026-03-02");
    expect(one("reframed").occurredOn).toBe("2027-05-10");
    expect(one("mounting-removed").occurredOn).toBe("2028-01-10");
    expect(one("valued").occurredOn).toBe("2026-02-01");
    // A correction or a catalogue edit happens when it is entered.
    expect(one("mounting-corrected").occurredOn).toBe(one("mounting-corrected").at.slice(0, 10));
    const mounted = items.findIndex((e) => e.type === "mounted");
    const reframed = items.findIndex((e) => e.type === "reframed");
    expect(reframed).toBeLessThan(mounted);
    expect(items.findIndex((e) => e.type === "valued")).toBeGreaterThan(mounted);
  });

  it("when an object is recorded, then a created event names its number and who recorded it", () => {
    const e = one("created");
    expect(e).toMatchObject({ actorName: "Test framer", data: { objectNumber: "H-JOURNEY" } });
    expect(e.summary).toContain("H-JOURNEY");
  });

  it("when the catalogue is edited, then catalogue-changed lists the changed paths with before and after", () => {
    const e = one("catalogue-changed");
    expect(e.data.changes).toEqual([
      { path: "medium", before: null, after: "Iron gall ink" },
      { path: "title", before: "Heron, ink study", after: "Heron at the weir, ink study" },
    ]);
    expect(e.summary).toContain("title");
  });

  it("when the valuation is edited, then valued says which fields changed but never the amounts", () => {
    const e = one("valued");
    expect(e.data).toEqual({ fields: expect.arrayContaining(["valuationMinor", "valuationCurrency", "valuationDate", "valuationBasis"]) });
    const text = JSON.stringify(e);
    // The amount in any form: minor units, major units, or with separators.
    for (const amount of ["1234500", "12345", "12,345", "1 234 500"]) expect(text).not.toContain(amount);
    expect(e.summary).not.toMatch(/\d/);
  });

  it("when a valuation edit also changes the catalogue, then the two are separate events and neither carries the amount", async () => {
    const o = await createObject(as.framer, objectBody(studio.institution.id));
    await edit(as.registrar, o, { title: "Renamed by the registrar", valuationMinor: 987_654, valuationCurrency: "EUR" });
    const got = (await history(as.registrar, o.id)).items;
    expect(got.map((e) => e.type)).toEqual(["valued", "catalogue-changed", "created"]);
    expect(at(got, 1).data.changes).toEqual([{ path: "title", before: "Heron, ink study", after: "Renamed by the registrar" }]);
    expect(JSON.stringify(got)).not.toContain("987654");
    expect(firstOf(got).actorName).toBe("Test registrar");
  });

  it("when an object is recorded with a value, then a valued event follows created, without the amount", async () => {
    const o = await createObject(as.admin, objectBody(studio.institution.id, { valuationMinor: 555_000, valuationCurrency: "USD" }));
    const got = (await history(as.admin, o.id)).items;
    expect(got.map((e) => e.type)).toEqual(["valued", "created"]);
    expect(JSON.stringify(got)).not.toContain("555000");
  });

  it("when an edit changes nothing, then no event is written", async () => {
    const o = await createObject(
      as.framer,
      objectBody(studio.institution.id, { sensitivities: ["light-sensitive"], borderLeftMm: 10, borderTopMm: 10, borderRightMm: 10, borderBottomMm: 12 }),
    );
    await edit(as.framer, o, {});
    expect((await history(as.framer, o.id)).items.map((e) => e.type)).toEqual(["created"]);
  });

  it("when a plan draft is saved, then plan-saved gives the window and outer size", () => {
    const e = one("plan-saved");
    expect(e.summary).toContain("200 × 287 mm");
    expect(e.summary).toContain("320 × 407 mm");
    expect(typeof e.data.planId).toBe("string");
  });

  it("when the first mounting is completed, then mounted names the record and its revision", () => {
    const e = one("mounted");
    expect(e.data).toEqual({ mountingId: first.id, revision: 1 });
    expect(e.summary).toMatch(/^Mounted: /);
    expect(e.summary).toContain("2 T-hinges");
  });

  it("when a later mounting is completed, then reframed names the record it supersedes", () => {
    const e = one("reframed");
    expect(e.data).toEqual({ mountingId: second.id, revision: 1, supersedes: first.id });
    expect(e.summary).toMatch(/^Reframed: /);
  });

  it("when a completed record is corrected, then mounting-corrected gives the reason, the revision and the changes", () => {
    const e = one("mounting-corrected");
    expect(e.data).toMatchObject({ mountingId: second.id, revision: 2 });
    expect(e.data.changes).toEqual([{ path: "glazing.type", before: "ar-uv-glass", after: "uv-acrylic" }]);
    expect(e.summary).toContain("Glazing was UV acrylic.");
  });

  it("when the current mount is taken out, then mounting-removed gives the reason", () => {
    const e = one("mounting-removed");
    expect(e.data).toEqual({ mountingId: second.id });
    expect(e.summary).toContain("Lent unframed.");
  });

  it("when a mounting draft is saved or edited, then no event is written: drafts are not history", async () => {
    const before = rowsOf(t, obj.id).length;
    const d = await as.framer.post(`/api/objects/${obj.id}/mountings`).send({ reason: "hinge-repair", mountedOn: "2028-05-01", data: DATA });
    expect(d.status).toBe(201);
    expect((await as.framer.put(`/api/mountings/${d.body.id}`).send({ reason: "hinge-repair", mountedOn: "2028-05-02", data: DATA, version: 1 })).status).toBe(200);
    expect(rowsOf(t, obj.id)).toHaveLength(before);
  });
});

describe("reading the history", () => {
  it("when types= is given, then only those types come back, newest first", async () => {
    const got = await history(as.framer, obj.id, "?types=mounted,reframed");
    expect(got.items.map((e) => e.type)).toEqual(["reframed", "mounted"]);
    expect(got.nextBefore).toBeNull();
  });

  it("when types= names an unknown type, then it answers 422 naming types", async () => {
    const res = await as.framer.get(`/api/objects/${obj.id}/history?types=mounted,burnt`);
    expect(res.status).toBe(422);
    expect(Object.keys(expectErrorShape(res.body, "validation_failed").fields ?? {})[0]).toMatch(/^types/);
  });

  it("when paging with limit and before, then the pages join up to the whole history without gaps or repeats", async () => {
    const all = (await history(as.framer, obj.id)).items;
    const pages: HistoryEvent[][] = [];
    let before: string | null = null;
    do {
      const page: { items: HistoryEvent[]; nextBefore: string | null } = await history(as.framer, obj.id, `?limit=3${before ? `&before=${before}` : ""}`);
      expect(page.items.length).toBeLessThanOrEqual(3);
      const last = at(page.items, -1);
      if (page.nextBefore !== null) expect(page.nextBefore).toBe(`${last.occurredOn}:${last.seq}`);
      pages.push(page.items);
      before = page.nextBefore;
    } while (before !== null && pages.length < 10);
    expect(pages.length).toBe(Math.ceil(all.length / 3));
    expect(pages.flat()).toEqual(all);
  });

  it("when the last page is exactly full, then nextBefore is null", async () => {
    const all = (await history(as.framer, obj.id)).items;
    const page = await history(as.framer, obj.id, `?limit=${all.length}`);
    expect(page.items).toHaveLength(all.length);
    expect(page.nextBefore).toBeNull();
  });

  it("when limit is 0 or above 200, then it answers 422 naming limit", async () => {
    for (const limit of [0, 201]) {
      const res = await as.framer.get(`/api/objects/${obj.id}/history?limit=${limit}`);
      expect(res.status, String(limit)).toBe(422);
      expect(Object.keys(expectErrorShape(res.body, "validation_failed").fields ?? {})).toEqual(["limit"]);
    }
  });
});

describe("the hash chain", () => {
  it("when canonical JSON is written, then keys are sorted at every level and undefined is left out", () => {
    expect(canonicalJson({ b: 1, a: { d: [2, { z: 1, y: null }], c: "x" }, u: undefined })).toBe('{"a":{"c":"x","d":[2,{"y":null,"z":1}]},"b":1}');
  });

  it("when each event is recomputed, then its hash is SHA-256 of its content and the previous event's hash", async () => {
    const rows = rowsOf(t, obj.id);
    expect(rows.length).toBeGreaterThanOrEqual(8);
    const api = new Map((await history(as.framer, obj.id, "?limit=200")).items.map((e) => [e.seq, e.hash]));
    let prev: string | null = null;
    for (const r of rows) {
      expect(r.prevHash, `event ${r.seq}`).toBe(prev);
      const content = hashedContent(r);
      // Recomputed by hand (HMAC-SHA256, RFC 2104, keyed with the app's history key) as well as through eventHash.
      const byHand = createHmac("sha256", t.historyKey).update(canonicalJson(content)).digest("hex");
      expect(r.hash, `event ${r.seq}`).toBe(byHand);
      expect(eventHash(content, t.historyKey)).toBe(byHand);
      expect(api.get(r.seq)).toBe(r.hash);
      prev = r.hash;
    }
  });

  it("when any part of an event's content or its link changes, then its hash changes", () => {
    const r = at(rowsOf(t, obj.id), 1);
    const content = hashedContent(r);
    const h = eventHash(content, t.historyKey);
    for (const over of [
      { summary: `${r.summary} ` },
      { at: content.at + 1 },
      { prevHash: "0".repeat(64) },
      { actorName: "Someone else" },
      { data: { ...(r.data as object), extra: 1 } },
      { type: "created" },
      { occurredOn: "1999-01-01" },
    ]) {
      expect(eventHash({ ...content, ...over }, t.historyKey), JSON.stringify(over)).not.toBe(h);
    }
  });

  it("when two objects have events, then each chain starts afresh at its own first event", async () => {
    const o = await createObject(as.framer, objectBody(studio.institution.id));
    const rows = rowsOf(t, o.id);
    expect(rows).toHaveLength(1);
    expect(firstOf(rows).prevHash).toBeNull();
  });

  it("when the object's chain is verified, then it is ok and counts the object's events", async () => {
    const res = await as.framer.get(`/api/objects/${obj.id}/history/verify`);
    expect(res.status).toBe(200);
    expect(res.body).toEqual({ ok: true, checked: rowsOf(t, obj.id).length });
  });

  it("when every chain is verified, then it is ok and counts every event", async () => {
    const res = await as.admin.get("/api/history/verify");
    expect(res.status).toBe(200);
    expect(res.body).toEqual({ ok: true, checked: t.db.select().from(events).all().length });
  });
});

describe("who may read and verify history", () => {
  let institutions: ObjectRecord;
  let others: ObjectRecord;
  let otherPrivate: ObjectRecord;
  beforeAll(async () => {
    institutions = await createObject(as.framer, objectBody(studio.institution.id));
    others = await createObject(as.framer, objectBody(studio.otherInstitution.id));
    otherPrivate = await createObject(as.framer, objectBody(makeClient(t.db, { kind: "private", name: "Basil Owner" }).id));
  });

  it("when the owning collector reads the history, then the whole history is there", async () => {
    const mine = await history(as.collector, obj.id);
    const studioView = await history(as.framer, obj.id);
    expect(mine).toEqual(studioView);
  });

  it("when a collector reads another client's object's history, then it answers 404", async () => {
    for (const o of [otherPrivate, institutions]) {
      const res = await as.collector.get(`/api/objects/${o.id}/history`);
      expect(res.status).toBe(404);
      expectErrorShape(res.body, "not_found");
    }
  });

  it("when a registrar reads their institution's object's history, then it answers 200", async () => {
    expect((await history(as.registrar, institutions.id)).items.map((e) => e.type)).toEqual(["created"]);
  });

  it("when a registrar reads another institution's object's history, then it answers 404", async () => {
    const res = await as.registrar.get(`/api/objects/${others.id}/history`);
    expect(res.status).toBe(404);
    expectErrorShape(res.body, "not_found");
  });

  it("when a collector or registrar asks to verify a chain, then both verify routes answer 403", async () => {
    for (const [agent, id] of [
      [as.collector, obj.id],
      [as.registrar, institutions.id],
    ] as const) {
      for (const path of [`/api/objects/${id}/history/verify`, "/api/history/verify"]) {
        const res = await agent.get(path);
        expect(res.status, path).toBe(403);
        expectErrorShape(res.body, "forbidden");
      }
    }
  });

  it("when a framer verifies one object's chain, then it answers 200; an unknown object answers 404", async () => {
    expect((await as.framer.get(`/api/objects/${others.id}/history/verify`)).body).toEqual({ ok: true, checked: 1 });
    const res = await as.framer.get("/api/objects/no-such-object/history/verify");
    expect(res.status).toBe(404);
    expect((await as.framer.get("/api/objects/no-such-object/history")).status).toBe(404);
  });

  it("when nobody is signed in, then history and verify answer 401", async () => {
    for (const path of [`/api/objects/${obj.id}/history`, `/api/objects/${obj.id}/history/verify`, "/api/history/verify"]) {
      const res = await t.agent().get(path);
      expect(res.status, path).toBe(401);
      expectErrorShape(res.body, "unauthenticated");
    }
  });
});

describe("nobody deletes history", () => {
  it("when anyone sends DELETE, PUT or PATCH to a history, then there is no such route (404) and nothing changes", async () => {
    const before = rowsOf(t, obj.id);
    for (const method of ["delete", "put", "patch"] as const) {
      for (const path of [`/api/objects/${obj.id}/history`, `/api/objects/${obj.id}/history/${firstOf(before).seq}`]) {
        const res = await as.admin[method](path).send({});
        expect(res.status, `${method} ${path}`).toBe(404);
        expectErrorShape(res.body, "not_found");
      }
    }
    expect(rowsOf(t, obj.id)).toEqual(before);
  });

  it("when the database is asked to UPDATE an event, then it refuses", () => {
    const seq = firstOf(rowsOf(t, obj.id)).seq;
    expect(() => t.database.sqlite.prepare("UPDATE events SET summary = 'nothing happened' WHERE seq = ?").run(seq)).toThrow(/history events cannot be changed/);
    expect(firstOf(rowsOf(t, obj.id)).summary).not.toBe("nothing happened");
  });

  it("when the database is asked to DELETE an event, then it refuses", () => {
    const count = rowsOf(t, obj.id).length;
    expect(() => t.database.sqlite.prepare("DELETE FROM events WHERE object_id = ?").run(obj.id)).toThrow(/history events cannot be deleted/);
    expect(rowsOf(t, obj.id)).toHaveLength(count);
  });
});

describe("tampering by hand is caught by verify", () => {
  // Its own database: these tests break chains on purpose.
  const x = createTestApp();
  let admin: Agent;
  let a: ObjectRecord;
  let b: ObjectRecord;

  beforeAll(async () => {
    const clientId = makeClient(x.db, { kind: "institution", name: "Damson Library" }).id;
    admin = await agentFor(x, await makePerson(x, "admin"));
    a = await createObject(admin, objectBody(clientId));
    a = await edit(admin, a, { title: "First change" });
    a = await edit(admin, a, { title: "Second change" });
    b = await createObject(admin, objectBody(clientId));
    b = await edit(admin, b, { title: "B, first change" });
    b = await edit(admin, b, { title: "B, second change" });
    b = await edit(admin, b, { title: "B, third change" });
    expect((await admin.get("/api/history/verify")).body.ok).toBe(true);
  });

  it("when one event's summary is changed after the trigger is dropped, then verify names that event's seq and object", async () => {
    const target = at(rowsOf(x, a.id), 1);
    x.database.sqlite.exec("DROP TRIGGER events_no_update");
    x.database.sqlite.prepare("UPDATE events SET summary = ? WHERE seq = ?").run("Catalogue changed: nothing.", target.seq);

    const one = await admin.get(`/api/objects/${a.id}/history/verify`);
    expect(one.status).toBe(200);
    expect(one.body).toMatchObject({ ok: false, checked: 1, brokenAt: { seq: target.seq, objectId: a.id } });
    expect(one.body.brokenAt.reason).toMatch(/changed/);
    const all = await admin.get("/api/history/verify");
    expect(all.body).toMatchObject({ ok: false, brokenAt: { seq: target.seq, objectId: a.id } });
    // The other object's chain is untouched.
    expect((await admin.get(`/api/objects/${b.id}/history/verify`)).body).toEqual({ ok: true, checked: 4 });

    // Putting the original text back makes the chain whole again: verify judges content, not the act of updating.
    x.database.sqlite.prepare("UPDATE events SET summary = ? WHERE seq = ?").run(target.summary, target.seq);
    expect((await admin.get("/api/history/verify")).body.ok).toBe(true);
  });

  it("when an event's data is changed, then verify names that event", async () => {
    const target = at(rowsOf(x, a.id), 2);
    x.database.sqlite.prepare("UPDATE events SET data = ? WHERE seq = ?").run(JSON.stringify({ changes: [] }), target.seq);
    expect((await admin.get(`/api/objects/${a.id}/history/verify`)).body).toMatchObject({ ok: false, checked: 2, brokenAt: { seq: target.seq, objectId: a.id } });
    x.database.sqlite.prepare("UPDATE events SET data = ? WHERE seq = ?").run(JSON.stringify(target.data), target.seq);
    expect((await admin.get(`/api/objects/${a.id}/history/verify`)).body.ok).toBe(true);
  });

  it("when a middle event is deleted after the trigger is dropped, then verify names the event after the gap", async () => {
    const rows = rowsOf(x, b.id);
    expect(rows).toHaveLength(4);
    x.database.sqlite.exec("DROP TRIGGER events_no_delete");
    x.database.sqlite.prepare("DELETE FROM events WHERE seq = ?").run(at(rows, 1).seq);

    const one = await admin.get(`/api/objects/${b.id}/history/verify`);
    expect(one.body).toMatchObject({ ok: false, checked: 1, brokenAt: { seq: at(rows, 2).seq, objectId: b.id } });
    expect(one.body.brokenAt.reason).toMatch(/removed/);
    const all = await admin.get("/api/history/verify");
    expect(all.body).toMatchObject({ ok: false, brokenAt: { seq: at(rows, 2).seq, objectId: b.id } });
  });

  it("when an object's first event is deleted, then verify names the event that now claims a missing predecessor", async () => {
    const rows = rowsOf(x, a.id);
    x.database.sqlite.prepare("DELETE FROM events WHERE seq = ?").run(firstOf(rows).seq);
    const one = await admin.get(`/api/objects/${a.id}/history/verify`);
    expect(one.body).toMatchObject({ ok: false, checked: 0, brokenAt: { seq: at(rows, 1).seq, objectId: a.id } });
    expect(one.body.brokenAt.reason).toMatch(/not there/);
  });

  it("when an object's newest events are cut from the end, then verify says the history ends early", async () => {
    const clientId = makeClient(x.db, { kind: "private", name: "Elder Owner" }).id;
    let c = await createObject(admin, objectBody(clientId));
    c = await edit(admin, c, { title: "C, first change" });
    c = await edit(admin, c, { title: "C, second change" });
    expect((await admin.get(`/api/objects/${c.id}/history/verify`)).body).toEqual({ ok: true, checked: 3 });
    const rows = rowsOf(x, c.id);
    x.database.sqlite.prepare("DELETE FROM events WHERE seq = ?").run(at(rows, 2).seq);
    const one = await admin.get(`/api/objects/${c.id}/history/verify`);
    expect(one.body).toMatchObject({ ok: false, brokenAt: { seq: at(rows, 1).seq, objectId: c.id } });
    expect(one.body.brokenAt.reason).toMatch(/ends before/);
  });
});
