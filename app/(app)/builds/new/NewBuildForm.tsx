"use client";
import { zodResolver } from "@hookform/resolvers/zod";
import { useRouter } from "next/navigation";
import { useForm } from "react-hook-form";
import type { z } from "zod";
import { Button, Field, Input } from "@/components/ui";
import { api, ApiFailure } from "@/components/api-client";
import { buildInput } from "@/shared/schemas/builds";

type Values = z.input<typeof buildInput>;

export function NewBuildForm() {
  const router = useRouter();
  const { register, handleSubmit, setError, formState } = useForm<Values>({ resolver: zodResolver(buildInput), defaultValues: { name: "", model: "", registration: "" } });
  const { errors, isSubmitting } = formState;
  async function onSubmit(v: Values) {
    try {
      const { build } = await api<{ build: { id: string } }>("/api/builds", { body: v });
      router.push(`/builds/${build.id}`);
    } catch (e) {
      if (e instanceof ApiFailure && e.fields) for (const [k, m] of Object.entries(e.fields)) setError(k as keyof Values, { message: m });
      setError("root", { message: e instanceof Error ? e.message : "Could not create the build." });
    }
  }
  return (
    <form onSubmit={handleSubmit(onSubmit)} className="space-y-4 rounded-lg border border-ink/10 bg-white p-5" noValidate>
      <Field label="Build name" htmlFor="name" error={errors.name?.message} hint="What you call this aircraft.">
        <Input id="name" aria-invalid={!!errors.name} autoFocus {...register("name")} />
      </Field>
      <Field label="Model or kit" htmlFor="model" error={errors.model?.message} hint="Free text, e.g. the plans or kit and its revision.">
        <Input id="model" aria-invalid={!!errors.model} {...register("model")} />
      </Field>
      <Field label="Registration (optional)" htmlFor="registration" error={errors.registration?.message}>
        <Input id="registration" aria-invalid={!!errors.registration} {...register("registration")} />
      </Field>
      {errors.root ? <p role="alert" className="text-xs text-hazard">{errors.root.message}</p> : null}
      <Button type="submit" disabled={isSubmitting}>{isSubmitting ? "Creating…" : "Create build"}</Button>
    </form>
  );
}
