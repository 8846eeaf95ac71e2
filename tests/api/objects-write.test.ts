import { beforeAll, describe, expect, it } from "vitest";
import { agentFor, createTestApp, expectErrorShape, makeClient, makeObject, makeStudio, type Agent } from "../setup/test-app.ts";
import type { ObjectCreateInput, ObjectRecord } from "../../shared/schemas/objects.ts";

// A fixed "now" so the next object number is predictable: mid-2026 in any time zone.
const t = createTestApp({ clock: () => new Date("2026-06-15T12:00:00Z") });

let framer: Agent;
let admin: Agent;
let clientId: string;

// ISO 216: A4 = 210 × 297 mm.
const body = (over: Partial<ObjectCreateInput> = {}): ObjectCreateInput => ({
  objectNumber: "W-0001",
  title: "Heron, ink study",
  maker: "Hollis Dray",
  objectType: "drawing",
  sheetWidthMm: 297,
  sheetHeightMm: 420,
  clientId,
  status: "in-studio",
  ...over,
});

function editable(r: ObjectRecord) {
  const { id: _i, clientName: _c, createdAt: _ca, updatedAt: _u, valuationVisible: _v, ...rest } = r;
  return rest;
}

beforeAll(async () => {
  const s = await makeStudio(t);
  clientId = s.collectorClient.id;
  framer = await agentFor(t, s.people.framer);
  admin = await agentFor(t, s.people.admin);
});

describe("POST /api/objects", () => {
  it("when a framer creates a valid object, then it answers 201 with the stored record at version 1", async () => {
    const res = await framer.post("/api/objects").send(body({ objectNumber: "W-0100", valuationMinor: 150000, valuationCurrency: "gbp" }));
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({
      objectNumber: "W-0100",
      title: "Heron, ink study",
      clientId,
      clientName: "Ada Collector",
      version: 1,
      valuationMinor: 150000,
      valuationCurrency: "GBP",
      valuationVisible: true,
      sensitivities: [],
    });
    expect(typeof res.body.id).toBe("string");
    const again = await framer.get(`/api/objects/${res.body.id}`);
    expect(again.body).toEqual(res.body);
  });

  it("when the object number is already used, then it answers 409 naming objectNumber", async () => {
    expect((await framer.post("/api/objects").send(body({ objectNumber: "W-0200" }))).status).toBe(201);
    const res = await framer.post("/api/objects").send(body({ objectNumber: "W-0200", title: "Another" }));
    expect(res.status).toBe(409);
    const error = expectErrorShape(res.body, "conflict");
    expect(error.fields).toEqual({ objectNumber: "W-0200 is already used by another object; choose another number." });
  });

  it("when the object number differs only in case, then it is still a duplicate", async () => {
    expect((await framer.post("/api/objects").send(body({ objectNumber: "ab-7" }))).status).toBe(201);
    const res = await framer.post("/api/objects").send(body({ objectNumber: "AB-7" }));
    expect(res.status).toBe(409);
    expect(expectErrorShape(res.body, "conflict").fields).toHaveProperty("objectNumber");
  });

  it("when the owner does not exist, then it answers 422 naming clientId", async () => {
    const res = await framer.post("/api/objects").send(body({ objectNumber: "W-0300", clientId: "no-such-client" }));
    expect(res.status).toBe(422);
    expect(expectErrorShape(res.body, "validation_failed").fields).toEqual({ clientId: "Choose an owner from the list." });
  });

  it("when the body breaks field and cross-field rules, then it answers 422 naming each field", async () => {
    const res = await framer.post("/api/objects").send(body({ objectNumber: "W-0400", sheetWidthMm: -5, valuationMinor: 100, photoProcess: "albumen" }));
    expect(res.status).toBe(422);
    const fields = expectErrorShape(res.body, "validation_failed").fields!;
    expect(Object.keys(fields).sort()).toEqual(["photoProcess", "sheetWidthMm", "valuationCurrency"]);
    expect(fields.sheetWidthMm).toBe("Sheet width must be greater than 0.");
  });

  it("when a length is sent as text, then it answers 422: the API takes millimetres as numbers", async () => {
    const res = await framer.post("/api/objects").send({ ...body({ objectNumber: "W-0500" }), sheetWidthMm: "7 5/8" });
    expect(res.status).toBe(422);
    expect(expectErrorShape(res.body, "validation_failed").fields).toEqual({ sheetWidthMm: "Sheet width: enter a length." });
  });
});

