import { beforeAll, describe, expect, it } from "vitest";
import { A4_CORNERS, A4_HINGED } from "../../server/db/factories.ts";
import { agentFor, createTestApp, expectErrorShape, makeObject, makeStudio, type Agent, type Person } from "../setup/test-app.ts";
import type { MountingDataInput, MountingListItem, MountingListPage, MountingRecord } from "../../shared/schemas/mountings.ts";

const t = createTestApp();

let framer: Agent;
let admin: Agent;
let registrar: Agent;
let collector: Agent;
let people: Record<"admin" | "framer" | "registrar" | "collector", Person>;

// The A4 print hinged, and in corners (sources beside the values in server/db/factories.ts); batch numbers are invented.
const HINGED = A4_HINGED;
const CORNERS = A4_CORNERS;
const withBatches = (data: MountingDataInput, windowBatch: string, backingBatch?: string): MountingDataInput => ({
  ...data,
  boards: { ...data.boards, window: { ...data.boards.window, batch: windowBatch }, backing: { ...data.boards.backing, batch: backingBatch } },
});

async function draft(agent: Agent, objectId: string, data: MountingDataInput, mountedOn: string, reason = "first-mounting"): Promise<MountingRecord> {
  const res = await agent.post(`/api/objects/${objectId}/mountings`).send({ reason, mountedOn, data });
  if (res.status !== 201) throw new Error(`Draft answered ${res.status}: ${JSON.stringify(res.body)}`);
  return res.body;
}
async function completed(agent: Agent, objectId: string, data: MountingDataInput, mountedOn: string, reason = "first-mounting"): Promise<MountingRecord> {
  const d = await draft(agent, objectId, data, mountedOn, reason);
  const res = await agent.post(`/api/mountings/${d.id}/complete`).send({ version: d.version });
  if (res.status !== 200) throw new Error(`Complete answered ${res.status}: ${JSON.stringify(res.body)}`);
  return res.body;
}

async function list(agent: Agent, query = ""): Promise<MountingListPage> {
  const res = await agent.get(`/api/mountings${query ? `?${query}` : ""}`);
  if (res.status !== 200) throw new Error(`GET /api/mountings?${query} answered ${res.status}: ${JSON.stringify(res.body)}`);
  return res.body;
}
/** Each record as "object number mounted-on", the way the register reads. */
const rows = (p: { items: MountingListItem[] }) => p.items.map((i) => `${i.objectNumber} ${i.mountedOn}`);

const ids: Record<string, string> = {};

beforeAll(async () => {
  const s = await makeStudio(t);
  people = s.people;
  framer = await agentFor(t, people.framer);
  admin = await agentFor(t, people.admin);
  registrar = await agentFor(t, people.registrar);
  collector = await agentFor(t, people.collector);
  const a = makeObject(t.db, s.collectorClient.id, { objectNumber: "2025-0101", title: "Harbour wall, morning" });
  const b = makeObject(t.db, s.institution.id, { objectNumber: "2025-0102", title: "Estuary at low water" });
  const c = makeObject(t.db, s.otherInstitution.id, { objectNumber: "2025-0103", title: "Night tram" });
  const d = makeObject(t.db, s.institution.id, { objectNumber: "2025-0104", title: "Birch bark, detail" });

  // A: hinged by the framer, then reframed in corners by the admin, which supersedes the first record.
  ids.aFirst = (await completed(framer, a, HINGED, "2025-01-10")).id;
  ids.aSecond = (await completed(admin, a, CORNERS, "2026-02-01", "reframing")).id;
  // B: hinged by the framer; a correction later gives the window board another batch (revision 2).
  const b1 = await completed(framer, b, withBatches(HINGED, "XB-1", "MB-2292"), "2025-06-15");
  const corrected = await framer
    .post(`/api/mountings/${b1.id}/corrections`)
    .send({ version: b1.version, correctionReason: "The window board came from the newer delivery.", data: withBatches(HINGED, "XB-2", "MB-2292") });
  if (corrected.status !== 201) throw new Error(`Correction answered ${corrected.status}: ${JSON.stringify(corrected.body)}`);
  ids.b = b1.id;
  // C: a draft the admin has started.
  ids.c = (await draft(admin, c, CORNERS, "2026-03-01")).id;
  // D: hinged by the framer, then taken out of its mount.
  const d1 = await completed(framer, d, withBatches(HINGED, "MB-2291"), "2025-09-09");
  const removed = await framer.post(`/api/mountings/${d1.id}/remove`).send({ version: d1.version, endedOn: "2026-01-05", endReason: "Lent unframed for a study day." });
  if (removed.status !== 200) throw new Error(`Remove answered ${removed.status}: ${JSON.stringify(removed.body)}`);
  ids.d = d1.id;
});

