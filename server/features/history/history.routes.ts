import { Router } from "express";
import type { Db } from "../../db/client.ts";
import { IdParamSchema } from "../../../shared/schemas/common.ts";
import { HistoryQuerySchema } from "../../../shared/schemas/history.ts";
import { assertCan, currentUser, requirePermission } from "../../middleware/require-permission.ts";
import { input, validate } from "../../middleware/validate.ts";
import { notFound } from "../../lib/errors.ts";
import { findObject } from "../objects/objects.repo.ts";
import { listEvents, verifyChains } from "./history.chain.ts";

/** Mounted at /api. History is read-only over HTTP: there is no route that changes or deletes an event. */
export function historyRoutes(db: Db) {
  const r = Router();

  r.get("/objects/:id/history", validate({ params: IdParamSchema, query: HistoryQuerySchema }), (req, res) => {
    const { id } = input(req, "params", IdParamSchema);
    const o = findObject(db, id);
    if (!o) throw notFound("That object");
    assertCan(currentUser(req), "history:read", { clientId: o.clientId }, { what: "That object" });
    res.json(listEvents(db, id, input(req, "query", HistoryQuerySchema)));
  });

  r.get("/objects/:id/history/verify", requirePermission("history:verify"), validate({ params: IdParamSchema }), (req, res) => {
    const { id } = input(req, "params", IdParamSchema);
    if (!findObject(db, id)) throw notFound("That object");
    res.json(verifyChains(db, id));
  });

  r.get("/history/verify", requirePermission("history:verify"), (_req, res) => {
    res.json(verifyChains(db));
  });

  return r;
}
