import type { Db } from "../../db/client.ts";
import { inTransaction } from "../../db/client.ts";
import type { SessionUser } from "../../../shared/schemas/auth.ts";
import type { ObjectCreate, ObjectListQuery, ObjectRecord, ObjectUpdate } from "../../../shared/schemas/objects.ts";
import { can, clientScope } from "../../../shared/permissions.ts";
import { assertCan } from "../../middleware/require-permission.ts";
import { AppError, conflict, forbidden, notFound } from "../../lib/errors.ts";
import { findClient } from "../clients/clients.repo.ts";
import * as repo from "./objects.repo.ts";
import { appendEvent } from "../history/history.chain.ts";
import { diffValues } from "../../../shared/domain/diff.ts";

const VALUATION_KEYS = ["valuationMinor", "valuationCurrency", "valuationDate", "valuationBasis", "valuer"] as const;

/** What an object answers with as it is stored, in the answer's order (the enums are stored as their text). */
const STORED_FIELDS = [
  "id",
  "objectNumber",
  "title",
  "maker",
  "dateMade",
  "objectType",
  "medium",
  "support",
  "photoProcess",
  "edition",
  "inscriptions",
  "sheetWidthMm",
  "sheetHeightMm",
  "borderLeftMm",
  "borderTopMm",
  "borderRightMm",
  "borderBottomMm",
  "thicknessNotes",
  "sensitivities",
  "clientId",
  "clientName",
  "status",
  "location",
  "valuationMinor",
  "valuationCurrency",
  "valuationDate",
  "valuationBasis",
  "valuer",
  "version",
] as const satisfies readonly (keyof repo.ObjectRow & keyof ObjectRecord)[];

function toRecord(row: repo.ObjectRow, user: SessionUser): ObjectRecord {
  const valuationVisible = can(user, "valuation:read", { clientId: row.clientId });
  const stored = {} as Record<(typeof STORED_FIELDS)[number], unknown>;
  for (const k of STORED_FIELDS) stored[k] = row[k];
  // Typed as the record's own fields: leaving one out of STORED_FIELDS (and not setting it here) does not compile.
  const record: ObjectRecord = {
    ...(stored as Pick<ObjectRecord, (typeof STORED_FIELDS)[number]>),
    createdAt: row.createdAt.toISOString(),
    updatedAt: row.updatedAt.toISOString(),
    valuationVisible,
  };
  if (!valuationVisible) for (const k of VALUATION_KEYS) record[k] = null;
  return record;
}

function duplicateNumber(objectNumber: string) {
  return conflict(`Object number ${objectNumber} is already used by another object.`, {
    objectNumber: `${objectNumber} is already used by another object; choose another number.`,
  });
}

function requireClient(db: Db, clientId: string) {
  if (!findClient(db, clientId)) {
    throw new AppError("validation_failed", "Check clientId: that owner does not exist.", { clientId: "Choose an owner from the list." });
  }
}

