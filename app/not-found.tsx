import { Main } from "@/components/ui";
import Link from "next/link";

export default function NotFound() {
  return (
    <Main className="mx-auto max-w-md p-10 text-center">
      <h1 className="text-lg font-semibold">Not here</h1>
      <p className="mt-2 text-ink-soft">This page does not exist, or it belongs to a build you are not a member of.</p>
      <Link className="mt-4 inline-block text-advisory underline" href="/builds">Back to your builds</Link>
    </Main>
  );
}
