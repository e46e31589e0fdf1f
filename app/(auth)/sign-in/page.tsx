import type { Metadata } from "next";
import { safeNext } from "@/shared/safe-next";
import { SignInForm } from "./SignInForm";

export const metadata: Metadata = { title: "Sign in" };

export default async function SignInPage({ searchParams }: { searchParams: Promise<{ next?: string; password?: string; confirmed?: string }> }) {
  const { next, password, confirmed } = await searchParams;
  return (
    <>
      {password === "changed" ? <p role="status" className="mb-3 rounded bg-ok/10 px-3 py-2 text-sm text-ok" data-testid="password-changed">Your password was changed and every session ended. Sign in with the new one.</p> : null}
      {confirmed === "1" ? <p role="status" className="mb-3 rounded bg-ok/10 px-3 py-2 text-sm text-ok" data-testid="account-confirmed">Your account is ready. Sign in with the e-mail and password you chose.</p> : null}
      <SignInForm next={safeNext(next)} />
    </>
  );
}
