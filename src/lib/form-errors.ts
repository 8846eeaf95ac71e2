import { useState } from "react";
import type { FieldErrors, FieldValues, Path, UseFormSetError } from "react-hook-form";
import { type ApiError, toApiError } from "./api-client.ts";

/** Turns `{ "data.boards.window.grade": "…" }` into the nested errors react-hook-form expects. */
export function nestedErrors<T extends FieldValues>(flat: Record<string, string>): FieldErrors<T> {
  const out: Record<string, unknown> = {};
  for (const [path, message] of Object.entries(flat)) {
    const parts = path.split(".");
    let cur = out;
    parts.forEach((p, i) => {
      if (i === parts.length - 1) cur[p] = { type: "validate", message };
      else {
        cur[p] ??= {};
        cur = cur[p] as Record<string, unknown>;
      }
    });
  }
  return out as FieldErrors<T>;
}

/** The message at a dotted path of react-hook-form's errors, if any. */
export function errorAt(errors: unknown, path: string): string | undefined {
  let cur: unknown = errors;
  for (const p of path.split(".")) cur = (cur as Record<string, unknown> | undefined)?.[p];
  return (cur as { message?: string } | undefined)?.message;
}

/**
 * Saving a react-hook-form form: `run` clears the last error, awaits the save and, when it fails, keeps
 * the error (for the notice above the form) and puts the server's field messages beside their fields.
 * The values stay exactly as typed. `accept` limits the messages to paths the form has a field for;
 * `focus` moves to the first one.
 */
export function useServerErrors<T extends FieldValues>(form: { setError: UseFormSetError<T> }, opts: { accept?: (path: string) => boolean; focus?: boolean } = {}) {
  const [error, setError] = useState<ApiError | null>(null);
  async function run<R>(save: () => Promise<R>): Promise<R | undefined> {
    setError(null);
    try {
      return await save();
    } catch (err) {
      const apiError = toApiError(err);
      setError(apiError);
      for (const [path, message] of Object.entries(apiError.fields)) {
        if (!opts.accept || opts.accept(path)) form.setError(path as Path<T>, { type: "server", message }, { shouldFocus: opts.focus ?? false });
      }
      return undefined;
    }
  }
  return { error, run, clear: () => setError(null) };
}
