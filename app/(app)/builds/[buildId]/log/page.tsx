import type { Metadata } from "next";
import { requirePageBuild } from "@/lib/page-access";
import { hourTotals, listEntries } from "@/db/log";
import { listLinkages } from "@/db/linkages";
import { BuildNav } from "@/components/BuildNav";
import { can } from "@/shared/roles";
import { LogScreen } from "./LogScreen";

export const metadata: Metadata = { title: "Build log" };

export default async function LogPage({ params }: { params: Promise<{ buildId: string }> }) {
  const { buildId } = await params;
  const { build, role } = await requirePageBuild(buildId, `/builds/${buildId}/log`);
  const [entries, totals, linkages] = await Promise.all([listEntries(build.id), hourTotals(build.id), listLinkages(build.id)]);
  return (
    <>
      <BuildNav buildId={build.id} buildName={build.name} current="/log" />
      <main className="mx-auto max-w-6xl p-6">
        <LogScreen buildId={build.id} canEdit={can(role, "edit")} initial={{ entries, totals }} linkages={linkages.map((l) => ({ id: l.id, name: l.name, revision: l.revision }))} />
      </main>
    </>
  );
}
