import { beforeAll, describe, expect, it } from "vitest";
import { PASSWORD, createTestApp, expectErrorShape, makePerson, type Person } from "../setup/test-app.ts";
import { MAX_SIGN_IN_DELAY_MS, signInDelay } from "../../server/middleware/sign-in-throttle.ts";

// OWASP Authentication Cheat Sheet ("Protect against automated attacks"): throttle by address and by account,
// with growing delays rather than a lock-out the attacker could use against the owner.
describe("sign-in throttling", () => {
  const t = createTestApp({ env: { LOGIN_RATE_LIMIT: "3", LOGIN_ACCOUNT_DELAY_AFTER: "2", LOGIN_DELAY_MS: "5" } });
  let framer: Person;
  let others: Person[];
  beforeAll(async () => {
    framer = await makePerson(t, "framer");
    others = [await makePerson(t, "framer"), await makePerson(t, "admin"), await makePerson(t, "framer")];
  });
  // Each address as the server sees it: the app trusts X-Forwarded-For from its loopback proxy.
  const from = (address: string, email: string, password: string) => t.agent().post("/api/session").set("X-Forwarded-For", address).send({ email, password });

  it("when a fourth failure comes from the same address within 15 minutes, then that address is refused with 429, even with the right password", async () => {
    for (let i = 0; i < 3; i++) expect((await from("203.0.113.7", framer.email, "wrong password")).status, `attempt ${i + 1}`).toBe(401);
    const fourth = await from("203.0.113.7", framer.email, PASSWORD);
    expect(fourth.status).toBe(429);
    const error = expectErrorShape(fourth.body, "rate_limited");
    expect(error.message).toBe("Too many failed sign-in attempts from this address. Wait 15 minutes, then try again.");
    expect(fourth.headers["ratelimit-policy"]).toContain("q=3");
  });

  it("when that address has flooded the account, then the right password from a fresh address is still accepted (delayed, never refused)", async () => {
    const res = await from("198.51.100.20", framer.email, PASSWORD);
    expect(res.status, JSON.stringify(res.body)).toBe(200);
  });

  it("when one address tries many accounts, then it is refused once its failures reach the limit, whichever account it tries next", async () => {
    for (const p of others) expect((await from("203.0.113.99", p.email, "wrong password")).status).toBe(401);
    expect((await from("203.0.113.99", framer.email, "wrong password")).status).toBe(429);
    // The accounts themselves stay open to their owners elsewhere.
    for (const p of others) expect((await from("198.51.100.30", p.email, PASSWORD)).status).toBe(200);
  });

  it("when the limit is reached, then the rest of the API is not limited", async () => {
    expect((await t.agent().get("/api/health")).status).toBe(200);
  });
});

describe("the account delay", () => {
  it("grows: nothing until the threshold, then the base, doubling each failure, capped at 10 s", () => {
    expect([1, 2, 3, 4, 5].map((n) => signInDelay(n, 2, 500))).toEqual([0, 0, 500, 1000, 2000]);
    expect(signInDelay(40, 2, 500)).toBe(MAX_SIGN_IN_DELAY_MS);
    expect(MAX_SIGN_IN_DELAY_MS).toBe(10_000);
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
