import { Router } from "express";
import { z } from "zod";
import type { Db } from "../../db/client.ts";
import { input, validate } from "../../middleware/validate.ts";
import { createDocumentsService } from "./documents.service.ts";

const CodeParam = z.object({ code: z.string().trim().min(4, { message: "Enter the verification code printed on the document." }).max(40) });

/** Public (mounted before the session check): anyone holding a document can check its code. */
export function verifyRoutes(db: Db) {
  const service = createDocumentsService(db);
  const r = Router();
  r.get("/verify/:code", validate({ params: CodeParam }), (req, res) => {
    res.setHeader("Cache-Control", "no-store");
    res.json(service.verify(input(req, "params", CodeParam).code));
  });
  return r;
}
