import type { FieldErrors, FieldValues } from "react-hook-form";

/** Turns `{ "data.boards.window.grade": "…" }` into the nested errors react-hook-form expects. */
export function nestedErrors<T extends FieldValues>(flat: Record<string, string>): FieldErrors<T> {
  const out: Record<string, unknown> = {};
  for (const [path, message] of Object.entries(flat)) {
    const parts = path.split(".");
    let cur = out;
    parts.forEach((p, i) => {
      if (i === parts.length - 1) cur[p] = { type: "validate", message };
      else cur = (cur[p] ??= {}) as Record<string, unknown>;
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
