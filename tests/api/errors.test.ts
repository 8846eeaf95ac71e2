import { beforeAll, describe, expect, it } from "vitest";
import { agentFor, createTestApp, expectErrorShape, makeStudio, type Agent } from "../setup/test-app.ts";

const t = createTestApp();

// Every Reversa route behind sign-in, with a method the route answers to. Public: /api/health,
// GET and POST /api/session, and DELETE /api/session (signing out when signed out is harmless).
const PROTECTED: [method: "get" | "post" | "put" | "delete", path: string][] = [
  ["get", "/api/me"],
  ["get", "/api/settings"],
  ["put", "/api/settings"],
  ["get", "/api/clients"],
  ["post", "/api/clients"],
  ["get", "/api/clients/some-id"],
  ["put", "/api/clients/some-id"],
  ["get", "/api/objects"],
  ["post", "/api/objects"],
  ["get", "/api/objects/next-number"],
  ["get", "/api/objects/some-id"],
  ["put", "/api/objects/some-id"],
  // Unknown paths answer 401 too, so the API's shape cannot be mapped without signing in.
  ["get", "/api/no-such-thing"],
  ["delete", "/api/objects/some-id"],
];

describe("health", () => {
  it("when anyone asks for /api/health, then it answers 200 ok without signing in", async () => {
    const res = await t.agent().get("/api/health");
    expect(res.status).toBe(200);
    expect(res.body).toEqual({ status: "ok" });
  });
});

describe("signed out", () => {
  for (const [method, path] of PROTECTED) {
    it(`when signed out, then ${method.toUpperCase()} ${path} answers 401 in the error shape`, async () => {
      const res = await t.agent()[method](path).send({});
      expect(res.status).toBe(401);
      const error = expectErrorShape(res.body, "unauthenticated");
      expect(error.message).toBe("Sign in to continue.");
    });
  }

  it("when signed out, then a forged session cookie is not accepted", async () => {
    const res = await t.agent().get("/api/me").set("Cookie", "better-auth.session_token=forged.value");
    expect(res.status).toBe(401);
    expectErrorShape(res.body, "unauthenticated");
  });
});

describe("signed in", () => {
  let framer: Agent;
  beforeAll(async () => {
    const s = await makeStudio(t);
    framer = await agentFor(t, s.people.framer);
  });

  it("when the /api path does not exist, then it answers 404 in the error shape naming the route", async () => {
    const res = await framer.get("/api/no-such-thing?x=1");
    expect(res.status).toBe(404);
    const error = expectErrorShape(res.body, "not_found");
    expect(error.message).toBe("There is no API route GET /api/no-such-thing.");
  });

  it("when a known path is used with a method it does not answer, then it answers 404", async () => {
    const res = await framer.delete("/api/objects/some-id");
    expect(res.status).toBe(404);
    expectErrorShape(res.body, "not_found");
  });

  it("when the body is not valid JSON, then it answers 422 saying so", async () => {
    const res = await framer.post("/api/objects").set("Content-Type", "application/json").send('{"title": ');
    expect(res.status).toBe(422);
    const error = expectErrorShape(res.body, "validation_failed");
    expect(error.message).toBe("The request body is not valid JSON.");
    expect(error.fields).toEqual({ _: "Not valid JSON." });
  });

  it("when a body field is malformed, then it answers 422 naming the field", async () => {
    const res = await framer.post("/api/clients").send({ kind: "private", name: "" });
    expect(res.status).toBe(422);
    const error = expectErrorShape(res.body, "validation_failed");
    expect(error.fields).toEqual({ name: "Give the client's name." });
    expect(error.message).toBe("Check name: Give the client's name.");
  });

  it("when several fields are malformed, then the message counts them and each is named", async () => {
    const res = await framer.post("/api/clients").send({ kind: "shop", name: "" });
    expect(res.status).toBe(422);
    const error = expectErrorShape(res.body, "validation_failed");
    expect(Object.keys(error.fields!).sort()).toEqual(["kind", "name"]);
    expect(error.message).toMatch(/^Check the 2 highlighted fields: /);
  });

  it("when a query parameter is malformed, then it answers 422 naming it", async () => {
    const res = await framer.get("/api/objects?sort=price&page=0");
    expect(res.status).toBe(422);
    const error = expectErrorShape(res.body, "validation_failed");
    expect(Object.keys(error.fields!).sort()).toEqual(["page", "sort"]);
  });

  it("when the body is larger than 1 MB, then it answers 413 in the error shape", async () => {
    const res = await framer.post("/api/clients").send({ kind: "private", name: "x", notes: "n".repeat(1_100_000) });
    expect(res.status).toBe(413);
    expectErrorShape(res.body, "payload_too_large");
  });

  it("when any API answer is sent, then it carries the security headers", async () => {
    const res = await framer.get("/api/me");
    expect(res.headers["x-powered-by"]).toBeUndefined();
    expect(res.headers["x-content-type-options"]).toBe("nosniff");
    expect(res.headers["content-security-policy"]).toContain("frame-ancestors 'none'");
  });
});
