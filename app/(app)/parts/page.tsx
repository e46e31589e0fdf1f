import { Main } from "@/components/ui";
import type { Metadata } from "next";
import Link from "next/link";
import { requirePageUser } from "@/lib/page-access";
import { PartsLibrary } from "@/components/records/PartsLibrary";

export const metadata: Metadata = { title: "My parts" };

export default async function MyPartsPage() {
  await requirePageUser("/parts");
  return (
    <Main className="mx-auto max-w-6xl p-6">
      <Link href="/builds" className="text-xs text-ink-soft hover:underline">Builds</Link>
      <PartsLibrary apiBase="/api/parts" canEdit title="My parts" intro="Your own library, with you in every build: suggestions on any joint look here as well as in the build's library." />
    </Main>
  );
}
