import { beforeAll, describe, expect, it } from "vitest";
import { eq } from "drizzle-orm";
import { agentsFor, createTestApp, expectErrorShape, makeObject, makeStudio, signIn, type Agent, type TestApp } from "../setup/test-app.ts";
import { custodyReceipts, events, objects } from "../../server/db/schema.ts";
import type { CustodyCreate, CustodyReceipt } from "../../shared/schemas/custody.ts";
import type { HistoryEvent } from "../../shared/schemas/history.ts";
import type { InStudioItem } from "../../server/features/custody/custody.service.ts";
import { DEMO_PASSWORD, seedDemo } from "../../server/db/seed.ts";
import { seedCustody } from "../../server/db/seed-custody.ts";
import { verifyChains } from "../../server/features/history/history.chain.ts";
import { at, first } from "../setup/lists.ts";

// "Today" is 1 December 2026 (midday UTC, the same day in any studio's time zone).
const clock = () => new Date("2026-12-01T12:00:00Z");
const t = createTestApp({ clock });

type RoleName = "admin" | "framer" | "collector" | "registrar";
let as: Record<RoleName, Agent>;
let studio: Awaited<ReturnType<typeof makeStudio>>;

const receipt = (over: Partial<CustodyCreate> = {}): CustodyCreate => ({
  kind: "intake",
  date: "2026-11-20",
  fromParty: "Ada Collector",
  toParty: "The studio (Test framer)",
  condition: "Stable; light foxing in the lower margin.",
  signedBy: "Ada Collector",
  location: null,
  notes: null,
  ...over,
});

const post = (agent: Agent, objectId: string, body: unknown) => agent.post(`/api/objects/${objectId}/custody`).send(body as object);
const objectRow = (app: TestApp, id: string) => app.db.select().from(objects).where(eq(objects.id, id)).get()!;
const receiptsOf = (app: TestApp, id: string) => app.db.select().from(custodyReceipts).where(eq(custodyReceipts.objectId, id)).all();
const eventsOf = (app: TestApp, id: string) => app.db.select().from(events).where(eq(events.objectId, id)).all();

beforeAll(async () => {
  studio = await makeStudio(t);
  as = await agentsFor(t, studio.people);
});

