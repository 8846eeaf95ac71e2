import { createHash, createHmac, timingSafeEqual } from "node:crypto";
import fs from "node:fs";
import { and, asc, desc, eq, gt, inArray, sql } from "drizzle-orm";
import type { Db } from "../../db/client.ts";
import { events, objects } from "../../db/schema.ts";
import type { ChainVerdict, EventType, HistoryEvent, HistoryQuery } from "../../../shared/schemas/history.ts";

/** JSON with object keys sorted at every level, so the same content always hashes the same. */
export function canonicalJson(value: unknown): string {
  if (Array.isArray(value)) return `[${value.map(canonicalJson).join(",")}]`;
  if (value && typeof value === "object") {
    const entries = Object.entries(value as Record<string, unknown>)
      .filter(([, v]) => v !== undefined)
      .sort(([a], [b]) => (a < b ? -1 : a > b ? 1 : 0));
    return `{${entries.map(([k, v]) => `${JSON.stringify(k)}:${canonicalJson(v)}`).join(",")}}`;
  }
  return JSON.stringify(value ?? null);
}

/** `occurredOn` joins the hash only when present, so events written before it existed still verify. */
type HashedContent = {
  objectId: string;
  type: string;
  at: number;
  actorId: string | null;
  actorName: string;
  summary: string;
  data: Record<string, unknown>;
  prevHash: string | null;
  occurredOn?: string;
};

/**
 * The event's hash: HMAC-SHA256, keyed with the history key, over its content and the previous event's
 * hash. The key lives outside the database (HISTORY_KEY, or .history-key beside it), so someone who can
 * write the database but not read the key cannot rewrite an event and recompute the chain unseen.
 */
export function eventHash(e: HashedContent, key: Buffer): string {
  return createHmac("sha256", key).update(canonicalJson(e)).digest("hex");
}

/** The chain as it was before it was keyed: plain SHA-256. Read only to upgrade an older database. */
export function plainEventHash(e: HashedContent): string {
  return createHash("sha256").update(canonicalJson(e)).digest("hex");
}

// ── The key and the checkpoints, per open database ─────────────────────────

/** One object's head as it was after a write: appended, signed, to the checkpoints file. */
export type Checkpoint = { objectId: string; seq: number; head: string; at: string; mac: string };
type Keyring = { key: Buffer; checkpointsFile: string | null; pending: Map<string, Omit<Checkpoint, "mac" | "at">>; scheduled: boolean };
const keyrings = new WeakMap<object, Keyring>();
/** The better-sqlite3 connection under a Drizzle database or transaction: the same for both. */
const connectionOf = (db: Db): object => (db as unknown as { session: { client: object } }).session.client;

/**
 * Gives an open database its history key and, for a database on disk, the append-only file its
 * checkpoints go to. Every writer of events (the app, the seed, scripts) calls this first.
 */
export function useHistoryKey(db: Db, key: Buffer, checkpointsFile: string | null) {
  keyrings.set(connectionOf(db), { key, checkpointsFile, pending: new Map(), scheduled: false });
}

function keyringOf(db: Db): Keyring {
  const k = keyrings.get(connectionOf(db));
  if (!k) throw new Error("history: no history key for this database (call useHistoryKey first)");
  return k;
}

export function checkpointMac(c: Omit<Checkpoint, "mac">, key: Buffer): string {
  return createHmac("sha256", key)
    .update(canonicalJson({ objectId: c.objectId, seq: c.seq, head: c.head, at: c.at }))
    .digest("hex");
}

/**
 * Writes the heads changed since the last flush to the checkpoints file. Run as a microtask after the
 * write: better-sqlite3 transactions are synchronous, so by then the transaction has committed or rolled
 * back, and only heads that are really in the database are written.
 */
