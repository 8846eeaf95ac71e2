import { beforeAll, describe, expect, it } from "vitest";
import { eq } from "drizzle-orm";
import { user } from "../../server/db/schema.ts";
import { PASSWORD, agentFor, createTestApp, expectErrorShape, makePerson, makeClient, type Person } from "../setup/test-app.ts";

const t = createTestApp();
let framer: Person;
let collector: Person;
let clientId: string;

beforeAll(async () => {
  framer = await makePerson(t, "framer");
  clientId = makeClient(t.db, { name: "Ada Collector" }).id;
  collector = await makePerson(t, "collector", clientId);
});

/** The Set-Cookie header of a response as a list. */
const setCookies = (res: { headers: Record<string, unknown> }): string[] => {
  const raw = res.headers["set-cookie"];
  return Array.isArray(raw) ? raw : typeof raw === "string" ? [raw] : [];
};

describe("POST /api/session", () => {
  it("when the e-mail and password match, then it answers 200 with the user's id", async () => {
    const res = await t.agent().post("/api/session").send({ email: framer.email, password: PASSWORD });
    expect(res.status).toBe(200);
    expect(res.body).toEqual({ ok: true, userId: framer.id });
  });

  it("when signing in, then every cookie is HttpOnly and SameSite=Lax, and the session cookie is set", async () => {
    const res = await t.agent().post("/api/session").send({ email: framer.email, password: PASSWORD });
    const cookies = setCookies(res);
    expect(cookies.some((c) => c.startsWith("better-auth.session_token="))).toBe(true);
    for (const c of cookies) {
      expect(c, c).toMatch(/;\s*HttpOnly/i);
      expect(c, c).toMatch(/;\s*SameSite=Lax/i);
      expect(c, c).toMatch(/;\s*Path=\//i);
    }
  });

  it("when the e-mail is typed in capitals, then it still signs in", async () => {
    const res = await t.agent().post("/api/session").send({ email: framer.email.toUpperCase(), password: PASSWORD });
    expect(res.status).toBe(200);
  });

  it("when the password is wrong, then it answers 401 with a clear message and no session cookie", async () => {
    const res = await t.agent().post("/api/session").send({ email: framer.email, password: "not the password" });
    expect(res.status).toBe(401);
    const error = expectErrorShape(res.body, "unauthenticated");
    expect(error.message).toBe("That e-mail address and password do not match an account. Check both and try again.");
    expect(error.fields).toEqual({ password: "E-mail address or password is wrong." });
    expect(setCookies(res).filter((c) => /^better-auth\.session_token=[^;]+/.test(c))).toEqual([]);
  });

  it("when the e-mail has no account, then it answers the same 401 as a wrong password", async () => {
    const wrong = await t.agent().post("/api/session").send({ email: framer.email, password: "not the password" });
    const unknown = await t.agent().post("/api/session").send({ email: "nobody@reversa.test", password: "not the password" });
    expect(unknown.status).toBe(401);
    expect(unknown.body).toEqual(wrong.body);
  });

  it("when the e-mail is not an address, then it answers 422 naming email", async () => {
    const res = await t.agent().post("/api/session").send({ email: "framer", password: PASSWORD });
    expect(res.status).toBe(422);
    expect(expectErrorShape(res.body, "validation_failed").fields).toEqual({ email: "Enter the e-mail address you sign in with." });
  });

  it("when the password is empty, then it answers 422 naming password", async () => {
    const res = await t.agent().post("/api/session").send({ email: framer.email, password: "" });
    expect(res.status).toBe(422);
    expect(expectErrorShape(res.body, "validation_failed").fields).toEqual({ password: "Enter your password." });
  });
});

describe("GET /api/session", () => {
  it("when signed out, then it answers 200 with no user, and is not cached", async () => {
    const res = await t.agent().get("/api/session");
    expect(res.status).toBe(200);
    expect(res.body).toEqual({ user: null });
    expect(res.headers["cache-control"]).toBe("no-store");
  });

  it("when signed in, then it answers the signed-in user", async () => {
    const agent = await agentFor(t, collector);
    const res = await agent.get("/api/session");
    expect(res.status).toBe(200);
    expect(res.body).toEqual({ user: { id: collector.id, name: "Test collector", email: collector.email, role: "collector", clientId } });
  });
});

describe("better-auth's own HTTP routes", () => {
  // They are not mounted (DEVELOPERS.md decision log): sign-up and the rest of better-auth's surface are unreachable.
  it("when someone signs up or signs in through /api/auth, then nothing is there and no account is made", async () => {
    const email = "walk-in@reversa.test";
    const up = await t.agent().post("/api/auth/sign-up/email").send({ email, password: "a long enough password", name: "Walk-in" });
    expect(up.status).toBe(401);
    expectErrorShape(up.body, "unauthenticated");
    const signInHere = await t.agent().post("/api/auth/sign-in/email").send({ email: framer.email, password: PASSWORD });
    expect(signInHere.status).toBe(401);
    expect(setCookies(signInHere).filter((c) => c.startsWith("better-auth.session_token="))).toEqual([]);
    expect((await t.agent().post("/api/session").send({ email, password: "a long enough password" })).status).toBe(401);
  });

  it("when signed in, then /api/auth paths answer 404 like any unknown API path", async () => {
    const agent = await agentFor(t, framer);
    const res = await agent.get("/api/auth/get-session");
    expect(res.status).toBe(404);
    expectErrorShape(res.body, "not_found");
  });
});

describe("GET /api/me", () => {
  it("when a framer is signed in, then it answers who they are with no client", async () => {
    const agent = await agentFor(t, framer);
    const res = await agent.get("/api/me");
    expect(res.status).toBe(200);
    expect(res.body).toEqual({ id: framer.id, name: "Test framer", email: framer.email, role: "framer", clientId: null });
  });

  it("when a collector is signed in, then it answers their role and their client", async () => {
    const agent = await agentFor(t, collector);
    const res = await agent.get("/api/me");
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ id: collector.id, role: "collector", clientId });
  });

  it("when the studio changes a signed-in user's role, then the very next call sees the new role", async () => {
    const someone = await makePerson(t, "framer");
    const agent = await agentFor(t, someone);
    expect((await agent.get("/api/objects/next-number")).status).toBe(200);
    t.db.update(user).set({ role: "collector", clientId }).where(eq(user.id, someone.id)).run();
    expect((await agent.get("/api/me")).body).toMatchObject({ role: "collector", clientId });
    expect((await agent.get("/api/objects/next-number")).status).toBe(403);
  });

  it("when an account's role is not one of Reversa's, then it answers 403 asking for the studio admin", async () => {
    const someone = await makePerson(t, "framer");
    const agent = await agentFor(t, someone);
    t.database.sqlite.prepare("update user set role = 'visitor' where id = ?").run(someone.id);
    const res = await agent.get("/api/me");
    expect(res.status).toBe(403);
    expect(expectErrorShape(res.body, "forbidden").message).toBe("Your account has no role in this studio; ask the studio admin.");
  });
});

