import type { Db } from "./client.ts";
import { insertUser } from "../features/users/users.repo.ts";
import type { Role } from "../../shared/schemas/auth.ts";
import { ClientCreateSchema, type ClientCreateInput, type ClientRecord } from "../../shared/schemas/clients.ts";
import { ObjectCreateSchema, type ObjectCreateInput } from "../../shared/schemas/objects.ts";
import { insertClient } from "../features/clients/clients.repo.ts";
import { insertObject } from "../features/objects/objects.repo.ts";

/** Factories shared by the demo seed and the tests. Input goes through the same zod schemas as the API. */
let counter = 0;
const next = () => ++counter;

export function makeClient(db: Db, over: Partial<ClientCreateInput> = {}): ClientRecord {
  const n = next();
  return insertClient(db, ClientCreateSchema.parse({ kind: "private", name: `Client ${n}`, ...over }));
}

export function makeObject(db: Db, clientId: string, over: Partial<ObjectCreateInput> = {}): string {
  const n = next();
  const data = ObjectCreateSchema.parse({
    objectNumber: `T-${String(n).padStart(5, "0")}`,
    title: `Study no. ${n}`,
    objectType: "print",
    sheetWidthMm: 210,
    sheetHeightMm: 297,
    clientId,
    status: "in-studio",
    ...over,
  });
  return insertObject(db, data, null);
}

export async function makeUser(db: Db, opts: { email: string; name: string; role: Role; clientId?: string | null; password: string }): Promise<string> {
  return insertUser(db, opts);
}
