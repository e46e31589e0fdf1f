"use client";
import { zodResolver } from "@hookform/resolvers/zod";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { useForm } from "react-hook-form";
import { z } from "zod";
import { api, ApiFailure } from "@/components/api-client";
import { Button, Card, Caution, Field, Input } from "@/components/ui";
import { DEFAULT_SETTINGS, settingsSchema, type AnalysisSettings } from "@/shared/analysis/types";
import { buildInput } from "@/shared/schemas/builds";

type Details = z.input<typeof buildInput>;

/** Where each default comes from, shown beside its field. */
const SOURCE: Record<string, string> = {
  pitchStick: "14 CFR 23.397(b): 167 lbf, stick, pitch",
  rollStick: "14 CFR 23.397(b): 67 lbf, stick, roll",
  yawPedal: "14 CFR 23.397(b): 200 lbf, pedal",
  other: "no published figure: flaps, trim and other inputs",
  ultimateFactor: "14 CFR 23.303: 1.5",
  fittingFactor: "14 CFR 23.625: 1.15 on fittings",
  bearingFactor: "14 CFR 23.693: 3.33 on plain bearings with angular motion",
};

/** A setting shown to a member who cannot change it: its value as text, not a field that looks editable. */
function ReadOnlyValue({ label, value, hint }: { label: string; value: React.ReactNode; hint?: string }) {
  return (
    <div className="space-y-0.5">
      <dt className="text-xs font-semibold uppercase tracking-wide text-ink-soft">{label}</dt>
      <dd className="text-sm font-medium">{value}</dd>
      {hint ? <dd className="text-xs text-ink-soft">{hint}</dd> : null}
    </div>
  );
}

function DetailsCard({ buildId, initial, canManage }: { buildId: string; initial: Details; canManage: boolean }) {
  const router = useRouter();
  const [saved, setSaved] = useState(false);
  const f = useForm<Details>({ resolver: zodResolver(buildInput), defaultValues: initial });
  const submit = f.handleSubmit(async (v) => {
    try {
      await api(`/api/builds/${buildId}`, { method: "PATCH", body: v });
      setSaved(true);
      router.refresh();
    } catch (e) {
      if (e instanceof ApiFailure && e.fields) for (const [k, m] of Object.entries(e.fields)) f.setError(k as keyof Details, { message: m });
      f.setError("root", { message: e instanceof Error ? e.message : String(e) });
    }
  });
  if (!canManage) {
    return (
      <Card title="Build details">
        <dl className="grid gap-3 sm:grid-cols-3" data-testid="details-read-only">
          <ReadOnlyValue label="Build name" value={initial.name} />
          <ReadOnlyValue label="Model or kit" value={initial.model || "Not set"} />
          <ReadOnlyValue label="Registration" value={initial.registration || "Not set"} />
        </dl>
      </Card>
    );
  }
  return (
    <Card title="Build details">
      <form onSubmit={submit} className="grid gap-3 sm:grid-cols-3" noValidate onChange={() => setSaved(false)}>
        <Field label="Build name" htmlFor="s-name" error={f.formState.errors.name?.message}><Input id="s-name" {...f.register("name")} /></Field>
        <Field label="Model or kit" htmlFor="s-model" error={f.formState.errors.model?.message}><Input id="s-model" {...f.register("model")} /></Field>
        <Field label="Registration" htmlFor="s-reg" error={f.formState.errors.registration?.message}><Input id="s-reg" {...f.register("registration")} /></Field>
        <div className="flex items-center gap-3 sm:col-span-3">
          <Button type="submit" disabled={f.formState.isSubmitting}>Save details</Button>
          {saved ? <span className="text-xs text-ok">Saved.</span> : null}
          {f.formState.errors.root ? <span role="alert" className="text-xs text-hazard">{f.formState.errors.root.message}</span> : null}
        </div>
      </form>
    </Card>
  );
}

