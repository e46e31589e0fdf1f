import { describe, expect, it } from "vitest";
import { pagedItems } from "@/components/paged-items";

/*
 * A paged list's items feed TanStack tables (the parts libraries). A new array on every render made the table
 * rebuild its rows and reset its page index, a state change, so the page re-rendered without end: the items
 * must be the same array for as long as the loaded pages are.
 */
describe("the items of a paged list", () => {
  const page1 = { parts: [{ id: "a" }, { id: "b" }], total: 3, nextCursor: "c1" };
  const page2 = { parts: [{ id: "c" }], total: 3, nextCursor: null };

  it("lays the pages' items end to end, in order", () => {
    expect(pagedItems<{ id: string }>([page1, page2], "parts").map((p) => p.id)).toEqual(["a", "b", "c"]);
    expect(pagedItems([{ total: 0, nextCursor: null }], "parts")).toEqual([]);
  });

  it("gives back the same array for the same pages, render after render", () => {
    const pages = [page1, page2];
    const first = pagedItems(pages, "parts");
    expect(pagedItems(pages, "parts")).toBe(first);
    expect(pagedItems(pages, "parts")).toBe(first);
  });

  it("gives back one shared empty array while nothing is loaded", () => {
    expect(pagedItems(undefined, "parts")).toBe(pagedItems(undefined, "parts"));
    expect(pagedItems([], "parts")).toBe(pagedItems(undefined, "parts"));
    expect(Object.isFrozen(pagedItems(undefined, "parts"))).toBe(true);
  });

  it("gives a new array once a page is added or replaced, and keeps lists of other names apart", () => {
    const one = [page1];
    const two = [page1, page2];
    expect(pagedItems(two, "parts")).not.toBe(pagedItems(one, "parts"));
    expect(pagedItems(two, "parts")).toHaveLength(3);
    expect(pagedItems([{ ...page1, parts: [{ id: "z" }] }], "parts")).toEqual([{ id: "z" }]);
    expect(pagedItems(two, "files")).toEqual([]);
    expect(pagedItems(two, "files")).toBe(pagedItems(two, "files"));
  });
});
