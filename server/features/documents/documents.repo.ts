import { and, desc, eq } from "drizzle-orm";
import { randomUUID } from "node:crypto";
import type { Db } from "../../db/client.ts";
import { issuedDocuments, objects } from "../../db/schema.ts";
import type { DocumentKind, IssuedDocument } from "../../../shared/schemas/documents.ts";

export type IssuedInsert = Omit<typeof issuedDocuments.$inferInsert, "id">;

export function insertIssuedDocument(db: Db, row: IssuedInsert): void {
  db.insert(issuedDocuments)
    .values({ id: randomUUID(), ...row })
    .run();
}

/** An issued document by its (normalised) code, with its object's number. */
export function findIssuedByCode(db: Db, code: string) {
  return (
    db
      .select({
        code: issuedDocuments.code,
        kind: issuedDocuments.kind,
        issuedAt: issuedDocuments.issuedAt,
        objectNumber: objects.objectNumber,
        sha256: issuedDocuments.sha256,
        pages: issuedDocuments.pages,
      })
      .from(issuedDocuments)
      .leftJoin(objects, eq(objects.id, issuedDocuments.objectId))
      .where(eq(issuedDocuments.code, code))
      .get() ?? null
  );
}

/** The latest 500 issued documents, of one object or client or of all. */
export function listIssued(db: Db, filter: { objectId?: string; clientId?: string } = {}): IssuedDocument[] {
  const where = [];
  if (filter.objectId) where.push(eq(issuedDocuments.objectId, filter.objectId));
  if (filter.clientId) where.push(eq(issuedDocuments.clientId, filter.clientId));
  return db
    .select()
    .from(issuedDocuments)
    .where(where.length ? and(...where) : undefined)
    .orderBy(desc(issuedDocuments.issuedAt))
    .limit(500)
    .all()
    .map((r) => ({
      id: r.id,
      code: r.code,
      kind: r.kind as DocumentKind,
      title: r.title,
      objectId: r.objectId,
      clientId: r.clientId,
      paperSize: r.paperSize,
      issuedAt: r.issuedAt.toISOString(),
      issuedByName: r.issuedByName,
    }));
}
