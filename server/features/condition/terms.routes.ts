import { Router } from "express";
import type { Db } from "../../db/client.ts";
import { IdParamSchema } from "../../../shared/schemas/common.ts";
import { TermCreateSchema, TermListQuerySchema, TermUpdateSchema } from "../../../shared/schemas/condition.ts";
import { currentUser, requirePermission } from "../../middleware/require-permission.ts";
import { input, validate } from "../../middleware/validate.ts";
import { createTermsService } from "./condition.service.ts";

/** Mounted at /api. Everyone signed in reads the active vocabulary; the admin keeps it. There is no delete: terms are retired. */
export function termRoutes(db: Db) {
  const service = createTermsService(db);
  const r = Router();

  r.get("/condition-terms", validate({ query: TermListQuerySchema }), (req, res) => {
    res.json({ items: service.list(currentUser(req), input(req, "query", TermListQuerySchema)) });
  });
  r.post("/condition-terms", requirePermission("terms:manage"), validate({ body: TermCreateSchema }), (req, res) => {
    res.status(201).json(service.create(input(req, "body", TermCreateSchema)));
  });
  r.put("/condition-terms/:id", requirePermission("terms:manage"), validate({ params: IdParamSchema, body: TermUpdateSchema }), (req, res) => {
    res.json(service.update(input(req, "params", IdParamSchema).id, input(req, "body", TermUpdateSchema)));
  });
  return r;
}
