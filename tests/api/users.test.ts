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
    const res = await admin
      .post("/api/users")
      .send({ name: "Nell Quarry", email: "Nell@Example.test", role: "collector", clientId: studio.collectorClient.id, password: "lantern quince oxbow 41" });
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ name: "Nell Quarry", email: "nell@example.test", role: "collector", clientId: studio.collectorClient.id, clientName: "Ada Collector" });
    const nell = await signIn(t.agent(), "nell@example.test", "lantern quince oxbow 41");
    expect((await nell.get("/api/me")).body).toMatchObject({ role: "collector", clientId: studio.collectorClient.id });
    expect((await admin.get("/api/users")).body.items.some((u: { email: string }) => u.email === "nell@example.test")).toBe(true);
  });

  it("when the e-mail address already has an account, then it answers 409 beside the field", async () => {
    const res = await admin.post("/api/users").send({ name: "Again", email: studio.people.framer.email, role: "framer", password: "marble ferry tundra 77" });
    expect(res.status).toBe(409);
    expect(expectErrorShape(res.body, "conflict").fields?.email).toMatch(/already has an account/);
  });

  it("when a registrar is given no institution, or a private owner, then it answers 422 naming clientId", async () => {
    const none = await admin.post("/api/users").send({ name: "Reg", email: "reg1@example.test", role: "registrar", password: "lantern quince oxbow 41" });
    expect(expectErrorShape(none.body, "validation_failed").fields?.clientId).toMatch(/institution/);
    const wrong = await admin
      .post("/api/users")
      .send({ name: "Reg", email: "reg2@example.test", role: "registrar", clientId: studio.collectorClient.id, password: "lantern quince oxbow 41" });
    expect(wrong.status).toBe(422);
    expect(wrong.body.error.fields.clientId).toMatch(/institution/);
  });

  it("when the password is short, then it answers 422 naming password", async () => {
    const res = await admin.post("/api/users").send({ name: "Short", email: "short@example.test", role: "framer", password: "short" });
    expect(expectErrorShape(res.body, "validation_failed").fields?.password).toMatch(/12 characters/);
  });

  it("when the password is 11 characters, then it is refused; 12 strong characters will do (Reversa's rule, above the 8 NIST SP 800-63B sets as its floor, from memory)", async () => {
    const eleven = await admin.post("/api/users").send({ name: "Eleven", email: "eleven@example.test", role: "framer", password: "Qz7#vLp2!mK" });
    expect(expectErrorShape(eleven.body, "validation_failed").fields?.password).toMatch(/12 characters/);
    const twelve = await admin.post("/api/users").send({ name: "Twelve", email: "twelve@example.test", role: "framer", password: "Qz7#vLp2!mKw" });
    expect(twelve.status, JSON.stringify(twelve.body)).toBe(201);
  });

  it.each([
    ["a common password, however long", "password12345"],
    ["a keyboard walk", "qwertyuiop123"],
    ["one built from the e-mail address", "hollis.wendemere"],
    ["one built from the person's name", "HollisWendemere1"],
    ["one built from the studio's name", "tidewellmarr2026"],
  ])("when the password is %s, then the strength estimator refuses it, naming password, and no account is made", async (_what, password) => {
    // The studio's name is the settings' (the test app's defaults until saved); set one to build on.
    await admin.put("/api/settings").send({ ...(await admin.get("/api/settings")).body, studioName: "Tidewell Marr", hasLogo: undefined });
    const res = await admin.post("/api/users").send({ name: "Hollis Wendemere", email: "hollis.wendemere@example.test", role: "framer", password });
    expect(res.status, JSON.stringify(res.body)).toBe(422);
    expect(expectErrorShape(res.body, "validation_failed").fields?.password).toMatch(/too easy to guess/);
    const list = await admin.get("/api/users");
    expect(list.body.items.map((u: { email: string }) => u.email)).not.toContain("hollis.wendemere@example.test");
  });

  it("when two accounts are asked for one e-mail at once, then one is made (201) and the others answer 409, never 500", async () => {
    const answers = await Promise.all(
      Array.from({ length: 5 }, (_, i) => admin.post("/api/users").send({ name: `Twin ${i}`, email: "twin@example.test", role: "framer", password: "lantern quince oxbow 41" })),
    );
    const statuses = answers.map((a) => a.status).sort();
    expect(statuses).toEqual([201, 409, 409, 409, 409]);
    for (const a of answers.filter((x) => x.status === 409)) expectErrorShape(a.body, "conflict");
  });

  it("when anyone but the admin asks, then the accounts are refused (403), and signed out 401", async () => {
    for (const who of ["framer", "registrar", "collector"] as const) {
      const a = await agentFor(t, studio.people[who]);
      expect((await a.get("/api/users")).status).toBe(403);
      expect((await a.post("/api/users").send({ name: "X", email: `x-${who}@example.test`, role: "admin", password: "lantern quince oxbow 41" })).status).toBe(403);
    }
    expect((await t.agent().get("/api/users")).status).toBe(401);
  });
});
