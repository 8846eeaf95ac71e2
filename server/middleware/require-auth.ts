import type { RequestHandler } from "express";
import { fromNodeHeaders } from "better-auth/node";
import type { Auth } from "../lib/auth.ts";
import { AppError } from "../lib/errors.ts";
import { RoleSchema } from "../../shared/schemas/auth.ts";

/** Loads the session from the cookie and answers 401 when there is none. */
export function requireAuth(auth: Auth): RequestHandler {
  return async (req, _res, next) => {
    const result = await auth.api.getSession({ headers: fromNodeHeaders(req.headers) });
    if (!result) throw new AppError(401, "unauthenticated", "Sign in to continue.");
    const u = result.user as typeof result.user & { role?: string; clientId?: string | null };
    const role = RoleSchema.safeParse(u.role);
    if (!role.success) throw new AppError(403, "forbidden", "Your account has no role in this studio; ask the studio admin.");
    req.user = { id: u.id, name: u.name, email: u.email, role: role.data, clientId: u.clientId ?? null };
    next();
  };
}
