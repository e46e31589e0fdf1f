import type { Metadata } from "next";
import { requirePageBuild } from "@/lib/page-access";
import { BuildNav } from "@/components/BuildNav";
import { can, ROLE_LABEL } from "@/shared/roles";
import { settingsSchema } from "@/shared/analysis/types";
import { SettingsForm } from "./SettingsForm";
import { Card, Main } from "@/components/ui";
import { ExportButton } from "@/components/records/ExportButton";

export const metadata: Metadata = { title: "Build settings" };

export default async function SettingsPage({ params }: { params: Promise<{ buildId: string }> }) {
  const { buildId } = await params;
  const { build, role } = await requirePageBuild(buildId, `/builds/${buildId}/settings`);
  return (
    <>
      <BuildNav buildId={build.id} buildName={build.name} page="/settings" />
      <Main className="mx-auto max-w-4xl space-y-6 p-6">
        <div>
          <h1 className="text-xl font-semibold">Build settings</h1>
          <p className="text-ink-soft">The build&apos;s details, and the design loads and factors every linkage is checked with.</p>
          {can(role, "manage") ? null : (
            <p role="note" className="mt-3 rounded border border-ink/15 bg-white px-3 py-2 text-sm" data-testid="settings-read-only">
              <strong className="font-semibold">Read only.</strong> Only the build&apos;s owner can change these settings; as a {ROLE_LABEL[role].toLowerCase()} you see the values in use.
            </p>
          )}
        </div>
        {can(role, "manage") ? (
          <Card title="Keep a copy of the whole build">
            <p className="mb-2 text-ink-soft">
              One archive (.tar) with the build log as a PDF, every linkage as a file with its checklist, every photo and document
              as uploaded, and the hardware list as CSV — the record to keep beside the aircraft&apos;s papers. It is made in the
              background; you can leave this page and the link comes by e-mail.
            </p>
            <ExportButton buildId={build.id} kind="build-archive" params={{}} testId="build-archive">Make the archive</ExportButton>
          </Card>
        ) : null}
        <SettingsForm
          buildId={build.id}
          canManage={can(role, "manage")}
          details={{ name: build.name, model: build.model, registration: build.registration ?? "" }}
          settings={settingsSchema.parse(build.analysisSettings ?? {})}
        />
      </Main>
    </>
  );
}
