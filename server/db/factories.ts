import type { Db } from "./client.ts";
import { insertUser } from "../features/users/users.repo.ts";
import type { Role } from "../../shared/schemas/auth.ts";
import { ClientCreateSchema, type ClientCreateInput, type ClientRecord } from "../../shared/schemas/clients.ts";
import { ObjectCreateSchema, type ObjectCreateInput } from "../../shared/schemas/objects.ts";
import { insertClient } from "../features/clients/clients.repo.ts";
import { insertObject } from "../features/objects/objects.repo.ts";
import type { SessionUser } from "../../shared/schemas/auth.ts";
import { MountingCreateSchema, type MountingDataInput, type MountingRecord } from "../../shared/schemas/mountings.ts";
import { ConditionCreateSchema, type ConditionDataInput, type ConditionReport } from "../../shared/schemas/condition.ts";
import type { CustodyCreate, CustodyReceipt } from "../../shared/schemas/custody.ts";
import { createMountingsService } from "../features/mountings/mountings.service.ts";
import { createConditionService } from "../features/condition/condition.service.ts";
import { dayOf, recordReceipt } from "../features/custody/custody.service.ts";
import type { Actor } from "../features/history/history.chain.ts";
import { insertPhoto, type PhotoInsert } from "../features/photos/photos.repo.ts";

/** Factories shared by the demo seed and the tests. Input goes through the same zod schemas as the API. */
let counter = 0;
const next = () => ++counter;

export function makeClient(db: Db, over: Partial<ClientCreateInput> = {}): ClientRecord {
  const n = next();
  return insertClient(db, ClientCreateSchema.parse({ kind: "private", name: `Client ${n}`, ...over }));
}

export function makeObject(db: Db, clientId: string, over: Partial<ObjectCreateInput> = {}): string {
  const n = next();
  const data = ObjectCreateSchema.parse({
    objectNumber: `T-${String(n).padStart(5, "0")}`,
    title: `Study no. ${n}`,
    objectType: "print",
    sheetWidthMm: 210,
    sheetHeightMm: 297,
    clientId,
    status: "in-studio",
    ...over,
  });
  return insertObject(db, data, null);
}

export async function makeUser(db: Db, opts: { email: string; name: string; role: Role; clientId?: string | null; password: string }): Promise<string> {
  return insertUser(db, opts);
}

// A4 = 210 × 297 mm (ISO 216), the factory object's default sheet; 5 mm overlap a side: common practice (no source),
// so the window is 200 × 287 mm. Two T-hinges of Japanese tissue with wheat starch paste along the top edge
// (Library of Congress, "Matting and Hinging Works of Art on Paper"); UV-filtering glass (NEDCC leaflet 4.10).
// Board makers and batch numbers are invented.
export const A4_HINGED: MountingDataInput = {
  plan: { unit: "mm", sheet: { width: 210, height: 297 }, window: { all: { mode: "overlap", overlap: 5 } }, borders: { all: 60 } },
  boards: {
    window: { grade: "museum", buffered: false, ply: 4, colour: "Antique white", maker: "Bainbridge", batch: "MB-2291" },
    backing: { grade: "museum", buffered: false, ply: 4, batch: "MB-2292" },
  },
  attachment: {
    method: "t-hinge",
    tissue: "Kozo, Japanese tissue",
    tissueWeightGsm: 12,
    adhesive: "wheat-starch-paste",
    hinges: [
      { edge: "top", offsetMm: 40, widthMm: 25 },
      { edge: "top", offsetMm: 145, widthMm: 25 },
    ],
  },
  glazing: { type: "uv-glass", thicknessMm: 2 },
  undoNotes: "Release both T-hinges with a damp blotter over the paste; lift the sheet once the paste has softened.",
};

/** A second mount for the same sheet: polyester corners (no adhesive) under conservation board, anti-reflective UV glass. */
export const A4_CORNERS: MountingDataInput = {
  ...A4_HINGED,
  boards: { window: { grade: "conservation", buffered: true, ply: 8, batch: "CB-7710" }, backing: { grade: "conservation", buffered: true, ply: 4 } },
  attachment: { method: "corners", hinges: [] },
  glazing: { type: "ar-uv-glass", thicknessMm: 3 },
  undoNotes: "Slide the sheet out of the four polyester corners; nothing is stuck to it.",
};

/**
 * A mounting record entered through the same service as the app (so its history event and the object's
 * current mount are written too): a draft, or (by default) completed. Data default to `A4_HINGED`.
 */
export function makeMounting(
  db: Db,
  actor: SessionUser,
  objectId: string,
  over: { data?: MountingDataInput; reason?: string; mountedOn?: string; status?: "draft" | "completed" } = {},
): MountingRecord {
  const service = createMountingsService(db);
  const body = MountingCreateSchema.parse({ reason: over.reason ?? "first-mounting", mountedOn: over.mountedOn ?? "2026-03-02", data: over.data ?? A4_HINGED });
  const draft = service.create(actor, objectId, body);
  return over.status === "draft" ? draft : service.complete(actor, draft.id, draft.version);
}

/**
 * A condition report entered through the same service as the app: a draft, or (by default) signed, which
 * moves the object's check date and writes its history event. The examiner's signature is the actor's, on
 * the report date, unless the data say otherwise.
 */
export function makeConditionReport(
  db: Db,
  actor: SessionUser,
  objectId: string,
  over: { context?: string; reportDate?: string; data?: Partial<ConditionDataInput>; mountingId?: string; status?: "draft" | "signed"; clock?: () => Date } = {},
): ConditionReport {
  const service = createConditionService(db, over.clock);
  const reportDate = over.reportDate ?? "2026-03-02";
  const body = ConditionCreateSchema.parse({
    context: over.context ?? "arrival",
    reportDate,
    ...(over.mountingId ? { mountingId: over.mountingId } : {}),
    data: { overallRating: "good", summary: "Stable.", findings: [], signatures: { examiner: { name: actor.name, date: reportDate } }, ...over.data },
  });
  const draft = service.create(actor, objectId, body);
  return over.status === "draft" ? draft : service.sign(actor, draft.id, draft.version);
}

/** A custody receipt written as the app writes one (the object moves as the kind says; the history records it). */
export function makeCustodyReceipt(db: Db, actor: Actor, objectId: string, over: Partial<CustodyCreate> = {}, now = new Date()): CustodyReceipt {
  const body: CustodyCreate = {
    kind: "intake",
    date: dayOf(now),
    fromParty: "The owner",
    toParty: "The studio",
    condition: "Stable.",
    signedBy: "The owner",
    location: null,
    notes: null,
    ...over,
  };
  return recordReceipt(db, objectId, body, actor, now);
}

/** A photo row as the photos feature leaves it, without its files (for tests that only need the row). */
export function makePhoto(db: Db, objectId: string, over: Partial<PhotoInsert> = {}): string {
  const key = `photo-${next()}`;
  return insertPhoto(db, {
    objectId,
    kind: "condition",
    mime: "image/jpeg",
    width: 1200,
    height: 900,
    bytes: 123_456,
    sha256: "a".repeat(64),
    originalKey: `o/${key}`,
    fullKey: `f/${key}`,
    webKey: `w/${key}`,
    thumbKey: `t/${key}`,
    ...over,
  });
}
