import { Router, type Response } from "express";
import type { Db } from "../../db/client.ts";
import { IdParamSchema } from "../../../shared/schemas/common.ts";
import { LABEL_SHEET_MAX, LabelSheetBodySchema, ReceiptParamsSchema, ScheduleBodySchema, WorkshopBodySchema } from "../../../shared/schemas/documents.ts";
import { AppError, conflict, notFound } from "../../lib/errors.ts";
import { assertCan, currentUser, requirePermission } from "../../middleware/require-permission.ts";
import { input, validate } from "../../middleware/validate.ts";
import { findClient } from "../clients/clients.repo.ts";
import { findMounting } from "../mountings/mountings.repo.ts";
import { findObject, objectIdsMatching } from "../objects/objects.repo.ts";
import { getSettings } from "../settings/settings.repo.ts";
import { createDocumentsService } from "./documents.service.ts";
import { documentJob, loadedDocumentJob } from "./registry.ts";
import { issueCustodyReceipt } from "./custody-receipt.tsx";
import { summaryOf, workshopData, type WorkshopItem } from "./workshop-sheet.tsx";
import { mountingDetail } from "../mountings/mounting-detail.ts";
import { objectUrl, qrFor, type LabelData } from "./labels.tsx";

/**
 * Why labels cannot be printed now, or null when they can: a QR code must lead to the address people
 * open Reversa at, never to a guessed localhost that only works on the studio's own machine.
 */
export function labelAddressProblem(address: { publicUrl: string; publicUrlGiven: boolean }): string | null {
  const host = (() => {
    try {
      return new URL(address.publicUrl).hostname;
    } catch {
      return "";
    }
  })();
  const loopback = host === "localhost" || host.endsWith(".localhost") || /^127\./.test(host) || host === "[::1]" || host === "::1" || host === "0.0.0.0";
  if (!address.publicUrlGiven)
    return `Reversa does not know the address people open it at, so the QR code would point at ${address.publicUrl}, this machine only. Set PUBLIC_URL (for example https://records.your-studio.example) and restart.`;
  if (loopback) return `PUBLIC_URL is ${address.publicUrl}, an address that opens only on this machine. Set it to the address people open Reversa at and restart.`;
  return null;
}

function sendPdf(res: Response, doc: { pdf: Buffer; code: string; filename: string }) {
  res.setHeader("Content-Type", "application/pdf");
  res.setHeader("Content-Disposition", `attachment; filename="${doc.filename}"`);
  res.setHeader("X-Verification-Code", doc.code);
  res.setHeader("Cache-Control", "no-store");
  res.send(doc.pdf);
}

