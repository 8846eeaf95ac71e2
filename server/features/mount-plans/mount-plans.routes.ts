import { Router } from "express";
import type { Db } from "../../db/client.ts";
import { IdParamSchema } from "../../../shared/schemas/common.ts";
import { CuttingListRequestSchema, MountPlanInputSchema, SavePlanSchema } from "../../../shared/schemas/mount-plan.ts";
import { currentUser, requirePermission } from "../../middleware/require-permission.ts";
import { input, validate } from "../../middleware/validate.ts";
import { createMountPlansService } from "./mount-plans.service.ts";

/** Mounted at /api. */
export function mountPlanRoutes(db: Db) {
  const service = createMountPlansService(db);
  const r = Router();

  r.post("/mount-plans/calculate", requirePermission("planner:use"), validate({ body: MountPlanInputSchema }), (req, res) => {
    res.json(service.calculate(input(req, "body", MountPlanInputSchema)));
  });

  r.post("/mount-plans/cutting-list", requirePermission("planner:use"), validate({ body: CuttingListRequestSchema }), (req, res) => {
    res.json(service.cuttingList(input(req, "body", CuttingListRequestSchema)));
  });

  r.get("/objects/:id/plan", validate({ params: IdParamSchema }), (req, res) => {
    res.json({ draft: service.getDraft(currentUser(req), input(req, "params", IdParamSchema).id) });
  });

  r.put("/objects/:id/plan", validate({ params: IdParamSchema, body: SavePlanSchema }), (req, res) => {
    const { id } = input(req, "params", IdParamSchema);
    res.json(service.saveDraft(currentUser(req), id, input(req, "body", SavePlanSchema)));
  });

  return r;
}
