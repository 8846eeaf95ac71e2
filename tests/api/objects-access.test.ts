import { beforeAll, describe, expect, it } from "vitest";
import { agentFor, agentsFor, createTestApp, expectErrorShape, makeObject, makePerson, makeStudio, type Agent } from "../setup/test-app.ts";
import type { ObjectRecord } from "../../shared/schemas/objects.ts";

const t = createTestApp();

let studio: Awaited<ReturnType<typeof makeStudio>>;
let ids: { collectors: string; institutions: string; others: string };
let as: Record<"admin" | "framer" | "collector" | "registrar", Agent>;

const VALUED = { valuationMinor: 420000, valuationCurrency: "GBP", valuationDate: "2025-09-14", valuationBasis: "market", valuer: "A. Valuer" } as const;

/** The fields of a record that a PUT sends back. */
function editable(r: ObjectRecord) {
  const { id: _i, clientName: _c, createdAt: _ca, updatedAt: _u, valuationVisible: _v, ...body } = r;
  return body;
}

beforeAll(async () => {
  studio = await makeStudio(t);
  ids = {
    collectors: makeObject(t.db, studio.collectorClient.id, { title: "Estuary at low water", ...VALUED }),
    institutions: makeObject(t.db, studio.institution.id, { title: "Survey of the east meadow", ...VALUED, valuationMinor: 2800000 }),
    others: makeObject(t.db, studio.otherInstitution.id, { title: "Parish boundary deed", ...VALUED, valuationMinor: 500000 }),
  };
  as = await agentsFor(t, studio.people);
});

describe("studio staff", () => {
  it("when a framer lists objects, then every client's objects are there", async () => {
    const res = await as.framer.get("/api/objects");
    expect(res.status).toBe(200);
    expect(res.body.total).toBe(3);
    expect(res.body.items.map((i: { id: string }) => i.id).sort()).toEqual(Object.values(ids).sort());
  });

  it("when a framer opens any client's object, then the valuation is shown", async () => {
    for (const id of Object.values(ids)) {
      const res = await as.framer.get(`/api/objects/${id}`);
      expect(res.status).toBe(200);
      expect(res.body.valuationVisible).toBe(true);
      expect(res.body.valuationMinor).toBeGreaterThan(0);
      expect(res.body.valuationCurrency).toBe("GBP");
      expect(res.body.valuer).toBe("A. Valuer");
    }
  });

  it("when an admin opens another client's object, then the valuation is shown", async () => {
    const res = await as.admin.get(`/api/objects/${ids.others}`);
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ valuationVisible: true, valuationMinor: 500000 });
  });

  it("when objects are listed, then the list carries no valuation at all", async () => {
    const res = await as.framer.get("/api/objects");
    for (const item of res.body.items) {
      for (const k of ["valuationMinor", "valuationCurrency", "valuationDate", "valuationBasis", "valuer"]) expect(item).not.toHaveProperty(k);
    }
  });
});

describe("a collector", () => {
  it("when listing objects, then only their own client's objects are there", async () => {
    const res = await as.collector.get("/api/objects");
    expect(res.status).toBe(200);
    expect(res.body.total).toBe(1);
    expect(res.body.items.map((i: { id: string }) => i.id)).toEqual([ids.collectors]);
  });

  it("when filtering by another client, then nothing comes back", async () => {
    const res = await as.collector.get(`/api/objects?clientId=${studio.institution.id}`);
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ items: [], total: 0 });
  });

  it("when opening their own object, then they see it with its valuation", async () => {
    const res = await as.collector.get(`/api/objects/${ids.collectors}`);
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ id: ids.collectors, clientName: "Ada Collector", valuationVisible: true, ...VALUED });
  });

  it("when opening another client's object, then it answers 404 exactly as for an id that does not exist", async () => {
    const other = await as.collector.get(`/api/objects/${ids.institutions}`);
    const missing = await as.collector.get("/api/objects/no-such-object");
    expect(other.status).toBe(404);
    expect(missing.status).toBe(404);
    expect(expectErrorShape(other.body, "not_found").message).toBe("That object was not found.");
    expect(other.body).toEqual(missing.body);
  });

  it("when saving their own object, then it answers 403: a collector only looks", async () => {
    const current = (await as.collector.get(`/api/objects/${ids.collectors}`)).body as ObjectRecord;
    const res = await as.collector.put(`/api/objects/${ids.collectors}`).send({ ...editable(current), title: "Renamed" });
    expect(res.status).toBe(403);
    expectErrorShape(res.body, "forbidden");
    expect((await as.framer.get(`/api/objects/${ids.collectors}`)).body.title).toBe("Estuary at low water");
  });

  it("when creating an object or asking for the next number, then it answers 403", async () => {
    const post = await as.collector.post("/api/objects").send({});
    expect(post.status).toBe(403);
    expectErrorShape(post.body, "forbidden");
    expect((await as.collector.get("/api/objects/next-number")).status).toBe(403);
  });

  it("when a collector has no client, then the list is empty", async () => {
    const orphan = await agentFor(t, await makePerson(t, "collector", null));
    const res = await orphan.get("/api/objects");
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ items: [], total: 0 });
  });
});

