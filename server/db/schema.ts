// The database's tables, one file per part of the record (server/db/schema/); drizzle.config.ts reads this file.
export * from "./schema/auth.ts";
export * from "./schema/catalogue.ts";
export * from "./schema/mountings.ts";
export * from "./schema/history.ts";
export * from "./schema/condition.ts";
export * from "./schema/documents.ts";
