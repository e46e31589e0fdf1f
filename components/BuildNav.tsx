import Link from "next/link";

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
    <div className="no-print border-b border-ink/10 bg-white px-6">
      <div className="mx-auto flex max-w-6xl items-end justify-between gap-4 pt-3">
        <div>
          <Link href="/builds" className="text-xs text-ink-soft hover:underline">Builds</Link>
          <p className="text-lg font-semibold leading-tight">{buildName}</p>
          <nav aria-label="Build sections" className="mt-2 flex gap-1 overflow-x-auto">
            {BUILD_SECTIONS.map((s) => (
              <Link
                key={s.href}
                href={`/builds/${buildId}${s.href}`}
                aria-current={current === s.href ? "page" : undefined}
                className={`border-b-2 px-3 py-1.5 ${current === s.href ? "border-ink font-semibold" : "border-transparent text-ink-soft hover:text-ink"}`}
              >
                {s.label}
              </Link>
            ))}
          </nav>
        </div>
        <div className="pb-2">{extra}</div>
      </div>
    </div>
  );
}
