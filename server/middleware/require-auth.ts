import type { Request, RequestHandler, Response } from "express";
import { fromNodeHeaders } from "better-auth/node";
import type { Auth } from "../lib/auth.ts";
import { AppError } from "../lib/errors.ts";
import { RoleSchema, type SessionUser } from "../../shared/schemas/auth.ts";

/** The user of the request's session cookie, or null when there is none. */
export async function loadUser(auth: Auth, req: Request, res: Response): Promise<SessionUser | null> {
  const { headers, response: result } = await auth.api.getSession({ headers: fromNodeHeaders(req.headers), returnHeaders: true });
  // A session that is refreshed, or a renewed session cache, comes back as cookies to pass on.
  const cookies = headers.getSetCookie();
  if (cookies.length) res.append("Set-Cookie", cookies);
  if (!result) return null;
  const u = result.user as typeof result.user & { role?: string; clientId?: string | null };
  const role = RoleSchema.safeParse(u.role);
  if (!role.success) throw new AppError(403, "forbidden", "Your account has no role in this studio; ask the studio admin.");
  return { id: u.id, name: u.name, email: u.email, role: role.data, clientId: u.clientId ?? null };
}

/** Loads the session from the cookie and answers 401 when there is none. */
export function requireAuth(auth: Auth): RequestHandler {
  return async (req, res, next) => {
    const user = await loadUser(auth, req, res);
    if (!user) throw new AppError(401, "unauthenticated", "Sign in to continue.");
    req.user = user;
    next();
  };
}
