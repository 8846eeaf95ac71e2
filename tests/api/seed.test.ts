import { beforeAll, describe, expect, it } from "vitest";
import { createTestApp, signIn } from "../setup/test-app.ts";
import { DEMO_PASSWORD, DEMO_USERS, seedDemo } from "../../server/db/seed.ts";

const t = createTestApp();
let seeded: boolean;

beforeAll(async () => {
  seeded = await seedDemo(t.db);
});

const demo = (role: (typeof DEMO_USERS)[number]["role"]) => DEMO_USERS.find((u) => u.role === role)!;

describe("the demo seed", () => {
  it("when the database is empty, then the demo studio is seeded, and a second run seeds nothing", async () => {
    expect(seeded).toBe(true);
    expect(await seedDemo(t.db)).toBe(false);
  });

  it("when each demo user signs in with the demo password, then they are who the seed says", async () => {
    for (const u of DEMO_USERS) {
      const agent = await signIn(t.agent(), u.email, DEMO_PASSWORD);
      const me = await agent.get("/api/me");
      expect(me.body).toMatchObject({ email: u.email, name: u.name, role: u.role });
    }
  });

  it("when the demo framer lists objects, then all 30 are there with distinct year-based numbers", async () => {
    const agent = await signIn(t.agent(), demo("framer").email, DEMO_PASSWORD);
    const res = await agent.get("/api/objects?pageSize=200");
    expect(res.body.total).toBe(30);
    const numbers = res.body.items.map((i: { objectNumber: string }) => i.objectNumber);
    expect(new Set(numbers).size).toBe(30);
    for (const n of numbers) expect(n).toMatch(/^2026-\d{4}$/);
  });

  it("when the demo collector lists objects, then only their own eight come back", async () => {
    const agent = await signIn(t.agent(), demo("collector").email, DEMO_PASSWORD);
    const res = await agent.get("/api/objects");
    expect(res.body.total).toBe(8);
    expect(new Set(res.body.items.map((i: { clientName: string }) => i.clientName))).toEqual(new Set(["Odile Varga-Pennick"]));
  });

  it("when the demo registrar lists clients, then only their institution comes back with its objects counted", async () => {
    const agent = await signIn(t.agent(), demo("registrar").email, DEMO_PASSWORD);
    const res = await agent.get("/api/clients");
    expect(res.body.items).toHaveLength(1);
    expect(res.body.items[0]).toMatchObject({ name: "Wrenfold Hall Collection Trust", kind: "institution", objectCount: 10 });
  });

  it("when the studio settings are read, then they are the demo studio's", async () => {
    const agent = await signIn(t.agent(), demo("admin").email, DEMO_PASSWORD);
    expect((await agent.get("/api/settings")).body).toMatchObject({ studioName: "Tidewell & Marr Conservation Framing", currency: "GBP" });
  });
});