function flushCheckpoints(db: Db, ring: Keyring) {
  ring.scheduled = false;
  if (!ring.checkpointsFile || ring.pending.size === 0) return;
  const at = new Date().toISOString();
  const lines: string[] = [];
  for (const c of ring.pending.values()) {
    const row = db.select({ hash: events.hash }).from(events).where(eq(events.seq, c.seq)).get();
    if (row?.hash !== c.head) continue; // rolled back
    lines.push(JSON.stringify({ ...c, at, mac: checkpointMac({ ...c, at }, ring.key) }));
  }
  ring.pending.clear();
  if (lines.length) fs.appendFileSync(ring.checkpointsFile, `${lines.join("\n")}\n`, { mode: 0o600 });
}

export type Actor = { id: string | null; name: string };

/**
 * Appends an event to an object's history, chained to the object's previous event.
 * Call it inside the transaction that makes the change, so the change and its record land together.
 */
export function appendEvent(
  db: Db,
  e: { objectId: string; type: EventType; actor: Actor; summary: string; data?: Record<string, unknown>; at?: Date; occurredOn?: string },
): HistoryEvent {
  const prev = db.select({ hash: events.hash }).from(events).where(eq(events.objectId, e.objectId)).orderBy(desc(events.seq)).limit(1).get();
  const content: HashedContent = {
    objectId: e.objectId,
    type: e.type,
    at: (e.at ?? new Date()).getTime(),
    actorId: e.actor.id,
    actorName: e.actor.name,
    summary: e.summary,
    data: e.data ?? {},
    prevHash: prev?.hash ?? null,
    // The day it happened; by default the day it was entered (UTC).
    occurredOn: e.occurredOn ?? new Date(e.at ?? Date.now()).toISOString().slice(0, 10),
  };
  const ring = keyringOf(db);
  const hash = eventHash(content, ring.key);
  const row = db
    .insert(events)
    .values({ ...content, at: new Date(content.at), data: content.data, hash })
    .returning({ seq: events.seq })
    .get();
  db.update(objects).set({ historyHead: hash }).where(eq(objects.id, e.objectId)).run();
  ring.pending.set(e.objectId, { objectId: e.objectId, seq: row.seq, head: hash });
  if (!ring.scheduled) {
    ring.scheduled = true;
    queueMicrotask(() => flushCheckpoints(db, ring));
  }
  return {
    seq: row.seq,
    objectId: e.objectId,
    type: e.type,
    at: new Date(content.at).toISOString(),
    occurredOn: content.occurredOn!,
    actorName: e.actor.name,
    summary: e.summary,
    data: content.data,
    hash,
  };
}

type EventRow = typeof events.$inferSelect;
const contentOf = (r: EventRow): HashedContent => ({
  objectId: r.objectId,
  type: r.type,
  at: r.at.getTime(),
  actorId: r.actorId,
  actorName: r.actorName,
  summary: r.summary,
  data: r.data,
  prevHash: r.prevHash,
  occurredOn: r.occurredOn ?? undefined,
});
const toEvent = (r: EventRow): HistoryEvent => ({
  seq: r.seq,
  objectId: r.objectId,
  type: r.type as EventType,
  at: r.at.toISOString(),
  occurredOn: r.occurredOn ?? r.at.toISOString().slice(0, 10),
  actorName: r.actorName,
  summary: r.summary,
  data: r.data,
  hash: r.hash,
});

/** The day an event happened: its own date, or for events entered before dates were kept, the day it was entered (UTC). */
const OCCURRED = sql<string>`coalesce(${events.occurredOn}, strftime('%Y-%m-%d', ${events.at} / 1000, 'unixepoch'))`;

/**
 * An object's events, newest first by the day they happened, then by when they were entered. The
 * cursor `before` is the last event's "day:seq", so a page follows on from the one before it.
 */
