"use client";
/** react-query hooks of the review API; every mutation refreshes the review queries of its linkage. */
import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { api } from "@/components/api-client";
import type { Subject, Finding } from "@/shared/analysis/types";
import type { GraphDiff } from "@/shared/review/diff";
import type { NotifyPref } from "@/shared/review-api";

export type Person = { id: string | null; name: string };
export type CommentView = {
  id: string;
  subject: Subject;
  parentId: string | null;
  author: Person;
  body: string;
  revision: number;
  createdAt: string;
  editedAt: string | null;
  editableUntil: string;
  resolvedAt: string | null;
  resolvedBy: Person | null;
};
export type AckView = { id: string; code: string; subject: Subject; reason: string; by: Person; revision: number; createdAt: string; status: "active" | "lapsed" };
export type FindingView = Finding & { subjectName: string; acknowledgement: AckView | null; lapsed: AckView | null };
export type SignoffView = { id: string; revision: number; reviewer: Person; statement: string; createdAt: string; stale: boolean };
export type RevisionRow = { revision: number; author: Person; createdAt: string; summary: { hazard: number; caution: number; advisory: number } | null };

const POLL = 4000;
const base = (buildId: string, linkageId: string) => `/api/builds/${buildId}/linkages/${linkageId}`;
export const reviewKey = (linkageId: string, what: string, ...rest: unknown[]) => ["review", linkageId, what, ...rest];

export function useComments(buildId: string, linkageId: string) {
  return useQuery({
    queryKey: reviewKey(linkageId, "comments"),
    queryFn: () => api<{ comments: CommentView[]; unresolved: Record<string, number>; editMinutes: number }>(`${base(buildId, linkageId)}/comments`),
    refetchInterval: POLL,
  });
}

/** Open threads per subject key ("joint:j1" → 2), for markers on the canvas. */
export function useUnresolvedCounts(buildId: string, linkageId: string): Record<string, number> {
  return useComments(buildId, linkageId).data?.unresolved ?? {};
}

export function useAcknowledgements(buildId: string, linkageId: string) {
  return useQuery({
    queryKey: reviewKey(linkageId, "acks"),
    queryFn: () => api<{ revision: number; findings: FindingView[]; acknowledgements: AckView[] }>(`${base(buildId, linkageId)}/acknowledgements`),
    refetchInterval: POLL,
  });
}

export function useSignoffs(buildId: string, linkageId: string) {
  return useQuery({
    queryKey: reviewKey(linkageId, "signoffs"),
    queryFn: () =>
      api<{ currentRevision: number; status: { state: "none" | "signed" | "stale"; latest: SignoffView | null }; signoffs: SignoffView[] }>(`${base(buildId, linkageId)}/signoffs`),
    refetchInterval: POLL,
  });
}

export function useRevisions(buildId: string, linkageId: string, enabled = true) {
  return useQuery({
    queryKey: reviewKey(linkageId, "revisions"),
    queryFn: () => api<{ currentRevision: number; revisions: RevisionRow[] }>(`${base(buildId, linkageId)}/revisions`),
    enabled,
    refetchInterval: POLL,
  });
}

export function useDiff(buildId: string, linkageId: string, from: number | null, to: number | null) {
  return useQuery({
    queryKey: reviewKey(linkageId, "diff", from, to),
    queryFn: () => api<{ diff: GraphDiff; from: { revision: number }; to: { revision: number } }>(`${base(buildId, linkageId)}/diff?from=${from}&to=${to}`),
    enabled: from !== null && to !== null,
    staleTime: Infinity,
  });
}

export function useNotify() {
  return useQuery({ queryKey: ["me", "notify"], queryFn: () => api<{ notify: NotifyPref }>("/api/me/notifications") });
}

function useReviewMutation<V, R>(linkageId: string, fn: (v: V) => Promise<R>) {
  const qc = useQueryClient();
  return useMutation({ mutationFn: fn, onSettled: () => qc.invalidateQueries({ queryKey: ["review", linkageId] }) });
}

export function useReviewActions(buildId: string, linkageId: string) {
  const b = base(buildId, linkageId);
  const qc = useQueryClient();
  return {
    comment: useReviewMutation(linkageId, (v: { subject: Subject; body: string; parentId?: string }) => api<{ comment: CommentView }>(`${b}/comments`, { method: "POST", body: v })),
    edit: useReviewMutation(linkageId, (v: { id: string; body: string }) => api(`${b}/comments/${v.id}`, { method: "PATCH", body: { body: v.body } })),
    resolve: useReviewMutation(linkageId, (v: { id: string; resolved: boolean }) => api(`${b}/comments/${v.id}`, { method: "PATCH", body: { resolved: v.resolved } })),
    acknowledge: useReviewMutation(linkageId, (v: { code: string; subject: Subject; reason: string }) => api(`${b}/acknowledgements`, { method: "POST", body: v })),
    withdraw: useReviewMutation(linkageId, (id: string) => api(`${b}/acknowledgements/${id}`, { method: "DELETE" })),
    signOff: useReviewMutation(linkageId, (v: { revision: number; statement: string }) => api(`${b}/signoffs`, { method: "POST", body: v })),
    setNotify: useMutation({
      mutationFn: (notify: NotifyPref) => api<{ notify: NotifyPref }>("/api/me/notifications", { method: "PATCH", body: { notify } }),
      onSuccess: (d) => qc.setQueryData(["me", "notify"], d),
    }),
  };
}