describe("GET /api/mountings: the register", () => {
  it("when nothing is asked, then every record across objects comes, newest first, drafts included", async () => {
    const p = await list(framer);
    expect(rows(p)).toEqual(["2025-0103 2026-03-01", "2025-0101 2026-02-01", "2025-0104 2025-09-09", "2025-0102 2025-06-15", "2025-0101 2025-01-10"]);
    expect(p).toMatchObject({ total: 5, page: 1, pageSize: 50 });
  });

  it("when a record is listed, then it carries its object, framer, reason, materials, batches and status", async () => {
    const p = await list(framer);
    const a2 = p.items.find((i) => i.id === ids.aSecond)!;
    expect(a2).toMatchObject({
      objectNumber: "2025-0101",
      objectTitle: "Harbour wall, morning",
      status: "completed",
      reason: "reframing",
      mountedOn: "2026-02-01",
      framerName: "Test admin",
      method: "corners",
      boardGrade: "conservation",
      glazing: "ar-uv-glass",
      batches: ["CB-7710"],
    });
    expect(p.items.find((i) => i.id === ids.aFirst)).toMatchObject({
      status: "superseded",
      method: "t-hinge",
      boardGrade: "museum",
      glazing: "uv-glass",
      batches: ["MB-2291", "MB-2292"],
    });
  });

  it("when a record was corrected, then its batches are those of the current revision", async () => {
    const b = (await list(framer)).items.find((i) => i.id === ids.b)!;
    expect(b.batches).toEqual(["XB-2", "MB-2292"]);
  });

  it("when the register is read, then it offers the framers who have made records, by name", async () => {
    const p = await list(framer);
    expect(p.framers).toEqual([
      { id: people.admin.id, name: "Test admin" },
      { id: people.framer.id, name: "Test framer" },
    ]);
  });
});

