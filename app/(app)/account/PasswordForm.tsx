"use client";
import { signOut } from "next-auth/react";
import { useId, useState } from "react";
import { api, ApiFailure } from "@/components/api-client";
import { Button, Field, Input } from "@/components/ui";
import { clearOfflineCopies } from "@/components/offline/register";

export function PasswordForm() {
  const id = useId();
  const [current, setCurrent] = useState("");
  const [next, setNext] = useState("");
  const [again, setAgain] = useState("");
  const [busy, setBusy] = useState(false);
  const [fields, setFields] = useState<Record<string, string>>({});
  const [message, setMessage] = useState<string | null>(null);
  const mismatch = again.length > 0 && again !== next;
  return (
    <form
      className="space-y-3"
      onSubmit={async (e) => {
        e.preventDefault();
        if (mismatch) return;
        setBusy(true);
        setFields({});
        setMessage(null);
        try {
          await api("/api/me/password", { method: "POST", body: { currentPassword: current, newPassword: next } });
          // Every session has ended with the change, this one too: sign in again with the new password.
          await clearOfflineCopies();
          await signOut({ callbackUrl: "/sign-in?password=changed" });
        } catch (err) {
          if (err instanceof ApiFailure) {
            setFields(err.fields ?? {});
            setMessage(err.message);
          } else setMessage(String(err));
          setBusy(false);
        }
      }}
    >
      <p className="text-xs text-ink-soft">Changing it signs you out everywhere, this device included; then sign in with the new one.</p>
      <Field label="Current password" htmlFor={`${id}-c`} error={fields.currentPassword ? `This ${fields.currentPassword}.` : undefined}>
        <Input id={`${id}-c`} type="password" autoComplete="current-password" value={current} onChange={(e) => setCurrent(e.target.value)} aria-invalid={!!fields.currentPassword} required />
      </Field>
      <Field label="New password" htmlFor={`${id}-n`} hint="At least 10 characters." error={fields.newPassword ? `The new password ${fields.newPassword.charAt(0).toLowerCase()}${fields.newPassword.slice(1)}.` : undefined}>
        <Input id={`${id}-n`} type="password" autoComplete="new-password" value={next} onChange={(e) => setNext(e.target.value)} aria-invalid={!!fields.newPassword} minLength={10} required />
      </Field>
      <Field label="New password again" htmlFor={`${id}-a`} error={mismatch ? "The two new passwords differ." : undefined}>
        <Input id={`${id}-a`} type="password" autoComplete="new-password" value={again} onChange={(e) => setAgain(e.target.value)} aria-invalid={mismatch} required />
      </Field>
      {message ? <p role="alert" className="text-sm text-hazard">{message}</p> : null}
      <Button type="submit" disabled={busy || mismatch || !current || next.length < 10} data-testid="change-password">{busy ? "Changing…" : "Change the password"}</Button>
    </form>
  );
}
