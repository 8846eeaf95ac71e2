import { expect, it } from "vitest";
import { makeObject } from "../../server/db/factories.ts";
import { expectErrorShape, type Agent, type makeStudio, type RoleAgents, type TestApp } from "./test-app.ts";

/**
 * "Role × route → status" sweeps. Each caller reaches for the object it would own: studio staff any
 * object, a registrar their institution's (or another institution's), a collector their own (or another
 * private client's), and a signed-out caller one of the collector's.
 */
export type Who = "admin" | "framer" | "registrar-own" | "registrar-other" | "collector-own" | "collector-other" | "signed-out";
export const WHO: readonly Who[] = ["admin", "framer", "registrar-own", "registrar-other", "collector-own", "collector-other", "signed-out"];

/** What one route answers each caller. */
export type Expected = Record<Who, number>;

/** One route of the sweep: `run` sets up its own rows on the object, calls the route, and says whether anything was written. */
export type MatrixRow = {
  route: string;
  expected: Expected;
  run: (agent: Agent, objectId: string) => Promise<{ status: number; body: unknown; written: () => boolean }>;
};

export type MatrixStudio = { studio: Awaited<ReturnType<typeof makeStudio>>; as: RoleAgents; otherPrivateClientId: string };

/** A fresh object for the caller to reach for (see `Who`), and the agent that calls. */
export function subjectFor(t: TestApp, who: Who, { studio, as, otherPrivateClientId }: MatrixStudio): { agent: Agent; objectId: string } {
  const on = (clientId: string) => makeObject(t.db, clientId);
  switch (who) {
    case "admin":
      return { agent: as.admin, objectId: on(studio.collectorClient.id) };
    case "framer":
      return { agent: as.framer, objectId: on(studio.institution.id) };
    case "registrar-own":
      return { agent: as.registrar, objectId: on(studio.institution.id) };
    case "registrar-other":
      return { agent: as.registrar, objectId: on(studio.otherInstitution.id) };
    case "collector-own":
      return { agent: as.collector, objectId: on(studio.collectorClient.id) };
    case "collector-other":
      return { agent: as.collector, objectId: on(otherPrivateClientId) };
    case "signed-out":
      return { agent: t.agent(), objectId: on(studio.collectorClient.id) };
  }
}

/** The error code a refusal carries, or undefined when the status is not a refusal. */
export const refusalCode = (status: number): string | undefined => ({ 401: "unauthenticated", 403: "forbidden", 404: "not_found" })[status as 401 | 403 | 404];

/**
 * Declares one test per route and caller: "when $who calls $route, then it answers $status". A refusal
 * carries its error code and leaves no trace; a 409 is a conflict and leaves no trace; an allowed POST or
 * PUT leaves one. `studio` is read when the tests run, so it may be filled in by a beforeAll.
 */
export function accessMatrix(t: TestApp, rows: readonly MatrixRow[], studio: () => MatrixStudio) {
  const cases = rows.flatMap((row) => WHO.map((who) => ({ route: row.route, who, status: row.expected[who], row })));
  it.each(cases)("when $who calls $route, then it answers $status", async ({ who, status, row }) => {
    const { agent, objectId } = subjectFor(t, who, studio());
    const res = await row.run(agent, objectId);
    expect(res.status).toBe(status);
    const code = refusalCode(status);
    if (code) {
      expectErrorShape(res.body, code);
      expect(res.written(), "a refused request left a trace").toBe(false);
    } else if (status === 409) {
      expectErrorShape(res.body, "conflict");
      expect(res.written()).toBe(false);
    } else if (row.route.startsWith("POST") || row.route.startsWith("PUT")) {
      expect(res.written(), "an allowed write left no trace").toBe(true);
    }
  });
}

type Answer = PromiseLike<{ status: number; body: unknown }>;

/** A read: `make` sets up the record on the caller's object, `call` asks for it; nothing may be written. */
export function readRow<R>(route: string, expected: Expected, make: (objectId: string) => Promise<R>, call: (agent: Agent, made: R, objectId: string) => Answer): MatrixRow {
  return {
    route,
    expected,
    run: async (agent, objectId) => {
      const made = await make(objectId);
      const res = await call(agent, made, objectId);
      return { status: res.status, body: res.body, written: () => false };
    },
  };
}

/** A write to a record `make` sets up: it counts as written when `snapshot(objectId)` differs from before the call. */
export function writeRow<R>(
  route: string,
  expected: Expected,
  snapshot: (objectId: string) => string,
  make: (objectId: string) => Promise<R>,
  call: (agent: Agent, made: R, objectId: string) => Answer,
): MatrixRow {
  return {
    route,
    expected,
    run: async (agent, objectId) => {
      const made = await make(objectId);
      const before = snapshot(objectId);
      const res = await call(agent, made, objectId);
      return { status: res.status, body: res.body, written: () => snapshot(objectId) !== before };
    },
  };
}
