import { beforeAll, describe, expect, it } from "vitest";
import { eq } from "drizzle-orm";
import { A4_HINGED } from "../../server/db/factories.ts";
import { agentFor, createTestApp, expectErrorShape, makeObject, makeStudio, type Agent } from "../setup/test-app.ts";
import { objects } from "../../server/db/schema.ts";
import { REGISTER_BOARD_GRADES, REGISTER_GLAZINGS, REGISTER_METHODS } from "../../shared/schemas/objects.ts";
import { ATTACHMENT_METHODS, BOARD_GRADES } from "../../shared/schemas/mount-plan.ts";
import { ATTACHMENT_METHOD_LABELS, GLAZING_TYPES, type MountingRecord } from "../../shared/schemas/mountings.ts";
import { first, present } from "../setup/lists.ts";
import { listObjects as list, objectNumbers as numbers } from "../setup/registers.ts";

const t = createTestApp();
let framer: Agent;
let collector: Agent;
const id: Record<string, string> = {};

/** Sets an object's register columns directly, as the mountings service (and later the condition feature) keeps them. */
function setRegister(objectId: string, cols: Partial<typeof objects.$inferInsert>) {
  t.db.update(objects).set(cols).where(eq(objects.id, objectId)).run();
}

// The A4 print hinged (sources beside the values in server/db/factories.ts).
const HINGED = A4_HINGED;

beforeAll(async () => {
  const s = await makeStudio(t);
  const mine = s.collectorClient.id;
  const other = s.institution.id;
  id.a = makeObject(t.db, mine, { objectNumber: "2026-0001", title: "Three pears", status: "in-studio" });
  id.b = makeObject(t.db, mine, { objectNumber: "2026-0002", title: "Harbour wall", status: "with-owner" });
  id.c = makeObject(t.db, other, { objectNumber: "2026-0003", title: "Estuary", status: "in-studio" });
  id.d = makeObject(t.db, other, { objectNumber: "2026-0004", title: "Night tram", status: "on-loan" });
  id.e = makeObject(t.db, other, { objectNumber: "2026-0005", title: "Birch bark", status: "in-studio" });
  id.f = makeObject(t.db, mine, { objectNumber: "2026-0006", title: "Heron", status: "in-studio" });
  id.g = makeObject(t.db, other, { objectNumber: "2026-0007", title: "Pebbles", status: "with-owner" });
  setRegister(id.b, { currentMethod: "corners", currentBoardGrade: "conservation", currentGlazing: "acrylic", lastMountedOn: "2024-05-01", checkDueOn: "2026-04-30" });
  setRegister(id.c, { currentMethod: "t-hinge", currentBoardGrade: "museum", currentGlazing: "ar-uv-glass", lastMountedOn: "2025-11-20", checkDueOn: "2026-05-01" });
  setRegister(id.d, { currentMethod: "sink-mount", currentBoardGrade: "museum", currentGlazing: "uv-acrylic", lastMountedOn: "2023-02-14", checkDueOn: "2025-02-14" });
  // Taken out of its mount: no current mount, but the last mounting date and the planned check remain.
  setRegister(id.e, { lastMountedOn: "2022-08-08", checkDueOn: "2027-01-01" });
  framer = await agentFor(t, s.people.framer);
  collector = await agentFor(t, s.people.collector);
  // A: mounted through the API, so the columns come from the mountings service itself.
  const draft = await framer.post(`/api/objects/${id.a}/mountings`).send({ reason: "first-mounting", mountedOn: "2026-03-02", data: HINGED });
  if (draft.status !== 201) throw new Error(`Draft answered ${draft.status}: ${JSON.stringify(draft.body)}`);
  const done = await framer.post(`/api/mountings/${(draft.body as MountingRecord).id}/complete`).send({ version: draft.body.version });
  if (done.status !== 200) throw new Error(`Complete answered ${done.status}: ${JSON.stringify(done.body)}`);
});

