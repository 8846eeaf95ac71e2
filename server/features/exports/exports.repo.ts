import { and, asc, eq, inArray } from "drizzle-orm";
import type { JobState } from "../../../shared/schemas/exports.ts";
import type { Db } from "../../db/client.ts";
import { conditionReports, custodyReceipts, exportJobs, photos } from "../../db/schema.ts";

// The SQL of the exports feature: the archive jobs in export_jobs, and what goes into an archive besides
// the datasets (which exports.datasets.ts reads in the worker).

export type ExportJobRow = typeof exportJobs.$inferSelect;
export type NewExportJob = typeof exportJobs.$inferInsert;

/** Reads in parts of 500 ids, under SQLite's limit on bound parameters. */
function inChunks<T>(ids: string[], read: (part: string[]) => T[]): T[] {
  const out: T[] = [];
  for (let i = 0; i < ids.length; i += 500) out.push(...read(ids.slice(i, i + 500)));
  return out;
}

export function createExportsRepo(db: Db) {
  return {
    jobs: {
      all: (): ExportJobRow[] => db.select().from(exportJobs).all(),
      byId: (id: string): ExportJobRow | undefined => db.select().from(exportJobs).where(eq(exportJobs.id, id)).get(),
      /** The archive of this client being built now, if any. */
      runningFor: (clientId: string) =>
        db
          .select({ id: exportJobs.id })
          .from(exportJobs)
          .where(and(eq(exportJobs.clientId, clientId), eq(exportJobs.state, "running")))
          .get(),
      insert: (row: NewExportJob) => db.insert(exportJobs).values(row).run(),
      save: (job: { id: string; state: JobState; progress: number; message: string }) =>
        db.update(exportJobs).set({ state: job.state, progress: job.progress, message: job.message }).where(eq(exportJobs.id, job.id)).run(),
      remove: (id: string) => db.delete(exportJobs).where(eq(exportJobs.id, id)).run(),
    },

    /** The ids of the draft condition reports of these objects. */
    draftReportIds: (objectIds: string[]) =>
      new Set(
        inChunks(objectIds, (part) =>
          db
            .select({ id: conditionReports.id })
            .from(conditionReports)
            .where(and(inArray(conditionReports.objectId, part), eq(conditionReports.status, "draft")))
            .all(),
        ).map((r) => r.id),
      ),

    /** The photos of these objects, oldest first. */
    photosOf: (objectIds: string[]) =>
      inChunks(objectIds, (part) =>
        db
          .select({
            id: photos.id,
            objectId: photos.objectId,
            originalKey: photos.originalKey,
            fullKey: photos.fullKey,
            reportId: photos.reportId,
            kind: photos.kind,
            caption: photos.caption,
          })
          .from(photos)
          .where(inArray(photos.objectId, part))
          .orderBy(asc(photos.createdAt), asc(photos.id))
          .all(),
      ),

    /** The signed condition reports of these objects, by date. */
    signedReportsOf: (objectIds: string[]) =>
      inChunks(objectIds, (part) =>
        db
          .select({ id: conditionReports.id, objectId: conditionReports.objectId, date: conditionReports.reportDate })
          .from(conditionReports)
          .where(and(inArray(conditionReports.objectId, part), eq(conditionReports.status, "signed")))
          .orderBy(asc(conditionReports.reportDate), asc(conditionReports.id))
          .all(),
      ),

    /** The custody receipts of these objects, by date. */
    receiptsOf: (objectIds: string[]) =>
      inChunks(objectIds, (part) =>
        db
          .select({ id: custodyReceipts.id, objectId: custodyReceipts.objectId, date: custodyReceipts.date, kind: custodyReceipts.kind })
          .from(custodyReceipts)
          .where(inArray(custodyReceipts.objectId, part))
          .orderBy(asc(custodyReceipts.date), asc(custodyReceipts.createdAt))
          .all(),
      ),
  };
}
