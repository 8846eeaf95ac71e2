import { Router } from "express";
import type { z } from "zod";
import type { Db } from "../../db/client.ts";
import { IdParamSchema } from "../../../shared/schemas/common.ts";
import { MountingCompleteSchema, MountingCorrectionSchema, MountingCreateSchema, MountingDraftUpdateSchema, MountingRemoveSchema } from "../../../shared/schemas/mountings.ts";
import { currentUser } from "../../middleware/require-permission.ts";
import { input, validate } from "../../middleware/validate.ts";
import { createMountingsService } from "./mountings.service.ts";

/** Mounted at /api. */
export function mountingRoutes(db: Db) {
  const service = createMountingsService(db);
  const r = Router();
  const P = { params: IdParamSchema };

  r.get("/objects/:id/mountings", validate(P), (req, res) => {
    res.json({ items: service.listForObject(currentUser(req), input(req, "params", IdParamSchema).id) });
  });
  r.post("/objects/:id/mountings", validate({ ...P, body: MountingCreateSchema }), (req, res) => {
    res.status(201).json(service.create(currentUser(req), input(req, "params", IdParamSchema).id, input(req, "body", MountingCreateSchema)));
  });
  r.get("/mountings/:id", validate(P), (req, res) => {
    res.json(service.get(currentUser(req), input(req, "params", IdParamSchema).id));
  });
  r.get("/mountings/:id/revisions", validate(P), (req, res) => {
    res.json({ items: service.revisions(currentUser(req), input(req, "params", IdParamSchema).id) });
  });
  r.put("/mountings/:id", validate({ ...P, body: MountingDraftUpdateSchema }), (req, res) => {
    res.json(service.updateDraft(currentUser(req), input(req, "params", IdParamSchema).id, input(req, "body", MountingDraftUpdateSchema)));
  });
  r.post("/mountings/:id/complete", validate({ ...P, body: MountingCompleteSchema }), (req, res) => {
    const body = input(req, "body", MountingCompleteSchema) as z.infer<typeof MountingCompleteSchema>;
    res.json(service.complete(currentUser(req), input(req, "params", IdParamSchema).id, body.version));
  });
  r.post("/mountings/:id/corrections", validate({ ...P, body: MountingCorrectionSchema }), (req, res) => {
    res.status(201).json(service.correct(currentUser(req), input(req, "params", IdParamSchema).id, input(req, "body", MountingCorrectionSchema)));
  });
  r.post("/mountings/:id/remove", validate({ ...P, body: MountingRemoveSchema }), (req, res) => {
    res.json(service.remove(currentUser(req), input(req, "params", IdParamSchema).id, input(req, "body", MountingRemoveSchema)));
  });
  return r;
}
