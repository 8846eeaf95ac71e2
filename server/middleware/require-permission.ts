import type { Request, RequestHandler } from "express";
import { can, type Action, type Resource } from "../../shared/permissions.ts";
import type { SessionUser } from "../../shared/schemas/auth.ts";
import { AppError, forbidden, notFound } from "../lib/errors.ts";

/** Route guard for actions that do not depend on a particular record; it carries its action, for the route table test. */
export function requirePermission(action: Action): RequestHandler & { permission: Action } {
  const guard: RequestHandler = (req, _res, next) => {
    if (!can(req.user, action)) throw forbidden();
    next();
  };
  return Object.assign(guard, { permission: action });
}

export function currentUser(req: Request): SessionUser {
  if (!req.user) throw new AppError("unauthenticated", "Sign in to continue.");
  return req.user;
}

/**
 * Record-level check. A user who may not even read the record gets 404, so that
 * other clients' records cannot be discovered; one who may read but not act gets 403.
 */
export function assertCan(user: SessionUser, action: Action, resource: Resource, opts: { readAction?: Action; what?: string } = {}) {
  if (can(user, action, resource)) return;
  const readAction = opts.readAction ?? "object:read";
  if (action !== readAction && can(user, readAction, resource)) throw forbidden();
  throw notFound(opts.what);
}
