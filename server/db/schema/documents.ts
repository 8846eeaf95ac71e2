import { index, integer, real, sqliteTable, text } from "drizzle-orm/sqlite-core";
import { clients, objects } from "./catalogue.ts";

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
