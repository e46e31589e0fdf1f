import Link from "next/link";
import { TabScroller } from "./TabScroller";

/** Tabs of a build. */
export const BUILD_SECTIONS: { href: string; label: string }[] = [
  { href: "", label: "Overview" },
  { href: "/log", label: "Build log" },
  { href: "/files", label: "Files" },
  { href: "/hardware", label: "Hardware list" },
  { href: "/parts", label: "Parts library" },
  { href: "/checklist", label: "Checklist" },
  { href: "/members", label: "Members" },
  { href: "/settings", label: "Settings" },
];

export function BuildNav({ buildId, buildName, current, extra }: { buildId: string; buildName: string; current: string; extra?: React.ReactNode }) {
  return (
    <div className="no-print border-b border-ink/10 bg-white px-4 sm:px-6">
      <div className="mx-auto flex max-w-6xl flex-wrap items-end justify-between gap-x-4 pt-3">
        {/* min-w-0: the tabs scroll inside their own bar instead of widening the page on a phone */}
        <div className="min-w-0 max-w-full flex-1">
          <Link href="/builds" className="text-xs text-ink-soft hover:underline">Builds</Link>
          <p className="text-lg font-semibold leading-tight">{buildName}</p>
          <nav id="build-tabs" aria-label="Build sections" className="tab-scroll -mx-1 mt-2 flex gap-1 overflow-x-auto px-1">
            {BUILD_SECTIONS.map((s) => (
              <Link
                key={s.href}
                href={`/builds/${buildId}${s.href}`}
                aria-current={current === s.href ? "page" : undefined}
                className={`flex min-h-11 shrink-0 items-center whitespace-nowrap border-b-2 px-3 ${current === s.href ? "border-ink font-semibold" : "border-transparent text-ink-soft hover:text-ink"}`}
              >
                {s.label}
              </Link>
            ))}
          </nav>
          <TabScroller navId="build-tabs" />
        </div>
        <div className="pb-2">{extra}</div>
      </div>
    </div>
  );
}
