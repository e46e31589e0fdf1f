import { Main } from "@/components/ui";
import type { Metadata } from "next";
import { requirePageBuild } from "@/lib/page-access";
import { hourTotals, pageEntries } from "@/db/log";
import { encodeCursor, LOG_FIRST_SCREEN } from "@/lib/paging";
import { listLinkages } from "@/db/linkages";
import { BuildNav } from "@/components/BuildNav";
import { can } from "@/shared/roles";
import { LogScreen } from "./LogScreen";

export const metadata: Metadata = { title: "Build log" };

export default async function LogPage({ params }: { params: Promise<{ buildId: string }> }) {
  const { buildId } = await params;
  const { build, role } = await requirePageBuild(buildId, `/builds/${buildId}/log`);
  const [first, totals, linkages] = await Promise.all([pageEntries(build.id, {}, { limit: LOG_FIRST_SCREEN, after: null }), hourTotals(build.id), listLinkages(build.id)]);
  return (
    <>
      <BuildNav buildId={build.id} buildName={build.name} page="/log" />
      <Main className="mx-auto max-w-6xl p-6">
        <LogScreen buildId={build.id} canEdit={can(role, "edit")} initial={{ entries: first.items, total: first.total, nextCursor: encodeCursor(first.next), totals }} linkages={linkages.map((l) => ({ id: l.id, name: l.name, revision: l.revision }))} />
      </Main>
    </>
  );
}
