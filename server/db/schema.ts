import { sql } from "drizzle-orm";
import { index, integer, real, sqliteTable, text, uniqueIndex } from "drizzle-orm/sqlite-core";

const timestamps = {
  createdAt: integer("created_at", { mode: "timestamp_ms" })
    .notNull()
    .default(sql`(cast(unixepoch('subsecond') * 1000 as integer))`),
  updatedAt: integer("updated_at", { mode: "timestamp_ms" })
    .notNull()
    .default(sql`(cast(unixepoch('subsecond') * 1000 as integer))`),
};

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

// ── better-auth's four tables (user carries Reversa's role and client) ────
export const user = sqliteTable("user", {
  id: text("id").primaryKey(),
  name: text("name").notNull(),
  email: text("email").notNull().unique(),
  emailVerified: integer("email_verified", { mode: "boolean" }).notNull().default(false),
  image: text("image"),
  role: text("role", { enum: ["admin", "framer", "registrar", "collector"] }).notNull().default("framer"),
  clientId: text("client_id").references(() => clients.id, { onDelete: "restrict" }),
  ...timestamps,
});

export const session = sqliteTable(
  "session",
  {
    id: text("id").primaryKey(),
    expiresAt: integer("expires_at", { mode: "timestamp_ms" }).notNull(),
    token: text("token").notNull().unique(),
    ipAddress: text("ip_address"),
    userAgent: text("user_agent"),
    userId: text("user_id")
      .notNull()
      .references(() => user.id, { onDelete: "cascade" }),
    ...timestamps,
  },
  (t) => [index("session_user_idx").on(t.userId)],
);

export const account = sqliteTable(
  "account",
  {
    id: text("id").primaryKey(),
    accountId: text("account_id").notNull(),
    providerId: text("provider_id").notNull(),
    userId: text("user_id")
      .notNull()
      .references(() => user.id, { onDelete: "cascade" }),
    accessToken: text("access_token"),
    refreshToken: text("refresh_token"),
    idToken: text("id_token"),
    accessTokenExpiresAt: integer("access_token_expires_at", { mode: "timestamp_ms" }),
    refreshTokenExpiresAt: integer("refresh_token_expires_at", { mode: "timestamp_ms" }),
    scope: text("scope"),
    password: text("password"),
    ...timestamps,
  },
  (t) => [index("account_user_idx").on(t.userId)],
);

export const verification = sqliteTable("verification", {
  id: text("id").primaryKey(),
  identifier: text("identifier").notNull(),
  value: text("value").notNull(),
  expiresAt: integer("expires_at", { mode: "timestamp_ms" }).notNull(),
  ...timestamps,
});

// ── Objects: the catalogue record (docs/trade-reference.md §4). Lengths in mm. ─────────────
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

