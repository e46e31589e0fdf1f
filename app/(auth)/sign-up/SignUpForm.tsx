"use client";
import { zodResolver } from "@hookform/resolvers/zod";
import { signIn } from "next-auth/react";
import Link from "next/link";
import { useForm } from "react-hook-form";
import type { z } from "zod";
import { Button, Field, Input } from "@/components/ui";
import { api, ApiFailure } from "@/components/api-client";
import { signUpInput } from "@/shared/schemas/users";

type Values = z.infer<typeof signUpInput>;

export function SignUpForm({ next }: { next: string }) {
  const { register, handleSubmit, setError, formState } = useForm<Values>({ resolver: zodResolver(signUpInput) });
  const { errors, isSubmitting } = formState;
  async function onSubmit(v: Values) {
    try {
      await api("/api/sign-up", { body: v });
      const res = await signIn("credentials", { email: v.email, password: v.password, redirect: false });
      if (res?.ok) window.location.assign(next);
      else setError("root", { message: "Account created; sign in to continue." });
    } catch (e) {
      if (e instanceof ApiFailure && e.fields) for (const [k, m] of Object.entries(e.fields)) setError(k as keyof Values, { message: m });
      setError("root", { message: e instanceof Error ? e.message : "Could not create the account." });
    }
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
