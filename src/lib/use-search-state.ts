import { useEffect, useMemo, useState } from "react";
import { useSearchParams } from "react-router";
import type { z } from "zod";
import { useDebounced } from "./use-debounced.ts";

type AnyObject = z.ZodObject<z.ZodRawShape>;
type Key<S extends AnyObject> = keyof z.output<S> & string;
export type SearchChanges<S extends AnyObject> = Partial<Record<Key<S>, string | number | undefined>>;

/**
 * A list page's state in its URL. Each parameter is read with its field of the list's zod schema (the
 * shared list query, or a page's pick of it): a value the field refuses is as if it were not there, so
 * the field's default (or nothing) applies and one bad parameter never empties the page.
 * `names` gives a field a shorter name in the address (e.g. `objectType` as `type`).
 *
 * `set` writes changes back (an empty value removes the parameter), replacing the history entry, and
 * sends the list back to its first page: `resetPage` names the page field to clear (null for none).
 */
export function useSearchState<S extends AnyObject>(schema: S, opts: { names?: Partial<Record<Key<S>, string>>; resetPage?: Key<S> | null } = {}) {
  const [params, setParams] = useSearchParams();
  const urlName = (key: string) => opts.names?.[key as Key<S>] ?? key;
  // The names arrive as a fresh object on each render; their content is what the state depends on.
  const namesKey = JSON.stringify(opts.names ?? {});

  const state = useMemo(() => {
    const names = JSON.parse(namesKey) as Record<string, string>;
    const out: Record<string, unknown> = {};
    for (const [key, field] of Object.entries(schema.shape) as [string, z.ZodType][]) {
      const parsed = field.safeParse(params.get(names[key] ?? key) ?? undefined);
      out[key] = parsed.success ? parsed.data : field.safeParse(undefined).data;
    }
    return out as z.output<S>;
  }, [params, schema, namesKey]);

  const defaultReset = opts.resetPage === undefined ? ("page" in schema.shape ? "page" : null) : opts.resetPage;
  const set = (changes: SearchChanges<S>, resetPage: Key<S> | null = defaultReset as Key<S> | null) => {
    setParams(
      (prev) => {
        const next = new URLSearchParams(prev);
        for (const [key, v] of Object.entries(changes)) v !== undefined && v !== "" ? next.set(urlName(key), String(v)) : next.delete(urlName(key));
        if (resetPage) next.delete(urlName(resetPage));
        return next;
      },
      { replace: true },
    );
  };

  return { state, set };
}

/** A search box over a URL parameter: typed freely, written to the address once typing pauses. */
export function useSearchText(inUrl: string | undefined, write: (text: string | undefined) => void) {
  const [text, setText] = useState(inUrl ?? "");
  const debounced = useDebounced(text.trim());
  // biome-ignore lint/correctness/useExhaustiveDependencies: runs when the typed text settles, reading the address as it is then; a change of address alone (going back) must not write the old text over it
  useEffect(() => {
    if ((inUrl ?? "") !== debounced) write(debounced || undefined);
  }, [debounced]);
  return { text, setText, debounced };
}