const numberField = z.coerce.number({ error: "Enter a number" });
const formSchema = z.object({
  pilotForce: z.object({
    pitchStick: numberField.positive("Must be above 0"),
    rollStick: numberField.positive("Must be above 0"),
    yawPedal: numberField.positive("Must be above 0"),
    other: numberField.positive("Must be above 0"),
  }),
  ultimateFactor: numberField.min(1, "At least 1").max(5, "At most 5"),
  fittingFactor: numberField.min(1, "At least 1").max(5, "At most 5"),
  bearingFactor: numberField.min(1, "At least 1").max(10, "At most 10"),
  bearingFactorOnRodEnds: z.boolean(),
  dualControls: z.boolean(),
});
type FormIn = z.input<typeof formSchema>;
type FormOut = z.output<typeof formSchema>;

function DesignCard({ buildId, initial, canManage }: { buildId: string; initial: AnalysisSettings; canManage: boolean }) {
  const router = useRouter();
  const [status, setStatus] = useState<string | null>(null);
  const f = useForm<FormIn, unknown, FormOut>({ resolver: zodResolver(formSchema), defaultValues: initial });
  const e = f.formState.errors;
  const submit = f.handleSubmit(async (v) => {
    setStatus("Saving and checking every linkage again…");
    try {
      await api(`/api/builds/${buildId}`, { method: "PATCH", body: { analysisSettings: settingsSchema.parse(v) } });
      setStatus("Saved. Every linkage's current revision was checked again with these settings.");
      router.refresh();
    } catch (err) {
      setStatus(err instanceof Error ? err.message : String(err));
    }
  });
  const num = (name: "ultimateFactor" | "fittingFactor" | "bearingFactor" | `pilotForce.${"pitchStick" | "rollStick" | "yawPedal" | "other"}`, label: string, unit: string, key: string, error?: string) => (
    <Field label={`${label} (${unit})`} htmlFor={`d-${key}`} error={error} hint={SOURCE[key]}>
      <Input id={`d-${key}`} inputMode="decimal" aria-invalid={!!error} {...f.register(name)} />
    </Field>
  );
  const intro = (
    <p className="mb-3 text-xs text-ink-soft">
      The load-path check starts from these limit pilot forces and multiplies by these factors. The defaults are the published
      figures; change them only where the designer&apos;s data or your regulator says otherwise. Every result shows the values in use.
    </p>
  );
  if (!canManage) {
    const v = (label: string, value: number, unit: string, key: string) => <ReadOnlyValue label={`${label} (${unit})`} value={String(value)} hint={SOURCE[key]} />;
    const legend = "mb-2 border-b border-ink/10 pb-1 text-sm font-semibold";
    return (
      <Card title="Design loads and factors">
        {intro}
        <div className="space-y-4" data-testid="design-read-only">
          <section>
            <h3 className={legend}>Design pilot forces, limit</h3>
            <dl className="grid gap-3 sm:grid-cols-2">
              {v("Stick, pitch", initial.pilotForce.pitchStick, "lbf", "pitchStick")}
              {v("Stick, roll", initial.pilotForce.rollStick, "lbf", "rollStick")}
              {v("Pedal, yaw", initial.pilotForce.yawPedal, "lbf", "yawPedal")}
              {v("Other inputs", initial.pilotForce.other, "lbf", "other")}
            </dl>
          </section>
          <section>
            <h3 className={legend}>Factors</h3>
            <dl className="grid gap-3 sm:grid-cols-3">
              {v("Ultimate factor", initial.ultimateFactor, "×", "ultimateFactor")}
              {v("Fitting factor", initial.fittingFactor, "×", "fittingFactor")}
              {v("Bearing factor", initial.bearingFactor, "×", "bearingFactor")}
            </dl>
          </section>
          <dl className="grid gap-3 sm:grid-cols-2">
            <ReadOnlyValue label="Bearing factor on spherical rod ends" value={initial.bearingFactorOnRodEnds ? "Applied" : "Not applied"} />
            <ReadOnlyValue label="Dual controls" value={initial.dualControls ? "Yes: each side takes 75 % of the pilot force" : "No"} />
          </dl>
        </div>
      </Card>
    );
  }
  return (
    <Card title="Design loads and factors">
      {intro}
      <form onSubmit={submit} noValidate className="space-y-4">
        <fieldset className="grid gap-3 sm:grid-cols-2">
          <legend className="mb-2 text-xs font-semibold uppercase tracking-wide text-ink-soft">Design pilot forces, limit</legend>
          {num("pilotForce.pitchStick", "Stick, pitch", "lbf", "pitchStick", e.pilotForce?.pitchStick?.message)}
          {num("pilotForce.rollStick", "Stick, roll", "lbf", "rollStick", e.pilotForce?.rollStick?.message)}
          {num("pilotForce.yawPedal", "Pedal, yaw", "lbf", "yawPedal", e.pilotForce?.yawPedal?.message)}
          {num("pilotForce.other", "Other inputs", "lbf", "other", e.pilotForce?.other?.message)}
        </fieldset>
        <fieldset className="grid gap-3 sm:grid-cols-3">
          <legend className="mb-2 text-xs font-semibold uppercase tracking-wide text-ink-soft">Factors</legend>
          {num("ultimateFactor", "Ultimate factor", "×", "ultimateFactor", e.ultimateFactor?.message)}
          {num("fittingFactor", "Fitting factor", "×", "fittingFactor", e.fittingFactor?.message)}
          {num("bearingFactor", "Bearing factor", "×", "bearingFactor", e.bearingFactor?.message)}
        </fieldset>
        <label className="flex items-start gap-2">
          <input type="checkbox" className="mt-0.5 shrink-0" {...f.register("bearingFactorOnRodEnds")} />
          <span>Apply the bearing factor to spherical rod ends too <span className="block text-xs text-ink-soft">Whether a rod end counts as a ball bearing under 14 CFR 23.693 is a matter of interpretation. Off: a rod end&apos;s rating must not be exceeded at limit × ultimate × fitting factor.</span></span>
        </label>
        <label className="flex items-start gap-2">
          <input type="checkbox" className="mt-0.5 shrink-0" {...f.register("dualControls")} />
          <span>Dual controls <span className="block text-xs text-ink-soft">Each side takes 75 % of the pilot force (Part 23 appendix A); both pilots are taken as pushing the same way.</span></span>
        </label>
        <div className="flex flex-wrap items-center gap-3">
          <Button type="submit" disabled={f.formState.isSubmitting} data-testid="save-design-settings">Save and re-check</Button>
          <Button type="button" tone="secondary" onClick={() => f.reset(DEFAULT_SETTINGS)}>Put back the published defaults</Button>
          {status ? <span role="status" className="text-xs text-ink-soft">{status}</span> : null}
        </div>
      </form>
    </Card>
  );
}

