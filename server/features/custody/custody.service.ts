import { format, parseISO } from "date-fns";
import { inTransaction } from "../../db/client.ts";
import type { Db } from "../../db/client.ts";
import type { SessionUser } from "../../../shared/schemas/auth.ts";
import {
  CUSTODY_KIND_EFFECT,
  CUSTODY_KIND_LABELS,
  type CustodyCreate,
  type CustodyReceipt,
  type InStudioItem,
  type InStudioQuery,
  type ReceiptListQuery,
} from "../../../shared/schemas/custody.ts";
import { isCalendarDate } from "../../../shared/domain/dates.ts";
export { InStudioQuerySchema, ReceiptListQuerySchema, type InStudioItem } from "../../../shared/schemas/custody.ts";
import { OBJECT_STATUS_LABELS, type ObjectStatus } from "../../../shared/schemas/objects.ts";
import type { Page } from "../../../shared/schemas/common.ts";
import type { EventType } from "../../../shared/schemas/history.ts";
import { AppError, conflict, notFound } from "../../lib/errors.ts";
import { assertCan } from "../../middleware/require-permission.ts";
import { findObject, type ObjectRow } from "../objects/objects.repo.ts";
import { appendEvent, type Actor } from "../history/history.chain.ts";
import * as repo from "./custody.repo.ts";

const utcDay = (s: string) => {
  const [y = NaN, m = NaN, d = NaN] = s.split("-").map(Number);
  return Date.UTC(y, m - 1, d);
};
export const daysBetween = (from: string, to: string) => Math.round((utcDay(to) - utcDay(from)) / 86_400_000);
/** The studio's calendar day (the server's local time zone). */
export const dayOf = (d: Date) => format(d, "yyyy-MM-dd");
const readable = (day: string) => format(parseISO(day), "d MMM yyyy");

function invalid(field: string, message: string) {
  return new AppError("validation_failed", `Check ${field}: ${message}`, { [field]: message });
}

function eventType(kind: CustodyCreate["kind"]): EventType {
  if (kind === "loan-out" || kind === "loan-return") return kind;
  return CUSTODY_KIND_EFFECT[kind].direction === "in" ? "custody-in" : "custody-out";
}

const sentence = (s: string) => s.replace(/[.\s]+$/, "");

export function toReceipt(row: repo.ReceiptRow): CustodyReceipt {
  return {
    id: row.id,
    objectId: row.objectId,
    objectNumber: row.objectNumber,
    objectTitle: row.objectTitle,
    direction: row.direction,
    kind: row.kind as CustodyReceipt["kind"],
    date: row.date,
    fromParty: row.fromParty,
    toParty: row.toParty,
    condition: row.condition,
    signedBy: row.signedBy,
    location: row.location,
    notes: row.notes,
    returnDue: row.returnDue,
    createdAt: row.createdAt.toISOString(),
  };
}

/**
 * Writes one receipt: the receipt, the object's new status (and location), and its history event,
 * in one transaction. The rules are checked against the object as stored inside that transaction.
 * Used by the API (after the permission check) and by the demo seed.
 */
