"use client";
import { signIn } from "next-auth/react";
import Link from "next/link";
import { useState } from "react";
import { Button, Field, Input } from "@/components/ui";

export function SignInForm({ next }: { next: string }) {
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  async function onSubmit(e: React.FormEvent<HTMLFormElement>) {
    e.preventDefault();
    const form = new FormData(e.currentTarget);
    setBusy(true);
    setError(null);
    const res = await signIn("credentials", { email: form.get("email"), password: form.get("password"), redirect: false });
    setBusy(false);
    if (res?.ok) window.location.assign(next);
    else setError(res?.error && res.error !== "CredentialsSignin" ? res.error : "That e-mail and password do not match an account.");
  }
  return (
    <form onSubmit={onSubmit} className="space-y-4" noValidate>
      <h1 className="text-lg font-semibold">Sign in</h1>
      <Field label="E-mail" htmlFor="email">
        <Input id="email" name="email" type="email" autoComplete="email" required autoFocus />
      </Field>
      <Field label="Password" htmlFor="password">
        <Input id="password" name="password" type="password" autoComplete="current-password" required />
      </Field>
      {error ? <p role="alert" data-testid="sign-in-error" className="rounded bg-hazard/10 px-2 py-1 text-xs text-hazard">{error}</p> : null}
      <Button type="submit" className="w-full justify-center" disabled={busy}>{busy ? "Signing in…" : "Sign in"}</Button>
      <p className="text-center text-xs text-ink-soft">
        New here? <Link className="text-advisory underline" href={`/sign-up?next=${encodeURIComponent(next)}`}>Create an account</Link>
      </p>
    </form>
  );
}
