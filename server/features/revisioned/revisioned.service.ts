import type { Db } from "../../db/client.ts";
import { inTransaction } from "../../db/client.ts";
import { can, type Action } from "../../../shared/permissions.ts";
import type { SessionUser } from "../../../shared/schemas/auth.ts";
import type { EventType } from "../../../shared/schemas/history.ts";
import type { Correction, Revision, RevisionWithChanges } from "../../../shared/schemas/revisioned.ts";
import { diffValues, type Change } from "../../../shared/domain/diff.ts";
import { AppError, conflict, notFound } from "../../lib/errors.ts";
import { assertCan } from "../../middleware/require-permission.ts";
import { findObject, type ObjectRow } from "../objects/objects.repo.ts";
import { appendEvent } from "../history/history.chain.ts";
import type { RecordBase, RevisionBase } from "./revisioned.repo.ts";

type User = { id: string; name: string };

/** What a revisioned feature tells the life cycle: its repo (revisionedRepo bound to its tables), actions, words and shapes. */
export type RevisionedFeature<Row extends RecordBase, Rev extends RevisionBase, D, Out, OutRev extends { data: D }> = {
  repo: {
    find(db: Db, id: string): Row | null;
    revision(db: Db, id: string, n: number): Rev | null;
    revisionsOf(db: Db, id: string): Rev[];
    currentRevisions(db: Db, rows: Row[]): Map<string, Rev>;
    addRevision(db: Db, row: Row, version: number, data: D, reason: string, user: User): number | null;
  };
  /** Reading and writing; drafts are read only by those who may write them (shared/permissions.ts). */
  actions: { read: Action; write: Action };
  /** How a 404 names a record: "That mounting record". */
  what: string;
  /** The 409 of a stale `version`. */
  stale: string;
  messages: {
    /** A draft update on a locked record. */
    locked: string;
    /** Locking a record that is no longer a draft. */
    alreadyLocked: string;
    /** A correction of a draft. */
    draftCorrected: string;
  };
  /** Refuse a stale `version` before checking the content (so a stale lock or correction answers 409, never 422). */
  versionFirst?: boolean;
  /** A revision row's data as the feature's type. */
  dataOf(rev: Rev): D;
  toRevision(rev: Rev, o: ObjectRow, row: Row): OutRev;
  toRecord(row: Row, o: ObjectRow, current: OutRev): Out;
};

/** The life cycle's 409 messages in a feature's words: `lockMessages("mounting record", "completed", "completed records")`. */
export function lockMessages(record: string, locked: string, lockedRecords: string): RevisionedFeature<RecordBase, RevisionBase, unknown, unknown, { data: unknown }>["messages"] {
  return {
    locked: `This ${record} is ${locked} and locked; make a correction instead, with a reason.`,
    alreadyLocked: `This ${record} is already ${locked}.`,
    draftCorrected: `A draft is edited directly; corrections are for ${lockedRecords}.`,
  };
}

/** The fields every revision answers with; `data` as the feature reads it. */
export function revisionFields<D>(r: RevisionBase, data: D): Revision<D> {
  return { revision: r.revision, data, correctionReason: r.correctionReason, createdAt: r.createdAt.toISOString(), createdByName: r.createdByName };
}

/** The fields every record answers with: which it is, its object, its status, revision and version, and its current revision in full. */
export function recordFields<S extends string, C>(row: RecordBase & { status: S }, o: ObjectRow, current: C) {
  return {
    id: row.id,
    objectId: row.objectId,
    objectNumber: o.objectNumber,
    objectTitle: o.title,
    status: row.status,
    currentRevision: row.currentRevision,
    version: row.version,
    current,
  };
}

/**
 * The revisioned life cycle on the server: draft → lock → corrections, with the reads and permission
 * gates around it. A feature's service calls these with its own rules (what to check, what locking
 * does, the history event of a correction); each write is one transaction, answering 409 when stale.
 */
