import type { ComponentProps } from "react";
import { BackLabelDocument, LabelSheetDocument } from "./labels.tsx";
import { ScheduleDocument } from "./schedule.tsx";
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

type Registry = typeof WORKER_DOCUMENTS;
/** A document to lay out in the worker: its name and its props, which must be plain data (structured clone). */
export type DocumentJob = { [K in keyof Registry]: { doc: K; props: ComponentProps<Registry[K]> } }[keyof Registry];

export function documentJob<K extends keyof Registry>(doc: K, props: ComponentProps<Registry[K]>): DocumentJob {
  return { doc, props } as DocumentJob;
}
