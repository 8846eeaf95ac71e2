import { openReadOnly, type DbHandle } from "../../db/client.ts";
import type { SessionUser } from "../../../shared/schemas/auth.ts";
import { findClient } from "../clients/clients.repo.ts";
import { buildTable, clientObjects, toCsv, toJson } from "./exports.datasets.ts";
import type { Dataset, ExportFilters, Format } from "../../../shared/schemas/exports.ts";

/** What to gather: datasets of one client's records as `user` may see them, in the given formats. */
export type GatherTask = { databaseFile: string; user: SessionUser; clientId: string; datasets: Dataset[]; formats: Format[]; filters: ExportFilters };
/** The files, already written out as text, and the objects they cover (for the archive's documents and events). */
export type Gathered = { objects: { id: string; objectNumber: string }[]; files: { dataset: Dataset; format: Format; text: string }[] };

const connections = new Map<string, DbHandle>();

/**
 * Gathers and writes out datasets in a worker thread, from a read-only connection in one read transaction
 * (one moment's records): for a client of 5,000 objects this is hundreds of milliseconds of work that
 * would otherwise pause every other request. The caller has checked that the client exists and the user
 * may export each dataset.
 */
export default function gather(task: GatherTask): Gathered {
  let h = connections.get(task.databaseFile);
  if (!h) {
    h = openReadOnly(task.databaseFile);
    connections.set(task.databaseFile, h);
  }
  const { db, sqlite } = h;
  return sqlite.transaction(() => {
    const client = findClient(db, task.clientId);
    if (!client) throw new Error("export worker: that client is gone");
    const objs = clientObjects(db, client.id, task.filters);
    const files: Gathered["files"] = [];
    for (const dataset of task.datasets) {
      const table = buildTable(db, task.user, client, dataset, task.filters, objs);
      for (const format of task.formats) files.push({ dataset, format, text: format === "csv" ? toCsv(table) : toJson(table) });
    }
    return { objects: objs.map((o) => ({ id: o.id, objectNumber: o.objectNumber })), files };
  })();
}
