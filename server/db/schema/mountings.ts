import { index, integer, sqliteTable, text, uniqueIndex } from "drizzle-orm/sqlite-core";
import { revisionColumns, timestamps } from "./columns.ts";
import type { MountPlanInput } from "../../../shared/schemas/mount-plan.ts";
import type { MountingData } from "../../../shared/schemas/mountings.ts";
import { objectRef } from "./catalogue.ts";

// ── Mount plans: the saved input of the planner; the plan itself is always recomputed from it ──
export const mountPlans = sqliteTable(
  "mount_plans",
  {
    id: text("id").primaryKey(),
    objectId: objectRef(),
    status: text("status", { enum: ["draft"] })
      .notNull()
      .default("draft"),
    schemaVersion: integer("schema_version").notNull(),
    input: text("input", { mode: "json" }).$type<MountPlanInput>().notNull(),
    version: integer("version").notNull().default(1),
    createdBy: text("created_by"),
    updatedBy: text("updated_by"),
    ...timestamps,
  },
  (t) => [index("mount_plans_object_idx").on(t.objectId, t.status)],
);

// ── Mounting records: one per mounting or framing of an object; revisions keep every correction ──
export const mountings = sqliteTable(
  "mountings",
  {
    id: text("id").primaryKey(),
    objectId: objectRef(),
    status: text("status", { enum: ["draft", "completed", "superseded", "removed"] })
      .notNull()
      .default("draft"),
    reason: text("reason").notNull(),
    mountedOn: text("mounted_on").notNull(),
    framerId: text("framer_id"),
    framerName: text("framer_name").notNull(),
    currentRevision: integer("current_revision").notNull().default(1),
    // Columns copied from the current revision for the mountings register's filters.
    method: text("method"),
    boardGrade: text("board_grade"),
    glazing: text("glazing"),
    supersededById: text("superseded_by_id"),
    completedAt: integer("completed_at", { mode: "timestamp_ms" }),
    completedBy: text("completed_by"),
    endedOn: text("ended_on"),
    endReason: text("end_reason"),
    version: integer("version").notNull().default(1),
    createdBy: text("created_by"),
    ...timestamps,
  },
  (t) => [
    index("mountings_object_idx").on(t.objectId, t.mountedOn),
    index("mountings_date_idx").on(t.mountedOn, t.id),
    index("mountings_framer_idx").on(t.framerId, t.mountedOn),
    index("mountings_method_idx").on(t.method, t.mountedOn),
    index("mountings_status_idx").on(t.status, t.mountedOn),
  ],
);

export const mountingRevisions = sqliteTable(
  "mounting_revisions",
  {
    mountingId: text("mounting_id")
      .notNull()
      .references(() => mountings.id, { onDelete: "restrict" }),
    /** Its data: the whole record as entered: plan input, boards, attachment, hinges, glazing, frame, undo notes. */
    ...revisionColumns<MountingData>(),
  },
  (t) => [uniqueIndex("mounting_revisions_uq").on(t.mountingId, t.revision)],
);

/** Maker's batch numbers of the boards of each mounting revision, to answer "which objects used batch X?". */
export const mountingBatches = sqliteTable(
  "mounting_batches",
  {
    mountingId: text("mounting_id")
      .notNull()
      .references(() => mountings.id, { onDelete: "restrict" }),
    revision: integer("revision").notNull(),
    role: text("role").notNull(),
    batch: text("batch").notNull(),
  },
  (t) => [index("mounting_batches_batch_idx").on(t.batch), index("mounting_batches_mounting_idx").on(t.mountingId, t.revision)],
);
