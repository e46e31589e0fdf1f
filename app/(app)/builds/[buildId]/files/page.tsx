import { Main } from "@/components/ui";
import type { Metadata } from "next";
import { requirePageBuild } from "@/lib/page-access";
import { pageFiles } from "@/db/files";
import { linkageNames } from "@/db/linkages";
import { encodeCursor, PAGE_DEFAULT } from "@/lib/paging";
import { BuildNav } from "@/components/BuildNav";
import { FilesScreen } from "./FilesScreen";

export const metadata: Metadata = { title: "Files" };

export default async function FilesPage({ params }: { params: Promise<{ buildId: string }> }) {
  const { buildId } = await params;
  const { build } = await requirePageBuild(buildId, `/builds/${buildId}/files`);
  const [first, linkages] = await Promise.all([pageFiles(build.id, undefined, { limit: PAGE_DEFAULT, after: null }), linkageNames(build.id)]);
  return (
    <>
      <BuildNav buildId={build.id} buildName={build.name} page="/files" />
      <Main className="mx-auto max-w-6xl p-6">
        <FilesScreen buildId={build.id} linkages={linkages} first={{ files: first.items, total: first.total, nextCursor: encodeCursor(first.next) }} />
      </Main>
    </>
  );
}
