"use client";
import { zodResolver } from "@hookform/resolvers/zod";
import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { useForm } from "react-hook-form";
import { useEffect, useRef, useState } from "react";
import type { z } from "zod";
import { api, ApiFailure } from "@/components/api-client";
import { Button, Card, Field, Input, Select } from "@/components/ui";
import { memberAdd } from "@/shared/schemas/members";
import { ROLES, ROLE_LABEL, type Role } from "@/shared/roles";

import { memberKeys } from "@/components/query-keys";
import type { Invitation, Member } from "@/shared/schemas/members";

const ROLE_HELP: Record<Role, string> = {
  owner: "everything, including members and deleting the build",
  builder: "edits linkages, hardware, the log and uploads",
  reviewer: "reads, comments, acknowledges findings and signs off",
  viewer: "reads only",
};

export function MembersManager(p: { buildId: string; me: string; canManage: boolean; initialMembers: Member[]; initialInvitations: Invitation[] }) {
  const qc = useQueryClient();
  const base = `/api/builds/${p.buildId}`;
  const members = useQuery({ queryKey: memberKeys.list(p.buildId), queryFn: async () => (await api<{ members: Member[] }>(`${base}/members`)).members, initialData: p.initialMembers });
  const invitations = useQuery({
    queryKey: memberKeys.invitations(p.buildId),
    queryFn: async () => (await api<{ invitations: Invitation[] }>(`${base}/invitations`)).invitations,
    initialData: p.initialInvitations,
    enabled: p.canManage,
  });
  const [link, setLink] = useState<string | null>(null);
  const [error, setError] = useState<string | null>(null);
  const refresh = () => { qc.invalidateQueries({ queryKey: memberKeys.list(p.buildId) }); qc.invalidateQueries({ queryKey: memberKeys.invitations(p.buildId) }); };
  const fail = (e: unknown) => setError(e instanceof Error ? e.message : String(e));

  const form = useForm<z.input<typeof memberAdd>>({ resolver: zodResolver(memberAdd), defaultValues: { email: "", role: "builder" } });
  const add = useMutation({
    mutationFn: (v: z.input<typeof memberAdd>) => api<{ link?: string }>(`${base}/members`, { body: v }),
    onSuccess: (r) => { setLink(r.link ?? null); setError(null); form.reset({ email: "", role: form.getValues("role") }); refresh(); },
    onError: (e) => { if (e instanceof ApiFailure && e.fields?.email) form.setError("email", { message: e.fields.email }); fail(e); },
  });
  const setRole = useMutation({ mutationFn: (v: { userId: string; role: Role }) => api(`${base}/members/${v.userId}`, { method: "PATCH", body: { role: v.role } }), onSuccess: refresh, onError: fail });
  const remove = useMutation({ mutationFn: (userId: string) => api(`${base}/members/${userId}`, { method: "DELETE" }), onSuccess: refresh, onError: fail });
  const revoke = useMutation({ mutationFn: (id: string) => api(`${base}/invitations/${id}`, { method: "DELETE" }), onSuccess: refresh, onError: fail });

  return (
    <div className="space-y-6">
      {error ? <p role="alert" className="rounded bg-hazard/10 px-3 py-2 text-xs text-hazard">{error}</p> : null}
      <Card title="People on this build">
        {/* A list, not a table: on a phone each person is a row of their own (name and e-mail, then role and Remove). */}
        <ul className="divide-y divide-ink/10">
          {members.data.map((m) => (
            <li key={m.userId} className="grid grid-cols-[minmax(0,1fr)_auto] items-center gap-x-3 gap-y-1 py-2 sm:grid-cols-[minmax(0,1fr)_10rem_5.5rem]" data-testid="member-row">
              <div className="col-span-2 min-w-0 sm:col-span-1">
                <p className="font-medium">{m.name}{m.userId === p.me ? <span className="font-normal text-ink-soft"> (you)</span> : null}</p>
                <p className="text-xs text-ink-soft [overflow-wrap:anywhere]">{m.email}</p>
              </div>
              <div className="min-w-0">
                {p.canManage ? (
                  <RoleChange m={m} mine={m.userId === p.me} saving={setRole.isPending} onSave={(role) => setRole.mutate({ userId: m.userId, role })} />
                ) : <span className="text-sm"><span className="sr-only">Role: </span>{ROLE_LABEL[m.role]}</span>}
              </div>
              <div className="text-right">
                {p.canManage && m.userId !== p.me ? (
                  <Button size="sm" tone="ghost" className="touch-target text-hazard" onClick={() => { if (window.confirm(`Remove ${m.name} from this build?`)) remove.mutate(m.userId); }}>Remove</Button>
                ) : null}
              </div>
            </li>
          ))}
        </ul>
      </Card>
      {p.canManage ? (
        <Card title="Add someone">
          <form className="grid gap-3 sm:grid-cols-[1fr_10rem_auto] sm:items-end" onSubmit={form.handleSubmit((v) => add.mutate(v))} noValidate>
            <Field label="E-mail" htmlFor="invite-email" error={form.formState.errors.email?.message}>
              <Input id="invite-email" type="email" aria-invalid={!!form.formState.errors.email} {...form.register("email")} />
            </Field>
            <Field label="Role" htmlFor="invite-role">
              <Select id="invite-role" {...form.register("role")}>{ROLES.map((r) => <option key={r} value={r}>{ROLE_LABEL[r]}</option>)}</Select>
            </Field>
            <Button type="submit" disabled={add.isPending}>{add.isPending ? "Adding…" : "Add"}</Button>
          </form>
          <ul className="mt-3 grid gap-1 text-xs text-ink-soft sm:grid-cols-2">
            {ROLES.map((r) => <li key={r}><span className="font-semibold text-ink">{ROLE_LABEL[r]}</span> — {ROLE_HELP[r]}</li>)}
          </ul>
          <p className="mt-2 text-xs text-ink-soft">Someone with an account joins at once. Anyone else gets an invitation link that works once, for 14 days.</p>
          {link ? (
            <div className="mt-3 rounded border border-advisory/30 bg-advisory/5 p-2 text-xs" data-testid="invite-link">
              Invitation link (send it to them): <code className="select-all break-all">{link}</code>
            </div>
          ) : null}
        </Card>
      ) : null}
      {p.canManage && invitations.data.length > 0 ? (
        <Card title="Invitations">
          <ul className="divide-y divide-ink/10">
            {invitations.data.map((i) => (
              <li key={i.id} className="flex flex-wrap items-center justify-between gap-x-3 py-2">
                <span className="min-w-0 [overflow-wrap:anywhere]">{i.email} · {ROLE_LABEL[i.role]}</span>
                <span className="flex items-center gap-2 text-xs text-ink-soft">
                  {i.acceptedAt ? `accepted ${new Date(i.acceptedAt).toLocaleDateString("en-CA")}` : `open until ${new Date(i.expiresAt).toLocaleDateString("en-CA")}`}
                  {!i.acceptedAt ? <Button size="sm" tone="ghost" onClick={() => revoke.mutate(i.id)}>Withdraw</Button> : null}
                </span>
              </li>
            ))}
          </ul>
        </Card>
      ) : null}
    </div>
  );
}

