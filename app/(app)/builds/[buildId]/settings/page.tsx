import type { Metadata } from "next";
import { requirePageBuild } from "@/lib/page-access";
import { BuildNav } from "@/components/BuildNav";
import { can } from "@/shared/roles";
import { settingsSchema } from "@/shared/analysis/types";
import { SettingsForm } from "./SettingsForm";

export const metadata: Metadata = { title: "Build settings" };

export default async function SettingsPage({ params }: { params: Promise<{ buildId: string }> }) {
  const { buildId } = await params;
  const { build, role } = await requirePageBuild(buildId, `/builds/${buildId}/settings`);
  return (
    <>
      <BuildNav buildId={build.id} buildName={build.name} current="/settings" />
      <main className="mx-auto max-w-4xl p-6">
        <SettingsForm
          buildId={build.id}
          canManage={can(role, "manage")}
          details={{ name: build.name, model: build.model, registration: build.registration ?? "" }}
          settings={settingsSchema.parse(build.analysisSettings ?? {})}
        />
      </main>
    </>
  );
}
