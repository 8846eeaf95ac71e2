import type { Db } from "../../db/client.ts";
import type { UserCreate } from "../../../shared/schemas/users.ts";
import { AppError } from "../../lib/errors.ts";
import { passwordProblem } from "../../lib/password-strength.ts";
import { findClient } from "../clients/clients.repo.ts";
import { getSettings } from "../settings/settings.repo.ts";
import { emailTaken, findUserByEmail, insertUser, listUsers } from "./users.repo.ts";

/** The studio admin's accounts: the caller has checked "user:manage". */
export function createUsersService(db: Db) {
  return {
    list: () => listUsers(db),

    /** A collector belongs to a private owner, a registrar to an institution; the password must be strong. */
    async create(body: UserCreate) {
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
      return listUsers(db).find((u) => u.id === id);
    },
  };
}
