"use client";
import Link from "next/link";
import { useEffect, useRef, useState } from "react";
import { api } from "@/components/api-client";
import type { z } from "zod";
import type { signUpConfirmResponse } from "@/shared/schemas/users";

/**
 * Posts the link's token once on opening (a plain GET of the page changes nothing, so a mail program that
 * fetches links to preview them cannot spend it) and goes on to sign-in, which says the account is ready.
 */
export function ConfirmSignUp({ token }: { token: string }) {
  const [error, setError] = useState<string | null>(null);
  const sent = useRef(false);
  useEffect(() => {
    if (sent.current) return;
    sent.current = true;
    api<z.infer<typeof signUpConfirmResponse>>("/api/sign-up/confirm", { body: { token } })
      .then((r) => window.location.assign(`/sign-in?confirmed=1&next=${encodeURIComponent(r.next)}`))
      .catch((e: unknown) => setError(e instanceof Error ? e.message : "The account could not be made. Try the link again."));
  }, [token]);
  return (
    <div className="space-y-4">
      <h1 className="text-lg font-semibold">Finish creating your account</h1>
      {error ? (
        <>
          <p role="alert" data-testid="confirm-error" className="rounded bg-hazard/10 px-2 py-1 text-sm text-hazard">{error}</p>
          <p className="text-center text-xs text-ink-soft">
            <Link className="text-advisory underline" href="/sign-in">Sign in</Link>
            {" · "}
            <Link className="text-advisory underline" href="/sign-up">Create an account</Link>
          </p>
        </>
      ) : (
        <p role="status" className="text-sm text-ink-soft">Making your account…</p>
      )}
    </div>
  );
}
