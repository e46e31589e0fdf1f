/**
 * Which build tab is current (shared/build-sections.ts, drawn by components/BuildNav.tsx): every page of a build
 * names its own route, and exactly its tab is the page, or its section's tab is marked; a page with no tab marks none.
 */
import { existsSync, readdirSync, readFileSync, statSync } from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { BUILD_SECTIONS, sectionCurrent } from "@/shared/build-sections";

const BUILD = path.resolve(__dirname, "../../app/(app)/builds/[buildId]");

/** Every page.tsx under the build's folder, with its route under the build ("" for the overview). */
function pages(dir = BUILD): { route: string; text: string }[] {
  const out: { route: string; text: string }[] = [];
  const here = path.join(dir, "page.tsx");
  if (existsSync(here)) out.push({ route: path.relative(BUILD, dir).split(path.sep).filter(Boolean).map((s) => `/${s}`).join(""), text: readFileSync(here, "utf8") });
  for (const name of readdirSync(dir)) if (statSync(path.join(dir, name)).isDirectory()) out.push(...pages(path.join(dir, name)));
  return out;
}

const marks = (page: string) => BUILD_SECTIONS.map((s) => [s.label, sectionCurrent(s.href, page)] as const).filter(([, c]) => c);

describe("the current build tab", () => {
  it("each build page that draws the tabs passes its own route", () => {
    const drawn = pages().filter((p) => p.text.includes("<BuildNav"));
    expect(drawn.length).toBeGreaterThanOrEqual(10);
    for (const p of drawn) expect(p.text.match(/<BuildNav[^>]*\bpage="([^"]*)"/)?.[1], p.route || "(overview)").toBe(p.route);
  });

  it("marks the tab of the page, the section of a page under a tab, and nothing on a page without a tab", () => {
    expect(marks("")).toEqual([["Overview", "page"]]);
    expect(marks("/activity")).toEqual([]);
    expect(marks("/checklist")).toEqual([["Checklist", "page"]]);
    expect(marks("/checklist/[linkageId]")).toEqual([["Checklist", "true"]]);
    for (const s of BUILD_SECTIONS) expect(marks(s.href)).toEqual([[s.label, "page"]]);
  });
});
