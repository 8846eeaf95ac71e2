/** A change between two versions of a record: a dotted path and the values before and after. */
export type Change = { path: string; before: unknown; after: unknown };

const isObject = (v: unknown): v is Record<string, unknown> => typeof v === "object" && v !== null && !Array.isArray(v);

/** Every leaf that differs between `before` and `after`, in a stable order. Arrays of objects compare item by item. */
export function diffValues(before: unknown, after: unknown, path = ""): Change[] {
  if (Object.is(before, after)) return [];
  if (isObject(before) && isObject(after)) {
    const keys = [...new Set([...Object.keys(before), ...Object.keys(after)])].sort();
    return keys.flatMap((k) => diffValues(before[k], after[k], path ? `${path}.${k}` : k));
  }
  if (Array.isArray(before) && Array.isArray(after)) {
    const n = Math.max(before.length, after.length);
    return Array.from({ length: n }, (_, i) => diffValues(before[i], after[i], `${path}.${i}`)).flat();
  }
  const norm = (v: unknown) => (v === undefined ? null : v);
  if (JSON.stringify(norm(before)) === JSON.stringify(norm(after))) return [];
  return [{ path, before: norm(before), after: norm(after) }];
}
