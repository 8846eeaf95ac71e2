import { beforeAll, describe, expect, it } from "vitest";
import { agentFor, createTestApp, makeObject, makeStudio, type Agent } from "../setup/test-app.ts";
import type { ObjectRecord } from "../../shared/schemas/objects.ts";
import { listObjects as list, objectNumbers as numbers } from "../setup/registers.ts";

const t = createTestApp();
let framer: Agent;
let collector: Agent;
let a: string;
let b: string;

beforeAll(async () => {
  const s = await makeStudio(t);
  a = s.collectorClient.id;
  b = s.institution.id;
  makeObject(t.db, a, { objectNumber: "2026-0014", title: "Three pears on a blue cloth", maker: "Amadou Fenn", objectType: "pastel", status: "in-studio" });
  makeObject(t.db, a, { objectNumber: "2026-0015", title: "Harbour wall, morning", maker: "Ilse Korrow", objectType: "print", status: "with-owner" });
  makeObject(t.db, b, { objectNumber: "2026-0016", title: "Estuary at low water", maker: "Ilse Korrow", objectType: "watercolour", status: "in-studio" });
  makeObject(t.db, b, {
    objectNumber: "2026-0140",
    title: "Birch bark, detail",
    maker: "Jarno Heikkilä-Moss",
    objectType: "photograph",
    photoProcess: "pigment-inkjet",
    status: "with-owner",
  });
  makeObject(t.db, b, { objectNumber: "2025-0001", title: "Night tram", objectType: "print", status: "on-loan" });
  framer = await agentFor(t, s.people.framer);
  collector = await agentFor(t, s.people.collector);
});

describe("search q", () => {
  it("when the whole object number is typed, then only that object is found", async () => {
    expect(numbers(await list(framer, "q=2026-0014"))).toEqual(["2026-0014"]);
  });

  it("when the object number is typed without its separator, then it is still found", async () => {
    expect(numbers(await list(framer, "q=20260014"))).toEqual(["2026-0014"]);
  });

  it("when the start of an object number is typed, then every number starting so is found", async () => {
    expect(numbers(await list(framer, "q=2026-01"))).toEqual(["2026-0140"]);
    expect(numbers(await list(framer, "q=2026"))).toEqual(["2026-0014", "2026-0015", "2026-0016", "2026-0140"]);
  });

  it("when the start of a title word is typed, then the object is found", async () => {
    expect(numbers(await list(framer, "q=pea"))).toEqual(["2026-0014"]);
    expect(numbers(await list(framer, "q=HARB%20wall"))).toEqual(["2026-0015"]);
  });

  it("when a maker is typed, then that maker's objects are found", async () => {
    expect(numbers(await list(framer, "q=korrow"))).toEqual(["2026-0015", "2026-0016"]);
  });

  it("when a maker's name is typed without its accent, then it is found", async () => {
    expect(numbers(await list(framer, "q=heikkila"))).toEqual(["2026-0140"]);
  });

  it("when words match different objects, then only objects matching every word are found", async () => {
    expect(numbers(await list(framer, "q=korrow%20estuary"))).toEqual(["2026-0016"]);
  });

  it("when nothing matches, then the list is empty with a total of 0", async () => {
    expect(await list(framer, "q=zebra")).toMatchObject({ items: [], total: 0 });
  });

  it("when FTS syntax is typed, then it is searched as words and does not fail", async () => {
    expect((await list(framer, `q=${encodeURIComponent('pears" OR "tram')}`)).total).toBe(0);
    expect(numbers(await list(framer, `q=${encodeURIComponent("(pears*")}`))).toEqual(["2026-0014"]);
  });

  it("when a collector searches, then only their own client's matches are found", async () => {
    expect(numbers(await list(collector, "q=korrow"))).toEqual(["2026-0015"]);
  });

  it("when a title is changed, then the search finds the new title and not the old", async () => {
    const id = (await list(framer, "q=2026-0016")).items[0]!.id;
    const current = (await framer.get(`/api/objects/${id}`)).body as ObjectRecord;
    const { id: _i, clientName: _c, createdAt: _ca, updatedAt: _u, valuationVisible: _v, ...edit } = current;
    expect((await framer.put(`/api/objects/${id}`).send({ ...edit, title: "Mudflats at dusk" })).status).toBe(200);
    expect((await list(framer, "q=estuary")).total).toBe(0);
    expect(numbers(await list(framer, "q=mudfl"))).toEqual(["2026-0016"]);
    // Restore for the other tests in this file.
    const again = (await framer.get(`/api/objects/${id}`)).body as ObjectRecord;
    await framer.put(`/api/objects/${id}`).send({ ...edit, version: again.version, title: "Estuary at low water" });
  });
});

