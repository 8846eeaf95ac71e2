import { beforeAll, describe, expect, it } from "vitest";
import request from "supertest";
import { createTestApp, expectErrorShape, makeObject, makeStudio, PASSWORD } from "../setup/test-app.ts";

// OWASP CSRF Prevention Cheat Sheet: verify the origin of state-changing requests with standard headers
// (Origin, or Fetch Metadata's Sec-Fetch-Site), and refuse a write whose origin is foreign, null or missing.
const t = createTestApp({ env: { PUBLIC_URL: "http://records.example.test", TRUSTED_ORIGINS: "http://intranet.example.test" } });
let cookie: string;
let objectId: string;
let email: string;

beforeAll(async () => {
  const studio = await makeStudio(t);
  email = studio.people.framer.email;
  const res = await request(t.app).post("/api/session").set("Origin", "http://records.example.test").send({ email, password: PASSWORD });
  expect(res.status).toBe(200);
  cookie = res.headers["set-cookie"] as unknown as string;
  objectId = makeObject(t.db, studio.institution.id);
});

const write = (headers: Record<string, string>) => {
  let r = request(t.app).post(`/api/objects/${objectId}/condition`).set("Cookie", cookie);
  for (const [k, v] of Object.entries(headers)) r = r.set(k, v);
  return r.send({ context: "arrival", reportDate: "2026-11-02", data: { overallRating: "good", summary: "Sound." } });
};

describe("writes come only from the studio's own pages", () => {
  it.each([
    ["a foreign origin", { Origin: "http://evil.example" }],
    ["the null origin of a sandboxed page", { Origin: "null" }],
    ["no Origin and a cross-site Sec-Fetch-Site", { "Sec-Fetch-Site": "cross-site" }],
    ["no Origin and no Sec-Fetch-Site", {}],
    ["a look-alike origin", { Origin: "http://records.example.test.evil.example" }],
  ])("when a signed-in write carries %s, then it answers 403 in the one error shape and changes nothing", async (_what, headers) => {
    const res = await write(headers);
    expect(res.status).toBe(403);
    expectErrorShape(res.body, "forbidden");
    const reports = await request(t.app).get(`/api/objects/${objectId}/condition`).set("Cookie", cookie);
    expect(reports.body.items ?? reports.body).toHaveLength(0);
  });

  it("when sign-in is posted from a foreign origin, then it is refused before the password is checked (login CSRF)", async () => {
    const res = await request(t.app).post("/api/session").set("Origin", "http://evil.example").send({ email, password: PASSWORD });
    expect(res.status).toBe(403);
    expect(res.headers["set-cookie"]).toBeUndefined();
  });

  it.each([
    ["PUBLIC_URL", { Origin: "http://records.example.test" }],
    ["an origin in TRUSTED_ORIGINS", { Origin: "http://intranet.example.test" }],
    ["no Origin but Sec-Fetch-Site same-origin", { "Sec-Fetch-Site": "same-origin" }],
  ])("when a write comes from %s, then it goes through", async (_what, headers) => {
    const res = await write(headers);
    expect(res.status, JSON.stringify(res.body)).toBe(201);
  });

  it("when a read carries a foreign origin, then it is still answered: only writes are guarded", async () => {
    const res = await request(t.app).get(`/api/objects/${objectId}`).set("Cookie", cookie).set("Origin", "http://evil.example");
    expect(res.status).toBe(200);
  });
});