/** Schedule of values, custody receipt, workshop sheet, back labels. Mounted at /api, after the session check. */
export function selectionDocumentsRoutes(db: Db, clock: () => Date, address: { publicUrl: string; publicUrlGiven: boolean }, uploadsDir?: string) {
  const { publicUrl } = address;
  const docs = createDocumentsService(db, clock, uploadsDir);
  const r = Router();

  // Valuations are confidential: the owning client's users and the studio only; other clients get 404.
  r.post("/clients/:id/documents/schedule", validate({ params: IdParamSchema, body: ScheduleBodySchema }), async (req, res) => {
    const user = currentUser(req);
    const { id } = input(req, "params", IdParamSchema);
    const body = input(req, "body", ScheduleBodySchema) ?? {};
    const client = findClient(db, id);
    if (!client) throw notFound("That client");
    assertCan(user, "client:read", { clientId: id }, { readAction: "client:read", what: "That client" });
    assertCan(user, "valuation:read", { clientId: id }, { readAction: "client:read", what: "That client" });
    const doc = await docs.issue({
      kind: "schedule-of-values",
      title: `Schedule of values — ${client.name}`,
      user,
      clientId: id,
      objectNumber: null,
      // The rows are gathered in the render worker: 5,000 objects take ~400 ms to gather (scripts/bench.ts).
      render: (meta) => loadedDocumentJob("schedule", meta, db, { clientId: id, filter: body, producedBy: user.name, on: clock() }),
    });
    doc.filename = doc.filename.replace("schedule-of-values-schedule-of-values", "schedule-of-values");
    sendPdf(res, doc);
  });

  r.post("/custody/:receiptId/document", validate({ params: ReceiptParamsSchema }), async (req, res) => {
    sendPdf(res, await issueCustodyReceipt(db, clock, uploadsDir, currentUser(req), input(req, "params", ReceiptParamsSchema).receiptId));
  });

  r.post("/documents/workshop-sheet", requirePermission("workshop-sheet:print"), validate({ body: WorkshopBodySchema }), async (req, res) => {
    const user = currentUser(req);
    const body = input(req, "body", WorkshopBodySchema);
    const items: WorkshopItem[] = [];
    for (const id of [...new Set(body.mountingIds)]) {
      const m = findMounting(db, id);
      const o = m ? findObject(db, m.objectId) : null;
      const detail = m ? mountingDetail(db, m) : null;
      if (!m || !o || !detail) throw notFound("One of those mountings");
      items.push({ objectNumber: o.objectNumber, title: o.title, detail });
    }
    items.sort((a, b) => a.objectNumber.localeCompare(b.objectNumber));
    const data = workshopData(db, items, body.boardSheetId);
    const one = items.length === 1 ? items[0] : null;
    const doc = await docs.issue({
      kind: "workshop-sheet",
      title: `Workshop sheet — ${items
        .map((i) => i.objectNumber)
        .join(", ")
        .slice(0, 200)}`,
      user,
      objectId: one?.detail.row.objectId ?? null,
      objectNumber: one?.objectNumber ?? null,
      render: (meta) => documentJob("workshop-sheet", { meta, data }),
    });
    sendPdf(res, doc);
  });

  // Before a framer prints: whether the labels' QR codes would lead anywhere (the screen warns when not).
  r.get("/documents/labels/readiness", requirePermission("label:print"), (_req, res) => {
    const problem = labelAddressProblem(address);
    res.json({ ready: problem === null, publicUrl, problem });
  });
  const assertLabelsReady = () => {
    const problem = labelAddressProblem(address);
    if (problem) throw conflict(`Labels cannot be printed yet. ${problem}`);
  };

  async function labelFor(objectId: string): Promise<LabelData> {
    const o = findObject(db, objectId);
    if (!o) throw notFound("That object");
    const m = o.currentMountingId ? findMounting(db, o.currentMountingId) : null;
    const detail = m ? mountingDetail(db, m) : null;
    const url = objectUrl(publicUrl, o.id);
    return {
      objectId: o.id,
      objectNumber: o.objectNumber,
      title: o.title,
      mountedOn: m?.mountedOn ?? o.lastMountedOn ?? null,
      summary: detail ? summaryOf(detail, getSettings(db).vocabulary) : null,
      url,
      qr: await qrFor(url),
    };
  }

  r.post("/objects/:id/documents/back-label", requirePermission("label:print"), validate({ params: IdParamSchema }), async (req, res) => {
    const user = currentUser(req);
    assertLabelsReady();
    const label = await labelFor(input(req, "params", IdParamSchema).id);
    const o = findObject(db, label.objectId)!;
    const doc = await docs.issue({
      kind: "back-label",
      title: `Back label — ${label.objectNumber}`,
      user,
      objectId: label.objectId,
      objectNumber: label.objectNumber,
      clientId: o.clientId,
      render: (meta) => documentJob("back-label", { meta, label, address: { publicUrl } }),
    });
    sendPdf(res, doc);
  });

  // One verification code for the whole sheet, recorded without an object (no per-object history event).
  r.post("/documents/label-sheet", requirePermission("label:print"), validate({ body: LabelSheetBodySchema }), async (req, res) => {
    const user = currentUser(req);
    assertLabelsReady();
    const body = input(req, "body", LabelSheetBodySchema);
    const { objectIds, ...filter } = body;
    let ids: string[];
    if (objectIds) ids = [...new Set(objectIds)];
    else {
      ids = objectIdsMatching(db, filter, LABEL_SHEET_MAX + 1);
      if (ids.length > LABEL_SHEET_MAX)
        throw new AppError("validation_failed", `At most ${LABEL_SHEET_MAX} labels at once: these filters match more. Narrow them (an owner, a status) and print in parts.`);
    }
    const labels: LabelData[] = [];
    for (const id of ids) labels.push(await labelFor(id).catch(() => Promise.reject(notFound("One of those objects"))));
    labels.sort((a, b) => a.objectNumber.localeCompare(b.objectNumber));
    if (labels.length === 0) throw new AppError("validation_failed", objectIds ? "Choose at least one object." : "No object matches these filters: there is nothing to label.");
    const doc = await docs.issue({
      kind: "label-sheet",
      title: `Sheet of back labels — ${labels.length} object${labels.length === 1 ? "" : "s"}`,
      user,
      render: (meta) => documentJob("label-sheet", { meta, labels, address: { publicUrl } }),
    });
    sendPdf(res, doc);
  });

  return r;
}
