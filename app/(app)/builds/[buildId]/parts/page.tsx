import { Main } from "@/components/ui";
import type { Metadata } from "next";
import Link from "next/link";
import { requirePageBuild } from "@/lib/page-access";
import { BuildNav } from "@/components/BuildNav";
import { PartsLibrary } from "@/components/records/PartsLibrary";
import { can } from "@/shared/roles";

export const metadata: Metadata = { title: "Parts library" };

export default async function BuildPartsPage({ params }: { params: Promise<{ buildId: string }> }) {
  const { buildId } = await params;
  const { build, role } = await requirePageBuild(buildId, `/builds/${buildId}/parts`);
  return (
    <>
      <BuildNav buildId={build.id} buildName={build.name} page="/parts" extra={<Link href="/parts" className="text-sm text-ink-soft hover:underline">My parts →</Link>} />
      <Main className="mx-auto max-w-6xl p-6">
        <PartsLibrary apiBase={`/api/builds/${build.id}/parts`} canEdit={can(role, "edit")} title="Parts library" intro="The parts bought for this aircraft, shared by its members. Suggestions on a joint draw from this library and from each member's own." />
      </Main>
    </>
  );
}
