import { Main } from "@/components/ui";
import type { Metadata } from "next";
import { requirePageBuild } from "@/lib/page-access";
import { buildHardware, listedHardware } from "@/db/hardware";
import { USED_IN_SHOWN } from "@/shared/schemas/hardware";
import { BuildNav } from "@/components/BuildNav";
import { can } from "@/shared/roles";
import { HardwareTable } from "./HardwareTable";

export const metadata: Metadata = { title: "Hardware list" };

export default async function HardwarePage({ params }: { params: Promise<{ buildId: string }> }) {
  const { buildId } = await params;
  const { build, role } = await requirePageBuild(buildId, `/builds/${buildId}/hardware`);
  const lines = listedHardware(await buildHardware(build.id), USED_IN_SHOWN);
  return (
    <>
      <BuildNav buildId={build.id} buildName={build.name} page="/hardware" />
      <Main className="mx-auto max-w-6xl p-6">
        <HardwareTable buildId={build.id} canEdit={can(role, "edit")} initial={lines} />
      </Main>
    </>
  );
}
