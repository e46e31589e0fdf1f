"use client";
import { useId, useState } from "react";
import { api, ApiFailure, uploadFile } from "@/components/api-client";
import { Button, Field, Input } from "@/components/ui";
import type { VerifyResponse } from "@/shared/schemas/verify";

function Answer({ r }: { r: VerifyResponse }) {
  if (!r.match || !r.record)
    return (
      <div role="status" data-testid="verify-result" data-match="no" className="rounded border border-hazard/30 bg-hazard/5 p-3">
        <p className="font-semibold text-hazard">No signed-off revision has this fingerprint.</p>
        <p className="text-ink-soft">The record may have been altered, made on another site, or typed with a mistake. Ask the builder for the record again.</p>
      </div>
    );
  const x = r.record;
  return (
    <div role="status" data-testid="verify-result" data-match="yes" data-current={x.current ? "yes" : "no"} className={`rounded border p-3 ${x.current ? "border-ok/30 bg-ok/5" : "border-caution/30 bg-caution/5"}`}>
      <p className="font-semibold text-ok">This record matches a signed-off revision.</p>
      <p>
        {x.linkageName}, revision {x.revision} — {x.buildName}{x.registration ? ` (${x.registration})` : ""}. Signed off by {x.signedBy} on {x.signedAt.slice(0, 10)}.
      </p>
      <p className={x.current ? "text-ok" : "font-semibold text-caution"}>
        {x.current
          ? "The sign-off is current: the linkage has not changed since."
          : `Superseded: the linkage has changed since (revision ${x.currentRevision} is current). This sign-off covers revision ${x.revision} only.`}
      </p>
    </div>
  );
}

export function VerifyForm() {
  const id = useId();
  const [typed, setTyped] = useState("");
  const [busy, setBusy] = useState(false);
  const [error, setError] = useState<string | null>(null);
  const [result, setResult] = useState<VerifyResponse | null>(null);
  const run = async (f: () => Promise<VerifyResponse>) => {
    setBusy(true);
    setError(null);
    setResult(null);
    try {
      setResult(await f());
    } catch (e) {
      const field = e instanceof ApiFailure ? (e.fields?.fingerprint ?? e.fields?.file) : undefined;
      setError(e instanceof ApiFailure ? `${e.message}${field ? ` (It ${field}.)` : ""}` : String(e));
    } finally {
      setBusy(false);
    }
  };
  return (
    <div className="space-y-4 rounded-lg border border-ink/10 bg-white p-4">
      <Field label="Record PDF" htmlFor={`${id}-file`} hint="The PDF as downloaded from the linkage's review panel.">
        <input
          id={`${id}-file`}
          type="file"
          accept="application/pdf"
          data-testid="verify-file"
          className="block w-full text-sm"
          onChange={(e) => {
            const f = e.target.files?.[0];
            if (f) void run(() => uploadFile<VerifyResponse>("/api/verify/file", f, f.name));
          }}
        />
      </Field>
      <form
        className="space-y-2"
        onSubmit={(e) => {
          e.preventDefault();
          void run(() => api<VerifyResponse>("/api/verify", { method: "POST", body: { fingerprint: typed } }));
        }}
      >
        <Field label="Or the fingerprint" htmlFor={`${id}-fp`} hint="64 characters, 0–9 and a–f; spaces as printed are fine.">
          <Input id={`${id}-fp`} value={typed} onChange={(e) => setTyped(e.target.value)} autoComplete="off" spellCheck={false} data-testid="verify-fingerprint" className="font-mono" />
        </Field>
        <Button type="submit" disabled={busy || !typed.trim()} data-testid="verify-submit">{busy ? "Checking…" : "Check"}</Button>
      </form>
      {error && <p role="alert" className="text-hazard" data-testid="verify-error">{error}</p>}
      {result && <Answer r={result} />}
    </div>
  );
}
