import { beforeAll, describe, expect, it } from "vitest";
import { agentsFor, createTestApp, expectErrorShape, makeObject, makeStudio, type Agent } from "../setup/test-app.ts";
import type { ClientRecord } from "../../shared/schemas/clients.ts";

const t = createTestApp();
let studio: Awaited<ReturnType<typeof makeStudio>>;
let as: Record<"admin" | "framer" | "collector" | "registrar", Agent>;

beforeAll(async () => {
  studio = await makeStudio(t);
  makeObject(t.db, studio.collectorClient.id);
  makeObject(t.db, studio.collectorClient.id);
  makeObject(t.db, studio.institution.id);
  as = await agentsFor(t, studio.people);
});

const names = (items: ClientRecord[]) => items.map((c) => c.name);

describe("GET /api/clients", () => {
  it("when a framer lists clients, then every client comes back by name with its object count", async () => {
    const res = await as.framer.get("/api/clients");
    expect(res.status).toBe(200);
    const items = res.body.items as ClientRecord[];
    expect(names(items)).toEqual(["Ada Collector", "Bramble Museum", "Cinder Archive"]);
    expect(items.map((c) => c.objectCount)).toEqual([2, 1, 0]);
  });

  it("when a collector lists clients, then only their own client comes back", async () => {
    const res = await as.collector.get("/api/clients");
    expect(res.status).toBe(200);
    expect(names(res.body.items)).toEqual(["Ada Collector"]);
  });

  it("when a registrar lists clients, then only their institution comes back", async () => {
    const res = await as.registrar.get("/api/clients");
    expect(names(res.body.items)).toEqual(["Bramble Museum"]);
  });
});

describe("GET /api/clients/:id", () => {
  it("when a collector opens their own client, then it answers 200", async () => {
    const res = await as.collector.get(`/api/clients/${studio.collectorClient.id}`);
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ id: studio.collectorClient.id, kind: "private", objectCount: 2 });
  });

  it("when a collector opens another client, then it answers 404 as for one that does not exist", async () => {
    const other = await as.collector.get(`/api/clients/${studio.institution.id}`);
    const missing = await as.collector.get("/api/clients/no-such-client");
    expect(other.status).toBe(404);
    expect(expectErrorShape(other.body, "not_found").message).toBe("That client was not found.");
    expect(other.body).toEqual(missing.body);
  });
});

describe("POST /api/clients", () => {
  it("when a framer adds a client, then it answers 201 and blank optional fields are null", async () => {
    const res = await as.framer.post("/api/clients").send({ kind: "institution", name: "  Saltmarsh Regional Archive ", email: "", phone: " " });
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ kind: "institution", name: "Saltmarsh Regional Archive", email: null, phone: null, objectCount: 0 });
    expect((await as.framer.get(`/api/clients/${res.body.id}`)).status).toBe(200);
  });

  it("when a registrar adds a client, then it answers 403", async () => {
    const res = await as.registrar.post("/api/clients").send({ kind: "private", name: "Someone" });
    expect(res.status).toBe(403);
    expectErrorShape(res.body, "forbidden");
  });

  it("when a collector adds a client, then it answers 403", async () => {
    const res = await as.collector.post("/api/clients").send({ kind: "private", name: "Someone" });
    expect(res.status).toBe(403);
    expectErrorShape(res.body, "forbidden");
  });

  it("when the e-mail address is not valid, then it answers 422 naming email", async () => {
    const res = await as.framer.post("/api/clients").send({ kind: "private", name: "Someone", email: "someone-at-example" });
    expect(res.status).toBe(422);
    expect(expectErrorShape(res.body, "validation_failed").fields).toEqual({ email: "Enter a valid e-mail address, or leave it empty." });
  });

  it("when the kind is missing, then it answers 422 naming kind", async () => {
    const res = await as.framer.post("/api/clients").send({ name: "Someone" });
    expect(res.status).toBe(422);
    expect(expectErrorShape(res.body, "validation_failed").fields).toEqual({ kind: "Choose private owner or institution." });
  });
});

describe("PUT /api/clients/:id", () => {
  it("when an admin edits a client, then the change is saved", async () => {
    const res = await as.admin.put(`/api/clients/${studio.otherInstitution.id}`).send({ kind: "institution", name: "Cinder Archive", email: "desk@cinder.example" });
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ email: "desk@cinder.example" });
  });

  it("when a registrar edits their own institution, then it answers 403: clients are the studio's to keep", async () => {
    const res = await as.registrar.put(`/api/clients/${studio.institution.id}`).send({ kind: "institution", name: "Renamed" });
    expect(res.status).toBe(403);
    expectErrorShape(res.body, "forbidden");
  });

  it("when the client does not exist, then it answers 404", async () => {
    const res = await as.framer.put("/api/clients/no-such-client").send({ kind: "private", name: "Nobody" });
    expect(res.status).toBe(404);
    expectErrorShape(res.body, "not_found");
  });
});
