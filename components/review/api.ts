"use client";
/**
 * react-query hooks of the review API. Every mutation refreshes the review queries of its linkage; a
 * save of the graph does too (editor/useAutosave), so nothing here polls. Threads and revisions come a
 * page at a time, newest first (components/paged.tsx).
 */
import { useInfiniteQuery, useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import type { z } from "zod";
import { api } from "@/components/api-client";
import { commentKeys, findingKeys, linkageKeys, meKeys, signoffKeys } from "@/components/query-keys";
import type { Subject } from "@/shared/schemas/common";
import type { commentsResponse, CommentView } from "@/shared/schemas/comments";
import type { acknowledgementsResponse } from "@/shared/schemas/acknowledgements";
import type { signoffsResponse, Signoff } from "@/shared/schemas/signoffs";
import type { diffResponse, revisionsResponse } from "@/shared/schemas/linkages";
import type { NotifyPref } from "@/shared/schemas/users";

export type { CommentView } from "@/shared/schemas/comments";
export type { AckView, FindingView } from "@/shared/schemas/acknowledgements";
export type { Person } from "@/shared/schemas/common";
export type { RevisionRow } from "@/shared/schemas/linkages";
export type SignoffView = Signoff;

const base = (buildId: string, linkageId: string) => `/api/builds/${buildId}/linkages/${linkageId}`;

type CommentPage = z.infer<typeof commentsResponse>;

/** The threads of one subject, newest first, a page at a time (each with its replies). */
export function useComments(buildId: string, linkageId: string, subject: Subject) {
  const q = useInfiniteQuery({
    queryKey: [...commentKeys.list(linkageId), subject.type, subject.id],
    queryFn: ({ pageParam }) =>
      api<CommentPage>(`${base(buildId, linkageId)}/comments?subjectType=${subject.type}&subjectId=${encodeURIComponent(subject.id)}${pageParam ? `&cursor=${encodeURIComponent(pageParam)}` : ""}`),
    initialPageParam: "",
    getNextPageParam: (last) => last.nextCursor ?? undefined,
  });
  const first = q.data?.pages[0];
  return { ...q, comments: q.data?.pages.flatMap((p) => p.comments) ?? [], total: first?.total ?? 0, unresolved: first?.unresolved ?? {}, unresolvedNames: first?.unresolvedNames ?? {} };
}

/** Open threads per subject key ("joint:j1" → 2), for markers on the canvas and the review bar (counted over every thread). */
/** One object for "no counts yet": a fresh `{}` on every render would change the markers' effect each time and loop. */
const NO_COUNTS: Record<string, number> = Object.freeze({}) as Record<string, number>;

export function useUnresolvedCounts(buildId: string, linkageId: string): Record<string, number> {
  return useQuery({
    queryKey: [...commentKeys.list(linkageId), "open"],
    queryFn: () => api<CommentPage>(`${base(buildId, linkageId)}/comments?limit=1`).then((r) => r.unresolved),
  }).data ?? NO_COUNTS;
}

export function useAcknowledgements(buildId: string, linkageId: string) {
  return useQuery({
    queryKey: findingKeys.list(linkageId),
    queryFn: () => api<z.infer<typeof acknowledgementsResponse>>(`${base(buildId, linkageId)}/acknowledgements`),
  });
}

export function useSignoffs(buildId: string, linkageId: string) {
  return useQuery({
    queryKey: signoffKeys.list(linkageId),
    queryFn: () => api<z.infer<typeof signoffsResponse>>(`${base(buildId, linkageId)}/signoffs`),
  });
}

/** The revision history a page at a time, newest first (see components/paged.tsx). */
export function useRevisions(buildId: string, linkageId: string, enabled = true) {
  const q = useInfiniteQuery({
    queryKey: linkageKeys.revisions(linkageId),
    queryFn: ({ pageParam }) => api<z.infer<typeof revisionsResponse>>(`${base(buildId, linkageId)}/revisions${pageParam ? `?cursor=${encodeURIComponent(pageParam)}` : ""}`),
    initialPageParam: "",
    getNextPageParam: (last) => last.nextCursor ?? undefined,
    enabled,
  });
  return { ...q, revisions: q.data?.pages.flatMap((p) => p.revisions) ?? [], total: q.data?.pages[0]?.total ?? 0 };
}

export function useDiff(buildId: string, linkageId: string, from: number | null, to: number | null) {
  return useQuery({
    queryKey: linkageKeys.diff(linkageId, from, to),
    queryFn: () => api<z.infer<typeof diffResponse>>(`${base(buildId, linkageId)}/diff?from=${from}&to=${to}`),
    enabled: from !== null && to !== null,
    staleTime: Infinity,
  });
}

export function useNotify() {
  return useQuery({ queryKey: meKeys.notify, queryFn: () => api<{ notify: NotifyPref }>("/api/me/notifications") });
}

function useReviewMutation<V, R>(linkageId: string, fn: (v: V) => Promise<R>) {
  const qc = useQueryClient();
  return useMutation({ mutationFn: fn, onSettled: () => qc.invalidateQueries({ queryKey: linkageKeys.review(linkageId) }) });
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
      onSuccess: (d) => qc.setQueryData(meKeys.notify, d),
    }),
  };
}
