import { Router, type Response } from "express";
import type { Db } from "../../db/client.ts";
import type { Config } from "../../lib/config.ts";
import { IdParamSchema } from "../../../shared/schemas/common.ts";
import { currentUser, requirePermission } from "../../middleware/require-permission.ts";
import { input, validate } from "../../middleware/validate.ts";
import { createObjectsService } from "../objects/objects.service.ts";
import { createDocumentsService } from "./documents.service.ts";
import { issueDossier } from "./dossier.tsx";
import { issueConditionReport } from "./condition-pdf.tsx";

function sendPdf(res: Response, doc: { pdf: Buffer; code: string; filename: string }) {
  res.setHeader("Content-Type", "application/pdf");
  res.setHeader("Content-Disposition", `attachment; filename="${doc.filename}"`);
  res.setHeader("X-Verification-Code", doc.code);
  res.setHeader("Access-Control-Expose-Headers", "X-Verification-Code, Content-Disposition");
  res.setHeader("Cache-Control", "no-store");
  res.send(doc.pdf);
}

/** Mounted at /api, after the session check. Issuing a PDF records its verification code and writes the object's history. */
export function documentsRoutes(db: Db, config: Pick<Config, "uploadsDir">, clock: () => Date) {
  const documents = createDocumentsService(db, clock);
  const objects = createObjectsService(db);
  const r = Router();
  const P = { params: IdParamSchema };

  r.post("/objects/:id/documents/dossier", validate(P), async (req, res) => {
    sendPdf(res, await issueDossier(db, config, clock, currentUser(req), input(req, "params", IdParamSchema).id));
  });

  r.post("/condition/:id/document", validate(P), async (req, res) => {
    sendPdf(res, await issueConditionReport(db, config, clock, currentUser(req), input(req, "params", IdParamSchema).id));
  });

  r.get("/objects/:id/documents", validate(P), (req, res) => {
    // get() answers 404 to anyone who may not read the object.
    const o = objects.get(currentUser(req), input(req, "params", IdParamSchema).id);
    res.json({ items: documents.list({ objectId: o.id }) });
  });

  r.get("/documents", requirePermission("document:list"), (_req, res) => {
    res.json({ items: documents.list() });
  });

  return r;
}
