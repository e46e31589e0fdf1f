"use client";
import { zodResolver } from "@hookform/resolvers/zod";
import Link from "next/link";
import { useState } from "react";
import { useForm } from "react-hook-form";
import type { z } from "zod";
import { Button, Field, Input } from "@/components/ui";
import { api, ApiFailure } from "@/components/api-client";
import { signUpInput, type signUpResponse } from "@/shared/schemas/users";

type Values = z.infer<typeof signUpInput>;

export function SignUpForm({ next }: { next: string }) {
  const { register, handleSubmit, setError, formState } = useForm<Values>({ resolver: zodResolver(signUpInput) });
  const { errors, isSubmitting } = formState;
  const [sent, setSent] = useState<{ email: string; message: string } | null>(null);
  async function onSubmit(v: Values) {
    try {
      // The same answer whether or not the address has an account: the e-mail says which.
      const r = await api<z.infer<typeof signUpResponse>>("/api/sign-up", { body: { ...v, next } });
      setSent({ email: v.email, message: r.message });
    } catch (e) {
      if (e instanceof ApiFailure && e.fields) for (const [k, m] of Object.entries(e.fields)) setError(k as keyof Values, { message: m });
      setError("root", { message: e instanceof Error ? e.message : "Could not create the account." });
    }
  }
  if (sent) {
    return (
      <div className="space-y-3" data-testid="sign-up-sent">
        <h1 className="text-lg font-semibold">Create an account</h1>
        <p role="status" className="rounded bg-ok/10 px-3 py-2 text-sm text-ok">{sent.message}</p>
        <p className="text-sm text-ink-soft">
          We sent a message to <strong className="break-all">{sent.email}</strong>. Open the link in it to finish; it works once, for a day.
          Nothing there after a few minutes? Look in the spam folder, or check the address and try again.
        </p>
        <p className="text-center text-xs text-ink-soft">
          <Link className="text-advisory underline" href={`/sign-in?next=${encodeURIComponent(next)}`}>Sign in</Link>
        </p>
      </div>
    );
  }
  return (
    <form onSubmit={handleSubmit(onSubmit)} className="space-y-4" noValidate>
      <h1 className="text-lg font-semibold">Create an account</h1>
      <Field label="Your name" htmlFor="name" error={errors.name?.message}>
        <Input id="name" autoComplete="name" aria-invalid={!!errors.name} {...register("name")} />
      </Field>
      <Field label="E-mail" htmlFor="email" error={errors.email?.message}>
        <Input id="email" type="email" autoComplete="email" aria-invalid={!!errors.email} {...register("email")} />
      </Field>
      <Field label="Password" htmlFor="password" error={errors.password?.message} hint="At least 10 characters.">
        <Input id="password" type="password" autoComplete="new-password" aria-invalid={!!errors.password} {...register("password")} />
      </Field>
      {errors.root ? <p role="alert" className="rounded bg-hazard/10 px-2 py-1 text-xs text-hazard">{errors.root.message}</p> : null}
      <Button type="submit" className="w-full justify-center" disabled={isSubmitting}>{isSubmitting ? "Creating…" : "Create account"}</Button>
      <p className="text-center text-xs text-ink-soft">
        Have an account? <Link className="text-advisory underline" href={`/sign-in?next=${encodeURIComponent(next)}`}>Sign in</Link>
      </p>
    </form>
  );
}
