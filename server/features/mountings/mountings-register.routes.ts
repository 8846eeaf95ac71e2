import { Router } from "express";
import type { Db } from "../../db/client.ts";
import { MountingListQuerySchema, type MountingListPage } from "../../../shared/schemas/mountings.ts";
import { requirePermission } from "../../middleware/require-permission.ts";
import { input, validate } from "../../middleware/validate.ts";
import { listFramers, listMountings } from "./mountings-register.repo.ts";

/**
 * Mounted at /api, before mountingRoutes, so that GET /mountings is this register and not a record id.
 * Studio only: the register spans every client's objects, drafts included.
 */
export function mountingsRegisterRoutes(db: Db) {
  const r = Router();

  r.get("/mountings", requirePermission("mounting:list"), validate({ query: MountingListQuerySchema }), (req, res) => {
    const q = input(req, "query", MountingListQuerySchema);
    const { items, total } = listMountings(db, q);
    const body: MountingListPage = { items, total, page: q.page, pageSize: q.pageSize, framers: listFramers(db) };
    res.json(body);
  });

  return r;
}
