import { beforeAll, describe, expect, it } from "vitest";
import { PASSWORD, createTestApp, expectErrorShape, makePerson, type Person } from "../setup/test-app.ts";

describe("the sign-in rate limit", () => {
  const t = createTestApp({ env: { LOGIN_RATE_LIMIT: "3" } });
  let framer: Person;
  beforeAll(async () => {
    framer = await makePerson(t, "framer");
  });

  it("when a fourth attempt comes from the same address within 15 minutes, then it answers 429 rate_limited", async () => {
    for (let i = 0; i < 3; i++) {
      const res = await t.agent().post("/api/session").send({ email: framer.email, password: "wrong password" });
      expect(res.status, `attempt ${i + 1}`).toBe(401);
    }
    // Even the right password is refused now: the limit counts attempts, not failures.
    const fourth = await t.agent().post("/api/session").send({ email: framer.email, password: PASSWORD });
    expect(fourth.status).toBe(429);
    const error = expectErrorShape(fourth.body, "rate_limited");
    expect(error.message).toBe("Too many sign-in attempts from this address. Wait 15 minutes, then try again.");
    expect(fourth.headers["ratelimit-policy"]).toContain("q=3");
  });

  it("when the limit is reached, then the rest of the API is not limited", async () => {
    expect((await t.agent().get("/api/health")).status).toBe(200);
  });
});

describe("cookies behind https", () => {
  const t = createTestApp({ env: { PUBLIC_URL: "https://studio.example" } });
  let framer: Person;
  beforeAll(async () => {
    framer = await makePerson(t, "framer");
  });

  it("when the public URL is https, then the session cookies are Secure as well as HttpOnly and SameSite=Lax", async () => {
    const res = await t.agent().post("/api/session").send({ email: framer.email, password: PASSWORD });
    expect(res.status).toBe(200);
    const raw = res.headers["set-cookie"] as unknown as string[];
    expect(raw.length).toBeGreaterThan(0);
    for (const c of raw) {
      expect(c, c).toMatch(/;\s*Secure/i);
      expect(c, c).toMatch(/;\s*HttpOnly/i);
      expect(c, c).toMatch(/;\s*SameSite=Lax/i);
    }
  });
});