export function listEvents(db: Db, objectId: string, q: HistoryQuery): { items: HistoryEvent[]; nextBefore: string | null } {
  const where = [eq(events.objectId, objectId)];
  if (q.types.length) where.push(inArray(events.type, q.types));
  if (q.before) {
    const [day, seq] = q.before;
    where.push(sql`(${OCCURRED} < ${day} OR (${OCCURRED} = ${day} AND ${events.seq} < ${seq}))`);
  }
  const rows = db
    .select()
    .from(events)
    .where(and(...where))
    .orderBy(desc(OCCURRED), desc(events.seq))
    .limit(q.limit + 1)
    .all();
  const more = rows.length > q.limit;
  const items = rows.slice(0, q.limit).map(toEvent);
  const last = items.at(-1);
  return { items, nextBefore: more && last ? `${last.occurredOn}:${last.seq}` : null };
}

/**
 * Recomputes every chain (or one object's) and names the first broken link: an event whose
 * content no longer matches its hash, or whose previous-hash does not match the event before it.
 */
export function verifyChains(db: Db, objectId?: string, keyOverride?: Buffer): ChainVerdict {
  const key = keyOverride ?? keyringOf(db).key;
  const BATCH = 5000;
  const last = new Map<string, string>();
  let checked = 0;
  let after = 0;
  for (;;) {
    const where = objectId ? and(eq(events.objectId, objectId), gt(events.seq, after)) : gt(events.seq, after);
    const rows = db.select().from(events).where(where).orderBy(asc(events.seq)).limit(BATCH).all();
    const newest = rows.at(-1);
    if (!newest) break;
    for (const r of rows) {
      const expectedPrev = last.get(r.objectId) ?? null;
      if (r.prevHash !== expectedPrev) {
        return {
          ok: false,
          checked,
          brokenAt: {
            seq: r.seq,
            objectId: r.objectId,
            reason:
              expectedPrev === null ? "it claims an earlier event that is not there" : "its link to the event before it does not match (an event was removed, added or reordered)",
          },
        };
      }
      const recomputed = eventHash(contentOf(r), key);
      if (recomputed !== r.hash)
        return { ok: false, checked, brokenAt: { seq: r.seq, objectId: r.objectId, reason: "its content no longer matches its hash (it was changed after it was written)" } };
      last.set(r.objectId, r.hash);
      checked++;
    }
    after = newest.seq;
  }
  // Each object's newest event must be the one its head records: events cut from the end show here.
  const heads = objectId
    ? db.select({ id: objects.id, head: objects.historyHead }).from(objects).where(eq(objects.id, objectId)).all()
    : db.select({ id: objects.id, head: objects.historyHead }).from(objects).all();
  for (const h of heads) {
    if ((last.get(h.id) ?? null) !== (h.head ?? null)) {
      const lastSeq = db.select({ seq: events.seq }).from(events).where(eq(events.objectId, h.id)).orderBy(desc(events.seq)).limit(1).get()?.seq ?? 0;
      return {
        ok: false,
        checked,
        brokenAt: { seq: lastSeq, objectId: h.id, reason: "the object's history ends before its recorded newest event (events were removed from the end)" },
      };
    }
  }
  return { ok: true, checked };
}

export function eventCount(db: Db, objectId: string): number {
  return db.select({ n: sql<number>`count(*)` }).from(events).where(eq(events.objectId, objectId)).get()?.n ?? 0;
}

/**
 * Checks the checkpoints file against the database: every line's signature, and that each object's latest
 * checkpointed head is still in its chain at the same place. Events cut from the end (and the head moved
 * back), or an object's history wiped, leave a checkpoint that no event answers.
 */
