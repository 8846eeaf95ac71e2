import { Router } from "express";
import type { Db } from "../../db/client.ts";
import { UserCreateSchema } from "../../../shared/schemas/users.ts";
import { requirePermission } from "../../middleware/require-permission.ts";
import { input, validate } from "../../middleware/validate.ts";
import { createUsersService } from "./users.service.ts";

/** Mounted at /api: the studio admin's list of accounts. */
export function userRoutes(db: Db) {
  const service = createUsersService(db);
  const r = Router();
  r.get("/users", requirePermission("user:manage"), (_req, res) => {
    res.json({ items: service.list() });
  });
  r.post("/users", requirePermission("user:manage"), validate({ body: UserCreateSchema }), async (req, res) => {
    res.status(201).json(await service.create(input(req, "body", UserCreateSchema)));
  });
  return r;
}
