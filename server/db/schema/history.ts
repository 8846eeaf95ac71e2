import { index, integer, sqliteTable, text } from "drizzle-orm/sqlite-core";
import { timestamps } from "./columns.ts";
import { objectRef } from "./catalogue.ts";

// ── History: an append-only, hash-chained event log per object ────────────
export const events = sqliteTable(
  "events",
  {
    seq: integer("seq").primaryKey({ autoIncrement: true }),
    objectId: objectRef(),
    type: text("type").notNull(),
    at: integer("at", { mode: "timestamp_ms" }).notNull(),
    actorId: text("actor_id"),
    actorName: text("actor_name").notNull(),
    summary: text("summary").notNull(),
    data: text("data", { mode: "json" }).$type<Record<string, unknown>>().notNull(),
    prevHash: text("prev_hash"),
    hash: text("hash").notNull(),
    /** The day the thing happened (mounted on, received on, valued on), as an ISO date; `at` is when it was entered. Null on events entered before this column. */
    occurredOn: text("occurred_on"),
  },
  (t) => [
    index("events_object_idx").on(t.objectId, t.seq),
    index("events_type_idx").on(t.objectId, t.type, t.seq),
    index("events_occurred_idx").on(t.objectId, t.occurredOn, t.seq),
  ],
);

// ── Custody: receipts when an object comes in or goes out ─────────────────
export const custodyReceipts = sqliteTable(
  "custody_receipts",
  {
    id: text("id").primaryKey(),
    objectId: objectRef(),
    direction: text("direction", { enum: ["in", "out"] }).notNull(),
    kind: text("kind").notNull(),
    date: text("date").notNull(),
    fromParty: text("from_party").notNull(),
    toParty: text("to_party").notNull(),
    condition: text("condition").notNull(),
    signedBy: text("signed_by").notNull(),
    /** Where the object went or was put on this hand-over. */
    location: text("location"),
    notes: text("notes"),
    /** For a loan: the day the object is agreed to come back. */
    returnDue: text("return_due"),
    createdBy: text("created_by"),
    ...timestamps,
  },
  (t) => [index("custody_object_idx").on(t.objectId, t.date), index("custody_date_idx").on(t.date, t.id)],
);
