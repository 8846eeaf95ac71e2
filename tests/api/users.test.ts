import { beforeAll, describe, expect, it } from "vitest";
import { agentFor, createTestApp, expectErrorShape, makeStudio, signIn, type Agent } from "../setup/test-app.ts";

const t = createTestApp();
let studio: Awaited<ReturnType<typeof makeStudio>>;
let admin: Agent;

beforeAll(async () => {
  studio = await makeStudio(t);
  admin = await agentFor(t, studio.people.admin);
});

describe("the studio admin's accounts", () => {
  it("when the admin adds a collector of a private owner, then the person can sign in with that role and client", async () => {
    const res = await admin.post("/api/users").send({ name: "Nell Quarry", email: "Nell@Example.test", role: "collector", clientId: studio.collectorClient.id, password: "a-first-password" });
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ name: "Nell Quarry", email: "nell@example.test", role: "collector", clientId: studio.collectorClient.id, clientName: "Ada Collector" });
    const nell = await signIn(t.agent(), "nell@example.test", "a-first-password");
    expect((await nell.get("/api/me")).body).toMatchObject({ role: "collector", clientId: studio.collectorClient.id });
    expect((await admin.get("/api/users")).body.items.some((u: { email: string }) => u.email === "nell@example.test")).toBe(true);
  });

  it("when the e-mail address already has an account, then it answers 409 beside the field", async () => {
    const res = await admin.post("/api/users").send({ name: "Again", email: studio.people.framer.email, role: "framer", password: "another-password" });
    expect(res.status).toBe(409);
    expect(expectErrorShape(res.body, "conflict").fields?.email).toMatch(/already has an account/);
  });

  it("when a registrar is given no institution, or a private owner, then it answers 422 naming clientId", async () => {
    const none = await admin.post("/api/users").send({ name: "Reg", email: "reg1@example.test", role: "registrar", password: "a-first-password" });
    expect(expectErrorShape(none.body, "validation_failed").fields?.clientId).toMatch(/institution/);
    const wrong = await admin.post("/api/users").send({ name: "Reg", email: "reg2@example.test", role: "registrar", clientId: studio.collectorClient.id, password: "a-first-password" });
    expect(wrong.status).toBe(422);
    expect(wrong.body.error.fields.clientId).toMatch(/institution/);
  });

  it("when the password is short, then it answers 422 naming password", async () => {
    const res = await admin.post("/api/users").send({ name: "Short", email: "short@example.test", role: "framer", password: "short" });
    expect(expectErrorShape(res.body, "validation_failed").fields?.password).toMatch(/10 characters/);
  });

  it("when anyone but the admin asks, then the accounts are refused (403), and signed out 401", async () => {
    for (const who of ["framer", "registrar", "collector"] as const) {
      const a = await agentFor(t, studio.people[who]);
      expect((await a.get("/api/users")).status).toBe(403);
      expect((await a.post("/api/users").send({ name: "X", email: `x-${who}@example.test`, role: "admin", password: "a-first-password" })).status).toBe(403);
    }
    expect((await t.agent().get("/api/users")).status).toBe(401);
  });
});
