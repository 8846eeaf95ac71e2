import { beforeAll, describe, expect, it } from "vitest";
import { agentFor, createTestApp, makeClient, makePerson, type Agent } from "../setup/test-app.ts";
import { keyPlainChains, plainEventHash, verifyChains } from "../../server/features/history/history.chain.ts";

// An older database kept plain SHA-256 chains; the server keys them once at start (server/index.ts).
const t = createTestApp();
let admin: Agent;
beforeAll(async () => {
  admin = await agentFor(t, await makePerson(t, "admin"));
  const clientId = makeClient(t.db, { kind: "private", name: "Ada Collector" }).id;
  for (const objectNumber of ["K-1", "K-2"]) {
    const res = await admin.post("/api/objects").send({ objectNumber, title: "Study", objectType: "print", sheetWidthMm: 210, sheetHeightMm: 297, clientId, status: "in-studio" });
    expect(res.status).toBe(201);
  }
});

/** Rewrites every chain as the older plain SHA-256 one, as a database from before the key would hold it. */
function makePlain(breakOne = false) {
  const s = t.database.sqlite;
  const guard = s.prepare("select sql from sqlite_master where type = 'trigger' and name = 'events_no_update'").get() as { sql: string } | undefined;
  s.exec("DROP TRIGGER IF EXISTS events_no_update");
  const rows = s.prepare("select * from events order by seq").all() as Record<string, unknown>[];
  const last = new Map<string, string>();
  for (const r of rows) {
    const prevHash = last.get(String(r.object_id)) ?? null;
    const hash = plainEventHash({
      objectId: String(r.object_id),
      type: String(r.type),
      at: Number(r.at),
      actorId: (r.actor_id as string) ?? null,
      actorName: String(r.actor_name),
      summary: String(r.summary),
      data: JSON.parse(String(r.data)),
      prevHash,
      occurredOn: (r.occurred_on as string) ?? undefined,
    });
    s.prepare("update events set prev_hash = ?, hash = ? where seq = ?").run(prevHash, hash, r.seq);
    last.set(String(r.object_id), hash);
  }
  for (const [id, head] of last) s.prepare("update objects set history_head = ? where id = ?").run(head, id);
  if (breakOne) s.prepare("update events set summary = 'altered' where seq = (select min(seq) from events)").run();
  if (guard) s.exec(guard.sql);
}

describe("keying an older database's history", () => {
  it("when the plain chains check out, then they are keyed in place and verify with the key", () => {
    makePlain();
    expect(verifyChains(t.db).ok).toBe(false);
    const n = keyPlainChains(t.db, t.historyKey);
    expect(n).toBe((t.database.sqlite.prepare("select count(*) as n from events").get() as { n: number }).n);
    expect(verifyChains(t.db)).toMatchObject({ ok: true });
    // Keyed already: a second start does nothing.
    expect(keyPlainChains(t.db, t.historyKey)).toBe(0);
    // The append-only guard is back.
    expect(() => t.database.sqlite.prepare("update events set summary = 'x'").run()).toThrow();
  });

  it("when a plain chain is already broken, then keying refuses rather than bless it", () => {
    makePlain(true);
    expect(() => keyPlainChains(t.db, t.historyKey)).toThrow(/does not check out/);
  });
});
