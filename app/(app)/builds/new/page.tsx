import { Main } from "@/components/ui";
import type { Metadata } from "next";
import { NewBuildForm } from "./NewBuildForm";

export const metadata: Metadata = { title: "New build" };

export default function NewBuildPage() {
  return (
    <Main className="mx-auto max-w-lg space-y-4 p-6">
      <h1 className="text-xl font-semibold">New build</h1>
      <p className="text-ink-soft">One build per aircraft. You become its owner and can invite builders, reviewers and viewers.</p>
      <NewBuildForm />
    </Main>
  );
}
