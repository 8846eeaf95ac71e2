import { Router, type Response } from "express";
import type { Db } from "../../db/client.ts";
import type { Config } from "../../lib/config.ts";
import { ArchiveBodySchema, DatasetParamsSchema, ExportFilterQuerySchema, ExportJobParamsSchema } from "../../../shared/schemas/exports.ts";
import { IdParamSchema } from "../../../shared/schemas/common.ts";
import type { ClientRecord } from "../../../shared/schemas/clients.ts";
import type { SessionUser } from "../../../shared/schemas/auth.ts";
import { notFound } from "../../lib/errors.ts";
import { assertCan, currentUser } from "../../middleware/require-permission.ts";
import { input, validate } from "../../middleware/validate.ts";
import { findClient } from "../clients/clients.repo.ts";
import { createExportsService } from "./exports.service.ts";
import { assertMayExport } from "./exports.datasets.ts";
import { gatherInWorker } from "./export-pool.ts";

/** Studio staff and the client's own users may export; anyone else is told the client does not exist. */
function exportableClient(db: Db, user: SessionUser, id: string): ClientRecord {
  const client = findClient(db, id);
  if (!client) throw notFound("That client");
  assertCan(user, "export:run", { clientId: client.id }, { readAction: "client:read", what: "That client" });
  return client;
}

const day = (d: Date) => d.toISOString().slice(0, 10);
const fileSlug = (s: string) =>
  s
    .normalize("NFKD")
    .replace(/[^\w\s-]/g, "")
    .trim()
    .replace(/\s+/g, "-")
    .toLowerCase()
    .slice(0, 60) || "client";

function attachment(res: Response, type: string, filename: string) {
  res.setHeader("Content-Type", type);
  res.setHeader("Content-Disposition", `attachment; filename="${filename}"`);
  // Exports may hold valuations: never kept by a shared cache or the browser.
  res.setHeader("Cache-Control", "no-store");
  res.setHeader("X-Content-Type-Options", "nosniff");
}

/** Mounted at /api. */
export function exportRoutes(db: Db, config: Config, clock: () => Date) {
  const service = createExportsService(db, config, clock);
  const r = Router();

  r.get("/clients/:id/exports/:dataset.:format", validate({ params: DatasetParamsSchema, query: ExportFilterQuerySchema }), async (req, res) => {
    const user = currentUser(req);
    const { id, dataset, format } = input(req, "params", DatasetParamsSchema);
    const client = exportableClient(db, user, id);
    assertMayExport(user, client, dataset);
    // Gathered and written out in a worker thread: a client of thousands of objects does not pause the server.
    const { files } = await gatherInWorker(db, { user, clientId: client.id, datasets: [dataset], formats: [format], filters: input(req, "query", ExportFilterQuerySchema) ?? {} });
    const filename = `${fileSlug(client.name)}-${dataset}-${day(clock())}.${format}`;
    attachment(res, format === "csv" ? "text/csv; charset=utf-8; header=present" : "application/json; charset=utf-8", filename);
    res.send(files[0]!.text);
  });

  r.post("/clients/:id/exports/archive", validate({ params: IdParamSchema, body: ArchiveBodySchema }), (req, res) => {
    const user = currentUser(req);
    const client = exportableClient(db, user, input(req, "params", IdParamSchema).id);
    res.status(202).json({ jobId: service.startArchive(user, client, input(req, "body", ArchiveBodySchema)) });
  });

  r.get("/exports/:jobId", validate({ params: ExportJobParamsSchema }), (req, res) => {
    res.setHeader("Cache-Control", "no-store");
    res.json(service.status(currentUser(req), input(req, "params", ExportJobParamsSchema).jobId));
  });

  r.get("/exports/:jobId/download", validate({ params: ExportJobParamsSchema }), (req, res, next) => {
    const { file, filename } = service.download(currentUser(req), input(req, "params", ExportJobParamsSchema).jobId);
    attachment(res, "application/zip", filename);
    res.sendFile(file, { cacheControl: false, dotfiles: "allow" }, (err) => {
      if (!err) return;
      if (res.headersSent) return void res.destroy();
      res.removeHeader("Content-Disposition");
      next(notFound("That export's file"));
    });
  });

  return r;
}