/**
 * A member's role as the owner sees it. Choosing a role in the select changes nothing yet: Save beside it makes the
 * change (Cancel, or Escape, puts the select back), so arrowing through a closed select never saves each role in turn.
 * The owner's own select is disabled, with the reason under it.
 */
function RoleChange({ m, mine, saving, onSave }: { m: Member; mine: boolean; saving: boolean; onSave: (role: Role) => void }) {
  const [draft, setDraft] = useState<Role>(m.role);
  // Save and Cancel go away once the select shows the saved role again: the focus goes back to the select.
  const select = useRef<HTMLSelectElement>(null);
  const sent = useRef(false);
  useEffect(() => {
    setDraft(m.role);
    if (sent.current) { sent.current = false; select.current?.focus(); }
  }, [m.role]);
  const cancel = () => { setDraft(m.role); select.current?.focus(); };
  const changed = draft !== m.role;
  const reasonId = `own-role-${m.userId}`;
  return (
    <div className="space-y-1" onKeyDown={(e) => { if (e.key === "Escape" && changed) { e.preventDefault(); cancel(); } }}>
      <Select ref={select} aria-label={`Role of ${m.name}`} value={draft} disabled={mine} aria-describedby={mine ? reasonId : undefined}
        onChange={(e) => setDraft(e.target.value as Role)} className="max-w-[12rem] disabled:bg-paper disabled:text-ink-soft sm:max-w-none">
        {ROLES.map((r) => <option key={r} value={r}>{ROLE_LABEL[r]}</option>)}
      </Select>
      {mine ? <p id={reasonId} className="text-xs text-ink-soft">Your own role: another owner can change it.</p> : null}
      {changed ? (
        <div className="flex flex-wrap gap-1" data-testid="role-change">
          <Button size="sm" className="touch-target min-h-6" aria-disabled={saving} onClick={() => { if (!saving) { sent.current = true; onSave(draft); } }}>Save: {ROLE_LABEL[draft]}</Button>
          <Button size="sm" tone="ghost" className="touch-target min-h-6" onClick={cancel}>Cancel</Button>
        </div>
      ) : null}
    </div>
  );
}
