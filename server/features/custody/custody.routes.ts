import { Router } from "express";
import type { Db } from "../../db/client.ts";
import { IdParamSchema } from "../../../shared/schemas/common.ts";
import { CustodyCreateSchema } from "../../../shared/schemas/custody.ts";
import { currentUser, requirePermission } from "../../middleware/require-permission.ts";
import { input, validate } from "../../middleware/validate.ts";
import { createCustodyService, InStudioQuerySchema, ReceiptListQuerySchema } from "./custody.service.ts";

/** Mounted at /api. `clock` fixes "today" (days in the studio, receipts dated in the future) in tests. */
export function custodyRoutes(db: Db, clock: () => Date = () => new Date()) {
  const service = createCustodyService(db, clock);
  const r = Router();

  // Record-level checks in the service: 404 for an object the user may not read, 403 when they may only read it.
  r.post("/objects/:id/custody", validate({ params: IdParamSchema, body: CustodyCreateSchema }), (req, res) => {
    const { id } = input(req, "params", IdParamSchema);
    res.status(201).json(service.record(currentUser(req), id, input(req, "body", CustodyCreateSchema)));
  });

  r.get("/objects/:id/custody", validate({ params: IdParamSchema }), (req, res) => {
    res.json(service.listForObject(currentUser(req), input(req, "params", IdParamSchema).id));
  });

  // The studio-wide views are the studio's own: only those who may write receipts see them.
  r.get("/custody/in-studio", requirePermission("custody:list"), validate({ query: InStudioQuerySchema }), (req, res) => {
    res.json(service.inStudio(input(req, "query", InStudioQuerySchema)));
  });

  r.get("/custody/receipts", requirePermission("custody:list"), validate({ query: ReceiptListQuerySchema }), (req, res) => {
    res.json(service.receipts(input(req, "query", ReceiptListQuerySchema)));
  });

  return r;
}
