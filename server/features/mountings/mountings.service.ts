import type { Db } from "../../db/client.ts";
import { can } from "../../../shared/permissions.ts";
import { inTransaction } from "../../db/client.ts";
import type { SessionUser } from "../../../shared/schemas/auth.ts";
import {
  MountingDataSchema,
  MOUNTING_REASON_LABELS,
  type MountingCorrection,
  type MountingCreate,
  type MountingData,
  type MountingDraftUpdate,
  type MountingRecord,
  type MountingRevision,
} from "../../../shared/schemas/mountings.ts";
import { UNBUILDABLE } from "../../../shared/domain/mount-plan/index.ts";
import { mountSummary, recordPlan, type CatalogueFacts } from "../../../shared/domain/mounting.ts";
import { diffValues, type Change } from "../../../shared/domain/diff.ts";
import { AppError, conflict, notFound } from "../../lib/errors.ts";
import { assertCan } from "../../middleware/require-permission.ts";
import { getSettings } from "../settings/settings.repo.ts";
import { findObject, type ObjectRow } from "../objects/objects.repo.ts";
import { appendEvent } from "../history/history.chain.ts";
import * as repo from "./mountings.repo.ts";

/** The catalogue facts a record's checks read, sent with each revision so the screen computes the same plan. */
function catalogueOf(o: ObjectRow): CatalogueFacts {
  return {
    objectType: o.objectType,
    photoProcess: o.photoProcess,
    sensitivities: o.sensitivities,
    medium: o.medium,
    support: o.support,
    borderLeftMm: o.borderLeftMm,
    borderTopMm: o.borderTopMm,
    borderRightMm: o.borderRightMm,
    borderBottomMm: o.borderBottomMm,
  };
}

const STALE = "Someone else changed this mounting record while you were working on it. Your entries are still in the form: reload to see theirs, then try again.";