describe("POST /api/objects/:id/custody", () => {
  it("when a framer records an intake for an object with its owner, then it answers 201 with the receipt and the object is in the studio where the receipt says", async () => {
    const id = makeObject(t.db, studio.collectorClient.id, { status: "with-owner", location: "Owner's home" });
    const res = await post(as.framer, id, receipt({ location: "Bench 2", notes: "Carried flat by the owner." }));
    expect(res.status).toBe(201);
    const r = res.body as CustodyReceipt;
    expect(r).toMatchObject({
      objectId: id,
      direction: "in",
      kind: "intake",
      date: "2026-11-20",
      fromParty: "Ada Collector",
      toParty: "The studio (Test framer)",
      condition: "Stable; light foxing in the lower margin.",
      signedBy: "Ada Collector",
      notes: "Carried flat by the owner.",
    });
    expect(r.objectNumber).toMatch(/^T-/);
    const o = objectRow(t, id);
    expect(o).toMatchObject({ status: "in-studio", location: "Bench 2", version: 2 });
    expect(receiptsOf(t, id)).toHaveLength(1);
  });

  it("when a loan is recorded with an agreed return date, then it is kept; a return date on an intake or before the hand-over is refused naming the field", async () => {
    const id = makeObject(t.db, studio.collectorClient.id, { status: "in-studio" });
    const early = await post(as.framer, id, receipt({ kind: "loan-out", fromParty: "The studio", toParty: "A borrowing gallery", returnDue: "2026-11-01" }));
    expect(early.status).toBe(422);
    expect(early.body.error.fields.returnDue).toMatch(/before the hand-over date/);
    const lent = await post(as.framer, id, receipt({ kind: "loan-out", fromParty: "The studio", toParty: "A borrowing gallery", returnDue: "2027-03-31" }));
    expect(lent.status, JSON.stringify(lent.body)).toBe(201);
    expect(lent.body.returnDue).toBe("2027-03-31");
    const other = makeObject(t.db, studio.collectorClient.id, { status: "with-owner" });
    const wrong = await post(as.framer, other, receipt({ returnDue: "2027-03-31" }));
    expect(wrong.status).toBe(422);
    expect(wrong.body.error.fields.returnDue).toMatch(/Only a loan or a stay with a conservator/);
    expect(receiptsOf(t, other)).toHaveLength(0);
  });

  it("when an admin records a return to the owner without a location, then the object is with its owner and keeps its location", async () => {
    const id = makeObject(t.db, studio.collectorClient.id, { status: "in-studio", location: "Bench 1" });
    const res = await post(as.admin, id, receipt({ kind: "return-to-owner", fromParty: "The studio", toParty: "Ada Collector", condition: "Framed; as received." }));
    expect(res.status).toBe(201);
    expect(res.body.direction).toBe("out");
    expect(objectRow(t, id)).toMatchObject({ status: "with-owner", location: "Bench 1", version: 2 });
  });

  it("when a registrar records a receipt for their own institution's object, then it answers 403 and nothing is written", async () => {
    const id = makeObject(t.db, studio.institution.id, { status: "with-owner" });
    const res = await post(as.registrar, id, receipt());
    expect(res.status).toBe(403);
    expectErrorShape(res.body, "forbidden");
    expect(receiptsOf(t, id)).toHaveLength(0);
    expect(objectRow(t, id).status).toBe("with-owner");
  });

  it("when a collector records a receipt for their own object, then it answers 403", async () => {
    const id = makeObject(t.db, studio.collectorClient.id, { status: "with-owner" });
    const res = await post(as.collector, id, receipt());
    expect(res.status).toBe(403);
    expectErrorShape(res.body, "forbidden");
    expect(receiptsOf(t, id)).toHaveLength(0);
  });

  it("when a collector or registrar writes to another client's object, then it answers 404 as if it did not exist", async () => {
    const id = makeObject(t.db, studio.otherInstitution.id, { status: "with-owner" });
    for (const role of ["collector", "registrar"] as const) {
      const res = await post(as[role], id, receipt());
      expect(res.status, role).toBe(404);
      expectErrorShape(res.body, "not_found");
    }
    expect(receiptsOf(t, id)).toHaveLength(0);
  });

  it("when nobody is signed in, then it answers 401", async () => {
    const id = makeObject(t.db, studio.collectorClient.id, { status: "with-owner" });
    const res = await post(t.agent(), id, receipt());
    expect(res.status).toBe(401);
    expectErrorShape(res.body, "unauthenticated");
  });

  it("when the object does not exist, then it answers 404", async () => {
    const res = await post(as.framer, "no-such-object", receipt());
    expect(res.status).toBe(404);
    expectErrorShape(res.body, "not_found");
  });

  it("when an intake is recorded for an object already in the studio, then it answers 409 saying so, and nothing changes", async () => {
    const id = makeObject(t.db, studio.collectorClient.id, { status: "in-studio" });
    const before = objectRow(t, id);
    const res = await post(as.framer, id, receipt());
    expect(res.status).toBe(409);
    const err = expectErrorShape(res.body, "conflict");
    expect(err.message).toContain("already in the studio");
    expect(err.fields).toHaveProperty("kind");
    expect(receiptsOf(t, id)).toHaveLength(0);
    expect(eventsOf(t, id)).toHaveLength(0);
    expect(objectRow(t, id)).toMatchObject({ status: "in-studio", version: before.version });
  });

  it("when a return to the owner is recorded for an object that is not in the studio, then it answers 409 naming where it is", async () => {
    for (const status of ["with-owner", "on-loan", "with-conservator"] as const) {
      const id = makeObject(t.db, studio.collectorClient.id, { status });
      const res = await post(as.framer, id, receipt({ kind: "return-to-owner" }));
      expect(res.status, status).toBe(409);
      expect(expectErrorShape(res.body, "conflict").message).toContain("not in the studio");
      expect(objectRow(t, id).status).toBe(status);
      expect(receiptsOf(t, id)).toHaveLength(0);
    }
  });

  it("when an object goes through every kind of hand-over, then each moves it to the kind's status and writes an event of the right type", async () => {
    const id = makeObject(t.db, studio.collectorClient.id, { status: "with-owner" });
    const steps = [
      { kind: "intake", date: "2026-09-01", status: "in-studio", type: "custody-in" },
      { kind: "loan-out", date: "2026-09-10", status: "on-loan", type: "loan-out" },
      { kind: "loan-return", date: "2026-10-20", status: "in-studio", type: "loan-return" },
      { kind: "to-conservator", date: "2026-10-22", status: "with-conservator", type: "custody-out" },
      { kind: "from-conservator", date: "2026-11-15", status: "in-studio", type: "custody-in" },
      { kind: "return-to-owner", date: "2026-11-15", status: "with-owner", type: "custody-out" },
    ] as const;
    for (const s of steps) {
      const res = await post(as.framer, id, receipt({ kind: s.kind, date: s.date, fromParty: `From ${s.kind}`, toParty: `To ${s.kind}`, condition: `Condition at ${s.kind}` }));
      expect(res.status, s.kind).toBe(201);
      expect(objectRow(t, id).status, s.kind).toBe(s.status);
    }
    expect(objectRow(t, id).version).toBe(1 + steps.length);

    const history = await as.collector.get(`/api/objects/${id}/history`);
    expect(history.status).toBe(200);
    const items = history.body.items as HistoryEvent[];
    expect(items.map((e) => e.type)).toEqual(steps.map((s) => s.type).reverse());
    const intake = at(items, -1);
    expect(intake.summary).toContain("from From intake to To intake");
    expect(intake.summary).toContain("Condition on arrival: Condition at intake.");
    expect(intake.summary).toContain("Received from the owner on 1 Sep 2026");
    expect(first(items).summary).toContain("Condition on departure: Condition at return-to-owner.");
    expect(intake.data).toMatchObject({ kind: "intake", direction: "in", statusBefore: "with-owner", statusAfter: "in-studio" });
    expect(verifyChains(t.db, id).ok).toBe(true);

    const typed = await as.framer.get(`/api/objects/${id}/history?types=loan-out,loan-return`);
    expect(typed.body.items.map((e: HistoryEvent) => e.type)).toEqual(["loan-return", "loan-out"]);
  });

  it("when the condition is written on several lines, then it is stored as one line", async () => {
    const id = makeObject(t.db, studio.collectorClient.id, { status: "with-owner" });
    const res = await post(as.framer, id, receipt({ condition: "Stable.\n  Light foxing\tlower margin." }));
    expect(res.status).toBe(201);
    expect(res.body.condition).toBe("Stable. Light foxing lower margin.");
  });

  it("when the condition is empty, then it answers 422 naming condition", async () => {
    const id = makeObject(t.db, studio.collectorClient.id, { status: "with-owner" });
    const res = await post(as.framer, id, receipt({ condition: "   " }));
    expect(res.status).toBe(422);
    const err = expectErrorShape(res.body, "validation_failed");
    expect(Object.keys(err.fields ?? {})).toEqual(["condition"]);
    expect(err.message).toContain("condition");
    expect(receiptsOf(t, id)).toHaveLength(0);
  });

  it("when the date is not a date, or not a day of the calendar, then it answers 422 naming date", async () => {
    const id = makeObject(t.db, studio.collectorClient.id, { status: "with-owner" });
    for (const date of ["30/11/2026", "yesterday", "", "2026-02-30", "2026-13-01"]) {
      const res = await post(as.framer, id, receipt({ date }));
      expect(res.status, date).toBe(422);
      expect(expectErrorShape(res.body, "validation_failed").fields, date).toHaveProperty("date");
    }
    expect(receiptsOf(t, id)).toHaveLength(0);
  });

  it("when the date is after today, then it answers 422 naming date; tomorrow is allowed for time zones ahead", async () => {
    const id = makeObject(t.db, studio.collectorClient.id, { status: "with-owner" });
    const late = await post(as.framer, id, receipt({ date: "2026-12-05" }));
    expect(late.status).toBe(422);
    expect(expectErrorShape(late.body, "validation_failed").fields?.date).toContain("after today");
    expect((await post(as.framer, id, receipt({ date: "2026-12-02" }))).status).toBe(201);
  });

  it("when a receipt is dated before the object's last receipt, then it answers 422 naming date", async () => {
    const id = makeObject(t.db, studio.collectorClient.id, { status: "with-owner" });
    expect((await post(as.framer, id, receipt({ date: "2026-11-10" }))).status).toBe(201);
    const res = await post(as.framer, id, receipt({ kind: "return-to-owner", date: "2026-11-01" }));
    expect(res.status).toBe(422);
    expect(expectErrorShape(res.body, "validation_failed").fields?.date).toContain("10 Nov 2026");
    expect(objectRow(t, id).status).toBe("in-studio");
  });

  it("when the kind is unknown or parties are missing, then it answers 422 naming each field", async () => {
    const id = makeObject(t.db, studio.collectorClient.id, { status: "with-owner" });
    const res = await post(as.framer, id, { ...receipt(), kind: "borrowed", fromParty: "", toParty: undefined, signedBy: "" });
    expect(res.status).toBe(422);
    const err = expectErrorShape(res.body, "validation_failed");
    expect(Object.keys(err.fields ?? {}).sort()).toEqual(["fromParty", "kind", "signedBy", "toParty"]);
  });
});

