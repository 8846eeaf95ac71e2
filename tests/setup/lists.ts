/**
 * Typed reads from a list for tests: each throws a message naming what was missing, where `list[0]`
 * would hand back `undefined` and fail later somewhere less clear.
 */

/** The first item; throws when the list is empty. */
export function first<T>(list: readonly T[], what = "the list"): T {
  if (list.length === 0) throw new Error(`Expected at least one item in ${what}, found none`);
  return list[0] as T;
}

/** The only item; throws unless the list holds exactly one. */
export function only<T>(list: readonly T[], what = "the list"): T {
  if (list.length !== 1) throw new Error(`Expected exactly one item in ${what}, found ${list.length}: ${JSON.stringify(list).slice(0, 500)}`);
  return list[0] as T;
}

/** The item at `index` (negative counts from the end); throws when there is none. */
export function at<T>(list: readonly T[], index: number, what = "the list"): T {
  const i = index < 0 ? list.length + index : index;
  if (i < 0 || i >= list.length) throw new Error(`Expected an item at ${index} in ${what}, which holds ${list.length}`);
  return list[i] as T;
}

/** The value, or a clear failure when it is null or undefined (a row that should be there, a regex match). */
export function present<T>(value: T | null | undefined, what = "the value"): T {
  if (value === null || value === undefined) throw new Error(`Expected ${what} to be there, got ${value}`);
  return value;
}
