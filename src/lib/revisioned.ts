import { queryOptions, useMutation, useQueryClient } from "@tanstack/react-query";
import type { FieldValues, Resolver } from "react-hook-form";
import type { z } from "zod";
import { issuesToFields } from "@shared/schemas/errors.ts";
import type { Correction, RevisionWithChanges } from "@shared/schemas/revisioned.ts";
import { api } from "./api-client.ts";
import { nestedErrors } from "./form-errors.ts";
import { objectHistoryKey, rootKeys } from "./query-keys.ts";

/**
 * The client side of a revisioned record (mounting records, condition reports): its query keys, the
 * queries of one record, an object's records and the revisions with their diff, the draft, lock and
 * correction mutations, and the form resolver with the "say why" rule. A feature's api/ file calls
 * `revisionedApi` with its paths and re-exports what it needs under its own names.
 */

/** Query keys under a feature's root: every record, an object's records, one record, its revisions. */
export const revisionedKeys = <K extends readonly unknown[]>(root: K) => ({
  all: root,
  object: (objectId: string) => [...root, "object", objectId] as const,
  one: (id: string) => [...root, "one", id] as const,
  revisions: (id: string) => [...root, "revisions", id] as const,
});

type Paths = {
  /** The records' root: "/api/mountings" (one record is `${base}/:id`). */
  base: string;
  /** An object's records: "mountings" in /api/objects/:id/mountings. */
  ofObject: string;
  /** The lock action: "complete" or "sign" (POST `${base}/:id/${lock}` with the version). */
  lock: string;
};

const enc = encodeURIComponent;

/** A feature's revisioned endpoints: its keys, its queries, and the paths the mutations below post to. */
export type RevisionedApi<Rec extends { id: string; objectId: string }, Rev, Create, D> = ReturnType<typeof revisionedApi<Rec, Rev, Create, D>>;

export function revisionedApi<Rec extends { id: string; objectId: string }, Rev, Create, D>(root: readonly unknown[], paths: Paths) {
  const keys = revisionedKeys(root);
  // An id not known yet (""; a page still loading what it belongs to) asks for nothing.
  const oneQuery = (id: string) => queryOptions({ queryKey: keys.one(id), queryFn: () => api.get<Rec>(`${paths.base}/${enc(id)}`), enabled: id !== "" });
  const objectQuery = (objectId: string) =>
    queryOptions({
      queryKey: keys.object(objectId),
      queryFn: () => api.get<{ items: Rec[] }>(`/api/objects/${enc(objectId)}/${paths.ofObject}`).then((r) => r.items),
      enabled: objectId !== "",
    });
  const revisionsQuery = (id: string) =>
    queryOptions({
      queryKey: keys.revisions(id),
      queryFn: () => api.get<{ items: RevisionWithChanges<Rev>[] }>(`${paths.base}/${enc(id)}/revisions`).then((r) => r.items),
      enabled: id !== "",
    });
  /** `sends` is for the types only (what the mutations send); it is never set. */
  return { keys, paths, oneQuery, objectQuery, revisionsQuery, sends: undefined as { create: Create; data: D } | undefined };
}

/** After a write: the answer is the record now; lists of it, the object's history and the objects' registers are stale. */
export function useRevisionedSaved<Rec extends { id: string; objectId: string }>(e: {
  keys: { all: readonly unknown[] };
  oneQuery: (id: string) => { queryKey: readonly unknown[] };
}) {
  const qc = useQueryClient();
  return (r: Rec) => {
    qc.setQueryData(e.oneQuery(r.id).queryKey, r);
    qc.invalidateQueries({ queryKey: e.keys.all });
    qc.invalidateQueries({ queryKey: objectHistoryKey(r.objectId) });
    qc.invalidateQueries({ queryKey: rootKeys.objects });
  };
}

/** POST /api/objects/:id/<records>: a new draft. */
export function useCreateDraft<Rec extends { id: string; objectId: string }, Rev, Create, D>(e: RevisionedApi<Rec, Rev, Create, D>, objectId: string) {
  const done = useRevisionedSaved<Rec>(e);
  return useMutation({ mutationFn: (body: Create) => api.post<Rec>(`/api/objects/${enc(objectId)}/${e.paths.ofObject}`, body), onSuccess: done });
}

