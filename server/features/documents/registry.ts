import type { ComponentProps } from "react";
import type { Db } from "../../db/client.ts";
import type { DocMeta } from "../../lib/pdf/layout.tsx";
import { BackLabelDocument, LabelSheetDocument } from "./labels.tsx";
import { ScheduleDocument } from "./schedule.tsx";
import { loadSchedule, type ScheduleFilter } from "./schedule-data.ts";
import { WorkshopSheetDocument } from "./workshop-sheet.tsx";

/**
 * Documents whose size grows with the selection (up to 5,000 objects, 200 mountings, a sheet of labels).
 * The request thread sends only the name and the data; the render worker builds the document from it,
 * so expanding thousands of rows into react-pdf's elements never pauses the server.
 */
export const WORKER_DOCUMENTS = {
  schedule: ScheduleDocument,
  "workshop-sheet": WorkshopSheetDocument,
  "back-label": BackLabelDocument,
  "label-sheet": LabelSheetDocument,
} as const;

/**
 * Documents whose rows are gathered in the worker too, from its own read-only connection in one read
 * transaction (one moment's records): for 5,000 objects the gathering alone takes the request thread
 * ~400 ms (scripts/bench.ts). A loader answers null when a chosen record is not there (→ 404).
 */
export const WORKER_LOADERS = {
  schedule: (db: Db, a: { clientId: string | null; filter: ScheduleFilter; producedBy: string; on: Date }) => loadSchedule(db, a.clientId, a.filter, a.producedBy, a.on),
} as const;

type Registry = typeof WORKER_DOCUMENTS;
type Loaders = typeof WORKER_LOADERS;
/**
 * A document to lay out in the worker: its name and its props, which must be plain data (structured
 * clone); or, for a document with a loader, its meta and what to load from which database file.
 */
export type DocumentJob =
  | { [K in keyof Registry]: { doc: K; props: ComponentProps<Registry[K]> } }[keyof Registry]
  | { [K in keyof Loaders]: { doc: K; meta: DocMeta; load: { databaseFile: string; args: Parameters<Loaders[K]>[1] } } }[keyof Loaders];

export function documentJob<K extends keyof Registry>(doc: K, props: ComponentProps<Registry[K]>): DocumentJob {
  return { doc, props } as DocumentJob;
}

/** A document whose rows the worker gathers from `db`'s file, as `WORKER_LOADERS[doc]` does. */
export function loadedDocumentJob<K extends keyof Loaders>(doc: K, meta: DocMeta, db: Db, args: Parameters<Loaders[K]>[1]): DocumentJob {
  return { doc, meta, load: { databaseFile: db.$client.name, args } } as DocumentJob;
}

/** What the worker throws when a loader finds no record; the pool answers it as a 404 naming `what`. */
export const NOT_FOUND_IN_WORKER = "reversa-not-found:";