export function createMountingsService(db: Db) {
  /**
   * Recomputes a revision's plan from its saved input, the object's catalogue and its materials
   * (recordPlan, the one function every screen and document uses); a record is never shown from
   * stored numbers. `built`: the record says what was done, so geometry that cannot be built is refused.
   */
  function planFor(data: MountingData, o: ObjectRow, opts: { built?: boolean } = {}) {
    const prefix = "data.plan.";
    const r = recordPlan(data, o, getSettings(db));
    if (!r.ok) {
      const fields = Object.fromEntries(Object.entries(r.fields).map(([k, v]) => [`${prefix}${k}`, v]));
      const first = Object.entries(fields)[0];
      throw new AppError("validation_failed", `Check ${first[0]}: ${first[1]}`, fields);
    }
    if (opts.built) {
      const bad = r.plan.findings.filter((f) => f.severity === "error" && UNBUILDABLE.has(f.code));
      if (bad.length) {
        const fields = Object.fromEntries(bad.map((f) => [`${prefix}${f.field ?? "window"}`, f.message]));
        throw new AppError("validation_failed", `This mount cannot be built as planned: ${bad[0].message}`, fields);
      }
    }
    return r.plan;
  }

  function toRevision(r: repo.RevisionRow, o: ObjectRow): MountingRevision {
    const data = MountingDataSchema.parse(r.data);
    return {
      revision: r.revision,
      data,
      correctionReason: r.correctionReason,
      createdAt: r.createdAt.toISOString(),
      createdByName: r.createdByName,
      plan: planFor(data, o),
      catalogue: catalogueOf(o),
    };
  }

  function toRecord(row: repo.MountingRow, o: ObjectRow, rev?: repo.RevisionRow): MountingRecord {
    const current = rev ?? repo.revision(db, row.id, row.currentRevision)!;
    return {
      id: row.id,
      objectId: row.objectId,
      objectNumber: o.objectNumber,
      objectTitle: o.title,
      status: row.status,
      reason: row.reason as MountingRecord["reason"],
      mountedOn: row.mountedOn,
      framerId: row.framerId,
      framerName: row.framerName,
      currentRevision: row.currentRevision,
      supersededById: row.supersededById,
      endedOn: row.endedOn,
      endReason: row.endReason,
      version: row.version,
      updatedAt: row.updatedAt.toISOString(),
      current: toRevision(current, o),
    };
  }

  function loadObject(user: SessionUser, objectId: string): ObjectRow {
    const o = findObject(db, objectId);
    if (!o) throw notFound("That object");
    assertCan(user, "mounting:read", { clientId: o.clientId }, { readAction: "mounting:read", what: "That object" });
    return o;
  }

  function load(user: SessionUser, id: string) {
    const row = repo.findMounting(db, id);
    if (!row) throw notFound("That mounting record");
    const o = findObject(db, row.objectId)!;
    assertCan(user, "mounting:read", { clientId: o.clientId }, { readAction: "mounting:read", what: "That mounting record" });
    return { row, o };
  }

  function write(user: SessionUser, id: string) {
    const l = load(user, id);
    // A draft is invisible to those who may not write it (GET answers 404), so a write must not reveal it either.
    if (!sees(user, l.o, l.row)) throw notFound("That mounting record");
    assertCan(user, "mounting:write", { clientId: l.o.clientId }, { readAction: "mounting:read", what: "That mounting record" });
    return l;
  }

  return {
    listForObject(user: SessionUser, objectId: string): MountingRecord[] {
      const o = loadObject(user, objectId);
      const rows = repo.mountingsOfObject(db, objectId);
      const revs = repo.currentRevisions(db, rows);
      // Drafts are studio work in progress: the owner sees records once they are completed.
      const visible = rows.filter((r) => sees(user, o, r));
      return visible.map((r) => toRecord(r, o, revs.get(r.id)));
    },

    get(user: SessionUser, id: string): MountingRecord {
      const { row, o } = load(user, id);
      if (!sees(user, o, row)) throw notFound("That mounting record");
      return toRecord(row, o);
    },

    revisions(user: SessionUser, id: string): (MountingRevision & { changes: Change[] })[] {
      const { row, o } = load(user, id);
      if (!sees(user, o, row)) throw notFound("That mounting record");
      const revs = repo.revisionsOf(db, id).map((r) => toRevision(r, o));
      return revs.map((r, i) => ({ ...r, changes: i === 0 ? [] : diffValues(revs[i - 1].data, r.data) }));
    },

    create(user: SessionUser, objectId: string, body: MountingCreate): MountingRecord {
      const o = loadObject(user, objectId);
      assertCan(user, "mounting:write", { clientId: o.clientId }, { readAction: "mounting:read", what: "That object" });
      planFor(body.data, o);
      const id = inTransaction(db, (t) => repo.insertDraft(t, objectId, body, user));
      return toRecord(repo.findMounting(db, id)!, o);
    },

    updateDraft(user: SessionUser, id: string, body: MountingDraftUpdate): MountingRecord {
      const { row, o } = write(user, id);
      if (row.status !== "draft") throw conflict("This mounting record is completed and locked; make a correction instead, with a reason.");
      planFor(body.data, o);
      const ok = inTransaction(db, (t) => repo.updateDraft(t, row, body.version, body));
      if (!ok) throw conflict(STALE);
      return toRecord(repo.findMounting(db, id)!, o);
    },

    complete(user: SessionUser, id: string, version: number): MountingRecord {
      const { row, o } = write(user, id);
      if (row.status !== "draft") throw conflict("This mounting record is already completed.");
      const rev = repo.revision(db, id, row.currentRevision)!;
      const data = MountingDataSchema.parse(rev.data);
      const plan = planFor(data, o, { built: true });
      const ok = inTransaction(db, (d) => {
        const previous = repo.currentCompleted(d, row.objectId, row.id);
        // A mounting dated before the current one is an earlier mounting recorded afterwards: it goes into
        // the history as already superseded, and the current mount stays as it is.
        if (previous && row.mountedOn < previous.mountedOn) {
          if (
            !repo.setStatus(d, row, version, {
              status: "superseded",
              supersededById: previous.id,
              completedAt: new Date(),
              completedBy: user.id,
              endedOn: previous.mountedOn,
              endReason: `Superseded by the mounting of ${previous.mountedOn}.`,
            })
          )
            return false;
          appendEvent(d, {
            objectId: row.objectId,
            type: "mounted",
            actor: user,
            occurredOn: row.mountedOn,
            summary: `Earlier mounting of ${row.mountedOn} recorded afterwards: ${mountSummary(data, plan)}.`,
            data: { mountingId: row.id, revision: row.currentRevision, recordedLater: true },
          });
          return true;
        }
        if (!repo.setStatus(d, row, version, { status: "completed", completedAt: new Date(), completedBy: user.id })) return false;
        if (previous)
          repo.setStatus(d, previous, previous.version, {
            status: "superseded",
            supersededById: row.id,
            endedOn: row.mountedOn,
            endReason: `Superseded by the ${MOUNTING_REASON_LABELS[row.reason as keyof typeof MOUNTING_REASON_LABELS].toLowerCase()} of ${row.mountedOn}.`,
          });
        repo.setObjectCurrentMount(d, row.objectId, { id: row.id, data, mountedOn: row.mountedOn });
        const summary = mountSummary(data, plan);
        const reason = MOUNTING_REASON_LABELS[row.reason as keyof typeof MOUNTING_REASON_LABELS].toLowerCase();
        const verb = previous ? "Reframed" : "Mounted";
        const plain = (previous && row.reason === "reframing") || (!previous && row.reason === "first-mounting");
        appendEvent(d, {
          objectId: row.objectId,
          type: previous ? "reframed" : "mounted",
          actor: user,
          occurredOn: row.mountedOn,
          summary: `${verb}${plain ? "" : ` (${reason})`}: ${summary}.`,
          data: { mountingId: row.id, revision: row.currentRevision, ...(previous ? { supersedes: previous.id } : {}) },
        });
        return true;
      });
      if (!ok) throw conflict(STALE);
      return toRecord(repo.findMounting(db, id)!, o);
    },

    correct(user: SessionUser, id: string, body: MountingCorrection): MountingRecord {
      const { row, o } = write(user, id);
      if (row.status === "draft") throw conflict("A draft is edited directly; corrections are for completed records.");
      const before = MountingDataSchema.parse(repo.revision(db, id, row.currentRevision)!.data);
      planFor(body.data, o, { built: true });
      const changes = diffValues(before, body.data);
      if (changes.length === 0) throw new AppError("validation_failed", "Check data: the correction changes nothing.", { data: "Change at least one entry, or cancel." });
      const ok = inTransaction(db, (d) => {
        const n = repo.addRevision(d, row, body.version, body.data, body.correctionReason, user);
        if (n === null) return false;
        if (row.status === "completed") repo.setObjectCurrentMount(d, row.objectId, { id: row.id, data: body.data, mountedOn: row.mountedOn });
        appendEvent(d, {
          objectId: row.objectId,
          type: "mounting-corrected",
          actor: user,
          summary: `Mounting record of ${row.mountedOn} corrected (revision ${n}): ${body.correctionReason}`,
          data: { mountingId: row.id, revision: n, changes },
        });
        return true;
      });
      if (!ok) throw conflict(STALE);
      return toRecord(repo.findMounting(db, id)!, o);
    },

    remove(user: SessionUser, id: string, body: { version: number; endedOn: string; endReason: string }): MountingRecord {
      const { row, o } = write(user, id);
      if (row.status !== "completed") throw conflict("Only the current mounting can be marked as taken out.");
      const ok = inTransaction(db, (d) => {
        if (!repo.setStatus(d, row, body.version, { status: "removed", endedOn: body.endedOn, endReason: body.endReason })) return false;
        repo.setObjectCurrentMount(d, row.objectId, null);
        appendEvent(d, {
          objectId: row.objectId,
          type: "mounting-removed",
          actor: user,
          occurredOn: body.endedOn,
          summary: `Taken out of the mount of ${row.mountedOn}: ${body.endReason}`,
          data: { mountingId: row.id },
        });
        return true;
      });
      if (!ok) throw conflict(STALE);
      return toRecord(repo.findMounting(db, id)!, o);
    },
  };
}

/** A draft is read only by those who may write it (shared/permissions.ts). */
function sees(user: SessionUser, o: ObjectRow, r: { status: string }): boolean {
  return can(user, "mounting:read", { clientId: o.clientId, draft: r.status === "draft" });
}