describe("filters", () => {
  it("when filtering by a batch, then every record whose boards came from it is found, whatever the case typed", async () => {
    expect(rows(await list(framer, "batch=mb-2291"))).toEqual(["2025-0104 2025-09-09", "2025-0101 2025-01-10"]);
    expect(rows(await list(framer, "batch=%20MB-2291%20"))).toEqual(["2025-0104 2025-09-09", "2025-0101 2025-01-10"]);
    expect(rows(await list(framer, "batch=MB-2292"))).toEqual(["2025-0102 2025-06-15", "2025-0101 2025-01-10"]);
  });

  it("when filtering by a batch, then only the whole batch number matches, not a part of it", async () => {
    expect(await list(framer, "batch=MB-229")).toMatchObject({ items: [], total: 0 });
  });

  it("when a batch was corrected away, then the record is still found by it, and by the new one", async () => {
    expect(rows(await list(framer, "batch=xb-1"))).toEqual(["2025-0102 2025-06-15"]);
    expect(rows(await list(framer, "batch=XB-2"))).toEqual(["2025-0102 2025-06-15"]);
  });

  it("when filtering by framer, then only that person's records come", async () => {
    expect(rows(await list(framer, `framerId=${people.admin.id}`))).toEqual(["2025-0103 2026-03-01", "2025-0101 2026-02-01"]);
    expect((await list(framer, `framerId=${people.framer.id}`)).total).toBe(3);
    expect((await list(framer, "framerId=nobody")).total).toBe(0);
  });

  it("when filtering by a date range, then both ends are included", async () => {
    expect(rows(await list(framer, "from=2025-06-15&to=2026-02-01"))).toEqual(["2025-0101 2026-02-01", "2025-0104 2025-09-09", "2025-0102 2025-06-15"]);
    expect(rows(await list(framer, "from=2026-01-01"))).toEqual(["2025-0103 2026-03-01", "2025-0101 2026-02-01"]);
    expect(rows(await list(framer, "to=2025-01-10"))).toEqual(["2025-0101 2025-01-10"]);
  });

  it("when filtering by method, then only records held that way come", async () => {
    expect(rows(await list(framer, "method=corners"))).toEqual(["2025-0103 2026-03-01", "2025-0101 2026-02-01"]);
    expect((await list(framer, "method=t-hinge")).total).toBe(3);
    expect((await list(framer, "method=sink-mount")).total).toBe(0);
  });

  it("when filtering by status, then drafts, current, superseded and removed records can each be listed", async () => {
    expect(rows(await list(framer, "status=draft"))).toEqual(["2025-0103 2026-03-01"]);
    expect(rows(await list(framer, "status=completed"))).toEqual(["2025-0101 2026-02-01", "2025-0102 2025-06-15"]);
    expect(rows(await list(framer, "status=superseded"))).toEqual(["2025-0101 2025-01-10"]);
    expect(rows(await list(framer, "status=removed"))).toEqual(["2025-0104 2025-09-09"]);
  });

  it("when filters are combined, then all of them apply", async () => {
    expect(rows(await list(framer, `batch=mb-2291&status=superseded`))).toEqual(["2025-0101 2025-01-10"]);
    expect(rows(await list(framer, `framerId=${people.framer.id}&method=t-hinge&from=2025-06-01&to=2025-12-31`))).toEqual(["2025-0104 2025-09-09", "2025-0102 2025-06-15"]);
    expect((await list(framer, `framerId=${people.admin.id}&batch=MB-2291`)).total).toBe(0);
  });

  it("when a filter value is not valid, then it answers 422 naming the filter", async () => {
    for (const [query, field] of [
      ["method=glue", "method"],
      ["status=lost", "status"],
      ["from=1%20March", "from"],
      ["to=2026-3-1", "to"],
      ["pageSize=201", "pageSize"],
    ] as const) {
      const res = await framer.get(`/api/mountings?${query}`);
      expect(res.status, query).toBe(422);
      expect(Object.keys(expectErrorShape(res.body, "validation_failed").fields ?? {})).toEqual([field]);
    }
  });
});

describe("pagination", () => {
  it("when paging two at a time, then every page has the full total and the pages do not overlap", async () => {
    const pages = [await list(framer, "pageSize=2&page=1"), await list(framer, "pageSize=2&page=2"), await list(framer, "pageSize=2&page=3")];
    expect(pages.map((p) => p.total)).toEqual([5, 5, 5]);
    expect(pages.map((p) => p.items.length)).toEqual([2, 2, 1]);
    expect(pages.flatMap(rows)).toEqual(rows(await list(framer)));
  });

  it("when the page is past the end, then it is empty but still tells the total", async () => {
    expect(await list(framer, "pageSize=2&page=4")).toMatchObject({ items: [], total: 5, page: 4, pageSize: 2 });
  });
});

describe("who may read it", () => {
  it("when an admin asks, then the register answers", async () => {
    expect((await list(admin)).total).toBe(5);
  });

  it("when a registrar or a collector asks, then it answers 403, even for records of their own objects", async () => {
    for (const agent of [registrar, collector]) {
      const res = await agent.get("/api/mountings");
      expect(res.status).toBe(403);
      expectErrorShape(res.body, "forbidden");
      expect((await agent.get(`/api/mountings?batch=MB-2291`)).status).toBe(403);
    }
  });

  it("when signed out, then it answers 401", async () => {
    const res = await t.agent().get("/api/mountings");
    expect(res.status).toBe(401);
    expectErrorShape(res.body, "unauthenticated");
  });

  it("when one record is asked for by id, then the record route still answers it", async () => {
    const res = await framer.get(`/api/mountings/${ids.aSecond}`);
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ id: ids.aSecond, objectNumber: "2025-0101", status: "completed" });
  });
});
