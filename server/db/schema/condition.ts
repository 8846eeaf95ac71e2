import { index, integer, sqliteTable, text, uniqueIndex } from "drizzle-orm/sqlite-core";
import { revisionColumns, timestamps } from "./columns.ts";
import type { ConditionData } from "../../../shared/schemas/condition.ts";
import { objectRef } from "./catalogue.ts";
import { mountings } from "./mountings.ts";

// ── Condition reports: draft → signed; corrections are revisions, like mounting records ──
export const conditionReports = sqliteTable(
  "condition_reports",
  {
    id: text("id").primaryKey(),
    objectId: objectRef(),
    status: text("status", { enum: ["draft", "signed"] })
      .notNull()
      .default("draft"),
    context: text("context").notNull(),
    reportDate: text("report_date").notNull(),
    examinerId: text("examiner_id"),
    examinerName: text("examiner_name").notNull(),
    mountingId: text("mounting_id").references(() => mountings.id, { onDelete: "restrict" }),
    // Copied from the current revision for the condition register's filters.
    rating: text("rating").notNull(),
    unresolvedCount: integer("unresolved_count").notNull().default(0),
    currentRevision: integer("current_revision").notNull().default(1),
    signedAt: integer("signed_at", { mode: "timestamp_ms" }),
    signedBy: text("signed_by"),
    version: integer("version").notNull().default(1),
    createdBy: text("created_by"),
    ...timestamps,
  },
  (t) => [
    index("condition_object_idx").on(t.objectId, t.reportDate),
    index("condition_date_idx").on(t.reportDate, t.id),
    index("condition_rating_idx").on(t.rating, t.reportDate),
    index("condition_context_idx").on(t.context, t.reportDate),
    index("condition_examiner_idx").on(t.examinerId, t.reportDate),
  ],
);

export const conditionRevisions = sqliteTable(
  "condition_revisions",
  {
    reportId: text("report_id")
      .notNull()
      .references(() => conditionReports.id, { onDelete: "restrict" }),
    /** Its data: summary, findings (with stable ids across revisions), recommendations, light notes, signatures. */
    ...revisionColumns<ConditionData>(),
  },
  (t) => [uniqueIndex("condition_revisions_uq").on(t.reportId, t.revision)],
);

// ── Photos: files live under uploads/ by content address; only ids and keys here ──
export const photos = sqliteTable(
  "photos",
  {
    id: text("id").primaryKey(),
    objectId: objectRef(),
    reportId: text("report_id").references(() => conditionReports.id, { onDelete: "restrict" }),
    kind: text("kind").notNull(),
    caption: text("caption"),
    takenAt: text("taken_at"),
    mime: text("mime").notNull(),
    width: integer("width").notNull(),
    height: integer("height").notNull(),
    bytes: integer("bytes").notNull(),
    /** SHA-256 of the file exactly as sent; the original is kept untouched under this name. */
    sha256: text("sha256").notNull(),
    originalKey: text("original_key").notNull(),
    fullKey: text("full_key").notNull(),
    webKey: text("web_key").notNull(),
    thumbKey: text("thumb_key").notNull(),
    uploadedBy: text("uploaded_by"),
    ...timestamps,
  },
  (t) => [index("photos_object_idx").on(t.objectId, t.createdAt), index("photos_report_idx").on(t.reportId)],
);

/** The controlled vocabulary of condition findings, one list for paper and one for photographs. */
export const conditionTerms = sqliteTable(
  "condition_terms",
  {
    id: text("id").primaryKey(),
    list: text("list", { enum: ["paper", "photograph"] }).notNull(),
    term: text("term").notNull(),
    /** Handling caution to show when this term is found (mould, insects). */
    caution: text("caution"),
    sortOrder: integer("sort_order").notNull().default(0),
    active: integer("active", { mode: "boolean" }).notNull().default(true),
  },
  (t) => [uniqueIndex("condition_terms_uq").on(t.list, t.term)],
);
