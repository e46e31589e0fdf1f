"use client";
import { useState } from "react";
import { api } from "@/components/api-client";
import { Button } from "@/components/ui";

export function AcceptInvitation({ token, signedInAs }: { token: string; signedInAs: string }) {
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  async function accept() {
    setBusy(true);
    try {
      const r = await api<{ buildId: string }>(`/api/invitations/${token}`, { method: "POST" });
      window.location.assign(`/builds/${r.buildId}`);
    } catch (e) {
      setError(e instanceof Error ? e.message : String(e));
      setBusy(false);
    }
  }
  return (
    <div className="mt-4 space-y-2">
      <p className="text-xs text-ink-soft">Signed in as {signedInAs}.</p>
      <Button onClick={accept} disabled={busy} data-testid="accept-invitation">{busy ? "Joining…" : "Accept and open the build"}</Button>
      {error ? <p role="alert" className="text-xs text-hazard">{error}</p> : null}
    </div>
  );
}
