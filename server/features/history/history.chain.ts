import { createHash } from "node:crypto";
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
type HashedContent = { objectId: string; type: string; at: number; actorId: string | null; actorName: string; summary: string; data: unknown; prevHash: string | null; occurredOn?: string };

/** SHA-256 over the event's content and the previous event's hash. */
export function eventHash(e: HashedContent): string {
  return createHash("sha256").update(canonicalJson(e)).digest("hex");
}

export type Actor = { id: string | null; name: string };

/**
 * Appends an event to an object's history, chained to the object's previous event.
 * Call it inside the transaction that makes the change, so the change and its record land together.
 */
export function appendEvent(db: Db, e: { objectId: string; type: EventType; actor: Actor; summary: string; data?: Record<string, unknown>; at?: Date; occurredOn?: string }): HistoryEvent {
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
  const hash = eventHash(content);
  const row = db
    .insert(events)
    .values({ ...content, at: new Date(content.at), data: content.data as Record<string, unknown>, hash })
    .returning({ seq: events.seq })
    .get();
  db.update(objects).set({ historyHead: hash }).where(eq(objects.id, e.objectId)).run();
  return { seq: row.seq, objectId: e.objectId, type: e.type, at: new Date(content.at).toISOString(), occurredOn: content.occurredOn!, actorName: e.actor.name, summary: e.summary, data: content.data as Record<string, unknown>, hash };
}

type EventRow = typeof events.$inferSelect;
const toEvent = (r: EventRow): HistoryEvent => ({
  seq: r.seq,
  objectId: r.objectId,
  type: r.type as EventType,
  at: r.at.toISOString(),
  occurredOn: r.occurredOn ?? r.at.toISOString().slice(0, 10),
  actorName: r.actorName,
  summary: r.summary,
  data: r.data as Record<string, unknown>,
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
  const last = items[items.length - 1];
  return { items, nextBefore: more ? `${last.occurredOn}:${last.seq}` : null };
}

/**
 * Recomputes every chain (or one object's) and names the first broken link: an event whose
 * content no longer matches its hash, or whose previous-hash does not match the event before it.
 */
export function verifyChains(db: Db, objectId?: string): ChainVerdict {
  const BATCH = 5000;
  const last = new Map<string, string>();
  let checked = 0;
  let after = 0;
  for (;;) {
    const where = objectId ? and(eq(events.objectId, objectId), gt(events.seq, after)) : gt(events.seq, after);
    const rows = db.select().from(events).where(where).orderBy(asc(events.seq)).limit(BATCH).all();
    if (rows.length === 0) break;
    for (const r of rows) {
      const expectedPrev = last.get(r.objectId) ?? null;
      if (r.prevHash !== expectedPrev) {
        return { ok: false, checked, brokenAt: { seq: r.seq, objectId: r.objectId, reason: expectedPrev === null ? "it claims an earlier event that is not there" : "its link to the event before it does not match (an event was removed, added or reordered)" } };
      }
      const recomputed = eventHash({ objectId: r.objectId, type: r.type, at: r.at.getTime(), actorId: r.actorId, actorName: r.actorName, summary: r.summary, data: r.data, prevHash: r.prevHash, occurredOn: r.occurredOn ?? undefined });
      if (recomputed !== r.hash) return { ok: false, checked, brokenAt: { seq: r.seq, objectId: r.objectId, reason: "its content no longer matches its hash (it was changed after it was written)" } };
      last.set(r.objectId, r.hash);
      checked++;
    }
    after = rows[rows.length - 1].seq;
  }
  // Each object's newest event must be the one its head records: events cut from the end show here.
  const heads = objectId
    ? db.select({ id: objects.id, head: objects.historyHead }).from(objects).where(eq(objects.id, objectId)).all()
    : db.select({ id: objects.id, head: objects.historyHead }).from(objects).all();
  for (const h of heads) {
    if ((last.get(h.id) ?? null) !== (h.head ?? null)) {
      const lastSeq = db.select({ seq: events.seq }).from(events).where(eq(events.objectId, h.id)).orderBy(desc(events.seq)).limit(1).get()?.seq ?? 0;
      return { ok: false, checked, brokenAt: { seq: lastSeq, objectId: h.id, reason: "the object's history ends before its recorded newest event (events were removed from the end)" } };
    }
  }
  return { ok: true, checked };
}

export function eventCount(db: Db, objectId: string): number {
  return db.select({ n: sql<number>`count(*)` }).from(events).where(eq(events.objectId, objectId)).get()?.n ?? 0;
}
