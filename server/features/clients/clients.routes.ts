import { Router } from "express";
import type { Db } from "../../db/client.ts";
import { ClientCreateSchema, ClientUpdateSchema } from "../../../shared/schemas/clients.ts";
import { IdParamSchema } from "../../../shared/schemas/common.ts";
import { isStudio } from "../../../shared/permissions.ts";
import { assertCan, currentUser, requirePermission } from "../../middleware/require-permission.ts";
import { input, validate } from "../../middleware/validate.ts";
import { notFound } from "../../lib/errors.ts";
import { findClient, insertClient, listClients, updateClient } from "./clients.repo.ts";

export function clientRoutes(db: Db) {
  const r = Router();

  // Studio staff see every client; a collector or registrar sees only their own.
  r.get("/", (req, res) => {
    const user = currentUser(req);
    const items = isStudio(user) ? listClients(db, null) : user.clientId ? listClients(db, user.clientId) : [];
    res.json({ items });
  });

  r.get("/:id", validate({ params: IdParamSchema }), (req, res) => {
    const { id } = input(req, "params", IdParamSchema);
    const client = findClient(db, id);
    if (!client) throw notFound("That client");
    assertCan(currentUser(req), "client:read", { clientId: client.id }, { readAction: "client:read", what: "That client" });
    res.json(client);
  });

  r.post("/", requirePermission("client:write"), validate({ body: ClientCreateSchema }), (req, res) => {
    res.status(201).json(insertClient(db, input(req, "body", ClientCreateSchema)));
  });

  r.put("/:id", requirePermission("client:write"), validate({ params: IdParamSchema, body: ClientUpdateSchema }), (req, res) => {
    const { id } = input(req, "params", IdParamSchema);
    const updated = updateClient(db, id, input(req, "body", ClientUpdateSchema));
    if (!updated) throw notFound("That client");
    res.json(updated);
  });

  return r;
}
