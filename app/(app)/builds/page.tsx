import Link from "next/link";
import type { Metadata } from "next";
import { requirePageUser } from "@/lib/page-access";
import { listBuildsForUser } from "@/db/builds";
import { Badge, Caution, EmptyState, Main } from "@/components/ui";
import { ROLE_LABEL } from "@/shared/roles";

export const metadata: Metadata = { title: "Builds" };

export default async function BuildsPage() {
  const user = await requirePageUser("/builds");
  const builds = await listBuildsForUser(user.id);
  return (
    <Main className="mx-auto max-w-5xl space-y-6 p-6">
      <div className="flex items-center justify-between">
        <h1 className="text-xl font-semibold">Your builds</h1>
        <Link href="/builds/new" className="rounded bg-ink px-3 py-1.5 font-medium text-white hover:bg-ink/90">New build</Link>
      </div>
      {builds.length === 0 ? (
        <EmptyState title="No builds yet" action={<Link href="/builds/new" className="rounded bg-ink px-3 py-1.5 font-medium text-white">Start your first build</Link>}>
          <p>
            A build is one aircraft. Inside it you draw each control run — stick or pedals, pushrods, bellcranks, horns — and
            record the hardware at every joint. Linkwright then works out the loads and flags a rod end without a locked jam
            nut, a bolt that could slip out, or a part rated below the load a pilot can put into it.
          </p>
          <p className="mt-2">Invited to someone else&apos;s build? Open the link from the invitation and it appears here.</p>
        </EmptyState>
      ) : (
        <ul className="grid gap-3 sm:grid-cols-2">
          {builds.map((b) => (
            <li key={b.id}>
              <Link href={`/builds/${b.id}`} className="block rounded-lg border border-ink/10 bg-white p-4 hover:border-advisory" data-testid="build-card">
                <div className="flex items-start justify-between gap-2">
                  <div>
                    <p className="font-semibold" data-testid="build-name">{b.name}</p>
                    <p className="text-ink-soft">{b.model || "Model not set"}{b.registration ? ` · ${b.registration}` : ""}</p>
                  </div>
                  <Badge>{ROLE_LABEL[b.role]}</Badge>
                </div>
                <p className="mt-3 text-xs text-ink-soft">
                  {b.linkageCount} linkage{b.linkageCount === 1 ? "" : "s"} · {b.memberCount} member{b.memberCount === 1 ? "" : "s"} · changed {new Date(b.updatedAt).toLocaleDateString("en-CA")}
                </p>
              </Link>
            </li>
          ))}
        </ul>
      )}
      <Caution />
    </Main>
  );
}
