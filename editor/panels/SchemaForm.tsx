"use client";
/**
 * A dense form over one of the shared zod schemas (node props or joint hardware).
 * Inputs show display units (US or SI); the resolver converts what was typed to the format's US
 * values, checks it with zodResolver on the shared schema and hands valid values to `onValid` as
 * the user types. Anything invalid stays in the box with the reason under it and is not applied.
 */
import { useEffect, useMemo } from "react";
import { useForm, type FieldErrors, type Resolver } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import type { z } from "zod";
import { fromDisplay, inputText, parseTyped, unitLabel, type Quantity, type UnitSystem } from "../units";

export type FieldSpec =
  | { type: "number"; path: string; label: string; q: Quantity; required?: boolean; hint?: string; placeholder?: string }
  /** `unsetHint`: what leaving it unset means — shown only while it is unset (under a set field it would be untrue). */
  | { type: "enum"; path: string; label: string; options: readonly (readonly [string, string])[]; required?: boolean; hint?: string; unsetHint?: string; default?: string }
  | { type: "bool"; path: string; label: string; default?: boolean; hint?: string }
  | { type: "text"; path: string; label: string; multiline?: boolean; hint?: string; placeholder?: string };

export type SectionSpec = {
  title: string;
  /** Path of an optional object in the schema; the section then has an on/off switch. */
  optional?: string;
  /** Omit the object(s) named here when every value in them is empty/false and the section is not asked for. */
  dropWhenEmpty?: string[];
  fields: FieldSpec[];
  note?: string;
};

type FormValues = { v: Record<string, string | boolean>; on: Record<string, boolean> };
const keyOf = (path: string) => path.replace(/\./g, "__");

export function getPath(obj: unknown, path: string): unknown {
  return path.split(".").reduce<unknown>((o, k) => (o && typeof o === "object" ? (o as Record<string, unknown>)[k] : undefined), obj);
}
function setPath(obj: Record<string, unknown>, path: string, value: unknown) {
  const parts = path.split(".");
  let o = obj;
  for (const p of parts.slice(0, -1)) o = (o[p] ??= {}) as Record<string, unknown>;
  o[parts[parts.length - 1]] = value;
}

function toForm(canonical: unknown, sections: SectionSpec[], u: UnitSystem): FormValues {
  const v: FormValues["v"] = {};
  const on: FormValues["on"] = {};
  for (const s of sections) {
    if (s.optional) on[keyOf(s.optional)] = getPath(canonical, s.optional) !== undefined;
    for (const f of s.fields) {
      const cur = getPath(canonical, f.path);
      const k = keyOf(f.path);
      if (f.type === "number") v[k] = inputText(cur as number | undefined, f.q, u);
      else if (f.type === "bool") v[k] = cur === undefined ? (f.default ?? false) : Boolean(cur);
      else if (f.type === "enum") v[k] = cur === undefined || cur === null ? (f.default ?? "") : String(cur);
      else v[k] = cur === undefined || cur === null ? "" : String(cur);
    }
  }
  return { v, on };
}

/** Typed form values → the canonical object, plus the errors found before the schema is asked. */
export function toCanonical(values: FormValues, sections: SectionSpec[], u: UnitSystem, base: Record<string, unknown>) {
  const out: Record<string, unknown> = structuredClone(base);
  const errors: Record<string, string> = {};
  for (const s of sections) {
    if (s.optional && !values.on[keyOf(s.optional)]) {
      setPath(out, s.optional, undefined);
      continue;
    }
    if (s.optional) setPath(out, s.optional, {});
    for (const o of s.dropWhenEmpty ?? []) setPath(out, o, {});
    for (const f of s.fields) {
      const k = keyOf(f.path);
      const raw = values.v[k];
      if (f.type === "number") {
        const r = parseTyped(String(raw ?? ""));
        if ("error" in r) errors[k] = r.error;
        else if (r.value === undefined) {
          setPath(out, f.path, undefined);
          if (f.required) errors[k] = `${f.label} is needed`;
        } else {
          // A box still showing the value it was given keeps that value exactly: boxes round (76.2 mm is
          // 3.0000000000000004 in back), and typing in one field must not change, or unmark, another.
          const was = getPath(base, f.path);
          setPath(out, f.path, typeof was === "number" && String(raw) === inputText(was, f.q, u) ? was : fromDisplay(r.value, f.q, u));
        }
      } else if (f.type === "enum") {
        if (raw === "" || raw === undefined) {
          setPath(out, f.path, undefined);
          if (f.required) errors[k] = `Choose the ${f.label.toLowerCase()}`;
        } else setPath(out, f.path, raw);
      } else if (f.type === "bool") setPath(out, f.path, Boolean(raw));
      else setPath(out, f.path, String(raw ?? ""));
    }
    for (const o of s.dropWhenEmpty ?? []) {
      const obj = getPath(out, o) as Record<string, unknown> | undefined;
      if (obj && Object.values(obj).every((x) => x === undefined || x === false || x === "")) setPath(out, o, undefined);
    }
  }
  return { out, errors };
}

