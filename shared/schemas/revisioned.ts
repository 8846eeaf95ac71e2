import { z } from "zod";
import type { Change } from "../domain/diff.ts";
import { requiredText } from "./common.ts";

/**
 * The life cycle shared by mounting records and condition reports (and any later revisioned record):
 * a draft rewritten in place, locked once (completed, signed), then only corrected, each correction a
 * new numbered revision with its reason. Every write names the `version` it started from (409 when stale).
 */

/** The optimistic-concurrency token every write after the first sends back. */
export const VersionSchema = z.number().int().min(1);

/**
 * The request schemas of a revisioned feature, built from its data schema and the record's own
 * fields (`fields`: what a draft sets beside its data, e.g. reason and date):
 * - `create`: the fields and the data (POST, the first draft);
 * - `draftUpdate`: the same with the `version` (PUT, a draft rewritten in place);
 * - `lock`: just the `version` (complete, sign);
 * - `correction`: `version`, the reason ("say why": `sayWhy` is the message when it is missing) and the data.
 */
export function revisionedSchemas<D extends z.ZodType, F extends z.ZodRawShape>(data: D, fields: F, sayWhy: string) {
  const create = z.object({ ...fields, data });
  return {
    create,
    draftUpdate: create.extend({ version: VersionSchema }),
    lock: z.object({ version: VersionSchema }),
    correction: z.object({ version: VersionSchema, correctionReason: correctionReasonSchema(sayWhy), data }),
  };
}

/** The reason a correction must give (the "say why" rule), trimmed, at most 1000 characters. */
export const correctionReasonSchema = (sayWhy: string) => requiredText(1000, sayWhy);

/** One numbered revision as the API answers it; a feature may add what it recomputes from the data (`Extra`). */
export type Revision<D, Extra extends object = object> = {
  revision: number;
  data: D;
  correctionReason: string | null;
  createdAt: string;
  createdByName: string | null;
} & Extra;

/** GET …/revisions: each revision with what changed since the one before (none for the first). */
export type RevisionWithChanges<R> = R & { changes: Change[] };

/** The body of a correction, for a feature's data type. */
export type Correction<D> = { version: number; correctionReason: string; data: D };