describe("GET /api/objects/:id/custody", () => {
  let collectors: string;
  let institutions: string;

  beforeAll(async () => {
    collectors = makeObject(t.db, studio.collectorClient.id, { status: "with-owner" });
    institutions = makeObject(t.db, studio.institution.id, { status: "with-owner" });
    for (const id of [collectors, institutions]) {
      expect((await post(as.framer, id, receipt({ date: "2026-10-01", condition: "First arrival." }))).status).toBe(201);
      expect((await post(as.framer, id, receipt({ kind: "return-to-owner", date: "2026-10-30", condition: "First departure." }))).status).toBe(201);
      expect((await post(as.framer, id, receipt({ date: "2026-10-30", condition: "Back the same day." }))).status).toBe(201);
    }
  });

  it("when a framer lists an object's receipts, then they come newest first, same-day receipts in the order written", async () => {
    const res = await as.framer.get(`/api/objects/${collectors}/custody`);
    expect(res.status).toBe(200);
    expect((res.body.items as CustodyReceipt[]).map((r) => r.condition)).toEqual(["Back the same day.", "First departure.", "First arrival."]);
  });

  it("when the owning client's registrar or collector lists receipts, then they see their own", async () => {
    const reg = await as.registrar.get(`/api/objects/${institutions}/custody`);
    expect(reg.status).toBe(200);
    expect(reg.body.items).toHaveLength(3);
    const col = await as.collector.get(`/api/objects/${collectors}/custody`);
    expect(col.status).toBe(200);
    expect(col.body.items).toHaveLength(3);
  });

  it("when a client's user asks for another client's receipts, then it answers 404", async () => {
    const col = await as.collector.get(`/api/objects/${institutions}/custody`);
    expect(col.status).toBe(404);
    expectErrorShape(col.body, "not_found");
    const reg = await as.registrar.get(`/api/objects/${collectors}/custody`);
    expect(reg.status).toBe(404);
  });

  it("when nobody is signed in, then it answers 401", async () => {
    const res = await t.agent().get(`/api/objects/${collectors}/custody`);
    expect(res.status).toBe(401);
    expectErrorShape(res.body, "unauthenticated");
  });

  it("when an object has no receipts, then the list is empty", async () => {
    const id = makeObject(t.db, studio.collectorClient.id, { status: "with-owner" });
    expect((await as.framer.get(`/api/objects/${id}/custody`)).body).toEqual({ items: [] });
  });
});

