import { Router } from "express";
import { VerifyCodeParamsSchema } from "../../../shared/schemas/documents.ts";
import type { Db } from "../../db/client.ts";
import { input, validate } from "../../middleware/validate.ts";
import { createDocumentsService } from "./documents.service.ts";

/** Public (mounted before the session check): anyone holding a document can check its code. */
export function verifyRoutes(db: Db) {
  const service = createDocumentsService(db);
  const r = Router();
  r.get("/verify/:code", validate({ params: VerifyCodeParamsSchema }), (req, res) => {
    res.setHeader("Cache-Control", "no-store");
    res.json(service.verify(input(req, "params", VerifyCodeParamsSchema).code));
  });
  return r;
}
