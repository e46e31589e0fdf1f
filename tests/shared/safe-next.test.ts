// Where a person goes after signing in: a path on this site, never another origin (an open redirect).
import { describe, expect, it } from "vitest";
import { NEXT_FALLBACK, safeNext } from "@/shared/safe-next";

describe("the next page after signing in", () => {
  it("keeps a path on this site, with its query and fragment", () => {
    expect(safeNext("/builds/123/linkages/abc?select=j-1#x")).toBe("/builds/123/linkages/abc?select=j-1#x");
    expect(safeNext("/invite/tok")).toBe("/invite/tok");
    expect(safeNext("/")).toBe("/");
  });

  it("sends anything a browser could read as another origin to the builds list", () => {
    for (const bad of [
      "//evil.example", "/\\evil.example", "/\\/evil.example", "\\\\evil.example", "/\t/evil.example", "/%09/evil.example".replace("%09", "\t"),
      "/\n/evil.example", "https://evil.example/", "http:/evil.example", "javascript:alert(1)", "evil.example", "", " /builds", "/builds\\..\\x",
    ]) expect(safeNext(bad), JSON.stringify(bad)).toBe(NEXT_FALLBACK);
    expect(safeNext(undefined)).toBe(NEXT_FALLBACK);
    expect(safeNext(["/a", "/b"])).toBe(NEXT_FALLBACK);
    expect(safeNext(`/${"a".repeat(3000)}`)).toBe(NEXT_FALLBACK);
  });

  it("leaves an encoded tab as it is: it stays inside the path, the browser does not drop it", () => {
    expect(safeNext("/%09/evil.example")).toBe("/%09/evil.example");
    expect(new URL(safeNext("/%09/evil.example"), "http://here.test").origin).toBe("http://here.test");
  });
});
