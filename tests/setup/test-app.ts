import fs from "node:fs";
import path from "node:path";
import { randomBytes, randomUUID } from "node:crypto";
import { afterAll, inject } from "vitest";
import request from "supertest";
import { createApp } from "../../server/app.ts";
import { openDatabase, type DbHandle } from "../../server/db/client.ts";
import { loadConfig } from "../../server/lib/config.ts";
import { makeClient, makeConditionReport, makeCustodyReceipt, makeMounting, makeObject, makePhoto, makeUser } from "../../server/db/factories.ts";
import { DEMO_PASSWORD, DEMO_USERS } from "../../server/db/seed.ts";
import type { Role } from "../../shared/schemas/auth.ts";
import type { ClientRecord } from "../../shared/schemas/clients.ts";

export { makeClient, makeConditionReport, makeCustodyReceipt, makeMounting, makeObject, makePhoto, makeUser };
export type Agent = request.Agent;

export type TestApp = {
  app: ReturnType<typeof createApp>["app"];
  database: DbHandle;
  db: DbHandle["db"];
  config: ReturnType<typeof loadConfig>;
  /** The history key and checkpoints file this app writes with (the test may tamper and verify). */
  historyKey: Buffer;
  checkpointsFile: string;
  /** The key as HISTORY_KEY would give it, for a script run against this app's database. */
  historyKeyText: string;
  /** A supertest agent: keeps the cookies it is given and sends the studio's Origin, like a browser on its pages. */
  agent: () => Agent;
};

/** Env that every test app starts from; a test may override any of it. */
const BASE_ENV = {
  LOG_LEVEL: "silent",
  SEED_DEMO: "false",
  NODE_ENV: "test",
  // Every supertest request comes from 127.0.0.1; the rate-limit test sets its own small limit.
  LOGIN_RATE_LIMIT: "1000",
  // Long documents in these tests must not be stopped because the machine is busy; the time limit itself
  // is tested with a limit of its own (render-off-thread.test.ts).
  WORK_TIME_LIMIT_S: "3600",
};

/**
 * Copies the run's migrated template to a fresh file and builds the real app on it.
 * Call once per test file (at module level or in beforeAll); the database is closed
 * and deleted after the file's tests.
 */
export function createTestApp(opts: { env?: Record<string, string>; clock?: () => Date } = {}): TestApp {
  const file = path.join(inject("testDbDir"), `${randomUUID()}.db`);
  fs.copyFileSync(inject("templateDb"), file);
  const database = openDatabase(file, { migrate: false });
  const config = loadConfig({ ...BASE_ENV, DATABASE_URL: file, UPLOADS_DIR: path.join(inject("testDbDir"), "uploads"), ...opts.env });
  const historyKeyText = randomBytes(32).toString("hex");
  const keying = { historyKey: Buffer.from(historyKeyText, "utf8"), checkpointsFile: `${file}.checkpoints.log` };
  const { app } = createApp({ config: { ...config, authSecret: randomBytes(32).toString("hex"), ...keying }, database, clock: opts.clock });
  afterAll(() => {
    database.close();
    for (const suffix of ["", "-wal", "-shm", ".checkpoints.log"]) fs.rmSync(file + suffix, { force: true });
  });
  // A browser sends its page's Origin with every write; the test agents do too, as the studio's own pages would.
  return { app, database, db: database.db, config, ...keying, historyKeyText, agent: () => request.agent(app).set("Origin", config.publicUrl) };
}

/** Signs in through POST /api/session and fails loudly when that does not answer 200. */
export async function signIn(agent: Agent, email: string, password: string): Promise<Agent> {
  const res = await agent.post("/api/session").send({ email, password });
  if (res.status !== 200) throw new Error(`Sign-in as ${email} answered ${res.status}: ${JSON.stringify(res.body)}`);
  return agent;
}

export const PASSWORD = "correct horse battery";

/** A user made for a test; it is also the SessionUser the factories take as the actor. */
export type Person = { id: string; name: string; email: string; role: Role; clientId: string | null };

/** Makes one user with PASSWORD through the shared factory. */
export async function makePerson(t: TestApp, role: Role, clientId: string | null = null): Promise<Person> {
  const email = `${role}-${randomUUID().slice(0, 8)}@reversa.test`;
  const name = `Test ${role}`;
  const id = await makeUser(t.db, { email, name, role, clientId, password: PASSWORD });
  return { id, name, email, role, clientId };
}

/** Signs a new agent in as the person. */
export async function agentFor(t: TestApp, person: Person): Promise<Agent> {
  return signIn(t.agent(), person.email, PASSWORD);
}

/**
 * A small studio: two clients (a private collector and an institution) and one user of each role.
 * Every row comes from the shared factories, as in the demo seed.
 */
export async function makeStudio(t: TestApp) {
  const collectorClient: ClientRecord = makeClient(t.db, { kind: "private", name: "Ada Collector" });
  const institution: ClientRecord = makeClient(t.db, { kind: "institution", name: "Bramble Museum" });
  const otherInstitution: ClientRecord = makeClient(t.db, { kind: "institution", name: "Cinder Archive" });
  const people = {
    admin: await makePerson(t, "admin"),
    framer: await makePerson(t, "framer"),
    collector: await makePerson(t, "collector", collectorClient.id),
    registrar: await makePerson(t, "registrar", institution.id),
  };
  return { collectorClient, institution, otherInstitution, people };
}

/** One signed-in agent for each role. */
export type RoleAgents = Record<Role, Agent>;

/** Signs one agent in for each person of a studio, one after the other (password hashing is CPU-bound). */
export async function agentsFor(t: TestApp, people: Record<Role, Person>): Promise<RoleAgents> {
  return {
    admin: await agentFor(t, people.admin),
    framer: await agentFor(t, people.framer),
    registrar: await agentFor(t, people.registrar),
    collector: await agentFor(t, people.collector),
  };
}

/** `makeStudio` with one signed-in agent per role beside it (`as.framer`, …). */
export async function makeSignedInStudio(t: TestApp) {
  const studio = await makeStudio(t);
  return { studio, as: await agentsFor(t, studio.people) };
}

/** After `seedDemo`: one agent signed in as each demo user (admin@reversa.test, …) with the demo password. */
export async function demoAgents(t: TestApp): Promise<RoleAgents> {
  const as: Partial<RoleAgents> = {};
  for (const u of DEMO_USERS) as[u.role] = await signIn(t.agent(), u.email, DEMO_PASSWORD);
  return as as RoleAgents;
}

/** The one error shape: `{ error: { code, message, fields? } }` with nothing else beside it. */
export function expectErrorShape(body: unknown, code: string) {
  const b = body as { error?: { code?: unknown; message?: unknown; fields?: unknown } };
  if (!b || typeof b !== "object" || !b.error) throw new Error(`Not the error shape: ${JSON.stringify(body)}`);
  if (Object.keys(b).length !== 1) throw new Error(`Error body has extra keys: ${JSON.stringify(body)}`);
  if (b.error.code !== code) throw new Error(`Expected error code ${code}, got ${JSON.stringify(b.error.code)}`);
  if (typeof b.error.message !== "string" || b.error.message.length === 0) throw new Error(`Error message missing: ${JSON.stringify(body)}`);
  if (JSON.stringify(body).includes("    at ")) throw new Error(`Error body leaks a stack trace: ${JSON.stringify(body)}`);
  return b.error as { code: string; message: string; fields?: Record<string, string> };
}
