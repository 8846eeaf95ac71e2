import { describe, expect, it } from "vitest";
import { ACTIONS, can, clientScope, isStudio, type Action, type Actor, type Resource } from "../../shared/permissions.ts";
import { ROLES, type Role } from "../../shared/schemas/auth.ts";

const OWN = "client-own";
const OTHER = "client-other";

const ACTORS: Record<Role, Actor> = {
  admin: { id: "u-admin", role: "admin", clientId: null },
  framer: { id: "u-framer", role: "framer", clientId: null },
  registrar: { id: "u-registrar", role: "registrar", clientId: OWN },
  collector: { id: "u-collector", role: "collector", clientId: OWN },
};

type Case = "own" | "other" | "none";
const RESOURCES: Record<Case, Resource | undefined> = {
  own: { clientId: OWN },
  other: { clientId: OTHER },
  none: undefined,
};

// The expected answers, written out by hand from docs/trade.md §13 (not derived from the code):
// each cell is [own client's record, another client's record, no record].
type Row = Record<Role, [boolean, boolean, boolean]>;
const Y = true;
const N = false;
const STUDIO_ONLY: Row = { admin: [Y, Y, Y], framer: [Y, Y, Y], registrar: [N, N, N], collector: [N, N, N] };
const EVERYONE: Row = { admin: [Y, Y, Y], framer: [Y, Y, Y], registrar: [Y, Y, Y], collector: [Y, Y, Y] };
const ADMIN_ONLY: Row = { admin: [Y, Y, Y], framer: [N, N, N], registrar: [N, N, N], collector: [N, N, N] };
// Studio staff, and the owning client's users for their own client's records only.
const STUDIO_AND_OWNER: Row = { admin: [Y, Y, Y], framer: [Y, Y, Y], registrar: [Y, N, N], collector: [Y, N, N] };
// Studio staff, and a registrar for their own institution's records (a collector only looks).
const STUDIO_AND_REGISTRAR: Row = { admin: [Y, Y, Y], framer: [Y, Y, Y], registrar: [Y, N, N], collector: [N, N, N] };

const EXPECTED: Record<Action, Row> = {
  "object:read": STUDIO_AND_OWNER,
  "object:create": STUDIO_ONLY,
  "plan:write": STUDIO_ONLY,
  "mounting:write": STUDIO_ONLY,
  "custody:write": STUDIO_ONLY,
  "history:verify": STUDIO_ONLY,
  "mounting:read": STUDIO_AND_OWNER,
  "history:read": STUDIO_AND_OWNER,
  "custody:read": STUDIO_AND_OWNER,
  "condition:read": STUDIO_AND_OWNER,
  "condition:write": STUDIO_AND_REGISTRAR,
  "terms:manage": ADMIN_ONLY,
  "object:update": STUDIO_AND_REGISTRAR,
  // docs/trade.md §13: valuations are confidential — admin, framers and the owning client's users only.
  "valuation:read": STUDIO_AND_OWNER,
  // docs/trade.md §13: a registrar keeps catalogue data and valuations current.
  "valuation:update": STUDIO_AND_REGISTRAR,
  "client:read": STUDIO_AND_OWNER,
  "client:write": STUDIO_ONLY,
  "settings:read": EVERYONE,
  // docs/trade.md §13: studio details, users and roles are the studio admin's.
  "settings:update": ADMIN_ONLY,
  "user:manage": ADMIN_ONLY,
  "planner:use": EVERYONE,
  "object:reassign": STUDIO_ONLY,
  "mounting:list": STUDIO_ONLY,
  "custody:list": STUDIO_ONLY,
  "document:list": STUDIO_ONLY,
  "label:print": STUDIO_ONLY,
  "workshop-sheet:print": STUDIO_ONLY,
  // Photos are condition evidence: written by those who write condition reports.
  "photo:write": STUDIO_AND_REGISTRAR,
  // docs/trade.md §13: the owning client's people may take their own records away.
  "export:run": STUDIO_AND_OWNER,
};

// docs/trade.md §13: a draft mounting record or condition report is read only by those who may write it.
const DRAFT_READ: Record<"mounting:read" | "condition:read", Row> = {
  "mounting:read": STUDIO_ONLY,
  "condition:read": STUDIO_AND_REGISTRAR,
};

describe("can", () => {
  it("when the action list changes, then this table must be updated with it", () => {
    expect(Object.keys(EXPECTED).sort()).toEqual([...ACTIONS].sort());
  });

  for (const action of ACTIONS) {
    for (const role of ROLES) {
      (["own", "other", "none"] as const).forEach((c, i) => {
        const expected = EXPECTED[action][role][i];
        it(`when a ${role} asks for ${action} on ${c === "none" ? "no record" : `${c} client's record`}, then the answer is ${expected ? "yes" : "no"}`, () => {
          expect(can(ACTORS[role], action, RESOURCES[c])).toBe(expected);
        });
      });
    }
  }

  for (const action of ["mounting:read", "condition:read"] as const) {
    for (const role of ROLES) {
      it(`when a ${role} asks for ${action} on a draft, then the answer is that of the draft's writers`, () => {
        const [own, other] = DRAFT_READ[action][role];
        expect(can(ACTORS[role], action, { clientId: OWN, draft: true })).toBe(own);
        expect(can(ACTORS[role], action, { clientId: OTHER, draft: true })).toBe(other);
        // Not a draft: the ordinary read rule.
        expect(can(ACTORS[role], action, { clientId: OWN, draft: false })).toBe(EXPECTED[action][role][0]);
      });
    }
  }

  it("when nobody is signed in, then every action is refused", () => {
    for (const action of ACTIONS) {
      expect(can(null, action, { clientId: OWN })).toBe(false);
      expect(can(undefined, action)).toBe(false);
    }
  });

  it("when a client-side user has no client, then a record with no client is not theirs", () => {
    const orphan: Actor = { id: "u-x", role: "collector", clientId: null };
    expect(can(orphan, "object:read", { clientId: null })).toBe(false);
    expect(can(orphan, "valuation:read", { clientId: null })).toBe(false);
    expect(can({ ...orphan, role: "registrar" }, "object:update", { clientId: null })).toBe(false);
  });
});

describe("isStudio and clientScope", () => {
  it("when the role is admin or framer, then it is studio staff and sees every client", () => {
    expect(isStudio(ACTORS.admin)).toBe(true);
    expect(isStudio(ACTORS.framer)).toBe(true);
    expect(clientScope(ACTORS.admin)).toBeNull();
    expect(clientScope(ACTORS.framer)).toBeNull();
  });

  it("when the role is collector or registrar, then listings are limited to their client", () => {
    expect(isStudio(ACTORS.registrar)).toBe(false);
    expect(isStudio(ACTORS.collector)).toBe(false);
    expect(clientScope(ACTORS.registrar)).toBe(OWN);
    expect(clientScope(ACTORS.collector)).toBe(OWN);
  });

  it("when a client-side user has no client, then listings show nothing", () => {
    expect(clientScope({ id: "u-x", role: "collector", clientId: null })).toBe("none");
  });
});
