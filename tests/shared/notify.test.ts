/**
 * The review e-mail choice (shared/notify.ts) as the editor's side panel shows it: the select's options are short
 * enough to show whole in the 360 px panel at 12 px (about 45 characters fit beside the arrow; the old first option,
 * 58 characters, was cut off at 1440 px), and the full sentence of each choice is there for the line under it.
 */
import { describe, expect, it } from "vitest";
import { NOTIFY_LABEL, NOTIFY_PREFS, NOTIFY_SHORT } from "@/shared/notify";

describe("review e-mail choice", () => {
  it("has a short option and a full sentence for every choice", () => {
    for (const p of NOTIFY_PREFS) {
      expect(NOTIFY_SHORT[p].length, p).toBeLessThanOrEqual(36);
      expect(NOTIFY_LABEL[p].length, p).toBeGreaterThanOrEqual(NOTIFY_SHORT[p].length);
      expect(NOTIFY_LABEL[p], p).not.toMatch(/\.$/); // the panel adds the full stop
    }
    expect(new Set(NOTIFY_PREFS.map((p) => NOTIFY_SHORT[p])).size).toBe(NOTIFY_PREFS.length);
  });
});
