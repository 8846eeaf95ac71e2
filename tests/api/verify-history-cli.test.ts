import fs from "node:fs";
import { spawnSync } from "node:child_process";
import path from "node:path";
import { fileURLToPath } from "node:url";
import { beforeAll, describe, expect, it } from "vitest";
import { asc, eq } from "drizzle-orm";
import { agentFor, createTestApp, makeClient, makePerson, type Agent } from "../setup/test-app.ts";
import { events } from "../../server/db/schema.ts";
import { plainEventHash } from "../../server/features/history/history.chain.ts";
import { at } from "../setup/lists.ts";

// `npm run verify-history` is `tsx server/db/verify-history-cli.ts`; run it as a separate process
// against this file's database, as an operator would against the studio's.
const ROOT = path.resolve(path.dirname(fileURLToPath(import.meta.url)), "../..");
const t = createTestApp();
const file = t.database.sqlite.name;

function runCli(databaseUrl = file, key = t.historyKeyText) {
  const r = spawnSync("npx", ["tsx", "server/db/verify-history-cli.ts"], {
    cwd: ROOT,
    env: { ...process.env, DATABASE_URL: databaseUrl, LOG_LEVEL: "silent", HISTORY_KEY: key, HISTORY_CHECKPOINTS: t.checkpointsFile },
    encoding: "utf8",
    timeout: 600_000,
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

  it("when checked with another key, then nothing checks out: the chain is keyed", () => {
    const r = runCli(file, "a".repeat(64));
    expect(r.status).toBe(1);
    expect(r.stderr).toContain("History broken at event");
  });
});

// Tampering as someone who can write the database but does not hold the key or the checkpoints file.
describe("npm run verify-history catches a database writer without the key", () => {
  const sqlite = () => t.database.sqlite;
  const snapshot = () => ({ events: sqlite().prepare("select * from events order by seq").all(), heads: sqlite().prepare("select id, history_head from objects").all() });
  let saved: ReturnType<typeof snapshot>;
  const restore = () => {
    sqlite().exec("DROP TRIGGER IF EXISTS events_no_update; DROP TRIGGER IF EXISTS events_no_delete;");
    sqlite().prepare("delete from events").run();
    const ins = sqlite().prepare(
      "insert into events (seq, object_id, type, at, actor_id, actor_name, summary, data, prev_hash, hash, occurred_on) values (@seq, @object_id, @type, @at, @actor_id, @actor_name, @summary, @data, @prev_hash, @hash, @occurred_on)",
    );
    for (const e of saved.events as Record<string, unknown>[]) ins.run(e);
    for (const h of saved.heads as { id: string; history_head: string | null }[]) sqlite().prepare("update objects set history_head = ? where id = ?").run(h.history_head, h.id);
  };
  beforeAll(() => {
    saved = snapshot();
    expect(runCli().status).toBe(0);
  });

  it("when one event was changed by hand, then it exits non-zero and names that event's seq and object", () => {
    const target = at(
      t.db
        .select()
        .from(events)
        .where(eq(events.objectId, at(objectIds, 1)))
        .orderBy(asc(events.seq))
        .all(),
      1,
    );
    sqlite().exec("DROP TRIGGER IF EXISTS events_no_update");
    sqlite().prepare("UPDATE events SET summary = ? WHERE seq = ?").run("Catalogue changed: nothing to see.", target.seq);
    const r = runCli();
    restore();
    expect(r.status).toBe(1);
    expect(r.stderr).toContain(`History broken at event ${target.seq}`);
    expect(r.stderr).toContain(`object ${objectIds[1]}`);
    // The three events before it (the first object's two and this object's first) check out.
    expect(r.stderr).toContain("3 events before it check out");
    expect(r.stdout).not.toContain("History intact");
  });

  it("when an event is changed and every hash recomputed as plain SHA-256, then it is caught", () => {
    sqlite().exec("DROP TRIGGER IF EXISTS events_no_update");
    const rows = sqlite().prepare("select * from events where object_id = ? order by seq").all(objectIds[1]) as Record<string, unknown>[];
    let prev: string | null = null;
    for (const r of rows) {
      const content = {
        objectId: r.object_id,
        type: r.type,
        at: r.at,
        actorId: r.actor_id,
        actorName: r.actor_name,
        summary: r.seq === at(rows, 1).seq ? "Nothing happened." : r.summary,
        data: JSON.parse(String(r.data)),
        prevHash: prev,
        occurredOn: r.occurred_on ?? undefined,
      };
      const hash = plainEventHash(content as never);
      sqlite().prepare("update events set summary = ?, prev_hash = ?, hash = ? where seq = ?").run(content.summary, prev, hash, r.seq);
      prev = hash;
    }
    sqlite().prepare("update objects set history_head = ? where id = ?").run(prev, objectIds[1]);
    const r = runCli();
    restore();
    expect(r.status).toBe(1);
    expect(r.stderr).toMatch(/History broken at event \d+ \(object /);
  });

  it("when the last events are deleted and the head moved back, then the checkpoints catch it", () => {
    sqlite().exec("DROP TRIGGER IF EXISTS events_no_delete");
    const rows = sqlite().prepare("select seq, hash from events where object_id = ? order by seq").all(objectIds[0]) as { seq: number; hash: string }[];
    sqlite().prepare("delete from events where seq = ?").run(at(rows, -1).seq);
    sqlite().prepare("update objects set history_head = ? where id = ?").run(at(rows, -2).hash, objectIds[0]);
    const r = runCli();
    restore();
    expect(r.status).toBe(1);
    expect(r.stderr).toContain("History checkpoints disagree");
    expect(r.stderr).toContain(`object ${objectIds[0]}`);
  });

  it("when an object's whole history is wiped, then the checkpoints catch it", () => {
    sqlite().exec("DROP TRIGGER IF EXISTS events_no_delete");
    sqlite().prepare("delete from events where object_id = ?").run(objectIds[1]);
    sqlite().prepare("update objects set history_head = null where id = ?").run(objectIds[1]);
    const r = runCli();
    restore();
    expect(r.status).toBe(1);
    expect(r.stderr).toContain("History checkpoints disagree");
    expect(r.stderr).toContain(`object ${objectIds[1]}`);
  });

  it("when a checkpoint line is forged, then its signature gives it away", () => {
    const before = fs.readFileSync(t.checkpointsFile, "utf8");
    const forged = JSON.stringify({ objectId: objectIds[0], seq: 1, head: "0".repeat(64), at: new Date().toISOString(), mac: "f".repeat(64) });
    fs.appendFileSync(t.checkpointsFile, `${forged}\n`);
    const r = runCli();
    fs.writeFileSync(t.checkpointsFile, before);
    expect(r.status).toBe(1);
    expect(r.stderr).toContain("signature does not match");
  });

  it("when everything is put back, then it checks out again (the cases above are each what failed)", () => {
    expect(runCli().status).toBe(0);
  });
});

it("when DATABASE_URL names a file that does not exist, then it refuses instead of checking an empty new database", () => {
  const missing = path.join(path.dirname(file), "no-such-studio.db");
  const r = runCli(missing);
  expect(r.status).toBe(2);
  expect(r.stderr).toContain("There is no database at");
  expect(fs.existsSync(missing)).toBe(false);
});