export function revisionedService<Row extends RecordBase, Rev extends RevisionBase, D, Out, OutRev extends { data: D }>(db: Db, f: RevisionedFeature<Row, Rev, D, Out, OutRev>) {
  const sees = (user: SessionUser, o: ObjectRow, r: { status: string }) => can(user, f.actions.read, { clientId: o.clientId, draft: r.status === "draft" });

  function loadObject(user: SessionUser, objectId: string): ObjectRow {
    const o = findObject(db, objectId);
    if (!o) throw notFound("That object");
    assertCan(user, f.actions.read, { clientId: o.clientId }, { readAction: f.actions.read, what: "That object" });
    return o;
  }

  /** A record the user may see: drafts only to those who may write them (404 otherwise, so a draft's existence is not revealed). */
  function load(user: SessionUser, id: string) {
    const row = f.repo.find(db, id);
    if (!row) throw notFound(f.what);
    const o = findObject(db, row.objectId)!;
    assertCan(user, f.actions.read, { clientId: o.clientId }, { readAction: f.actions.read, what: f.what });
    if (!sees(user, o, row)) throw notFound(f.what);
    return { row, o };
  }

  function write(user: SessionUser, id: string) {
    const l = load(user, id);
    assertCan(user, f.actions.write, { clientId: l.o.clientId }, { readAction: f.actions.read, what: f.what });
    return l;
  }

  function show(row: Row, o: ObjectRow, rev?: Rev): Out {
    return f.toRecord(row, o, f.toRevision(rev ?? f.repo.revision(db, row.id, row.currentRevision)!, o, row));
  }
  const reload = (id: string, o: ObjectRow) => show(f.repo.find(db, id)!, o);

  /** Runs a write in one transaction; false from it means the version was stale. */
  function commit(fn: (d: Db) => boolean) {
    if (!inTransaction(db, fn)) throw conflict(f.stale);
  }

  const life = {
    sees,
    loadObject,
    load,
    write,
    show,

    listForObject(user: SessionUser, objectId: string, rowsOf: (db: Db, objectId: string) => Row[]): Out[] {
      const o = loadObject(user, objectId);
      // Drafts are work in progress: those who may only read see records once they are locked.
      const rows = rowsOf(db, objectId).filter((r) => sees(user, o, r));
      const revs = f.repo.currentRevisions(db, rows);
      return rows.map((r) => show(r, o, revs.get(r.id)));
    },

    get(user: SessionUser, id: string): Out {
      const { row, o } = load(user, id);
      return show(row, o);
    },

    revisions(user: SessionUser, id: string): RevisionWithChanges<OutRev>[] {
      const { row, o } = load(user, id);
      const revs = f.repo.revisionsOf(db, id).map((r) => f.toRevision(r, o, row));
      return revs.map((r, i) => {
        const previous = revs[i - 1];
        return { ...r, changes: previous ? diffValues(previous.data, r.data) : [] };
      });
    },

    /** The three reads a feature's service answers with as they are: the records of an object (its rows found by `rowsOf`), one record, its revisions. */
    reads(rowsOf: (db: Db, objectId: string) => Row[]) {
      return {
        listForObject: (user: SessionUser, objectId: string): Out[] => life.listForObject(user, objectId, rowsOf),
        get: (user: SessionUser, id: string): Out => life.get(user, id),
        revisions: (user: SessionUser, id: string): RevisionWithChanges<OutRev>[] => life.revisions(user, id),
      };
    },

    /** A new draft: `check` returns the data to store (or throws), `insert` writes it and returns the id. */
    create(user: SessionUser, objectId: string, s: { check(o: ObjectRow): D; insert(t: Db, data: D): string }): Out {
      const o = loadObject(user, objectId);
      assertCan(user, f.actions.write, { clientId: o.clientId }, { readAction: f.actions.read, what: "That object" });
      const data = s.check(o);
      const id = inTransaction(db, (t) => s.insert(t, data));
      return reload(id, o);
    },

    /** A draft rewritten in place; a locked record answers 409 (it is corrected instead). */
    updateDraft(user: SessionUser, id: string, s: { check(row: Row, o: ObjectRow): D; rewrite(t: Db, row: Row, data: D): boolean }): Out {
      const { row, o } = write(user, id);
      if (row.status !== "draft") throw conflict(f.messages.locked);
      const data = s.check(row, o);
      commit((t) => s.rewrite(t, row, data));
      return reload(id, o);
    },

    /** Locks a draft (complete, sign): `lock` checks the current data and returns the transaction that locks it. */
    lock(user: SessionUser, id: string, version: number, lock: (row: Row, o: ObjectRow, data: D) => (d: Db) => boolean): Out {
      const { row, o } = write(user, id);
      if (row.status !== "draft") throw conflict(f.messages.alreadyLocked);
      if (f.versionFirst && row.version !== version) throw conflict(f.stale);
      const tx = lock(row, o, f.dataOf(f.repo.revision(db, id, row.currentRevision)!));
      commit(tx);
      return reload(id, o);
    },

    /**
     * A correction of a locked record: the reason is the contract's ("say why"); `check` validates the new
     * data against the current (and may return it respelt); a correction that changes nothing is refused.
     * The new revision, `after` (what else the correction moves) and its history event land together.
     */
    correct(
      user: SessionUser,
      id: string,
      body: Correction<D>,
      s: {
        check(row: Row, o: ObjectRow, before: D): D;
        after?(d: Db, row: Row, data: D): void;
        event(row: Row, n: number, data: D, changes: Change[]): { type: EventType; summary: string; data: Record<string, unknown>; at?: Date };
      },
    ): Out {
      const { row, o } = write(user, id);
      if (row.status === "draft") throw conflict(f.messages.draftCorrected);
      if (f.versionFirst && row.version !== body.version) throw conflict(f.stale);
      const before = f.dataOf(f.repo.revision(db, id, row.currentRevision)!);
      const data = s.check(row, o, before);
      const changes = diffValues(before, data);
      if (changes.length === 0) throw new AppError("validation_failed", "Check data: the correction changes nothing.", { data: "Change at least one entry, or cancel." });
      commit((d) => {
        const n = f.repo.addRevision(d, row, body.version, data, body.correctionReason, user);
        if (n === null) return false;
        s.after?.(d, row, data);
        appendEvent(d, { objectId: row.objectId, actor: user, ...s.event(row, n, data, changes) });
        return true;
      });
      return reload(id, o);
    },
  };
  return life;
}