export function recordReceipt(db: Db, objectId: string, body: CustodyCreate, actor: Actor, now: Date, today = dayOf(now)): CustodyReceipt {
  if (!isCalendarDate(body.date)) throw invalid("date", "That day is not in the calendar; use a date such as 2026-11-30.");
  // A day's grace, so a receipt written just after midnight in a time zone ahead of the server's is not refused.
  if (daysBetween(today, body.date) > 1) throw invalid("date", `A receipt records a hand-over that has happened; ${readable(body.date)} is after today.`);
  const data: CustodyCreate = { ...body, condition: body.condition.replace(/\s+/g, " ") };
  const effect = CUSTODY_KIND_EFFECT[data.kind];

  const id = inTransaction(db, (t) => {
    const o = findObject(t, objectId);
    if (!o) throw notFound("That object");
    const where = OBJECT_STATUS_LABELS[o.status as ObjectStatus]?.toLowerCase() ?? o.status;
    if (effect.direction === "in" && o.status === "in-studio") {
      throw conflict(`${o.objectNumber} is already in the studio, so it cannot be received again. Record how it left first, or choose a hand-over out of the studio.`, {
        kind: "The object is already in the studio.",
      });
    }
    if (effect.direction === "out" && o.status !== "in-studio") {
      throw conflict(`${o.objectNumber} is not in the studio (it is ${where}), so it cannot be handed over from here. Record its arrival first.`, {
        kind: `The object is ${where}, not in the studio.`,
      });
    }
    const last = repo.latestReceipt(t, objectId);
    if (last && body.date < last.date) {
      throw invalid("date", `The object's last receipt is dated ${readable(last.date)}; a new receipt cannot be dated before it.`);
    }
    const receiptId = repo.insertReceipt(t, objectId, data, effect.direction, actor.id);
    if (!repo.moveObject(t, objectId, o.version, { status: effect.status, location: data.location })) {
      throw conflict("Someone else changed this object while you were writing the receipt. Nothing was saved; your receipt is still in the form, so try again.");
    }
    const conditionWord = effect.direction === "in" ? "on arrival" : "on departure";
    appendEvent(t, {
      objectId,
      type: eventType(data.kind),
      actor,
      at: now,
      occurredOn: data.date,
      summary:
        `${CUSTODY_KIND_LABELS[data.kind]} on ${readable(data.date)}: from ${data.fromParty} to ${data.toParty}. ` +
        `Condition ${conditionWord}: ${sentence(data.condition)}. Signed by ${data.signedBy}.`,
      data: {
        receiptId,
        kind: data.kind,
        direction: effect.direction,
        date: data.date,
        fromParty: data.fromParty,
        toParty: data.toParty,
        condition: data.condition,
        signedBy: data.signedBy,
        location: data.location,
        statusBefore: o.status,
        statusAfter: effect.status,
      },
    });
    return receiptId;
  });
  return toReceipt(repo.findReceipt(db, id)!);
}

export function createCustodyService(db: Db, clock: () => Date = () => new Date()) {
  function load(user: SessionUser, objectId: string, action: "custody:read" | "custody:write"): ObjectRow {
    const o = findObject(db, objectId);
    if (!o) throw notFound("That object");
    assertCan(user, action, { clientId: o.clientId }, { readAction: "custody:read", what: "That object" });
    return o;
  }

  return {
    record(user: SessionUser, objectId: string, body: CustodyCreate): CustodyReceipt {
      load(user, objectId, "custody:write");
      return recordReceipt(db, objectId, body, user, clock());
    },

    listForObject(user: SessionUser, objectId: string): { items: CustodyReceipt[] } {
      load(user, objectId, "custody:read");
      return { items: repo.listForObject(db, objectId).map(toReceipt) };
    },

    inStudio(q: InStudioQuery): Page<InStudioItem> {
      const today = dayOf(clock());
      const { items, total } = repo.listInStudio(db, q.page, q.pageSize);
      return {
        items: items.map((r) => ({
          objectId: r.objectId,
          objectNumber: r.objectNumber,
          title: r.title,
          clientId: r.clientId,
          clientName: r.clientName,
          location: r.location,
          receipt: r.receiptId ? { id: r.receiptId, date: r.receivedOn!, fromParty: r.fromParty!, condition: r.condition! } : null,
          since: r.since,
          daysInStudio: Math.max(0, daysBetween(r.since, today)),
        })),
        total,
        page: q.page,
        pageSize: q.pageSize,
      };
    },

    receipts(q: ReceiptListQuery): Page<CustodyReceipt> {
      const { items, total } = repo.listReceipts(db, q);
      return { items: items.map(toReceipt), total, page: q.page, pageSize: q.pageSize };
    },
  };
}
