/** The tabs of a build (components/BuildNav.tsx) and which of them a page is, or is under. */
export const BUILD_SECTIONS = [
  { href: "", label: "Overview" },
  { href: "/log", label: "Build log" },
  { href: "/files", label: "Files" },
  { href: "/hardware", label: "Hardware list" },
  { href: "/parts", label: "Parts library" },
  { href: "/checklist", label: "Checklist" },
  { href: "/members", label: "Members" },
  { href: "/settings", label: "Settings" },
] as const;

/**
 * A tab's aria-current on a page of the build, `page` being the page's route under the build ("" for the overview,
 * "/checklist/[linkageId]"): "page" on the tab that is this page, "true" on the tab of a section the page sits in
 * (a linkage's checklist under Checklist), nothing otherwise: a page with no tab of its own (Activity) marks none.
 */
export function sectionCurrent(href: string, page: string): "page" | "true" | undefined {
  if (page === href) return "page";
  if (href !== "" && page.startsWith(`${href}/`)) return "true";
  return undefined;
}