describe("register columns", () => {
  it("when an object's mounting is completed, then the register shows its current mount and the date", async () => {
    const a = (await list(framer, "q=2026-0001")).items[0];
    // The mountings service plans the next check a year after the mounting (its CHECK_INTERVAL_MONTHS).
    // The studio default interval is 24 months (12 on loan): see StudioSettingsSchema.
    expect(a).toMatchObject({ currentMethod: "t-hinge", currentBoardGrade: "museum", currentGlazing: "uv-glass", lastMountedOn: "2026-03-02", checkDueOn: "2028-03-02" });
  });

  it("when an object was never mounted, then its mount columns are empty and the old columns are all still there", async () => {
    const f = first((await list(framer, "q=2026-0006")).items);
    expect(f).toMatchObject({
      objectNumber: "2026-0006",
      title: "Heron",
      objectType: "print",
      status: "in-studio",
      sheetWidthMm: 210,
      sheetHeightMm: 297,
      clientName: "Ada Collector",
    });
    expect(f).toMatchObject({ currentMethod: null, currentBoardGrade: null, currentGlazing: null, lastMountedOn: null, checkDueOn: null });
    expect(typeof f.updatedAt).toBe("string");
  });

  it("when the register's lists are compared with the mounting contract's, then they are the same values", () => {
    expect([...REGISTER_METHODS]).toEqual([...ATTACHMENT_METHODS]);
    expect([...REGISTER_BOARD_GRADES]).toEqual([...BOARD_GRADES]);
    expect([...REGISTER_GLAZINGS]).toEqual([...GLAZING_TYPES]);
    expect(Object.keys(ATTACHMENT_METHOD_LABELS)).toEqual([...ATTACHMENT_METHODS]);
  });
});

describe("mount filters", () => {
  it("when filtering by method, then only objects currently held that way come", async () => {
    expect(numbers(await list(framer, "method=t-hinge"))).toEqual(["2026-0001", "2026-0003"]);
    expect(numbers(await list(framer, "method=corners"))).toEqual(["2026-0002"]);
    expect(await list(framer, "method=polyester-straps")).toMatchObject({ items: [], total: 0 });
  });

  it("when filtering by board grade, then only objects whose window board is of that grade come", async () => {
    expect(numbers(await list(framer, "boardGrade=museum"))).toEqual(["2026-0001", "2026-0003", "2026-0004"]);
    expect(numbers(await list(framer, "boardGrade=conservation"))).toEqual(["2026-0002"]);
  });

  it("when filtering by glazing, then only objects behind that glazing come", async () => {
    expect(numbers(await list(framer, "glazing=uv-acrylic"))).toEqual(["2026-0004"]);
    expect(numbers(await list(framer, "glazing=uv-glass"))).toEqual(["2026-0001"]);
  });

  it("when asking for objects due for a check by a date, then those due on or before it come, and never-planned ones do not", async () => {
    expect(numbers(await list(framer, "checkDueBy=2026-04-30"))).toEqual(["2026-0002", "2026-0004"]);
    expect(numbers(await list(framer, "checkDueBy=2026-05-01"))).toEqual(["2026-0002", "2026-0003", "2026-0004"]);
    expect((await list(framer, "checkDueBy=2020-01-01")).total).toBe(0);
  });

  it("when mount filters are combined with each other and the older filters, then all of them apply", async () => {
    expect(numbers(await list(framer, "boardGrade=museum&status=in-studio"))).toEqual(["2026-0001", "2026-0003"]);
    expect(numbers(await list(framer, "boardGrade=museum&glazing=ar-uv-glass&method=t-hinge"))).toEqual(["2026-0003"]);
    expect(numbers(await list(framer, "checkDueBy=2026-12-31&objectType=print&q=harbour"))).toEqual(["2026-0002"]);
  });

  it("when a collector filters, then they still see only their own objects", async () => {
    expect(numbers(await list(collector, "boardGrade=museum"))).toEqual(["2026-0001"]);
    expect(numbers(await list(collector, "checkDueBy=2026-12-31"))).toEqual(["2026-0002"]);
  });

  it("when a mount filter value is not in the list, then it answers 422 naming the filter", async () => {
    for (const [query, field] of [
      ["method=glue", "method"],
      ["boardGrade=foam", "boardGrade"],
      ["glazing=window-pane", "glazing"],
      ["checkDueBy=today", "checkDueBy"],
      ["sort=checkedOn", "sort"],
    ] as const) {
      const res = await framer.get(`/api/objects?${query}`);
      expect(res.status, query).toBe(422);
      expect(Object.keys(expectErrorShape(res.body, "validation_failed").fields ?? {})).toEqual([field]);
    }
  });
});