describe("filters", () => {
  it("when filtering by client, then only that client's objects come back", async () => {
    expect(numbers(await list(framer, `clientId=${a}`))).toEqual(["2026-0014", "2026-0015"]);
  });

  it("when filtering by status, then only objects with that status come back", async () => {
    expect(numbers(await list(framer, "status=in-studio"))).toEqual(["2026-0014", "2026-0016"]);
  });

  it("when filtering by object type, then only that type comes back", async () => {
    expect(numbers(await list(framer, "objectType=print"))).toEqual(["2025-0001", "2026-0015"]);
  });

  it("when filters and a search are combined, then all of them apply", async () => {
    expect(numbers(await list(framer, "objectType=print&status=on-loan"))).toEqual(["2025-0001"]);
    expect(numbers(await list(framer, `q=korrow&clientId=${b}&status=in-studio`))).toEqual(["2026-0016"]);
  });

  it("when a filter value is not in the list, then it answers 422 naming the filter", async () => {
    const res = await framer.get("/api/objects?status=lost");
    expect(res.status).toBe(422);
    expect(Object.keys(res.body.error.fields)).toEqual(["status"]);
  });
});

describe("sort and dir", () => {
  it("when nothing is asked, then objects come by object number ascending", async () => {
    expect(numbers(await list(framer, ""))).toEqual(["2025-0001", "2026-0014", "2026-0015", "2026-0016", "2026-0140"]);
  });

  it("when sorting by title, then titles come alphabetically, and reversed with dir=desc", async () => {
    const asc = (await list(framer, "sort=title")).items.map((i) => i.title);
    expect(asc).toEqual(["Birch bark, detail", "Estuary at low water", "Harbour wall, morning", "Night tram", "Three pears on a blue cloth"]);
    const desc = (await list(framer, "sort=title&dir=desc")).items.map((i) => i.title);
    expect(desc).toEqual([...asc].reverse());
  });

  it("when sorting by maker, then an unrecorded maker comes first", async () => {
    const makers = (await list(framer, "sort=maker")).items.map((i) => i.maker);
    expect(makers).toEqual([null, "Amadou Fenn", "Ilse Korrow", "Ilse Korrow", "Jarno Heikkilä-Moss"]);
  });

  it("when sorting by status, then statuses are grouped", async () => {
    const statuses = (await list(framer, "sort=status")).items.map((i) => i.status);
    expect(statuses).toEqual(["in-studio", "in-studio", "on-loan", "with-owner", "with-owner"]);
  });
});

describe("pagination", () => {
  it("when paging two at a time, then every page has the full total and the pages do not overlap", async () => {
    const pages = [await list(framer, "pageSize=2&page=1"), await list(framer, "pageSize=2&page=2"), await list(framer, "pageSize=2&page=3")];
    expect(pages.map((p) => p.total)).toEqual([5, 5, 5]);
    expect(pages.map((p) => p.items.length)).toEqual([2, 2, 1]);
    expect(pages.map((p) => p.page)).toEqual([1, 2, 3]);
    expect(pages.flatMap(numbers)).toEqual(["2025-0001", "2026-0014", "2026-0015", "2026-0016", "2026-0140"]);
  });

  it("when the page is past the end, then it is empty but still tells the total", async () => {
    expect(await list(framer, "pageSize=2&page=4")).toEqual({ items: [], total: 5, page: 4, pageSize: 2 });
  });

  it("when a search is paged, then the total counts the matches, not the page", async () => {
    const body = await list(framer, "q=2026&pageSize=3");
    expect(body.total).toBe(4);
    expect(body.items).toHaveLength(3);
  });

  it("when the page size is above 200, then it answers 422 naming pageSize", async () => {
    const res = await framer.get("/api/objects?pageSize=201");
    expect(res.status).toBe(422);
    expect(Object.keys(res.body.error.fields)).toEqual(["pageSize"]);
  });
});
