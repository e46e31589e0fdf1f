import Link from "next/link";
import { requirePageUser } from "@/lib/page-access";
import { Providers } from "@/components/Providers";
import { UserMenu } from "@/components/UserMenu";

export default async function AppLayout({ children }: { children: React.ReactNode }) {
  const user = await requirePageUser();
  return (
    <Providers>
      <header className="no-print sticky top-0 z-30 flex h-14 items-center justify-between border-b border-ink/10 bg-white px-4">
        <Link href="/builds" className="flex items-center gap-2 font-semibold tracking-tight">
          <svg width="22" height="22" viewBox="0 0 24 24" aria-hidden="true">
            <circle cx="5" cy="12" r="3" fill="none" stroke="currentColor" strokeWidth="2" />
            <circle cx="19" cy="12" r="3" fill="none" stroke="currentColor" strokeWidth="2" />
            <path d="M8 12h8" stroke="currentColor" strokeWidth="2.5" />
          </svg>
          Linkwright
        </Link>
        <UserMenu name={user.name} email={user.email} unitSystem={user.unitSystem} isSiteAdmin={user.isSiteAdmin} />
      </header>
      {children}
    </Providers>
  );
}
