"use client";
import { signIn } from "next-auth/react";
import Link from "next/link";
import { useRef, useState } from "react";
import { Button, Field, Input } from "@/components/ui";

type Missing = { email?: string; password?: string };

/** What the form asks for before it goes to the server: both fields, the first one missing focused. The server still checks them. */
function missingFields(email: string, password: string): Missing {
  const m: Missing = {};
  if (!email.trim()) m.email = "Enter your e-mail address.";
  if (!password) m.password = "Enter your password.";
  return m;
}

export function SignInForm({ next }: { next: string }) {
  const [error, setError] = useState<string | null>(null);
  const [missing, setMissing] = useState<Missing>({});
  const [busy, setBusy] = useState(false);
  const emailRef = useRef<HTMLInputElement>(null);
  const passwordRef = useRef<HTMLInputElement>(null);
  async function onSubmit(e: React.FormEvent<HTMLFormElement>) {
    e.preventDefault();
    const form = new FormData(e.currentTarget);
    const email = String(form.get("email") ?? "");
    const password = String(form.get("password") ?? "");
    const m = missingFields(email, password);
    setMissing(m);
    if (m.email || m.password) {
      setError(null);
      (m.email ? emailRef : passwordRef).current?.focus();
      return;
    }
    setBusy(true);
    setError(null);
    const res = await signIn("credentials", { email, password, redirect: false });
    setBusy(false);
    if (res?.ok) window.location.assign(next);
    else setError(res?.error && res.error !== "CredentialsSignin" ? res.error : "That e-mail and password do not match an account.");
  }
  // A field asked for stops being marked once something is typed into it.
  const clear = (k: keyof Missing) => () => { if (missing[k]) setMissing((m) => ({ ...m, [k]: undefined })); };
  return (
    <form onSubmit={onSubmit} className="space-y-4" noValidate>
      <h1 className="text-lg font-semibold">Sign in</h1>
      <Field label="E-mail" htmlFor="email" error={missing.email}>
        <Input ref={emailRef} id="email" name="email" type="email" autoComplete="email" required autoFocus aria-invalid={!!missing.email} onChange={clear("email")} data-testid="sign-in-email" />
      </Field>
      <Field label="Password" htmlFor="password" error={missing.password}>
        <Input ref={passwordRef} id="password" name="password" type="password" autoComplete="current-password" required aria-invalid={!!missing.password} onChange={clear("password")} data-testid="sign-in-password" />
      </Field>
      {error ? <p role="alert" data-testid="sign-in-error" className="rounded bg-hazard/10 px-2 py-1 text-xs text-hazard">{error}</p> : null}
      <Button type="submit" className="w-full justify-center" disabled={busy}>{busy ? "Signing in…" : "Sign in"}</Button>
      <p className="text-center text-xs text-ink-soft">
        New here? <Link className="text-advisory underline" href={`/sign-up?next=${encodeURIComponent(next)}`}>Create an account</Link>
      </p>
    </form>
  );
}
