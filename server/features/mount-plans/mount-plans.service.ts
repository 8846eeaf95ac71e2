import type { Db } from "../../db/client.ts";
import { inTransaction } from "../../db/client.ts";
import type { SessionUser } from "../../../shared/schemas/auth.ts";
import { MountPlanInputSchema, type CuttingListRequest, type MountPlanParsed, type SavedPlan, type SavePlan } from "../../../shared/schemas/mount-plan.ts";
import { computePlan, cuttingList, type PlanResult } from "../../../shared/domain/mount-plan/index.ts";
import { parseLength } from "../../../shared/domain/units.ts";
import { DEFAULT_KERF_MM } from "../../../shared/domain/mount-plan/constants.ts";
import { AppError, conflict, notFound } from "../../lib/errors.ts";
import { assertCan } from "../../middleware/require-permission.ts";
import { getSettings } from "../settings/settings.repo.ts";
import { findObject, type ObjectRow } from "../objects/objects.repo.ts";
import { draftPlan } from "../../../shared/domain/mounting.ts";
import * as repo from "./mount-plans.repo.ts";
import { appendEvent } from "../history/history.chain.ts";
import type { Db as DbT } from "../../db/client.ts";

function impossible(fields: Record<string, string>) {
  const first = Object.entries(fields)[0];
  return new AppError("validation_failed", first ? `Check ${first[0]}: ${first[1]}` : "The plan cannot be computed.", fields);
}

/** The plan, or a 422 whose field paths name the request body's own fields (`at` is where the plan input sits). */
function planOrRefuse(result: PlanResult, at: string) {
  if (!result.ok) throw impossible(Object.fromEntries(Object.entries(result.fields).map(([path, message]) => [at + path, message])));
  return result.plan;
}

export function createMountPlansService(db: Db) {
  /** `at` is where the plan input sits in the request body, so that field paths name the body's own fields. */
  function calculate(input: MountPlanParsed, at = "") {
    const s = getSettings(db);
    return planOrRefuse(computePlan(input, { minOverlapMm: s.minOverlapMm, rebateClearanceMm: s.rebateClearanceMm }), at);
  }

  /** A draft on an object: recomputed with the object's catalogue (draftPlan), shown in the studio's unit. */
  function draftOf(input: MountPlanParsed, o: ObjectRow, at = "") {
    return planOrRefuse(draftPlan(input, o, getSettings(db)), at);
  }

  function toSaved(row: repo.PlanRow): SavedPlan {
    // A saved plan is recomputed from its input every time it is shown, never stored as numbers.
    const input = MountPlanInputSchema.parse(row.input);
    const o = findObject(db, row.objectId)!;
    return {
      id: row.id,
      objectId: row.objectId,
      status: "draft",
      version: row.version,
      input: row.input,
      plan: draftOf(input, o),
      updatedAt: row.updatedAt.toISOString(),
      updatedBy: row.updatedBy,
    };
  }

  function loadObject(user: SessionUser, objectId: string) {
    const o = findObject(db, objectId);
    if (!o) throw notFound("That object");
    assertCan(user, "object:read", { clientId: o.clientId }, { what: "That object" });
    return o;
  }

  return {
    calculate,

    cuttingList(req: CuttingListRequest) {
      const fields: Record<string, string> = {};
      const mm = (v: string | number, path: string, label: string) => {
        const r = parseLength(v, req.unit);
        if (!r.ok) fields[path] = `${label}: ${r.message}`;
        else if (!(r.mm > 0)) fields[path] = `${label} must be greater than 0.`;
        return r.ok ? r.mm : NaN;
      };
      const sheet = { width: mm(req.boardSheet.width, "boardSheet.width", "Board sheet width"), height: mm(req.boardSheet.height, "boardSheet.height", "Board sheet height") };
      const kerfR = req.kerf !== undefined ? parseLength(req.kerf, req.unit) : { ok: true as const, mm: DEFAULT_KERF_MM };
      if (!kerfR.ok || kerfR.mm < 0) fields.kerf = "Kerf must be a length of 0 or more.";
      const pieces = req.pieces.map((p, i) => ({
        id: p.id,
        label: p.label,
        quantity: p.quantity,
        width: mm(p.width, `pieces.${i}.width`, "Board width"),
        height: mm(p.height, `pieces.${i}.height`, "Board height"),
      }));
      if (Object.keys(fields).length) throw impossible(fields);
      return cuttingList(pieces, sheet, kerfR.ok ? kerfR.mm : 0);
    },

    getDraft(user: SessionUser, objectId: string): SavedPlan | null {
      loadObject(user, objectId);
      const row = repo.findDraft(db, objectId);
      return row ? toSaved(row) : null;
    },

    saveDraft(user: SessionUser, objectId: string, body: SavePlan): SavedPlan {
      const o = loadObject(user, objectId);
      assertCan(user, "plan:write", { clientId: o.clientId }, { what: "That object" });
      const plan = draftOf(body.input, o, "input.");
      const logSaved = (tx: DbT, planId: string) =>
        appendEvent(tx, {
          objectId,
          type: "plan-saved",
          actor: user,
          summary: `Draft plan saved: window ${plan.display.aperture}, outer ${plan.display.outer}.`,
          data: { planId },
        });
      const existing = repo.findDraft(db, objectId);
      if (!existing) {
        const row = inTransaction(db, (tx) => {
          const row = repo.insertDraft(tx, objectId, body.input, user.id);
          logSaved(tx, row.id);
          return row;
        });
        return toSaved(row);
      }
      if (body.version === undefined || body.version !== existing.version) {
        throw conflict("Someone else saved this plan while you were working on it. Your plan is still on screen: reload to see theirs, then save again.");
      }
      const updated = inTransaction(db, (tx) => {
        const row = repo.updateDraft(tx, existing.id, existing.version, body.input, user.id);
        if (row) logSaved(tx, row.id);
        return row;
      });
      if (!updated) throw conflict("Someone else saved this plan while you were working on it. Your plan is still on screen: reload to see theirs, then save again.");
      return toSaved(updated);
    },
  };
}
