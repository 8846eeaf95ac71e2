import type { Role } from "./schemas/auth.ts";

/**
 * The one permission model. The server enforces it on every route; the client calls the same
 * function only to hide what a user may not do.
 */
export const ACTIONS = [
  "object:read",
  "object:create",
  "object:update",
  "valuation:read",
  "valuation:update",
  "object:reassign",
  "client:read",
  "client:write",
  "settings:read",
  "settings:update",
  "user:manage",
  "planner:use",
  "plan:write",
  "mounting:read",
  "mounting:write",
  "mounting:list",
  "history:read",
  "history:verify",
  "custody:read",
  "custody:write",
  "custody:list",
  "condition:read",
  "condition:write",
  "photo:write",
  "terms:manage",
  "document:list",
  "label:print",
  "workshop-sheet:print",
  "export:run",
] as const;
export type Action = (typeof ACTIONS)[number];

export type Actor = { id: string; role: Role; clientId: string | null };
/**
 * What an action is about: the owning client; and, for reading a mounting record or a condition report
 * (or a photo of one), whether it is a draft — a draft is seen only by those who may write it.
 */
export type Resource = { clientId: string | null; draft?: boolean };

const STUDIO: readonly Role[] = ["admin", "framer"];

export function isStudio(actor: Actor): boolean {
  return STUDIO.includes(actor.role);
}

/** True when the actor is a client-side user (collector or registrar) of the resource's client. */
function ownsResource(actor: Actor, resource?: Resource): boolean {
  return !!resource && actor.clientId !== null && resource.clientId === actor.clientId;
}

export function can(actor: Actor | null | undefined, action: Action, resource?: Resource): boolean {
  if (!actor) return false;
  const studio = isStudio(actor);
  switch (action) {
    case "settings:read":
    case "planner:use":
      return true;
    case "settings:update":
    case "user:manage":
    case "terms:manage":
      return actor.role === "admin";
    case "object:create":
    case "object:reassign":
    case "plan:write":
    case "mounting:write":
    case "mounting:list":
    case "custody:write":
    case "custody:list":
    case "history:verify":
    case "client:write":
    case "document:list":
    case "label:print":
    case "workshop-sheet:print":
      return studio;
    // A draft can still change: it is read only by those who may write it (docs/trade.md §13).
    case "mounting:read":
      return resource?.draft ? can(actor, "mounting:write", resource) : studio || ownsResource(actor, resource);
    case "condition:read":
      return resource?.draft ? can(actor, "condition:write", resource) : studio || ownsResource(actor, resource);
    case "object:read":
    case "export:run":
    case "history:read":
    case "custody:read":
    case "client:read":
    case "valuation:read":
      // Valuations are confidential: studio staff and the owning client's users only (docs/trade.md §13).
      return studio || ownsResource(actor, resource);
    case "object:update":
    case "condition:write":
    case "photo:write":
    case "valuation:update":
      return studio || (actor.role === "registrar" && ownsResource(actor, resource));
    default: {
      const never: never = action;
      return never;
    }
  }
}

/** For listings: null means every client, otherwise the one client the actor is limited to. */
export function clientScope(actor: Actor): string | null | "none" {
  if (isStudio(actor)) return null;
  return actor.clientId ?? "none";
}