describe("a registrar", () => {
  it("when listing objects, then only their institution's objects are there", async () => {
    const res = await as.registrar.get("/api/objects");
    expect(res.status).toBe(200);
    expect(res.body.items.map((i: { id: string }) => i.id)).toEqual([ids.institutions]);
  });

  it("when opening their institution's object, then they see it with its valuation", async () => {
    const res = await as.registrar.get(`/api/objects/${ids.institutions}`);
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ valuationVisible: true, valuationMinor: 2800000 });
  });

  it("when opening another client's object, then it answers 404", async () => {
    const res = await as.registrar.get(`/api/objects/${ids.others}`);
    expect(res.status).toBe(404);
    expectErrorShape(res.body, "not_found");
  });

  it("when updating their institution's catalogue data and valuation, then both are saved and the version moves on", async () => {
    const current = (await as.registrar.get(`/api/objects/${ids.institutions}`)).body as ObjectRecord;
    const res = await as.registrar
      .put(`/api/objects/${ids.institutions}`)
      .send({ ...editable(current), title: "Survey of the east meadow, 1791", valuationMinor: 3000000, valuationDate: "2026-05-01" });
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ title: "Survey of the east meadow, 1791", valuationMinor: 3000000, valuationDate: "2026-05-01", version: current.version + 1 });
    // The studio sees what the registrar saved.
    expect((await as.framer.get(`/api/objects/${ids.institutions}`)).body).toMatchObject({ valuationMinor: 3000000 });
  });

  it("when updating another client's object, then it answers 404 and nothing changes", async () => {
    const current = (await as.framer.get(`/api/objects/${ids.others}`)).body as ObjectRecord;
    const res = await as.registrar.put(`/api/objects/${ids.others}`).send({ ...editable(current), title: "Hijacked" });
    expect(res.status).toBe(404);
    expectErrorShape(res.body, "not_found");
    expect((await as.framer.get(`/api/objects/${ids.others}`)).body.title).toBe("Parish boundary deed");
  });

  it("when moving their institution's object to another owner, then it answers 403 and the owner stays", async () => {
    const current = (await as.registrar.get(`/api/objects/${ids.institutions}`)).body as ObjectRecord;
    const res = await as.registrar.put(`/api/objects/${ids.institutions}`).send({ ...editable(current), clientId: studio.otherInstitution.id });
    expect(res.status).toBe(403);
    expect(expectErrorShape(res.body, "forbidden").message).toBe("Only studio staff move an object to another owner.");
    expect((await as.framer.get(`/api/objects/${ids.institutions}`)).body.clientId).toBe(studio.institution.id);
  });

  it("when creating an object, even for their own institution, then it answers 403", async () => {
    const res = await as.registrar.post("/api/objects").send({
      objectNumber: "R-1",
      title: "New accession",
      objectType: "print",
      sheetWidthMm: 210,
      sheetHeightMm: 297,
      clientId: studio.institution.id,
      status: "with-owner",
    });
    expect(res.status).toBe(403);
    expectErrorShape(res.body, "forbidden");
  });
});
