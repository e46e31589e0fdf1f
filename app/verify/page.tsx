import type { Metadata } from "next";
import { Caution, Main } from "@/components/ui";
import { VerifyForm } from "./VerifyForm";

export const metadata: Metadata = { title: "Check a revision record" };

/** Public: an inspector checks a revision record PDF (or its printed fingerprint) against the signed revisions. */
export default function VerifyPage() {
  return (
    <Main className="mx-auto max-w-xl space-y-4 p-6">
      <div>
        <p className="text-xs font-semibold uppercase tracking-wide text-ink-soft">Linkwright</p>
        <h1 className="text-xl font-semibold">Check a revision record</h1>
        <p className="text-ink-soft">
          A revision record is the PDF a reviewer&apos;s sign-off produces. Upload it, or type the fingerprint printed near its top, to see whether it
          matches a signed-off revision here and whether that sign-off still covers the linkage as it is today. The file is read, not kept.
        </p>
      </div>
      <VerifyForm />
      <Caution />
    </Main>
  );
}
