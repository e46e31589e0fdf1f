"use client";
import { useRouter } from "next/navigation";
import { startTransition } from "react";
import { DB_UNAVAILABLE_DIGEST, DB_UNAVAILABLE_MESSAGE } from "@/shared/unavailable";

/**
 * A page that failed on the server. In production the browser is told no server message, only a digest:
 * the database not answering carries its own (db/unavailable.ts), so it is named, with a way to try again.
 * The page's status stays 500: an error boundary cannot set it (the API answers 503 with Retry-After).
 */
export default function PageError({ error, reset }: { error: Error & { digest?: string }; reset: () => void }) {
  const router = useRouter();
  const dbDown = error.digest === DB_UNAVAILABLE_DIGEST;
  const again = () => startTransition(() => { router.refresh(); reset(); });
  return (
    <main id="main" tabIndex={-1} className="mx-auto max-w-md p-10 text-center" data-testid="page-error" data-reason={dbDown ? "unavailable" : "server"}>
      <h1 className="text-lg font-semibold">{dbDown ? "Not answering just now" : "Something went wrong"}</h1>
      <p className="mt-2 text-ink-soft" role="alert">
        {dbDown ? DB_UNAVAILABLE_MESSAGE : "Something went wrong on the server. Nothing was changed; try again, and if it keeps happening, tell the site's admin."}
      </p>
      <button type="button" onClick={again} className="mt-4 text-advisory underline">Try again</button>
    </main>
  );
}