describe("PUT /api/objects/:id", () => {
  it("when the edit starts from the stored version, then it saves and the version moves on", async () => {
    const created = (await framer.post("/api/objects").send(body({ objectNumber: "W-1000" }))).body as ObjectRecord;
    const res = await framer.put(`/api/objects/${created.id}`).send({ ...editable(created), location: "Plan chest C" });
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ status: created.status, location: "Plan chest C", version: 2 });
  });

  it("when an edit would change the status, then it answers 422 naming status and the object stays where its custody record puts it", async () => {
    const created = (await framer.post("/api/objects").send(body({ objectNumber: "W-1050" }))).body as ObjectRecord;
    for (const status of ["with-owner", "on-loan", "with-conservator"] as const) {
      const res = await framer.put(`/api/objects/${created.id}`).send({ ...editable(created), status });
      expect(res.status).toBe(422);
      expect(expectErrorShape(res.body, "validation_failed").fields?.status).toMatch(/Custody/);
    }
    const now = (await framer.get(`/api/objects/${created.id}`)).body as ObjectRecord;
    expect(now).toMatchObject({ status: created.status, version: 1 });
  });

  it("when the edit starts from a stale version, then it answers 409 and keeps the other person's save", async () => {
    const created = (await framer.post("/api/objects").send(body({ objectNumber: "W-1100" }))).body as ObjectRecord;
    const first = await admin.put(`/api/objects/${created.id}`).send({ ...editable(created), title: "Saved first" });
    expect(first.status).toBe(200);
    const second = await framer.put(`/api/objects/${created.id}`).send({ ...editable(created), title: "Saved second" });
    expect(second.status).toBe(409);
    expect(expectErrorShape(second.body, "conflict").message).toMatch(/^Someone else saved this object while you were editing it\./);
    expect((await framer.get(`/api/objects/${created.id}`)).body).toMatchObject({ title: "Saved first", version: 2 });
  });

  it("when the version is left out, then it answers 422 naming version", async () => {
    const created = (await framer.post("/api/objects").send(body({ objectNumber: "W-1200" }))).body as ObjectRecord;
    const { version: _v, ...noVersion } = editable(created);
    const res = await framer.put(`/api/objects/${created.id}`).send(noVersion);
    expect(res.status).toBe(422);
    expect(Object.keys(expectErrorShape(res.body, "validation_failed").fields!)).toEqual(["version"]);
  });

  it("when the number is changed to another object's number, then it answers 409 naming objectNumber", async () => {
    await framer.post("/api/objects").send(body({ objectNumber: "W-1300" }));
    const b = (await framer.post("/api/objects").send(body({ objectNumber: "W-1301" }))).body as ObjectRecord;
    const res = await framer.put(`/api/objects/${b.id}`).send({ ...editable(b), objectNumber: "W-1300" });
    expect(res.status).toBe(409);
    expect(expectErrorShape(res.body, "conflict").fields).toHaveProperty("objectNumber");
  });

  it("when the object keeps its own number, then that is not a duplicate", async () => {
    const a = (await framer.post("/api/objects").send(body({ objectNumber: "W-1400" }))).body as ObjectRecord;
    const res = await framer.put(`/api/objects/${a.id}`).send({ ...editable(a), title: "Same number, new title" });
    expect(res.status).toBe(200);
  });

  it("when a framer moves an object to another owner, then it is saved with the new owner", async () => {
    const other = makeClient(t.db, { name: "Second Owner" });
    const a = (await framer.post("/api/objects").send(body({ objectNumber: "W-1500" }))).body as ObjectRecord;
    const res = await framer.put(`/api/objects/${a.id}`).send({ ...editable(a), clientId: other.id });
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ clientId: other.id, clientName: "Second Owner" });
  });

  it("when the object does not exist, then it answers 404", async () => {
    const res = await framer.put("/api/objects/no-such-object").send({ ...body(), version: 1 });
    expect(res.status).toBe(404);
    expectErrorShape(res.body, "not_found");
  });
});

describe("GET /api/objects/next-number", () => {
  it("when this year's numbers run to 0007, then the next is 0008, whatever the other years hold", async () => {
    makeObject(t.db, clientId, { objectNumber: "2026-0007" });
    makeObject(t.db, clientId, { objectNumber: "2026-0003" });
    makeObject(t.db, clientId, { objectNumber: "2025-0950" });
    const res = await framer.get("/api/objects/next-number");
    expect(res.status).toBe(200);
    expect(res.body).toEqual({ objectNumber: "2026-0008" });
  });

  it("when the highest number has a part suffix, then the next number is still a whole sequence number", async () => {
    // Museums number the parts of an object 2026-0009.1, 2026-0009.2 … (common practice (no source)).
    makeObject(t.db, clientId, { objectNumber: "2026-0009.1" });
    makeObject(t.db, clientId, { objectNumber: "2026-0009.2" });
    const res = await framer.get("/api/objects/next-number");
    expect(res.body).toEqual({ objectNumber: "2026-0010" });
  });

  it("when the next number is used, then it can be created", async () => {
    const { objectNumber } = (await framer.get("/api/objects/next-number")).body as { objectNumber: string };
    const res = await framer.post("/api/objects").send(body({ objectNumber }));
    expect(res.status).toBe(201);
    expect((await framer.get("/api/objects/next-number")).body.objectNumber).not.toBe(objectNumber);
  });
});
