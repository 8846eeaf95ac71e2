import { asc, eq } from "drizzle-orm";
import { randomUUID } from "node:crypto";
import type { Db } from "../../db/client.ts";
import { account, clients, user } from "../../db/schema.ts";
import { hashUserPassword } from "../../lib/auth.ts";
import { conflict } from "../../lib/errors.ts";
import type { Role } from "../../../shared/schemas/auth.ts";
import type { UserRecord } from "../../../shared/schemas/users.ts";

/** Creates an account that better-auth can sign in: the user row and its credential with better-auth's own hash. */
export async function insertUser(db: Db, u: { email: string; name: string; role: Role; clientId?: string | null; password: string }): Promise<string> {
  const id = randomUUID();
  const hash = await hashUserPassword(u.password);
  try {
    db.transaction((tx) => {
      tx.insert(user)
        .values({ id, email: u.email.toLowerCase(), name: u.name, role: u.role, clientId: u.clientId ?? null, emailVerified: true })
        .run();
      tx.insert(account).values({ id: randomUUID(), accountId: id, providerId: "credential", userId: id, password: hash }).run();
    });
  } catch (err) {
    // Two requests for one e-mail at once both pass the check before either writes: the unique index decides.
    if (err instanceof Error && /UNIQUE constraint failed: user\.email/.test(err.message)) throw emailTaken(u.email);
    throw err;
  }
  return id;
}

export const emailTaken = (email: string) => conflict(`${email} already has an account.`, { email: "This e-mail address already has an account." });

export function findUserByEmail(db: Db, email: string) {
  return db.select({ id: user.id }).from(user).where(eq(user.email, email.toLowerCase())).get() ?? null;
}

export function listUsers(db: Db): UserRecord[] {
  return db
    .select({ id: user.id, name: user.name, email: user.email, role: user.role, clientId: user.clientId, clientName: clients.name, createdAt: user.createdAt })
    .from(user)
    .leftJoin(clients, eq(clients.id, user.clientId))
    .orderBy(asc(user.name))
    .all()
    .map((u) => ({ ...u, createdAt: u.createdAt.toISOString() }));
}
