import { sql } from "drizzle-orm";
import { integer, text } from "drizzle-orm/sqlite-core";

export const timestamps = {
  createdAt: integer("created_at", { mode: "timestamp_ms" }).notNull().default(sql`(cast(unixepoch('subsecond') * 1000 as integer))`),
  updatedAt: integer("updated_at", { mode: "timestamp_ms" }).notNull().default(sql`(cast(unixepoch('subsecond') * 1000 as integer))`),
};

/**
 * The columns every revision of a revisioned record has (mounting records, condition reports): its number,
 * the whole entry as JSON, the reason for a correction, who wrote it and when. The parent column is the
 * table's own (mounting_id, report_id).
 */
export const revisionColumns = <D>() => ({
  id: text("id").primaryKey(),
  revision: integer("revision").notNull(),
  data: text("data", { mode: "json" }).$type<D>().notNull(),
  correctionReason: text("correction_reason"),
  createdBy: text("created_by"),
  createdByName: text("created_by_name"),
  ...timestamps,
});