describe("date sorts", () => {
  // Objects without the date come after the dated ones in both directions, in id order (the tie-breaker).
  const byId = (dir: "asc" | "desc", ...keys: string[]) => {
    const sorted = keys.map((k) => ({ k, id: present(id[k], `object ${k}`) })).sort((x, y) => (x.id < y.id ? -1 : 1));
    return (dir === "asc" ? sorted : sorted.reverse()).map(({ k }) => `2026-000${"abcdefg".indexOf(k) + 1}`);
  };

  it("when sorting by last mounted, then the oldest mounting comes first, and the never-mounted last", async () => {
    expect(numbers(await list(framer, "sort=lastMountedOn"))).toEqual(["2026-0005", "2026-0004", "2026-0002", "2026-0003", "2026-0001", ...byId("asc", "f", "g")]);
  });

  it("when sorting by last mounted descending, then the newest comes first, and the never-mounted still last", async () => {
    expect(numbers(await list(framer, "sort=lastMountedOn&dir=desc"))).toEqual(["2026-0001", "2026-0003", "2026-0002", "2026-0004", "2026-0005", ...byId("desc", "f", "g")]);
  });

  it("when sorting by check due, then the most overdue comes first and objects without a planned check come last", async () => {
    expect(numbers(await list(framer, "sort=checkDueOn"))).toEqual(["2026-0004", "2026-0002", "2026-0003", "2026-0005", "2026-0001", ...byId("asc", "f", "g")]);
    expect(numbers(await list(framer, "sort=checkDueOn&dir=desc"))).toEqual(["2026-0001", "2026-0005", "2026-0003", "2026-0002", "2026-0004", ...byId("desc", "f", "g")]);
  });

  it("when a date sort is paged across the end of the dated objects, then the pages join without gaps or repeats", async () => {
    for (const q of ["sort=checkDueOn", "sort=checkDueOn&dir=desc", "sort=lastMountedOn"]) {
      const whole = numbers(await list(framer, q));
      const pages = [];
      for (let p = 1; p <= 4; p++) pages.push(await list(framer, `${q}&pageSize=2&page=${p}`));
      expect(
        pages.map((p) => p.total),
        q,
      ).toEqual([7, 7, 7, 7]);
      expect(pages.flatMap(numbers), q).toEqual(whole);
      // Pages that start past the five dated objects still land on the right undated rows.
      expect(numbers(await list(framer, `${q}&pageSize=1&page=6`)), q).toEqual(whole.slice(5, 6));
      expect(numbers(await list(framer, `${q}&pageSize=1&page=7`)), q).toEqual(whole.slice(6));
      expect(numbers(await list(framer, `${q}&pageSize=1&page=8`)), q).toEqual([]);
    }
  });

  it("when a date sort is combined with a filter, then only the filtered objects come, in date order", async () => {
    expect(numbers(await list(framer, "checkDueBy=2026-12-31&sort=checkDueOn"))).toEqual(["2026-0004", "2026-0002", "2026-0003"]);
    expect(numbers(await list(collector, "sort=lastMountedOn&dir=desc"))).toEqual(["2026-0001", "2026-0002", "2026-0006"]);
  });
});
