import type { ReactElement } from "react";
import { inTransaction } from "../../db/client.ts";
import type { DocumentProps } from "@react-pdf/renderer";
import { renderPdf } from "./render-pool.ts";
import type { DocumentJob } from "./registry.ts";
import { createHash } from "node:crypto";
import { newVerificationCode } from "./verification-code.ts";
import type { Db } from "../../db/client.ts";
import { findIssuedByCode, insertIssuedDocument, listIssued } from "./documents.repo.ts";
import type { SessionUser } from "../../../shared/schemas/auth.ts";
import { DOCUMENT_KIND_LABELS, normaliseCode, type DocumentKind, type IssuedDocument, type Verification } from "../../../shared/schemas/documents.ts";
import type { DocMeta } from "../../lib/pdf/layout.tsx";
import { getLogo, getSettings } from "../settings/settings.repo.ts";
import { appendEvent } from "../history/history.chain.ts";

export type IssueRequest = {
  kind: DocumentKind;
  title: string;
  user: SessionUser;
  objectId?: string | null;
  objectNumber?: string | null;
  clientId?: string | null;
  /** False for documents issued into an archive: the archive writes one event per object naming them all. */
  inHistory?: boolean;
  /** Builds the PDF for the document's header and footer data: an element, or a named document with its data (registry.ts). */
  render: (meta: DocMeta) => ReactElement<DocumentProps> | DocumentJob;
};

/** The object a document is about, as an IssueRequest names it (its verification record and its history event). */
export const aboutObject = (o: { id: string; objectNumber: string; clientId: string }): Pick<IssueRequest, "objectId" | "objectNumber" | "clientId"> => ({
  objectId: o.id,
  objectNumber: o.objectNumber,
  clientId: o.clientId,
});

/** `uploadsDir` is where the studio's logo is read from; without it documents are issued without the logo. */
export function createDocumentsService(db: Db, clock: () => Date = () => new Date(), uploadsDir?: string) {
  return {
    /**
     * Renders a document, records it with its verification code and, for an object's document,
     * writes the issue into the object's history. The record is written only once the PDF rendered.
     */
    async issue(req: IssueRequest): Promise<{ pdf: Buffer; code: string; filename: string }> {
      const settings = getSettings(db);
      const code = newVerificationCode();
      const issuedAt = clock();
      const meta: DocMeta = {
        studioName: settings.studioName,
        studioAddress: settings.studioAddress,
        studioContact: settings.studioContact,
        kindLabel: DOCUMENT_KIND_LABELS[req.kind],
        objectNumber: req.objectNumber ?? null,
        code,
        issuedAt,
        paperSize: settings.paperSize,
        title: req.title,
        logo: await getLogo(db, uploadsDir),
      };
      // Laid out in a worker thread (render-pool.ts), so the server keeps answering meanwhile.
      const { pdf, pages } = await renderPdf(req.render(meta));
      // The fingerprint the public check shows: the file's SHA-256 and its page count (counted in the worker).
      const sha256 = createHash("sha256").update(pdf).digest("hex");
      inTransaction(db, (tx) => {
        insertIssuedDocument(tx, {
          code,
          kind: req.kind,
          title: req.title,
          objectId: req.objectId ?? null,
          clientId: req.clientId ?? null,
          paperSize: settings.paperSize,
          issuedAt,
          issuedBy: req.user.id,
          issuedByName: req.user.name,
          sha256,
          pages,
        });
        if (req.objectId && req.inHistory !== false) {
          appendEvent(tx, {
            objectId: req.objectId,
            type: "document-issued",
            actor: req.user,
            summary: `${DOCUMENT_KIND_LABELS[req.kind]} issued, verification code ${code}.`,
            data: { code, kind: req.kind },
            at: issuedAt,
          });
        }
      });
      const safe = (req.objectNumber ?? req.kind).replace(/[^A-Za-z0-9-]+/g, "-");
      return { pdf: Buffer.from(pdf), code, filename: `${req.kind}-${safe}-${code}.pdf` };
    },

    /** Public: whether a code was issued, of what kind, for which object and when — nothing more. */
    verify(code: string): Verification {
      const norm = normaliseCode(code);
      const row = findIssuedByCode(db, norm);
      if (!row) return { valid: false, code: norm };
      const kind = row.kind as DocumentKind;
      return {
        valid: true,
        code: row.code,
        kind,
        kindLabel: DOCUMENT_KIND_LABELS[kind],
        objectNumber: row.objectNumber ?? null,
        issuedAt: row.issuedAt.toISOString(),
        sha256: row.sha256,
        pages: row.pages,
      };
    },

    list(filter: { objectId?: string; clientId?: string } = {}): IssuedDocument[] {
      return listIssued(db, filter);
    },
  };
}
export type DocumentsService = ReturnType<typeof createDocumentsService>;
