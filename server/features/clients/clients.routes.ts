import { Router } from "express";
import type { Db } from "../../db/client.ts";
import { ClientCreateSchema, ClientUpdateSchema } from "../../../shared/schemas/clients.ts";
import { IdParamSchema } from "../../../shared/schemas/common.ts";
import { currentUser, requirePermission } from "../../middleware/require-permission.ts";
import { input, validate } from "../../middleware/validate.ts";
import { createClientsService } from "./clients.service.ts";

export function clientRoutes(db: Db) {
  const service = createClientsService(db);
  const r = Router();
  r.get("/", (req, res) => {
    res.json({ items: service.list(currentUser(req)) });
  });
  r.get("/:id", validate({ params: IdParamSchema }), (req, res) => {
    res.json(service.get(currentUser(req), input(req, "params", IdParamSchema).id));
  });
  r.post("/", requirePermission("client:write"), validate({ body: ClientCreateSchema }), (req, res) => {
    res.status(201).json(service.create(input(req, "body", ClientCreateSchema)));
  });
  r.put("/:id", requirePermission("client:write"), validate({ params: IdParamSchema, body: ClientUpdateSchema }), (req, res) => {
    res.json(service.update(input(req, "params", IdParamSchema).id, input(req, "body", ClientUpdateSchema)));
  });
  return r;
}
