import type { Db } from "../../db/client.ts";
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
import { UNBUILDABLE, type PlanResult } from "../../../shared/domain/mount-plan/index.ts";
import { mountSummary, recordPlan } from "../../../shared/domain/mounting.ts";
import { AppError, conflict } from "../../lib/errors.ts";
import { getSettings } from "../settings/settings.repo.ts";
import type { ObjectRow } from "../objects/objects.repo.ts";
import { lockMessages, recordFields, revisionedService, revisionFields } from "../revisioned/revisioned.service.ts";
import { appendEvent } from "../history/history.chain.ts";
import * as repo from "./mountings.repo.ts";
import { mountingDetail } from "./mounting-detail.ts";

const STALE = "Someone else changed this mounting record while you were working on it. Your entries are still in the form: reload to see theirs, then try again.";

export function createMountingsService(db: Db) {
  /** A recomputed plan, or the 422 when it cannot be computed (or, `built`, when its geometry cannot be built). */
  function checked(r: PlanResult, opts: { built?: boolean } = {}) {
    const prefix = "data.plan.";
    if (!r.ok) {
      const fields = Object.fromEntries(Object.entries(r.fields).map(([k, v]) => [`${prefix}${k}`, v]));
      const [first] = Object.entries(fields);
      throw new AppError("validation_failed", first ? `Check ${first[0]}: ${first[1]}` : "The plan cannot be computed.", fields);
    }
    if (opts.built) {
      const bad = r.plan.findings.filter((f) => f.severity === "error" && UNBUILDABLE.has(f.code));
      const [firstBad] = bad;
      if (firstBad) {
        const fields = Object.fromEntries(bad.map((f) => [`${prefix}${f.field ?? "window"}`, f.message]));
        throw new AppError("validation_failed", `This mount cannot be built as planned: ${firstBad.message}`, fields);
      }
    }
    return r.plan;
  }

  /**
   * Recomputes a plan from data about to be saved, the object's catalogue and its materials (recordPlan,
   * the one function every screen and document uses). `built`: the record says what was done, so
   * geometry that cannot be built is refused.
   */
  const planFor = (data: MountingData, o: ObjectRow, opts: { built?: boolean } = {}) => checked(recordPlan(data, o, getSettings(db)), opts);

  /** A revision as the API answers it, from mountingDetail: a record is never shown from stored numbers. */
  function toRevision(r: repo.RevisionRow, o: ObjectRow, row: repo.MountingRow): MountingRevision {
    const d = mountingDetail(db, row, { object: o, revision: r })!;
    return { ...revisionFields(r, d.data), plan: checked(d.result), catalogue: d.catalogue };
  }

  function toRecord(row: repo.MountingRow, o: ObjectRow, current: MountingRevision): MountingRecord {
    return {
      ...recordFields(row, o, current),
      reason: row.reason as MountingRecord["reason"],
      mountedOn: row.mountedOn,
      framerId: row.framerId,
      framerName: row.framerName,
      supersededById: row.supersededById,
      endedOn: row.endedOn,
      endReason: row.endReason,
      updatedAt: row.updatedAt.toISOString(),
    };
  }

  const life = revisionedService<repo.MountingRow, repo.RevisionRow, MountingData, MountingRecord, MountingRevision>(db, {
    repo: { find: repo.findMounting, revision: repo.revision, revisionsOf: repo.revisionsOf, currentRevisions: repo.currentRevisions, addRevision: repo.addRevision },
    actions: { read: "mounting:read", write: "mounting:write" },
    what: "That mounting record",
    stale: STALE,
    messages: lockMessages("mounting record", "completed", "completed records"),
    dataOf: (r: repo.RevisionRow) => MountingDataSchema.parse(r.data),
    toRevision,
    toRecord,
  });

  return {
    ...life.reads(repo.mountingsOfObject),

    create(user: SessionUser, objectId: string, body: MountingCreate): MountingRecord {
      return life.create(user, objectId, {
        check: (o) => {
          planFor(body.data, o);
          return body.data;
        },
        insert: (t) => repo.insertDraft(t, objectId, body, user),
      });
    },

    updateDraft(user: SessionUser, id: string, body: MountingDraftUpdate): MountingRecord {
      return life.updateDraft(user, id, {
        check: (_row, o) => {
          planFor(body.data, o);
          return body.data;
        },
        rewrite: (t, row) => repo.updateDraft(t, row, body.version, body),
      });
    },

    complete(user: SessionUser, id: string, version: number): MountingRecord {
      return life.lock(user, id, version, (row, o, data) => {
        const plan = planFor(data, o, { built: true });
        return (d) => {
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
        };
      });
    },

    correct(user: SessionUser, id: string, body: MountingCorrection): MountingRecord {
      return life.correct(user, id, body, {
        check: (_row, o) => {
          planFor(body.data, o, { built: true });
          return body.data;
        },
        after: (d, row, data) => {
          if (row.status === "completed") repo.setObjectCurrentMount(d, row.objectId, { id: row.id, data, mountedOn: row.mountedOn });
        },
        event: (row, n, _data, changes) => ({
          type: "mounting-corrected",
          summary: `Mounting record of ${row.mountedOn} corrected (revision ${n}): ${body.correctionReason}`,
          data: { mountingId: row.id, revision: n, changes },
        }),
      });
    },

    remove(user: SessionUser, id: string, body: { version: number; endedOn: string; endReason: string }): MountingRecord {
      const { row, o } = life.write(user, id);
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
      return life.show(repo.findMounting(db, id)!, o);
    },
  };
}