function flattenErrors(e: FieldErrors, prefix = ""): Record<string, string> {
  const flat: Record<string, string> = {};
  for (const [k, val] of Object.entries(e)) {
    if (!val) continue;
    const path = prefix ? `${prefix}.${k}` : k;
    if (typeof (val as { message?: unknown }).message === "string") flat[path] = (val as { message: string }).message;
    else if (typeof val === "object") Object.assign(flat, flattenErrors(val as FieldErrors, path));
  }
  return flat;
}

export function SchemaForm<S extends z.ZodType>({
  schema,
  sections,
  value,
  unitSystem,
  disabled,
  onValid,
  onInvalid,
  testId,
  onFieldChange,
  starting,
}: {
  schema: S;
  sections: SectionSpec[];
  value: Record<string, unknown>;
  unitSystem: UnitSystem;
  disabled?: boolean;
  onValid: (v: z.output<S>) => void;
  onInvalid?: (count: number) => void;
  testId: string;
  /** Lets a caller fill related fields (e.g. bolt diameter from its size). */
  onFieldChange?: (path: string, value: string | boolean, set: (path: string, value: string) => void) => void;
  /** Paths of the fields still at the starting value the part was placed with: each says so, in words, under its box. */
  starting?: ReadonlySet<string>;
}) {
  const fieldPaths = useMemo(() => new Map(sections.flatMap((s) => s.fields.map((f) => [f.path, keyOf(f.path)] as const))), [sections]);

  const resolver: Resolver<FormValues> = useMemo(() => {
    const zr = zodResolver(schema as never) as unknown as Resolver<Record<string, unknown>>;
    return async (values, ctx, options) => {
      const { out, errors } = toCanonical(values, sections, unitSystem, value);
      const r = await zr(out, ctx, { ...options, fields: {}, names: undefined } as never);
      const all: Record<string, string> = { ...flattenErrors(r.errors as FieldErrors) };
      const v: Record<string, { type: string; message: string }> = {};
      let rootMsg = "";
      for (const [path, msg] of Object.entries(all)) {
        const k = fieldPaths.get(path);
        if (k) v[k] = { type: "schema", message: msg };
        else rootMsg += (rootMsg ? "; " : "") + `${path}: ${msg}`;
      }
      for (const [k, msg] of Object.entries(errors)) v[k] = { type: "typed", message: msg };
      if (Object.keys(v).length || rootMsg) {
        const errs: Record<string, unknown> = {};
        if (Object.keys(v).length) errs.v = v;
        if (rootMsg) errs.root = { type: "schema", message: rootMsg };
        return { values: {}, errors: errs as FieldErrors<FormValues> };
      }
      return { values: r.values as unknown as FormValues, errors: {} };
    };
  }, [schema, sections, unitSystem, value, fieldPaths]);

  const form = useForm<FormValues>({ defaultValues: toForm(value, sections, unitSystem), resolver, mode: "onChange" });
  const { register, watch, handleSubmit, formState, setValue } = form;

  useEffect(() => {
    const sub = watch((_vals, { name }) => {
      if (name && onFieldChange && name.startsWith("v.")) {
        const path = name.slice(2).replace(/__/g, ".");
        onFieldChange(path, form.getValues(name as `v.${string}`), (p, val) => setValue(`v.${keyOf(p)}`, val, { shouldValidate: true }));
      }
      void handleSubmit(
        (canonical) => onValid(canonical as unknown as z.output<S>),
        (errs) => onInvalid?.(Object.keys(errs.v ?? {}).length + (errs.root ? 1 : 0)),
      )();
    });
    return () => sub.unsubscribe();
  }, [watch, handleSubmit, onValid, onInvalid, onFieldChange, setValue, form]);

  const vErr = (formState.errors.v ?? {}) as Record<string, { message?: string } | undefined>;
  const on = watch("on");
  const vals = watch("v");
  const errCount = Object.keys(vErr).length + (formState.errors.root ? 1 : 0);

  return (
    <form data-testid={testId} onSubmit={(e) => e.preventDefault()} noValidate>
      <fieldset disabled={disabled} className="min-w-0 space-y-2">
        {errCount > 0 && (
          <p role="alert" data-testid={`${testId}-not-applied`} className="rounded border border-hazard/40 bg-hazard/5 px-2 py-1 text-[11px] text-hazard">
            Not applied yet: {errCount} field{errCount > 1 ? "s" : ""} need{errCount > 1 ? "" : "s"} attention. The last valid values stay in the linkage.
            {formState.errors.root?.message && <span className="block">{formState.errors.root.message}</span>}
          </p>
        )}
        {sections.map((s) => {
          const active = !s.optional || on?.[keyOf(s.optional)];
          return (
            <section key={s.title} className="rounded border border-ink/10 bg-white">
              <header className="flex items-center justify-between border-b border-ink/5 px-2 py-1">
                <h4 className="text-[11px] font-semibold uppercase tracking-wide text-ink-soft">{s.title}</h4>
                {s.optional && (
                  <label className="touch-target flex items-center gap-1 text-[11px] text-ink-soft">
                    <input type="checkbox" {...register(`on.${keyOf(s.optional)}`)} data-testid={`${testId}-on-${keyOf(s.optional)}`} />
                    present
                  </label>
                )}
              </header>
              {active && (
                <div className="grid grid-cols-2 gap-x-2 gap-y-1.5 p-2">
                  {s.fields.map((f) => {
                    const k = keyOf(f.path);
                    const err = vErr[k]?.message;
                    const id = `${testId}-${k}`;
                    const wide = f.type === "text";
                    const start = starting?.has(f.path) ?? false;
                    const describedBy = [err && `${id}-err`, start && `${id}-start`].filter(Boolean).join(" ") || undefined;
                    return (
                      <div key={k} className={wide ? "col-span-2" : f.type === "bool" ? "col-span-2 sm:col-span-1" : ""}>
                        {f.type === "bool" ? (
                          <label htmlFor={id} className="touch-target flex items-center gap-1.5 py-0.5 text-[12px] text-ink">
                            <input id={id} type="checkbox" data-testid={id} aria-describedby={describedBy} {...register(`v.${k}`)} />
                            {f.label}
                          </label>
                        ) : (
                          <>
                            <label htmlFor={id} className="block text-[11px] leading-4 text-ink-soft">
                              {f.label}
                              {f.type === "number" && unitLabel(f.q, unitSystem) && <span className="text-ink-soft/70"> ({unitLabel(f.q, unitSystem)})</span>}
                              {"required" in f && f.required && <span aria-hidden="true"> *</span>}
                            </label>
                            {f.type === "enum" ? (
                              <select id={id} data-testid={id} {...register(`v.${k}`)} aria-invalid={!!err} aria-describedby={describedBy} data-starting={start || undefined} className="w-full rounded border border-ink/20 bg-white px-1 py-0.5 text-[12px] text-ink data-[starting=true]:border-dashed data-[starting=true]:border-caution/60 aria-[invalid=true]:border-hazard">
                                {!f.required && <option value="">— not set</option>}
                                {f.required && <option value="" disabled>choose…</option>}
                                {f.options.map(([v, l]) => (
                                  <option key={v} value={v}>
                                    {l}
                                  </option>
                                ))}
                              </select>
                            ) : f.type === "text" && f.multiline ? (
                              <textarea id={id} data-testid={id} rows={2} {...register(`v.${k}`)} placeholder={f.placeholder} aria-describedby={describedBy} className="w-full rounded border border-ink/20 px-1 py-0.5 text-[12px] text-ink" />
                            ) : (
                              <input
                                id={id}
                                data-testid={id}
                                type="text"
                                inputMode={f.type === "number" ? "decimal" : undefined}
                                autoComplete="off"
                                placeholder={f.placeholder}
                                aria-invalid={!!err}
                                aria-describedby={describedBy}
                                data-starting={start || undefined}
                                {...register(`v.${k}`)}
                                className="w-full rounded border border-ink/20 px-1 py-0.5 text-[12px] tabular-nums text-ink data-[starting=true]:border-dashed data-[starting=true]:border-caution/60 aria-[invalid=true]:border-hazard aria-[invalid=true]:bg-hazard/5"
                              />
                            )}
                          </>
                        )}
                        {err && (
                          <p id={`${id}-err`} data-testid={`${id}-error`} className="mt-0.5 text-[10px] leading-3 text-hazard">
                            {err}
                          </p>
                        )}
                        {start && (
                          <p id={`${id}-start`} data-testid={`${id}-starting`} className="mt-0.5 text-[10px] leading-3 text-caution">
                            starting value — enter yours
                          </p>
                        )}
                        {!err && f.hint && <p className="mt-0.5 text-[10px] leading-3 text-ink-soft/80">{f.hint}</p>}
                        {!err && f.type === "enum" && f.unsetHint && !vals?.[k] && (
                          <p data-testid={`${id}-unset`} className="mt-0.5 text-[10px] leading-3 text-ink-soft/80">{f.unsetHint}</p>
                        )}
                      </div>
                    );
                  })}
                  {s.note && <p className="col-span-2 text-[10px] leading-3 text-ink-soft">{s.note}</p>}
                </div>
              )}
            </section>
          );
        })}
      </fieldset>
    </form>
  );
}