function DeleteCard({ buildId, name }: { buildId: string; name: string }) {
  const [typed, setTyped] = useState("");
  const [error, setError] = useState<string | null>(null);
  return (
    <Card title="Delete this build">
      <p className="text-ink-soft">Deletes every linkage, revision, comment, sign-off, log entry and upload of this build, for every member. It cannot be undone — export what you want to keep first.</p>
      <div className="mt-3 flex flex-wrap items-end gap-2">
        <Field label={`Type the build's name (${name}) to confirm`} htmlFor="del-name">
          <Input id="del-name" value={typed} onChange={(e) => setTyped(e.target.value)} autoComplete="off" />
        </Field>
        <Button
          tone="danger"
          disabled={typed !== name}
          onClick={async () => {
            try {
              await api(`/api/builds/${buildId}`, { method: "DELETE" });
              window.location.assign("/builds");
            } catch (e) {
              setError(e instanceof Error ? e.message : String(e));
            }
          }}
        >
          Delete the build
        </Button>
      </div>
      {error ? <p role="alert" className="mt-2 text-xs text-hazard">{error}</p> : null}
    </Card>
  );
}

export function SettingsForm(p: { buildId: string; canManage: boolean; details: { name: string; model: string; registration: string }; settings: AnalysisSettings }) {
  return (
    <div className="space-y-6">
      <DetailsCard buildId={p.buildId} initial={p.details} canManage={p.canManage} />
      <DesignCard buildId={p.buildId} initial={p.settings} canManage={p.canManage} />
      {p.canManage ? <DeleteCard buildId={p.buildId} name={p.details.name} /> : null}
      <Caution />
    </div>
  );
}
