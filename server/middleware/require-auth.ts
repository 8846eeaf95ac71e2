import type { Request, RequestHandler, Response } from "express";
import { fromNodeHeaders } from "better-auth/node";
import { parse as parseCookies } from "cookie";
import { eq, sql } from "drizzle-orm";
import type { Auth } from "../lib/auth.ts";
import type { Db } from "../db/client.ts";
import { user as userTable } from "../db/schema.ts";
import { AppError } from "../lib/errors.ts";
import { RoleSchema, type SessionUser } from "../../shared/schemas/auth.ts";

const TOKEN_COOKIES = ["better-auth.session_token", "__Secure-better-auth.session_token"];

/**
 * Resolves the signed-in user of a request. better-auth verifies the session cookie; a verified
 * session is then remembered for a few seconds (and forgotten at once on sign-out), so most calls
 * skip that verification. The user's role and client are read fresh from the database on every call.
 */
export function createSessionResolver(auth: Auth, db: Db, opts: { ttlMs?: number; max?: number } = {}) {
  const ttlMs = opts.ttlMs ?? 10_000;
  const max = opts.max ?? 10_000;
  const verified = new Map<string, { userId: string; until: number }>();
  const userById = db
    .select()
    .from(userTable)
    .where(eq(userTable.id, sql.placeholder("id")))
    .prepare();

  const tokenOf = (req: Request): string | null => {
    const header = req.headers.cookie;
    if (!header) return null;
    const cookies = parseCookies(header);
    for (const name of TOKEN_COOKIES) if (cookies[name]) return cookies[name]!;
    return null;
  };

  function toSessionUser(u: { id: string; name: string; email: string; role?: string | null; clientId?: string | null }): SessionUser {
    const role = RoleSchema.safeParse(u.role);
    if (!role.success) throw new AppError("forbidden", "Your account has no role in this studio; ask the studio admin.");
    return { id: u.id, name: u.name, email: u.email, role: role.data, clientId: u.clientId ?? null };
  }

  async function resolve(req: Request, res: Response): Promise<SessionUser | null> {
    const token = tokenOf(req);
    if (!token) return null;
    const hit = verified.get(token);
    if (hit && hit.until > Date.now()) {
      const row = userById.get({ id: hit.userId });
      if (row) return toSessionUser(row);
      verified.delete(token);
      return null;
    }
    verified.delete(token);
    const { headers, response: result } = await auth.api.getSession({ headers: fromNodeHeaders(req.headers), returnHeaders: true });
    // A refreshed session comes back as cookies to pass on.
    const cookies = headers.getSetCookie();
    if (cookies.length) res.append("Set-Cookie", cookies);
    if (!result) return null;
    if (verified.size >= max) verified.delete(verified.keys().next().value!);
    verified.set(token, { userId: result.user.id, until: Math.min(Date.now() + ttlMs, new Date(result.session.expiresAt).getTime()) });
    return toSessionUser(result.user as typeof result.user & { role?: string; clientId?: string | null });
  }

  return {
    resolve,
    /** Called on sign-out, so the cookie stops working at once. */
    forget(req: Request) {
      const token = tokenOf(req);
      if (token) verified.delete(token);
    },
  };
}
export type SessionResolver = ReturnType<typeof createSessionResolver>;

/** Loads the session from the cookie and answers 401 when there is none. */
export function requireAuth(sessions: SessionResolver): RequestHandler {
  return async (req, res, next) => {
    const user = await sessions.resolve(req, res);
    if (!user) throw new AppError("unauthenticated", "Sign in to continue.");
    req.user = user;
    next();
  };
}