// ── Studio settings: one row ─────────────────────────────────────────────
export const studioSettings = sqliteTable("studio_settings", {
  id: integer("id").primaryKey(),
  studioName: text("studio_name").notNull(),
  studioAddress: text("studio_address"),
  /** Telephone and e-mail as the studio wants them printed on documents and back labels. */
  studioContact: text("studio_contact"),
  unit: text("unit", { enum: ["mm", "in"] }).notNull().default("mm"),
  vocabulary: text("vocabulary", { enum: ["mount", "mat"] }).notNull().default("mount"),
  paperSize: text("paper_size", { enum: ["A4", "Letter"] }).notNull().default("A4"),
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

// ── Mount plans: the saved input of the planner; the plan itself is always recomputed from it ──
export const mountPlans = sqliteTable(
  "mount_plans",
  {
    id: text("id").primaryKey(),
    objectId: text("object_id")
      .notNull()
      .references(() => objects.id, { onDelete: "restrict" }),
    status: text("status", { enum: ["draft"] }).notNull().default("draft"),
    schemaVersion: integer("schema_version").notNull(),
    input: text("input", { mode: "json" }).notNull(),
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
    objectId: text("object_id")
      .notNull()
      .references(() => objects.id, { onDelete: "restrict" }),
    status: text("status", { enum: ["draft", "completed", "superseded", "removed"] }).notNull().default("draft"),
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
    id: text("id").primaryKey(),
    mountingId: text("mounting_id")
      .notNull()
      .references(() => mountings.id, { onDelete: "restrict" }),
    revision: integer("revision").notNull(),
    /** The whole record as entered: plan input, boards, attachment, hinges, glazing, frame, undo notes. */
    data: text("data", { mode: "json" }).notNull(),
    correctionReason: text("correction_reason"),
    createdBy: text("created_by"),
    createdByName: text("created_by_name"),
    ...timestamps,
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

// ── History: an append-only, hash-chained event log per object ────────────
export const events = sqliteTable(
  "events",
  {
    seq: integer("seq").primaryKey({ autoIncrement: true }),
    objectId: text("object_id")
      .notNull()
      .references(() => objects.id, { onDelete: "restrict" }),
    type: text("type").notNull(),
    at: integer("at", { mode: "timestamp_ms" }).notNull(),
    actorId: text("actor_id"),
    actorName: text("actor_name").notNull(),
    summary: text("summary").notNull(),
    data: text("data", { mode: "json" }).notNull(),
    prevHash: text("prev_hash"),
    hash: text("hash").notNull(),
    /** The day the thing happened (mounted on, received on, valued on), as an ISO date; `at` is when it was entered. Null on events entered before this column. */
    occurredOn: text("occurred_on"),
  },
  (t) => [index("events_object_idx").on(t.objectId, t.seq), index("events_type_idx").on(t.objectId, t.type, t.seq), index("events_occurred_idx").on(t.objectId, t.occurredOn, t.seq)],
);

// ── Custody: receipts when an object comes in or goes out ─────────────────
export const custodyReceipts = sqliteTable(
  "custody_receipts",
  {
    id: text("id").primaryKey(),
    objectId: text("object_id")
      .notNull()
      .references(() => objects.id, { onDelete: "restrict" }),
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

// ── Condition reports: draft → signed; corrections are revisions, like mounting records ──
export const conditionReports = sqliteTable(
  "condition_reports",
  {
    id: text("id").primaryKey(),
    objectId: text("object_id")
      .notNull()
      .references(() => objects.id, { onDelete: "restrict" }),
    status: text("status", { enum: ["draft", "signed"] }).notNull().default("draft"),
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
    id: text("id").primaryKey(),
    reportId: text("report_id")
      .notNull()
      .references(() => conditionReports.id, { onDelete: "restrict" }),
    revision: integer("revision").notNull(),
    /** Summary, findings (with stable ids across revisions), recommendations, light notes, signatures. */
    data: text("data", { mode: "json" }).notNull(),
    correctionReason: text("correction_reason"),
    createdBy: text("created_by"),
    createdByName: text("created_by_name"),
    ...timestamps,
  },
  (t) => [uniqueIndex("condition_revisions_uq").on(t.reportId, t.revision)],
);

// ── Photos: files live under uploads/ by content address; only ids and keys here ──
export const photos = sqliteTable(
  "photos",
  {
    id: text("id").primaryKey(),
    objectId: text("object_id")
      .notNull()
      .references(() => objects.id, { onDelete: "restrict" }),
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

// ── Issued documents: every PDF carries a verification code recorded here ──
export const issuedDocuments = sqliteTable(
  "issued_documents",
  {
    id: text("id").primaryKey(),
    code: text("code").notNull().unique(),
    kind: text("kind").notNull(),
    title: text("title").notNull(),
    objectId: text("object_id").references(() => objects.id, { onDelete: "restrict" }),
    clientId: text("client_id").references(() => clients.id, { onDelete: "restrict" }),
    paperSize: text("paper_size").notNull(),
    issuedAt: integer("issued_at", { mode: "timestamp_ms" }).notNull(),
    issuedBy: text("issued_by"),
    issuedByName: text("issued_by_name").notNull(),
    /** The issued file's fingerprint: SHA-256 of its bytes (hex) and its page count; null for documents issued before they were kept. */
    sha256: text("sha256"),
    pages: integer("pages"),
  },
  (t) => [index("issued_object_idx").on(t.objectId, t.issuedAt), index("issued_at_idx").on(t.issuedAt)],
);

// ── Archive jobs: kept in the database so a restart finds them (running ones are then marked failed) ──
export const exportJobs = sqliteTable(
  "export_jobs",
  {
    id: text("id").primaryKey(),
    ownerId: text("owner_id").notNull(),
    clientId: text("client_id").notNull(),
    state: text("state", { enum: ["running", "done", "failed"] }).notNull(),
    progress: real("progress").notNull().default(0),
    message: text("message").notNull(),
    originals: integer("originals", { mode: "boolean" }).notNull().default(false),
    dir: text("dir").notNull(),
    file: text("file").notNull(),
    filename: text("filename").notNull(),
    createdAtMs: integer("created_at_ms").notNull(),
  },
  (t) => [index("export_jobs_client_idx").on(t.clientId, t.state)],
);