export function createObjectsService(db: Db) {
  function load(user: SessionUser, id: string): repo.ObjectRow {
    const row = repo.findObject(db, id);
    if (!row) throw notFound("That object");
    assertCan(user, "object:read", { clientId: row.clientId }, { what: "That object" });
    return row;
  }

  return {
    list(user: SessionUser, query: ObjectListQuery) {
      const scope = clientScope(user);
      if (scope === "none") return { items: [], total: 0, page: query.page, pageSize: query.pageSize };
      const { items, total } = repo.listObjects(db, query, scope);
      return {
        items: items.map((i) => ({ ...i, updatedAt: i.updatedAt.toISOString() })),
        total,
        page: query.page,
        pageSize: query.pageSize,
      };
    },

    get(user: SessionUser, id: string): ObjectRecord {
      return toRecord(load(user, id), user);
    },

    create(user: SessionUser, data: ObjectCreate): ObjectRecord {
      assertCan(user, "object:create", { clientId: data.clientId });
      requireClient(db, data.clientId);
      if (repo.findObjectIdByNumber(db, data.objectNumber)) throw duplicateNumber(data.objectNumber);
      try {
        const id = inTransaction(db, (tx) => {
          const id = repo.insertObject(tx, data, user.id);
          appendEvent(tx, { objectId: id, type: "created", actor: user, summary: `Recorded as ${data.objectNumber}, “${data.title}”.`, data: { objectNumber: data.objectNumber } });
          if (data.valuationMinor !== null) {
            appendEvent(tx, {
              objectId: id,
              type: "valued",
              actor: user,
              summary: "Insured value recorded.",
              data: { valuation: true },
              occurredOn: data.valuationDate ?? undefined,
            });
          }
          return id;
        });
        return toRecord(repo.findObject(db, id)!, user);
      } catch (e) {
        if (String(e).includes("UNIQUE constraint failed: objects.object_number")) throw duplicateNumber(data.objectNumber);
        throw e;
      }
    },

    update(user: SessionUser, id: string, data: ObjectUpdate): ObjectRecord {
      const current = load(user, id);
      assertCan(user, "object:update", { clientId: current.clientId }, { what: "That object" });
      const { version, ...changes } = data;
      // Whereabouts change only through custody receipts, so every move is in the object's history with who and when.
      if (changes.status !== undefined && changes.status !== current.status) {
        throw new AppError("validation_failed", "Check status: an object's whereabouts change only through a custody receipt.", {
          status: "Record the hand-over in the object's Custody section; the status follows from it.",
        });
      }
      // Only studio staff move an object to another owner.
      // The user may edit this object, so a refusal here is 403 (assertCan would answer "That record was not found").
      if (changes.clientId !== current.clientId) {
        if (!can(user, "object:reassign", { clientId: changes.clientId })) throw forbidden("Only studio staff move an object to another owner.");
        requireClient(db, changes.clientId);
      }
      // Someone who may not see valuations cannot change them either: keep what is stored.
      const patch: Partial<ObjectCreate> = { ...changes };
      if (!can(user, "valuation:update", { clientId: current.clientId })) for (const k of VALUATION_KEYS) delete patch[k];
      const other = repo.findObjectIdByNumber(db, changes.objectNumber);
      if (other && other !== id) throw duplicateNumber(changes.objectNumber);
      const before: Record<string, unknown> = {};
      for (const k of Object.keys(patch) as (keyof ObjectCreate)[]) before[k] = current[k as keyof repo.ObjectRow];
      const changed = diffValues(before, patch);
      const ok = inTransaction(db, (tx) => {
        if (!repo.updateObject(tx, id, version, patch)) return false;
        const valuationChanges = changed.filter((c) => (VALUATION_KEYS as readonly string[]).includes(c.path.split(".")[0] ?? c.path));
        const catalogueChanges = changed.filter((c) => !valuationChanges.includes(c));
        if (catalogueChanges.length) {
          appendEvent(tx, {
            objectId: id,
            type: "catalogue-changed",
            actor: user,
            summary: `Catalogue changed: ${[...new Set(catalogueChanges.map((c) => c.path.split(".")[0]))].join(", ")}.`,
            data: { changes: catalogueChanges },
          });
        }
        // The history keeps that the valuation changed, never the amounts: the log is shown to more people than may see values.
        if (valuationChanges.length) {
          // Valued on the valuation's own date when that changed with it; otherwise the day it was entered.
          const dated = valuationChanges.some((c) => c.path === "valuationDate") && patch.valuationDate ? patch.valuationDate : undefined;
          appendEvent(tx, { objectId: id, type: "valued", actor: user, summary: "Valuation updated.", data: { fields: valuationChanges.map((c) => c.path) }, occurredOn: dated });
        }
        return true;
      });
      if (!ok) {
        throw conflict("Someone else saved this object while you were editing it. Your changes are still in the form: reload the record in another tab, compare, then save again.");
      }
      return toRecord(repo.findObject(db, id)!, user);
    },

    nextNumber(now: Date): string {
      const year = now.getFullYear();
      return `${year}-${String(repo.lastSequenceForYear(db, year) + 1).padStart(4, "0")}`;
    },
  };
}
export type ObjectsService = ReturnType<typeof createObjectsService>;