describe("DELETE /api/session", () => {
  it("when signing out, then it answers 204, clears the cookies and the next call is 401", async () => {
    const agent = await agentFor(t, framer);
    expect((await agent.get("/api/me")).status).toBe(200);
    const out = await agent.delete("/api/session");
    expect(out.status).toBe(204);
    const cleared = setCookies(out).filter((c) => c.startsWith("better-auth.session_token="));
    expect(cleared.length).toBeGreaterThan(0);
    for (const c of cleared) expect(c).toMatch(/Max-Age=0/i);
    const after = await agent.get("/api/me");
    expect(after.status).toBe(401);
    expectErrorShape(after.body, "unauthenticated");
  });

  it("when the cookies of a signed-out session are replayed, then they are no longer accepted", async () => {
    const res = await t.agent().post("/api/session").send({ email: framer.email, password: PASSWORD });
    // Every cookie the browser was given, as someone who copied them would send them back.
    const cookie = setCookies(res)
      .map((c) => c.split(";")[0])
      .join("; ");
    expect((await t.agent().get("/api/me").set("Cookie", cookie)).status).toBe(200);
    expect((await t.agent().delete("/api/session").set("Cookie", cookie)).status).toBe(204);
    expect((await t.agent().get("/api/me").set("Cookie", cookie)).status).toBe(401);
  });

  it("when nobody is signed in, then signing out still answers 204 (signing out twice is harmless)", async () => {
    const res = await t.agent().delete("/api/session");
    expect(res.status).toBe(204);
  });
});