/** PUT <base>/:id: the draft rewritten, from the version it was read at. */
export function useUpdateDraft<Rec extends { id: string; objectId: string }, Rev, Create, D>(e: RevisionedApi<Rec, Rev, Create, D>, id: string) {
  const done = useRevisionedSaved<Rec>(e);
  return useMutation({ mutationFn: (body: Create & { version: number }) => api.put<Rec>(`${e.paths.base}/${enc(id)}`, body), onSuccess: done });
}

/** POST <base>/:id/<lock>: completes or signs the draft. */
export function useLock<Rec extends { id: string; objectId: string }, Rev, Create, D>(e: RevisionedApi<Rec, Rev, Create, D>, id: string) {
  const done = useRevisionedSaved<Rec>(e);
  return useMutation({ mutationFn: (version: number) => api.post<Rec>(`${e.paths.base}/${enc(id)}/${e.paths.lock}`, { version }), onSuccess: done });
}

/** POST <base>/:id/corrections: a new revision of a locked record, with its reason. */
export function useCorrect<Rec extends { id: string; objectId: string }, Rev, Create, D>(e: RevisionedApi<Rec, Rev, Create, D>, id: string) {
  const done = useRevisionedSaved<Rec>(e);
  return useMutation({ mutationFn: (body: Correction<D>) => api.post<Rec>(`${e.paths.base}/${enc(id)}/corrections`, body), onSuccess: done });
}

/**
 * The resolver of a revisioned record's form (react-hook-form): the body (`toBody` of the values) is
 * checked with the shared create schema; a correction must also say why, with the shared correction
 * schema's own rule and message. Either the parsed body with the trimmed reason, or every message at its field.
 */
export function revisionedResolver<V extends FieldValues & { correctionReason: string }, S extends z.ZodType>(
  schemas: { create: S; correction: z.ZodObject<{ correctionReason: z.ZodType<string> }> },
  toBody: (values: V) => unknown,
  correcting: boolean,
): Resolver<V, unknown, z.output<S> & { correctionReason: string }> {
  return async (values) => {
    const parsed = schemas.create.safeParse(toBody(values));
    const fields = parsed.success ? {} : issuesToFields(parsed.error.issues);
    const reason = schemas.correction.shape.correctionReason.safeParse(values.correctionReason);
    if (correcting && !reason.success) fields.correctionReason = reason.error.issues[0]?.message ?? "Say why this correction is made.";
    if (parsed.success && Object.keys(fields).length === 0)
      return {
        values: { ...(parsed.data as object), correctionReason: reason.success ? reason.data : values.correctionReason.trim() } as z.output<S> & { correctionReason: string },
        errors: {},
      };
    return { values: {}, errors: nestedErrors<V>(fields) };
  };
}

/** What a revisioned record's form is doing: a new draft, a draft rewritten in place, or a correction of a locked record. */
/** The revision a record's page shows: the one picked in its revisions list (once the list has loaded), else the current one. */
export const shownRevision = <C, R extends { revision: number }>(shown: number | null, revisions: R[] | undefined, current: C): C | R =>
  shown !== null && revisions ? (revisions.find((r) => r.revision === shown) ?? current) : current;

export type RevisionedFormMode = "new" | "draft" | "correct";

/** The mode from the page's path: …/new, …/:id/edit (a draft) or …/:id/correct. */
export const formModeOf = (pathname: string): RevisionedFormMode => (pathname.endsWith("/correct") ? "correct" : pathname.endsWith("/edit") ? "draft" : "new");

type Save<B, R> = { mutateAsync: (body: B) => Promise<R> };

/** Saves a revisioned form by its mode: the first draft, the draft from the version it was read at, or a correction with its reason. */
export function saveByMode<Rec, Create extends { data: D }, D>(
  mode: RevisionedFormMode,
  m: { create: Save<Create, Rec>; update: Save<Create & { version: number }, Rec>; correct: Save<Correction<D>, Rec> },
  body: Create,
  existing: { version: number } | undefined,
  correctionReason: string,
): Promise<Rec> {
  if (mode === "new") return m.create.mutateAsync(body);
  if (mode === "draft") return m.update.mutateAsync({ ...body, version: existing!.version });
  return m.correct.mutateAsync({ version: existing!.version, correctionReason, data: body.data });
}
