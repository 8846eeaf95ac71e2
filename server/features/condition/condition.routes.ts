import { Router } from "express";
import type { Db } from "../../db/client.ts";
import { IdParamSchema } from "../../../shared/schemas/common.ts";
import {
  ConditionCompareQuerySchema,
  ConditionCorrectionSchema,
  ConditionCreateSchema,
  ConditionDraftUpdateSchema,
  ConditionListQuerySchema,
  ConditionSignSchema,
} from "../../../shared/schemas/condition.ts";
import { currentUser } from "../../middleware/require-permission.ts";
import { input, validate } from "../../middleware/validate.ts";
import { createConditionService } from "./condition.service.ts";

/** Mounted at /api. The register and the comparison come before /condition/:id, so their paths are not read as ids. */
export function conditionRoutes(db: Db, clock: () => Date) {
  const service = createConditionService(db, clock);
  const r = Router();
  const P = { params: IdParamSchema };
  const id = (req: Parameters<typeof currentUser>[0]) => input(req, "params", IdParamSchema).id;

  r.get("/condition", validate({ query: ConditionListQuerySchema }), (req, res) => {
    res.json(service.list(currentUser(req), input(req, "query", ConditionListQuerySchema)));
  });
  r.get("/condition/compare", validate({ query: ConditionCompareQuerySchema }), (req, res) => {
    const q = input(req, "query", ConditionCompareQuerySchema);
    res.json(service.compare(currentUser(req), q.from, q.to));
  });
  r.get("/objects/:id/condition", validate(P), (req, res) => {
    res.json({ items: service.listForObject(currentUser(req), id(req)) });
  });
  r.post("/objects/:id/condition", validate({ ...P, body: ConditionCreateSchema }), (req, res) => {
    res.status(201).json(service.create(currentUser(req), id(req), input(req, "body", ConditionCreateSchema)));
  });
  r.get("/condition/:id", validate(P), (req, res) => {
    res.json(service.get(currentUser(req), id(req)));
  });
  r.get("/condition/:id/revisions", validate(P), (req, res) => {
    res.json({ items: service.revisions(currentUser(req), id(req)) });
  });
  r.put("/condition/:id", validate({ ...P, body: ConditionDraftUpdateSchema }), (req, res) => {
    res.json(service.updateDraft(currentUser(req), id(req), input(req, "body", ConditionDraftUpdateSchema)));
  });
  r.post("/condition/:id/sign", validate({ ...P, body: ConditionSignSchema }), (req, res) => {
    res.json(service.sign(currentUser(req), id(req), input(req, "body", ConditionSignSchema).version));
  });
  r.post("/condition/:id/corrections", validate({ ...P, body: ConditionCorrectionSchema }), (req, res) => {
    res.status(201).json(service.correct(currentUser(req), id(req), input(req, "body", ConditionCorrectionSchema)));
  });
  return r;
}
