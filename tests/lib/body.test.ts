/** The JSON checks of lib/body.ts on their own: one pass for depth, a walk without recursion for bad strings. */
import { describe, expect, it } from "vitest";
import { badStringIn, MAX_JSON_DEPTH, nestsDeeperThan, parseJsonText } from "@/lib/body";

describe("nestsDeeperThan", () => {
  it("counts brackets outside strings only, escapes included", () => {
    expect(nestsDeeperThan("[[1]]", 2)).toBe(false);
    expect(nestsDeeperThan("[[[1]]]", 2)).toBe(true);
    expect(nestsDeeperThan('["[[[[", {"a": "\\"[[["}]', 2)).toBe(false);
    expect(nestsDeeperThan('{"a\\\\": [[[1]]]}', 3)).toBe(true); // the escaped backslash ends the key
  });
  it("siblings do not add up", () => {
    expect(nestsDeeperThan("[" + "[],".repeat(10_000) + "[]]", 2)).toBe(false);
  });
});

describe("parseJsonText", () => {
  it("refuses a million levels without parsing them", () => {
    expect(() => parseJsonText("[".repeat(1_000_000) + "]".repeat(1_000_000))).toThrow(/nested too deeply/);
  });
  it(`reads ${MAX_JSON_DEPTH} levels`, () => {
    expect(parseJsonText("[".repeat(MAX_JSON_DEPTH) + "]".repeat(MAX_JSON_DEPTH))).toBeTruthy();
  });
  it("names the field holding a NUL or a lone surrogate, a key's problem at `_`", () => {
    const fields = (text: string) => {
      try {
        parseJsonText(text);
        return null;
      } catch (e) {
        return (e as { fields?: Record<string, string> }).fields ?? null;
      }
    };
    expect(fields('{"a":{"b":["ok","x\\u0000"]}}')).toEqual({ "a.b.1": "must not contain NUL characters" });
    expect(Object.keys(fields('{"a":"\\ud800"}')!)).toEqual(["a"]);
    expect(Object.keys(fields('{"a":"\\udc00\\ud800"}')!)).toEqual(["a"]); // reversed pair: both halves alone
    expect(Object.keys(fields('{"a":{"\\udfff":1}}')!)).toEqual(["a._"]);
    expect(fields('{"a":"\\ud83d\\ude80 and \\\\u0000 as text"}')).toBeNull();
  });
});

describe("badStringIn", () => {
  it("walks a value nested 200,000 deep without running out of stack", () => {
    let v: unknown = "x\u0000";
    for (let i = 0; i < 200_000; i++) v = [v];
    expect(badStringIn(v)?.path.split(".").length).toBe(200_000);
  });
});
