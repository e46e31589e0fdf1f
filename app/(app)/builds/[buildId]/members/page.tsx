import { Main } from "@/components/ui";
import type { Metadata } from "next";
import { requirePageBuild } from "@/lib/page-access";
import { listInvitations, listMembers } from "@/db/builds";
import { BuildNav } from "@/components/BuildNav";
import { can } from "@/shared/roles";
import { MembersManager } from "./MembersManager";

export const metadata: Metadata = { title: "Members" };

export default async function MembersPage({ params }: { params: Promise<{ buildId: string }> }) {
  const { buildId } = await params;
  const { build, role, user } = await requirePageBuild(buildId, `/builds/${buildId}/members`);
  const manage = can(role, "manage");
  const [members, invitations] = await Promise.all([listMembers(build.id), manage ? listInvitations(build.id) : Promise.resolve([])]);
  return (
    <>
      <BuildNav buildId={build.id} buildName={build.name} page="/members" />
      <Main className="mx-auto max-w-4xl space-y-4 p-6">
        <div>
          <h1 className="text-xl font-semibold">Members</h1>
          <p className="text-ink-soft">Who works on this build and what each may do.{manage ? "" : " Only the build's owner adds people or changes their roles."}</p>
        </div>
        <MembersManager buildId={build.id} me={user.id} canManage={manage} initialMembers={members} initialInvitations={invitations} />
      </Main>
    </>
  );
}