// The studio-wide lists get a database of their own, so their contents are exactly what these tests wrote.
describe("GET /api/custody/in-studio and /api/custody/receipts", () => {
  const u = createTestApp({ clock });
  let us: Record<RoleName, Agent>;
  let ids: Record<"early" | "late" | "twice" | "noReceipt" | "gone" | "onLoan", string>;
  let numbers: Record<keyof typeof ids, string>;

  beforeAll(async () => {
    const s = await makeStudio(u);
    us = await agentsFor(u, s.people);
    const mk = (n: string, clientId: string, status = "with-owner") => makeObject(u.db, clientId, { objectNumber: n, title: `Object ${n}`, status: status as "with-owner" });
    numbers = { early: "S-003", late: "S-001", twice: "S-002", noReceipt: "S-004", gone: "S-005", onLoan: "S-006" };
    ids = {
      late: mk(numbers.late, s.collectorClient.id),
      twice: mk(numbers.twice, s.institution.id),
      early: mk(numbers.early, s.collectorClient.id),
      noReceipt: mk(numbers.noReceipt, s.institution.id, "in-studio"),
      gone: mk(numbers.gone, s.collectorClient.id),
      onLoan: mk(numbers.onLoan, s.institution.id),
    };
    const w = async (id: string, over: Partial<CustodyCreate>) => expect((await post(us.framer, id, receipt(over))).status).toBe(201);
    await w(ids.early, { date: "2026-10-02", fromParty: "Early owner", condition: "Early condition." });
    await w(ids.late, { date: "2026-11-25", fromParty: "Late owner", condition: "Late condition." });
    await w(ids.twice, { date: "2026-06-01", fromParty: "First time", condition: "First visit." });
    await w(ids.twice, { kind: "return-to-owner", date: "2026-07-01", condition: "Left after the first visit." });
    await w(ids.twice, { date: "2026-11-01", fromParty: "Second time", condition: "Second visit." });
    await w(ids.gone, { date: "2026-09-01" });
    await w(ids.gone, { kind: "return-to-owner", date: "2026-09-30", toParty: "Gone owner" });
    await w(ids.onLoan, { date: "2026-08-01" });
    await w(ids.onLoan, { kind: "loan-out", date: "2026-08-15", toParty: "A gallery" });
  });

  it("when a framer or admin opens the in-studio list, then it lists only objects in the studio, oldest arrival first, each with its latest receipt in", async () => {
    for (const role of ["framer", "admin"] as const) {
      const res = await us[role].get("/api/custody/in-studio");
      expect(res.status, role).toBe(200);
      expect(res.body).toMatchObject({ total: 4, page: 1, pageSize: 50 });
      const items = res.body.items as InStudioItem[];
      expect(items.map((i) => i.objectNumber)).toEqual([numbers.early, numbers.twice, numbers.late, numbers.noReceipt]);
      expect(items[0]).toMatchObject({
        objectId: ids.early,
        title: `Object ${numbers.early}`,
        clientName: "Ada Collector",
        since: "2026-10-02",
        // 2 Oct to 1 Dec 2026: 29 + 30 + 1 days.
        daysInStudio: 60,
        receipt: { date: "2026-10-02", fromParty: "Early owner", condition: "Early condition." },
      });
      expect(items[1]).toMatchObject({ clientName: "Bramble Museum", since: "2026-11-01", daysInStudio: 30, receipt: { fromParty: "Second time", condition: "Second visit." } });
      expect(items[2]).toMatchObject({ since: "2026-11-25", daysInStudio: 6 });
      expect(items[3]).toMatchObject({ objectId: ids.noReceipt, receipt: null, daysInStudio: 0 });
    }
  });

  it("when the in-studio list is paged, then each page holds the next objects and the total stays", async () => {
    const p1 = await us.framer.get("/api/custody/in-studio?pageSize=2&page=1");
    const p2 = await us.framer.get("/api/custody/in-studio?pageSize=2&page=2");
    const p3 = await us.framer.get("/api/custody/in-studio?pageSize=2&page=3");
    expect(p1.body.items.map((i: InStudioItem) => i.objectNumber)).toEqual([numbers.early, numbers.twice]);
    expect(p2.body.items.map((i: InStudioItem) => i.objectNumber)).toEqual([numbers.late, numbers.noReceipt]);
    expect(p3.body.items).toEqual([]);
    for (const p of [p1, p2, p3]) expect(p.body).toMatchObject({ total: 4, pageSize: 2 });
  });

  it("when the page size is over 200 or the page is not a number, then it answers 422 naming the parameter", async () => {
    const big = await us.framer.get("/api/custody/in-studio?pageSize=201");
    expect(big.status).toBe(422);
    expect(expectErrorShape(big.body, "validation_failed").fields).toHaveProperty("pageSize");
    const bad = await us.framer.get("/api/custody/in-studio?page=first");
    expect(bad.status).toBe(422);
    expect(expectErrorShape(bad.body, "validation_failed").fields).toHaveProperty("page");
  });

  it("when a registrar or collector opens the studio-wide lists, then they answer 403; signed out, 401", async () => {
    for (const role of ["registrar", "collector"] as const) {
      for (const url of ["/api/custody/in-studio", "/api/custody/receipts"]) {
        const res = await us[role].get(url);
        expect(res.status, `${role} ${url}`).toBe(403);
        expectErrorShape(res.body, "forbidden");
      }
    }
    for (const url of ["/api/custody/in-studio", "/api/custody/receipts"]) expect((await u.agent().get(url)).status, url).toBe(401);
  });

  it("when a framer lists recent receipts, then every receipt comes newest first with its object", async () => {
    const res = await us.framer.get("/api/custody/receipts");
    expect(res.status).toBe(200);
    expect(res.body.total).toBe(9);
    const items = res.body.items as CustodyReceipt[];
    expect(items.map((r) => r.date)).toEqual([...items.map((r) => r.date)].sort().reverse());
    expect(items[0]).toMatchObject({ objectNumber: numbers.late, objectTitle: `Object ${numbers.late}`, date: "2026-11-25", direction: "in" });
  });

  it("when receipts are filtered by direction, kind and dates, then only matching receipts come back", async () => {
    const out = await us.framer.get("/api/custody/receipts?direction=out");
    expect(out.body.total).toBe(3);
    expect(out.body.items.every((r: CustodyReceipt) => r.direction === "out")).toBe(true);
    const loans = await us.framer.get("/api/custody/receipts?kind=loan-out");
    expect(loans.body.items.map((r: CustodyReceipt) => r.toParty)).toEqual(["A gallery"]);
    const autumn = await us.framer.get("/api/custody/receipts?from=2026-09-01&to=2026-10-02");
    expect(autumn.body.items.map((r: CustodyReceipt) => r.date)).toEqual(["2026-10-02", "2026-09-30", "2026-09-01"]);
    const inAutumn = await us.framer.get("/api/custody/receipts?from=2026-09-01&to=2026-10-02&direction=in&kind=");
    expect(inAutumn.body.items.map((r: CustodyReceipt) => r.date)).toEqual(["2026-10-02", "2026-09-01"]);
  });

  it("when receipts are paged, then pages do not overlap and together hold every receipt", async () => {
    const seen: string[] = [];
    for (let page = 1; page <= 4; page++) {
      const res = await us.framer.get(`/api/custody/receipts?pageSize=3&page=${page}`);
      expect(res.body.total).toBe(9);
      seen.push(...res.body.items.map((r: CustodyReceipt) => r.id));
    }
    expect(seen).toHaveLength(9);
    expect(new Set(seen).size).toBe(9);
  });

  it("when a receipt filter is not valid, then it answers 422 naming it", async () => {
    const cases: [string, string][] = [
      ["kind=borrowed", "kind"],
      ["direction=sideways", "direction"],
      ["from=2026-13-01", "from"],
      ["to=30/11/2026", "to"],
      ["from=2026-11-02&to=2026-11-01", "to"],
    ];
    for (const [q, field] of cases) {
      const res = await us.framer.get(`/api/custody/receipts?${q}`);
      expect(res.status, q).toBe(422);
      expect(expectErrorShape(res.body, "validation_failed").fields, q).toHaveProperty(field);
    }
  });
});

