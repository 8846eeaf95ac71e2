import { describe, expect, it } from "vitest";
import type { Express } from "express";
import { ACTIONS, type Action } from "../../shared/permissions.ts";
import { createTestApp } from "../setup/test-app.ts";

type Layer = { rawPath?: string; handle: { stack?: Layer[] }; route?: { path: string; methods: Record<string, boolean>; stack: { handle: { permission?: Action } }[] } };

/** Every API route of the app as "METHOD /api/path", with the action its route guard carries (requirePermission), if it has one. */
function routesOf(app: Express): Map<string, Action | null> {
  const out = new Map<string, Action | null>();
  const walk = (stack: Layer[], prefix: string) => {
    for (const layer of stack) {
      if (layer.route) {
        const guard = layer.route.stack.map((s) => s.handle.permission).find(Boolean) ?? null;
        for (const m of Object.keys(layer.route.methods)) out.set(`${m.toUpperCase()} ${(prefix + layer.route.path).replace(/(.)\/$/, "$1")}`, guard);
      } else if (layer.handle.stack) walk(layer.handle.stack, prefix + (layer.rawPath && layer.rawPath !== "/" ? layer.rawPath : ""));
    }
  };
  walk((app as unknown as { router: { stack: Layer[] } }).router.stack, "");
  return out;
}

type Rule = "public" | "signed-in" | Action | Action[];
/**
 * What each route asks of its caller: the action(s) of shared/permissions.ts it checks, first the one that
 * decides whether it may run at all ("public": anyone; "signed-in": any signed-in user). Written by hand:
 * a route added, removed or guarded by another action fails this file until the table says so.
 */
const ROUTES: Record<string, Rule> = {
  "GET /api/health": "public",
  "POST /api/session": "public",
  "GET /api/session": "public",
  "DELETE /api/session": "public",
  "GET /api/verify/:code": "public",
  "GET /api/me": "signed-in",
  "GET /api/users": "user:manage",
  "POST /api/users": "user:manage",
  "GET /api/settings": "settings:read",
  "PUT /api/settings": "settings:update",
  "PUT /api/settings/logo": "settings:update",
  "DELETE /api/settings/logo": "settings:update",
  "GET /api/settings/logo": "signed-in",
  "GET /api/clients": "client:read",
  "GET /api/clients/:id": "client:read",
  "POST /api/clients": "client:write",
  "PUT /api/clients/:id": "client:write",
  "POST /api/mount-plans/calculate": "planner:use",
  "POST /api/mount-plans/cutting-list": "planner:use",
  "GET /api/objects/:id/plan": "object:read",
  "PUT /api/objects/:id/plan": "plan:write",
  "GET /api/objects/:id/history": "history:read",
  "GET /api/objects/:id/history/verify": "history:verify",
  "GET /api/history/verify": "history:verify",
  "POST /api/objects/:id/custody": "custody:write",
  "GET /api/objects/:id/custody": "custody:read",
  "GET /api/custody/in-studio": "custody:list",
  "GET /api/custody/receipts": "custody:list",
  "GET /api/mountings": "mounting:list",
  "GET /api/objects/:id/mountings": "mounting:read",
  "POST /api/objects/:id/mountings": "mounting:write",
  "GET /api/mountings/:id": "mounting:read",
  "GET /api/mountings/:id/revisions": "mounting:read",
  "PUT /api/mountings/:id": "mounting:write",
  "POST /api/mountings/:id/complete": "mounting:write",
  "POST /api/mountings/:id/corrections": "mounting:write",
  "POST /api/mountings/:id/remove": "mounting:write",
  "POST /api/objects/:id/photos": "photo:write",
  "GET /api/objects/:id/photos": ["object:read", "condition:read"],
  "GET /api/photos/:id": ["object:read", "condition:read"],
  "PUT /api/photos/:id": "photo:write",
  "GET /api/photos/:id/:version": ["object:read", "condition:read"],
  "GET /api/condition": "condition:read",
  "GET /api/condition/compare": "condition:read",
  "GET /api/objects/:id/condition": "condition:read",
  "POST /api/objects/:id/condition": "condition:write",
  "GET /api/condition/:id": "condition:read",
  "GET /api/condition/:id/revisions": "condition:read",
  "PUT /api/condition/:id": "condition:write",
  "POST /api/condition/:id/sign": "condition:write",
  "POST /api/condition/:id/corrections": "condition:write",
  "GET /api/condition-terms": "signed-in",
  "POST /api/condition-terms": "terms:manage",
  "PUT /api/condition-terms/:id": "terms:manage",
  "POST /api/clients/:id/documents/schedule": ["client:read", "valuation:read"],
  "POST /api/custody/:receiptId/document": ["custody:read", "valuation:read"],
  "POST /api/documents/workshop-sheet": "workshop-sheet:print",
  "GET /api/documents/labels/readiness": "label:print",
  "POST /api/objects/:id/documents/back-label": "label:print",
  "POST /api/documents/label-sheet": "label:print",
  "POST /api/objects/:id/documents/dossier": ["object:read", "valuation:read", "mounting:read"],
  "POST /api/condition/:id/document": ["condition:read", "valuation:read"],
  "GET /api/objects/:id/documents": "object:read",
  "GET /api/documents": "document:list",
  "GET /api/clients/:id/exports/:dataset.:format": ["export:run", "valuation:read", "mounting:read", "condition:read"],
  "POST /api/clients/:id/exports/archive": ["export:run", "valuation:read", "condition:read"],
  "GET /api/exports/:jobId": "export:run",
  "GET /api/exports/:jobId/download": "export:run",
  "GET /api/objects": ["object:read", "valuation:read"],
  "GET /api/objects/next-number": "object:create",
  "GET /api/objects/:id": ["object:read", "valuation:read"],
  "POST /api/objects": "object:create",
  "PUT /api/objects/:id": ["object:update", "valuation:update", "object:reassign"],
};

const t = createTestApp();
const routes = routesOf(t.app);
const actionsOf = (rule: Rule): Action[] => (Array.isArray(rule) ? rule : rule === "public" || rule === "signed-in" ? [] : [rule]);

describe("every route says which action it is", () => {
  it("when the app's routes are listed, then each is in the table and the table names no route the app lacks", () => {
    expect([...routes.keys()].sort()).toEqual(Object.keys(ROUTES).sort());
  });

  it("when a route has a guard, then the guard checks the action the table gives first", () => {
    for (const [route, guard] of routes) {
      if (guard) expect(actionsOf(ROUTES[route]!)[0], route).toBe(guard);
    }
  });

  it("when the actions are listed, then every one is asked for by some route (no unused action)", () => {
    const used = new Set(Object.values(ROUTES).flatMap(actionsOf));
    expect(ACTIONS.filter((a) => !used.has(a))).toEqual([]);
    for (const a of used) expect(ACTIONS).toContain(a);
  });
});
