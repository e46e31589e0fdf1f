"use client";
import { signOut } from "next-auth/react";
import Link from "next/link";
import { useState } from "react";
import { Button } from "@/components/ui";
import { clearOfflineCopies } from "@/components/offline/register";

export function SignOutForm() {
  const [busy, setBusy] = useState(false);
  return (
    <div className="space-y-4">
      <h1 className="text-lg font-semibold">Sign out</h1>
      <p className="text-ink-soft">Saved work stays on the server. Anything the editor has not saved yet is lost if you sign out now.</p>
      <div className="flex gap-2">
        <Button autoFocus disabled={busy} onClick={() => { setBusy(true); void clearOfflineCopies().then(() => signOut({ callbackUrl: "/sign-in" })); }} data-testid="confirm-sign-out">
          {busy ? "Signing out…" : "Sign out"}
        </Button>
        <Link href="/builds" className="rounded px-3 py-1.5 hover:bg-ink/5">Stay signed in</Link>
      </div>
    </div>
  );
}