describe("the demo custody seed", () => {
  const d = createTestApp({ clock });
  let framer: Agent;
  let written: number;

  beforeAll(async () => {
    // The demo seed writes the custody receipts itself.
    await seedDemo(d.db);
    written = d.db.select().from(custodyReceipts).all().length;
    framer = await signIn(d.agent(), "framer@reversa.test", DEMO_PASSWORD);
  });

  it("when the demo is seeded, then every object keeps its status, each in-studio object has an intake within 60 days before 1 December 2026, and a second run writes nothing", async () => {
    expect(written).toBeGreaterThan(20);
    expect(seedCustody(d.db, { id: null, name: "Jonah Pell" })).toBe(0);
    const res = await framer.get("/api/custody/in-studio?pageSize=200");
    expect(res.body.total).toBe(16);
    for (const item of res.body.items as InStudioItem[]) {
      expect(item.receipt, item.objectNumber).not.toBeNull();
      expect(item.daysInStudio, item.objectNumber).toBeLessThanOrEqual(60);
    }
    const days = (res.body.items as InStudioItem[]).map((i) => i.since);
    expect(days).toEqual([...days].sort());
    const statuses = d.db
      .select({ status: objects.status })
      .from(objects)
      .all()
      .map((o) => o.status);
    expect(statuses.filter((s) => s === "on-loan")).toHaveLength(2);
    expect(statuses.filter((s) => s === "with-conservator")).toHaveLength(1);
  });

  it("when the demo is seeded, then on-loan objects were lent, the conservator has the sampler, and every history chain holds", async () => {
    const loans = await framer.get("/api/custody/receipts?kind=loan-out");
    expect(loans.body.items.map((r: CustodyReceipt) => r.objectNumber).sort()).toEqual(["2026-0008", "2026-0018"]);
    const cons = await framer.get("/api/custody/receipts?kind=to-conservator");
    expect(cons.body.items.map((r: CustodyReceipt) => r.objectNumber)).toEqual(["2026-0016"]);
    const sampler = d.db.select().from(objects).where(eq(objects.objectNumber, "2026-0016")).get()!;
    expect(sampler).toMatchObject({ status: "with-conservator", location: "With the textile conservator" });
    const history = await framer.get(`/api/objects/${sampler.id}/history?types=custody-in,custody-out,loan-out,loan-return`);
    expect(history.body.items.map((e: HistoryEvent) => e.type)).toEqual(["custody-out", "custody-in"]);
    expect(history.body.items[0].summary).toContain("Sent to a conservator on 30 Jul 2026: from Tidewell & Marr Conservation Framing to Lena Marsh");
    expect(verifyChains(d.db).ok).toBe(true);
    expect(
      d.db
        .select()
        .from(events)
        .all()
        .filter((e) => e.type.startsWith("custody-") || e.type.startsWith("loan-")),
    ).toHaveLength(written);
  });
});
