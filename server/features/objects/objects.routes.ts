import { Router } from "express";
import type { Db } from "../../db/client.ts";
import { IdParamSchema } from "../../../shared/schemas/common.ts";
import { ObjectCreateSchema, ObjectListQuerySchema, ObjectUpdateSchema } from "../../../shared/schemas/objects.ts";
import { currentUser, requirePermission } from "../../middleware/require-permission.ts";
import { input, validate } from "../../middleware/validate.ts";
import { createObjectsService } from "./objects.service.ts";

export function objectRoutes(db: Db, clock: () => Date) {
  const service = createObjectsService(db);
  const r = Router();

  r.get("/", validate({ query: ObjectListQuerySchema }), (req, res) => {
    res.json(service.list(currentUser(req), input(req, "query", ObjectListQuerySchema)));
  });

  r.get("/next-number", requirePermission("object:create"), (_req, res) => {
    res.json({ objectNumber: service.nextNumber(clock()) });
  });

  r.get("/:id", validate({ params: IdParamSchema }), (req, res) => {
    res.json(service.get(currentUser(req), input(req, "params", IdParamSchema).id));
  });

  r.post("/", requirePermission("object:create"), validate({ body: ObjectCreateSchema }), (req, res) => {
    res.status(201).json(service.create(currentUser(req), input(req, "body", ObjectCreateSchema)));
  });

  r.put("/:id", validate({ params: IdParamSchema, body: ObjectUpdateSchema }), (req, res) => {
    const { id } = input(req, "params", IdParamSchema);
    res.json(service.update(currentUser(req), id, input(req, "body", ObjectUpdateSchema)));
  });

  return r;
}
