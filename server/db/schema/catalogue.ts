import { sql } from "drizzle-orm";
import { index, integer, real, sqliteTable, text, uniqueIndex } from "drizzle-orm/sqlite-core";
import { timestamps } from "./columns.ts";

// ── Clients: private owners and institutions ─────────────────────────────
export const clients = sqliteTable(
  "clients",
  {
    id: text("id").primaryKey(),
    kind: text("kind", { enum: ["private", "institution"] }).notNull(),
    name: text("name").notNull(),
    contactName: text("contact_name"),
    email: text("email"),
    phone: text("phone"),
    address: text("address"),
    notes: text("notes"),
    ...timestamps,
  },
  (t) => [index("clients_name_idx").on(t.name)],
);

// ── Objects: the catalogue record (docs/trade.md §4). Lengths in mm. ─────────────
export const objects = sqliteTable(
  "objects",
  {
    id: text("id").primaryKey(),
    objectNumber: text("object_number").notNull(),
    title: text("title").notNull(),
    maker: text("maker"),
    dateMade: text("date_made"),
    objectType: text("object_type").notNull(),
    medium: text("medium"),
    support: text("support"),
    photoProcess: text("photo_process"),
    edition: text("edition"),
    inscriptions: text("inscriptions"),
    sheetWidthMm: real("sheet_width_mm").notNull(),
    sheetHeightMm: real("sheet_height_mm").notNull(),
    borderLeftMm: real("border_left_mm"),
    borderTopMm: real("border_top_mm"),
    borderRightMm: real("border_right_mm"),
    borderBottomMm: real("border_bottom_mm"),
    thicknessNotes: text("thickness_notes"),
    sensitivities: text("sensitivities", { mode: "json" }).$type<string[]>().notNull().default(sql`'[]'`),
    clientId: text("client_id")
      .notNull()
      .references(() => clients.id, { onDelete: "restrict" }),
    status: text("status").notNull(),
    location: text("location"),
    valuationMinor: integer("valuation_minor"),
    valuationCurrency: text("valuation_currency"),
    valuationDate: text("valuation_date"),
    valuationBasis: text("valuation_basis"),
    valuer: text("valuer"),
    version: integer("version").notNull().default(1),
    createdBy: text("created_by"),
    // The current mounting, kept in step by the mountings service for the register's columns and filters.
    currentMountingId: text("current_mounting_id"),
    currentMethod: text("current_method"),
    currentBoardGrade: text("current_board_grade"),
    currentGlazing: text("current_glazing"),
    lastMountedOn: text("last_mounted_on"),
    lastConditionOn: text("last_condition_on"),
    checkDueOn: text("check_due_on"),
    /** Hash of the object's newest history event, so a history cut short at its end is caught too. */
    historyHead: text("history_head"),
    ...timestamps,
  },
  (t) => [
    index("objects_method_idx").on(t.currentMethod, t.objectNumber),
    index("objects_board_idx").on(t.currentBoardGrade, t.objectNumber),
    index("objects_glazing_idx").on(t.currentGlazing, t.objectNumber),
    index("objects_last_mounted_idx").on(t.lastMountedOn, t.id),
    index("objects_check_due_idx").on(t.checkDueOn, t.id),
    uniqueIndex("objects_number_uq").on(t.objectNumber),
    index("objects_client_idx").on(t.clientId, t.objectNumber),
    index("objects_status_idx").on(t.status, t.objectNumber),
    index("objects_type_idx").on(t.objectType, t.objectNumber),
    index("objects_status_type_idx").on(t.status, t.objectType, t.objectNumber),
    // Sorts carry the id as tie-breaker (stable pages), so the sort indexes do too.
    index("objects_title_idx").on(t.title, t.id),
    index("objects_maker_idx").on(t.maker, t.id),
    index("objects_updated_idx").on(t.updatedAt, t.id),
    index("objects_status_sort_idx").on(t.status, t.id),
  ],
);

/** The object a row belongs to: required, and the object cannot be deleted while rows point at it. */
export const objectRef = () =>
  text("object_id")
    .notNull()
    .references(() => objects.id, { onDelete: "restrict" });

// ── Studio settings: one row ─────────────────────────────────────────────
export const studioSettings = sqliteTable("studio_settings", {
  id: integer("id").primaryKey(),
  studioName: text("studio_name").notNull(),
  studioAddress: text("studio_address"),
  /** Telephone and e-mail as the studio wants them printed on documents and back labels. */
  studioContact: text("studio_contact"),
  unit: text("unit", { enum: ["mm", "in"] })
    .notNull()
    .default("mm"),
  vocabulary: text("vocabulary", { enum: ["mount", "mat"] })
    .notNull()
    .default("mount"),
  paperSize: text("paper_size", { enum: ["A4", "Letter"] })
    .notNull()
    .default("A4"),
  currency: text("currency").notNull().default("GBP"),
  minOverlapMm: real("min_overlap_mm").notNull().default(5),
  rebateClearanceMm: real("rebate_clearance_mm").notNull().default(2),
  /** The studio's own ready-made frame sizes, in mm. */
  /** Condition checks fall due this many months after the last one; sooner for objects on loan. */
  checkIntervalMonths: integer("check_interval_months").notNull().default(24),
  checkIntervalOnLoanMonths: integer("check_interval_on_loan_months").notNull().default(12),
  framePresets: text("frame_presets", { mode: "json" }).$type<{ label: string; widthMm: number; heightMm: number }[]>().notNull().default(sql`'[]'`),
  /** Storage key (server/lib/storage.ts) of the studio's logo PNG, shown on every document; null for none. */
  logoKey: text("logo_key"),
  ...timestamps,
});