export function verifyCheckpoints(db: Db, file: string, key: Buffer): { ok: true; checked: number } | { ok: false; line: number; objectId: string | null; reason: string } {
  if (!fs.existsSync(file)) return { ok: true, checked: 0 };
  const latest = new Map<string, { c: Checkpoint; line: number }>();
  const lines = fs.readFileSync(file, "utf8").split("\n");
  for (const [i, text] of lines.entries()) {
    if (!text.trim()) continue;
    let c: Checkpoint;
    try {
      c = JSON.parse(text) as Checkpoint;
    } catch {
      return { ok: false, line: i + 1, objectId: null, reason: "the checkpoints file has a line that is not a checkpoint (it was edited)" };
    }
    const want = Buffer.from(checkpointMac(c, key), "hex");
    const got = Buffer.from(String(c.mac ?? ""), "hex");
    if (got.length !== want.length || !timingSafeEqual(got, want))
      return { ok: false, line: i + 1, objectId: c.objectId ?? null, reason: "a checkpoint's signature does not match (it was forged or edited)" };
    const prev = latest.get(c.objectId);
    if (!prev || c.seq >= prev.c.seq) latest.set(c.objectId, { c, line: i + 1 });
  }
  for (const { c, line } of latest.values()) {
    const row = db.select({ hash: events.hash, objectId: events.objectId }).from(events).where(eq(events.seq, c.seq)).get();
    if (!row || row.objectId !== c.objectId || row.hash !== c.head) {
      return {
        ok: false,
        line,
        objectId: c.objectId,
        reason: `event ${c.seq}, checkpointed as this object's head, is no longer in its history (events were removed, or the history was wiped or rewritten)`,
      };
    }
  }
  return { ok: true, checked: latest.size };
}

/**
 * Keys an older database's plain SHA-256 chains: checks them as they are, then recomputes every hash with
 * the key, in order, and sets each object's head. Refuses (throws) when the plain chains do not check out,
 * so a damaged history is never blessed with the key. Returns how many events were keyed.
 */
export function keyPlainChains(db: Db, key: Buffer): number {
  const rows = db.select().from(events).orderBy(asc(events.seq)).all();
  const probe = rows.at(-1);
  if (!probe) return 0;
  if (eventHash(contentOf(probe), key) === probe.hash) return 0; // already keyed
  const last = new Map<string, string>();
  for (const r of rows) {
    if (r.prevHash !== (last.get(r.objectId) ?? null) || plainEventHash(contentOf(r)) !== r.hash) {
      throw new Error(`history: event ${r.seq} (object ${r.objectId}) does not check out, and no key matches it; run npm run verify-history and restore a backup before starting`);
    }
    last.set(r.objectId, r.hash);
  }
  const keyed = new Map<string, string>();
  return db.transaction((tx) => {
    // The append-only guard (drizzle/0006) is lifted for this one rewrite, inside the transaction, and put back.
    const guard = tx.get<{ sql: string } | undefined>(sql`select sql from sqlite_master where type = 'trigger' and name = 'events_no_update'`);
    if (guard) tx.run(sql`drop trigger events_no_update`);
    for (const r of rows) {
      const prevHash = keyed.get(r.objectId) ?? null;
      const hash = eventHash({ ...contentOf(r), prevHash }, key);
      tx.update(events).set({ prevHash, hash }).where(eq(events.seq, r.seq)).run();
      keyed.set(r.objectId, hash);
    }
    for (const [objectId, head] of keyed) tx.update(objects).set({ historyHead: head }).where(eq(objects.id, objectId)).run();
    if (guard) tx.run(sql.raw(guard.sql));
    return rows.length;
  });
}

/** Writes a checkpoint of every object's head (after keying, and at any time as a fresh baseline). */
export function checkpointAllHeads(db: Db, file: string, key: Buffer): number {
  const at = new Date().toISOString();
  const heads = db
    .select({ objectId: events.objectId, seq: sql<number>`max(${events.seq})` })
    .from(events)
    .groupBy(events.objectId)
    .all();
  const lines: string[] = [];
  for (const h of heads) {
    const row = db.select({ hash: events.hash }).from(events).where(eq(events.seq, h.seq)).get()!;
    const c = { objectId: h.objectId, seq: h.seq, head: row.hash, at };
    lines.push(JSON.stringify({ ...c, mac: checkpointMac(c, key) }));
  }
  if (lines.length) fs.appendFileSync(file, `${lines.join("\n")}\n`, { mode: 0o600 });
  return lines.length;
}
