/**
 * The activity list's words (shared/activity.ts): every action the code records has words of its own, so the page
 * never shows a code such as "linkage.picture"; and an event names the linkage or entry it was about when it can.
 */
import { readdirSync, readFileSync, statSync } from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { ACTION_TEXT, activityText } from "@/shared/activity";

const ROOT = path.resolve(__dirname, "../..");

function sources(dir: string): string[] {
  const out: string[] = [];
  for (const name of readdirSync(dir)) {
    if (name === "node_modules" || name === "migrations" || name.startsWith(".")) continue;
    const p = path.join(dir, name);
    if (statSync(p).isDirectory()) out.push(...sources(p));
    else if (/\.(ts|tsx)$/.test(name)) out.push(p);
  }
  return out;
}

/** Every action code written by an audit call or an audit_events insert: the quoted codes in an `action:` value. */
function writtenActions(): Map<string, string> {
  const found = new Map<string, string>();
  for (const file of ["db", "lib", "app"].flatMap((d) => sources(path.join(ROOT, d)))) {
    const text = readFileSync(file, "utf8");
    if (!/\baudit\(|audit_events/.test(text)) continue;
    for (const m of text.matchAll(/\baction:\s*([^\n]*?)(?:,\s*detail\b|\s*\}\s*[,)])/g)) {
      for (const code of m[1].matchAll(/["'`]([a-z]+\.[a-z-]+)["'`]/g)) found.set(code[1], path.relative(ROOT, file));
    }
  }
  return found;
}

describe("activity wording", () => {
  it("finds the actions the code writes (the scan itself works)", () => {
    const written = writtenActions();
    for (const code of ["checklist.tick", "hardware.state", "joint.photo", "linkage.picture", "log.create", "file.delete", "build.delete", "comment.reply", "comment.create", "demo.seed"]) {
      expect(written.has(code), code).toBe(true);
    }
  });

  it("has words for every action the code writes", () => {
    const missing = [...writtenActions()].filter(([code]) => !ACTION_TEXT[code]).map(([code, file]) => `${code} (${file})`);
    expect(missing).toEqual([]);
  });

  it("never shows a code, even for an action it does not know", () => {
    for (const code of Object.keys(ACTION_TEXT)) expect(activityText(code, {})).not.toMatch(/[a-z]\.[a-z]/);
    expect(activityText("something.new", {})).toBe("did something in this build");
  });

  it("names the linkage added, deleted or renamed, and the log entry written, when the event has it", () => {
    expect(activityText("linkage.create", { linkageId: "x", name: "Pitch — stick to elevator" })).toBe("added the linkage “Pitch — stick to elevator”");
    expect(activityText("linkage.delete", { linkageId: "x", name: "Old yaw run" })).toBe("deleted the linkage “Old yaw run”");
    expect(activityText("linkage.delete", { linkageId: "x" })).toBe("deleted a linkage"); // recorded before the name was kept
    expect(activityText("linkage.update", { linkageId: "x", name: "Roll" })).toBe("renamed a linkage to “Roll”");
    expect(activityText("log.create", { entryId: "e", title: "Fitted the aft pushrod" })).toBe("wrote the log entry “Fitted the aft pushrod”");
    expect(activityText("checklist.tick", { ticked: true })).toBe("ticked a checklist item");
    expect(activityText("checklist.tick", { ticked: false })).toBe("cleared a checklist tick");
    expect(activityText("linkage.picture", { revision: 1 })).toBe("kept a picture of a linkage (revision 1) for the log");
  });
});
