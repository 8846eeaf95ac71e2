import { z } from "zod";
import { OBJECT_STATUSES, OBJECT_TYPES, type ObjectStatus, type ObjectType } from "./objects.ts";

/** The datasets one client's records export as (docs/exports.md), and their formats. */
export const DATASETS = ["objects", "mountings", "condition", "custody", "valuations"] as const;
export type Dataset = (typeof DATASETS)[number];
export const FORMATS = ["csv", "json"] as const;
export type Format = (typeof FORMATS)[number];
export type ExportFilters = { status?: ObjectStatus; objectType?: ObjectType };

/** The states of an archive job, and what polling one answers. */
export const EXPORT_JOB_STATES = ["running", "done", "failed"] as const;
export type JobState = (typeof EXPORT_JOB_STATES)[number];
export type JobStatus = { state: JobState; progress: number; message: string };

export const DatasetParamsSchema = z.object({
  id: z.string().min(1).max(64),
  dataset: z.enum(DATASETS, { message: "Choose objects, mountings, condition, custody or valuations." }),
  format: z.enum(FORMATS, { message: "Choose csv or json." }),
});
export const ExportFilterQuerySchema = z.object({ status: z.enum(OBJECT_STATUSES).optional(), objectType: z.enum(OBJECT_TYPES).optional() });
/** `originals: true` (studio staff only) puts the photos' original files in, with their metadata. */
export const ArchiveBodySchema = z
  .object({ originals: z.boolean({ message: "originals is true or false." }).default(false) })
  .strict()
  .default({ originals: false });
export const ExportJobParamsSchema = z.object({ jobId: z.string().min(1).max(64) });
