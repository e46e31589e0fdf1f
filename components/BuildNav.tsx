import Link from "next/link";
import { BUILD_SECTIONS, sectionCurrent } from "@/shared/build-sections";

export { BUILD_SECTIONS };

/**
 * The build's name and its tabs. The tabs wrap onto a second row when the screen is narrow (a phone, a tablet), so
 * every tab shows its whole name and none hides off the edge. `extra` (the role badge, a link) sits beside the
 * build's name, where it has room at any width. `page` is the page's route under the build ("", "/activity",
 * "/checklist/[linkageId]"): the tab that is that page, or the section it sits in, is marked current.
 */
export function BuildNav({ buildId, buildName, page, extra }: { buildId: string; buildName: string; page: string; extra?: React.ReactNode }) {
  return (
    <div className="no-print border-b border-ink/10 bg-white px-4 sm:px-6">
      <div className="mx-auto max-w-6xl pt-3">
        <div className="flex flex-wrap items-end justify-between gap-x-4 gap-y-1">
          <div className="min-w-0">
            <Link href="/builds" className="text-xs text-ink-soft hover:underline">Builds</Link>
            <p className="break-words text-lg font-semibold leading-tight">{buildName}</p>
          </div>
          {extra ? <div className="shrink-0">{extra}</div> : null}
        </div>
        <nav aria-label="Build sections" className="-mx-2 mt-2 flex flex-wrap sm:-mx-1 sm:gap-x-1">
          {BUILD_SECTIONS.map((s) => {
            const current = sectionCurrent(s.href, page);
            return (
            <Link
              key={s.href}
              href={`/builds/${buildId}${s.href}`}
              aria-current={current}
              className={`flex min-h-11 items-center whitespace-nowrap border-b-2 px-2 text-sm sm:px-3 sm:text-base ${current ? "border-ink font-semibold" : "border-transparent text-ink-soft hover:text-ink"}`}
            >
              {s.label}
            </Link>
            );
          })}
        </nav>
      </div>
    </div>
  );
}
