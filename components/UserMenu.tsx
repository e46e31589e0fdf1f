"use client";
import Link from "next/link";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { api } from "./api-client";

export function UserMenu({ name, email, unitSystem, isSiteAdmin = false }: { name: string; email: string; unitSystem: "US" | "SI"; isSiteAdmin?: boolean }) {
  const router = useRouter();
  const [units, setUnits] = useState(unitSystem);
  async function switchUnits(next: "US" | "SI") {
    setUnits(next);
    await api("/api/me", { method: "PATCH", body: { unitSystem: next } });
    router.refresh();
  }
  return (
    <div className="flex items-center gap-3 text-xs">
      <div role="group" aria-label="Units" className="flex rounded border border-ink/20">
        {(["US", "SI"] as const).map((u) => (
          <button
            key={u}
            type="button"
            aria-pressed={units === u}
            onClick={() => switchUnits(u)}
            className={`min-h-6 px-2 py-1 first:rounded-l last:rounded-r ${units === u ? "bg-ink text-white" : "bg-white text-ink hover:bg-ink/5"}`}
            title={u === "US" ? "US customary: lbf, in, in·lbf" : "SI: N, mm, N·m"}
          >
            {u}
          </button>
        ))}
      </div>
      {isSiteAdmin ? <Link href="/admin/users" className="rounded px-2 py-1 hover:bg-ink/5">Users</Link> : null}
      <Link href="/account" className="rounded px-2 py-1 text-ink-soft hover:bg-ink/5" title={`${email} — your account`}>
        <span className="sm:hidden">Account</span>
        <span className="hidden sm:inline">{name}</span>
      </Link>
      <Link href="/sign-out" className="rounded px-2 py-1 hover:bg-ink/5">Sign out</Link>
    </div>
  );
}
