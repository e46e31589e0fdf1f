"use client";
import { useState } from "react";
import { api } from "@/components/api-client";

export function AdminToggle({ userId, name, initial, self }: { userId: string; name: string; initial: boolean; self: boolean }) {
  const [on, setOn] = useState(initial);
  const [error, setError] = useState<string | null>(null);
  return (
    <label className="inline-flex min-h-11 items-center gap-2 text-xs">
      <input
        type="checkbox"
        aria-label={`Site admin: ${name}`}
        className="h-5 w-5"
        checked={on}
        disabled={self && on}
        title={self ? "You cannot remove your own admin rights" : undefined}
        onChange={async (e) => {
          const next = e.target.checked;
          setOn(next);
          try {
            await api(`/api/admin/users/${userId}`, { method: "PATCH", body: { isSiteAdmin: next } });
            setError(null);
          } catch (err) {
            setOn(!next);
            setError(err instanceof Error ? err.message : String(err));
          }
        }}
      />
      {error ? <span className="text-hazard">{error}</span> : null}
    </label>
  );
}
