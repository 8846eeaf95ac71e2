import { Router } from "express";
import type { Db } from "../../db/client.ts";
import { UserCreateSchema } from "../../../shared/schemas/users.ts";
import { requirePermission } from "../../middleware/require-permission.ts";
import { input, validate } from "../../middleware/validate.ts";
import { AppError } from "../../lib/errors.ts";
import { findClient } from "../clients/clients.repo.ts";
import { emailTaken, findUserByEmail, insertUser, listUsers } from "./users.repo.ts";
import { passwordProblem } from "../../lib/password-strength.ts";
import { getSettings } from "../settings/settings.repo.ts";

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
        throw new AppError("validation_failed", "Check clientId: choose a client of the right kind.", {
          clientId: body.role === "collector" ? "Choose a private owner." : "Choose an institution.",
        });
      }
    }
    if (findUserByEmail(db, body.email)) throw emailTaken(body.email);
    const weak = await passwordProblem(body.password, [body.email, body.name, getSettings(db).studioName]);
    if (weak) throw new AppError("validation_failed", `Check password: ${weak}`, { password: weak });
    const id = await insertUser(db, body);
    res.status(201).json(listUsers(db).find((u) => u.id === id));
  });
  return r;
}
