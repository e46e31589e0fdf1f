/**
 * The items of a paged list, its pages' arrays laid end to end. The same `pages` array (react-query keeps it
 * while nothing changes) always gives back the same items array: a table fed these items sees new data only
 * when a page really changed. A new array on every render made TanStack Table rebuild its rows and reset its
 * page index (a state change) on every render, which re-rendered the list forever.
 */
const EMPTY: readonly never[] = Object.freeze([]);
const flattened = new WeakMap<readonly object[], Map<string, readonly unknown[]>>();

export function pagedItems<T>(pages: readonly Record<string, unknown>[] | undefined, name: string): readonly T[] {
  if (!pages || pages.length === 0) return EMPTY;
  let byName = flattened.get(pages);
  if (!byName) flattened.set(pages, (byName = new Map()));
  let items = byName.get(name);
  if (!items) byName.set(name, (items = pages.flatMap((p) => (p[name] as T[] | undefined) ?? [])));
  return items as readonly T[];
}
