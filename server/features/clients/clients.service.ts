import type { Db } from "../../db/client.ts";
import type { SessionUser } from "../../../shared/schemas/auth.ts";
import type { ClientCreate, ClientRecord } from "../../../shared/schemas/clients.ts";
import { clientScope } from "../../../shared/permissions.ts";
import { notFound } from "../../lib/errors.ts";
import { assertCan } from "../../middleware/require-permission.ts";
import { findClient, insertClient, listClients, updateClient } from "./clients.repo.ts";

export function createClientsService(db: Db) {
  return {
    /** Studio staff see every client; a collector or registrar sees only their own. */
    list(user: SessionUser): ClientRecord[] {
      const scope = clientScope(user);
      return scope === "none" ? [] : listClients(db, scope);
    },
    get(user: SessionUser, id: string): ClientRecord {
      const client = findClient(db, id);
      if (!client) throw notFound("That client");
      assertCan(user, "client:read", { clientId: client.id }, { readAction: "client:read", what: "That client" });
      return client;
    },
    create: (data: ClientCreate) => insertClient(db, data),
    update(id: string, data: ClientCreate): ClientRecord {
      const updated = updateClient(db, id, data);
      if (!updated) throw notFound("That client");
      return updated;
    },
  };
}
