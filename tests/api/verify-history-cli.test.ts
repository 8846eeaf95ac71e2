import fs from "node:fs";
import { spawnSync } from "node:child_process";
import path from "node:path";
import { fileURLToPath } from "node:url";
import { beforeAll, describe, expect, it } from "vitest";
import { asc, eq } from "drizzle-orm";
import { agentFor, createTestApp, makeClient, makePerson, type Agent } from "../setup/test-app.ts";
import { events } from "../../server/db/schema.ts";

// `npm run verify-history` is `tsx server/db/verify-history-cli.ts`; run it as a separate process
// against this file's database, as an operator would against the studio's.
const ROOT = path.resolve(path.dirname(fileURLToPath(import.meta.url)), "../..");
const t = createTestApp();
const file = t.database.sqlite.name;

function runCli(databaseUrl = file) {
  const r = spawnSync("npx", ["tsx", "server/db/verify-history-cli.ts"], {
    cwd: ROOT,
    env: { ...process.env, DATABASE_URL: databaseUrl, LOG_LEVEL: "silent" },
    encoding: "utf8",
    timeout: 60_000,
  });
  if (r.error) throw r.error;
  return { status: r.status, stdout: r.stdout, stderr: r.stderr };
}

let admin: Agent;
let objectIds: string[];

beforeAll(async () => {
  const clientId = makeClient(t.db, { kind: "private", name: "Ada Collector" }).id;
  admin = await agentFor(t, await makePerson(t, "admin"));
  objectIds = [];
  for (const objectNumber of ["CLI-1", "CLI-2"]) {
    // A4 = 210 × 297 mm (ISO 216).
    const res = await admin.post("/api/objects").send({ objectNumber, title: "Study", objectType: "print", sheetWidthMm: 210, sheetHeightMm: 297, clientId, status: "in-studio" });
    expect(res.status).toBe(201);
    const { id: _i, clientName: _c, createdAt: _ca, updatedAt: _u, valuationVisible: _v, ...editable } = res.body;
    expect((await admin.put(`/api/objects/${res.body.id}`).send({ ...editable, title: "Study, renamed" })).status).toBe(200);
    objectIds.push(res.body.id);
  }
});

describe("npm run verify-history", () => {
  it("when every chain is intact, then it exits 0 and says History intact with the count", () => {
    const count = t.db.select().from(events).all().length;
    expect(count).toBe(4);
    const r = runCli();
    expect(r.status, r.stderr).toBe(0);
    expect(r.stdout).toContain("History intact");
    expect(r.stdout).toContain(`${count} events checked`);
    expect(r.stderr).not.toContain("History broken");
  });

  it("when one event was changed by hand, then it exits non-zero and names that event's seq and object", () => {
    const target = t.db.select().from(events).where(eq(events.objectId, objectIds[1])).orderBy(asc(events.seq)).all()[1];
    t.database.sqlite.exec("DROP TRIGGER events_no_update");
    t.database.sqlite.prepare("UPDATE events SET summary = ? WHERE seq = ?").run("Catalogue changed: nothing to see.", target.seq);

    const r = runCli();
    expect(r.status).not.toBe(0);
    expect(r.status).not.toBeNull();
    expect(r.stderr).toContain(`History broken at event ${target.seq}`);
    expect(r.stderr).toContain(`object ${objectIds[1]}`);
    // The three events before it (the first object's two and this object's first) check out.
    expect(r.stderr).toContain("3 events before it check out");
    expect(r.stdout).not.toContain("History intact");
  });
});

it("when DATABASE_URL names a file that does not exist, then it refuses instead of checking an empty new database", () => {
  const missing = path.join(path.dirname(file), "no-such-studio.db");
  const r = runCli(missing);
  expect(r.status).toBe(2);
  expect(r.stderr).toContain("There is no database at");
  expect(fs.existsSync(missing)).toBe(false);
});
