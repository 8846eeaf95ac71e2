import { Router } from "express";
import type { Db } from "../../db/client.ts";
import { UserCreateSchema } from "../../../shared/schemas/users.ts";
import { requirePermission } from "../../middleware/require-permission.ts";
import { input, validate } from "../../middleware/validate.ts";
import { AppError, conflict } from "../../lib/errors.ts";
import { findClient } from "../clients/clients.repo.ts";
import { findUserByEmail, insertUser, listUsers } from "./users.repo.ts";

/** Mounted at /api: the studio admin's list of accounts. */
export function userRoutes(db: Db) {
  const r = Router();
  r.get("/users", requirePermission("user:manage"), (_req, res) => {
    res.json({ items: listUsers(db) });
  });
  r.post("/users", requirePermission("user:manage"), validate({ body: UserCreateSchema }), async (req, res) => {
    const body = input(req, "body", UserCreateSchema);
    if (body.clientId) {
      const c = findClient(db, body.clientId);
      const kind = body.role === "collector" ? "private" : "institution";
      if (!c || c.kind !== kind) {
        throw new AppError(422, "validation_failed", "Check clientId: choose a client of the right kind.", {
          clientId: body.role === "collector" ? "Choose a private owner." : "Choose an institution.",
        });
      }
    }
    if (findUserByEmail(db, body.email)) throw conflict(`${body.email} already has an account.`, { email: "This e-mail address already has an account." });
    const id = await insertUser(db, body);
    res.status(201).json(listUsers(db).find((u) => u.id === id));
  });
  return r;
}
