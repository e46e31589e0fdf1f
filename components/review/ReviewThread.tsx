"use client";
/**
 * The review thread of the editor's selection (rendered under the joint card): comment threads with
 * replies, edit-within-the-window, resolve / reopen, and the acknowledgements of the subject's findings.
 * With nothing selected it shows the linkage's review panel: sign-off, history and diff.
 */
import { findingTitle } from "@/shared/analysis/finding-title";
import { useEffect, useRef, useState } from "react";
import { LoadMore } from "@/components/paged";
import type { Subject } from "@/shared/analysis/types";
import { ApiFailure } from "@/components/api-client";
import { LinkifiedText } from "./LinkifiedText";
import { useAcknowledgements, useComments, useReviewActions, type CommentView, type FindingView } from "./api";
import { ReviewPanel } from "./ReviewPanel";
import { when } from "./format";

export type ReviewMe = { userId: string; canComment: boolean; canAcknowledge: boolean; canSignOff: boolean };
type Props = { buildId: string; linkageId: string; subject: Subject; me: ReviewMe };

const errText = (e: unknown) => (e instanceof ApiFailure ? (e.fields ? Object.values(e.fields).join(" ") : e.message) : e ? String(e) : "");
const box = "w-full rounded border border-ink/20 bg-white px-2 py-1 text-[12px] text-ink focus:border-advisory focus:outline-none";
const btn = "min-h-6 rounded px-2 py-0.5 text-[11px] font-medium disabled:opacity-50";

function Composer({ testId, placeholder, submitLabel, onSubmit, busy, error, autoFocus }: { testId: string; placeholder: string; submitLabel: string; onSubmit: (text: string) => Promise<unknown>; busy: boolean; error?: string; autoFocus?: boolean }) {
  const [text, setText] = useState("");
  const field = useRef<HTMLTextAreaElement>(null);
  return (
    <form
      className="space-y-1"
      onSubmit={async (e) => {
        e.preventDefault();
        if (!text.trim()) return;
        try {
          await onSubmit(text);
          setText("");
          // The button is disabled with the box empty: the focus stays in the box for the next comment.
          field.current?.focus();
        } catch {}
      }}
    >
      <textarea ref={field} data-testid={`${testId}-body`} className={box} rows={2} value={text} placeholder={placeholder} onChange={(e) => setText(e.target.value)} autoFocus={autoFocus} maxLength={10000} />
      {error && <p role="alert" className="text-[11px] text-hazard">{error}</p>}
      <button type="submit" data-testid={`${testId}-submit`} disabled={busy || !text.trim()} className={`${btn} bg-ink text-white`}>
        {busy ? "Sending…" : submitLabel}
      </button>
    </form>
  );
}

function CommentItem({ c, me, onEdit, editing, setEditing }: { c: CommentView; me: ReviewMe; onEdit: (body: string) => Promise<unknown>; editing: boolean; setEditing: (v: boolean) => void }) {
  const [draft, setDraft] = useState(c.body);
  const canEdit = me.canComment && c.author.id === me.userId && Date.now() < Date.parse(c.editableUntil);
  return (
    <div data-testid="comment" data-comment-id={c.id} className="text-[12px]">
      <div className="flex items-baseline gap-1 text-[11px] text-ink-soft">
        <span className="font-semibold text-ink" data-testid="comment-author">{c.author.name}</span>
        <span title={c.createdAt}>{when(c.createdAt)}</span>
        <span>· r{c.revision}</span>
        {c.editedAt && <span title={c.editedAt}>· edited</span>}
        {canEdit && !editing && (
          <button type="button" data-testid="comment-edit" className="ml-auto text-advisory hover:underline" onClick={() => { setDraft(c.body); setEditing(true); }}>
            edit
          </button>
        )}
      </div>
      {editing ? (
        <form className="mt-1 space-y-1" onSubmit={async (e) => { e.preventDefault(); try { await onEdit(draft); setEditing(false); } catch {} }}>
          <textarea data-testid="comment-edit-body" className={box} rows={2} value={draft} onChange={(e) => setDraft(e.target.value)} />
          <div className="flex gap-1">
            <button type="submit" data-testid="comment-edit-save" className={`${btn} bg-ink text-white`}>Save</button>
            <button type="button" className={`${btn} text-ink-soft`} onClick={() => setEditing(false)}>Cancel</button>
          </div>
        </form>
      ) : (
        <LinkifiedText text={c.body} className="mt-0.5 text-ink" />
      )}
    </div>
  );
}

function Thread({ root, replies, me, actions }: { root: CommentView; replies: CommentView[]; me: ReviewMe; actions: ReturnType<typeof useReviewActions> }) {
  const [replying, setReplying] = useState(false);
  const [editing, setEditing] = useState<string | null>(null);
  const resolved = !!root.resolvedAt;
  return (
    <li data-testid="review-thread-item" data-thread-id={root.id} data-resolved={resolved ? "yes" : "no"} className={`space-y-1.5 rounded border p-2 ${resolved ? "border-ink/10 bg-paper opacity-75" : "border-caution/40 bg-white"}`}>
      <CommentItem c={root} me={me} editing={editing === root.id} setEditing={(v) => setEditing(v ? root.id : null)} onEdit={(body) => actions.edit.mutateAsync({ id: root.id, body })} />
      {replies.length > 0 && (
        <ul className="space-y-1.5 border-l-2 border-ink/10 pl-2">
          {replies.map((r) => (
            <li key={r.id}>
              <CommentItem c={r} me={me} editing={editing === r.id} setEditing={(v) => setEditing(v ? r.id : null)} onEdit={(body) => actions.edit.mutateAsync({ id: r.id, body })} />
            </li>
          ))}
        </ul>
      )}
      {resolved && (
        <p className="text-[11px] text-ok" data-testid="thread-resolved-note">
          Resolved by {root.resolvedBy?.name} · {when(root.resolvedAt!)}
        </p>
      )}
      {me.canComment && (
        <div className="flex gap-2">
          {!resolved && (
            <button type="button" data-testid="thread-reply" className="text-[11px] text-advisory hover:underline" onClick={() => setReplying((v) => !v)}>
              Reply
            </button>
          )}
          <button
            type="button"
            data-testid={resolved ? "thread-reopen" : "thread-resolve"}
            className="text-[11px] text-ink-soft hover:underline"
            disabled={actions.resolve.isPending}
            onClick={() => actions.resolve.mutate({ id: root.id, resolved: !resolved })}
          >
            {resolved ? "Reopen" : "Mark resolved"}
          </button>
        </div>
      )}
      {replying && !resolved && (
        <Composer
          testId="reply"
          placeholder="Reply…"
          submitLabel="Reply"
          autoFocus
          busy={actions.comment.isPending}
          error={errText(actions.comment.error)}
          onSubmit={async (body) => {
            await actions.comment.mutateAsync({ subject: root.subject, body, parentId: root.id });
            setReplying(false);
          }}
        />
      )}
    </li>
  );
}

/**
 * The findings of the selection and their acknowledgements. Focus, for the keyboard: "Acknowledge…" opens the
 * finding's reason box with the focus in it; Escape in the box closes it (not the card around it) with the focus
 * back on that button; once recorded, the focus goes to the finding's Withdraw button.
 */
function SubjectFindingsReview({ findings, me, actions }: { findings: FindingView[]; me: ReviewMe; actions: ReturnType<typeof useReviewActions> }) {
  const [open, setOpen] = useState<string | null>(null);
  const [reason, setReason] = useState("");
  const openers = useRef(new Map<string, HTMLButtonElement>());
  const withdrawers = useRef(new Map<string, HTMLButtonElement>());
  /** The finding whose acknowledgement was just recorded: its Withdraw button takes the focus when it appears. */
  const [recorded, setRecorded] = useState<string | null>(null);
  useEffect(() => {
    if (!recorded) return;
    const b = withdrawers.current.get(recorded);
    if (b) {
      b.focus();
      setRecorded(null);
    }
  });
  const close = (key: string) => {
    setOpen(null);
    openers.current.get(key)?.focus();
  };
  if (findings.length === 0) return null;
  return (
    <ul className="space-y-1" data-testid="review-findings">
      {findings.map((f) => {
        const key = `${f.code}`;
        const ack = f.acknowledgement;
        return (
          <li key={key} data-testid={`review-finding-${f.code}`} data-acknowledged={ack ? "yes" : f.lapsed ? "lapsed" : "no"} className="rounded border border-ink/10 bg-white p-1.5 text-[11px]">
            <div className="flex items-center gap-1">
              <span className={`font-semibold ${f.severity === "hazard" ? "text-hazard" : f.severity === "caution" ? "text-caution" : "text-advisory"}`}>{f.severity}</span>
              <span className="font-semibold text-ink-soft" data-code={f.code}>{findingTitle(f.code)}</span>
              {me.canAcknowledge && !ack && (
                <button
                  type="button"
                  data-testid={`ack-open-${f.code}`}
                  aria-expanded={open === key}
                  ref={(b) => { if (b) openers.current.set(key, b); else openers.current.delete(key); }}
                  className="ml-auto min-h-6 text-advisory hover:underline"
                  onClick={() => { setOpen(open === key ? null : key); setReason(""); }}
                >
                  Acknowledge…
                </button>
              )}
              {me.canAcknowledge && ack && (
                <button
                  type="button"
                  data-testid={`ack-withdraw-${f.code}`}
                  ref={(b) => { if (b) withdrawers.current.set(key, b); else withdrawers.current.delete(key); }}
                  className="ml-auto min-h-6 text-ink-soft hover:underline"
                  onClick={() => actions.withdraw.mutate(ack.id)}
                >
                  Withdraw
                </button>
              )}
            </div>
            {ack && (
              <p className="mt-0.5 text-ok" data-testid={`ack-status-${f.code}`}>
                Acknowledged by {ack.by.name} (r{ack.revision}): <span className="text-ink">{ack.reason}</span>
              </p>
            )}
            {!ack && f.lapsed && (
              <p className="mt-0.5 text-caution" data-testid={`ack-lapsed-${f.code}`}>
                Acknowledgement by {f.lapsed.by.name} lapsed: this {f.subject.type}&apos;s hardware changed after r{f.lapsed.revision}.
              </p>
            )}
            {open === key && (
              <form
                className="mt-1 space-y-1"
                onSubmit={async (e) => {
                  e.preventDefault();
                  try {
                    await actions.acknowledge.mutateAsync({ code: f.code, subject: f.subject, reason });
                    setOpen(null);
                    setRecorded(key);
                  } catch {}
                }}
              >
                <textarea
                  data-testid={`ack-reason-${f.code}`}
                  aria-label={`Why the ${findingTitle(f.code)} finding is acceptable`}
                  className={box}
                  rows={2}
                  value={reason}
                  placeholder="Why this is acceptable (e.g. the part's tested rating, the designer's note)"
                  autoFocus
                  onChange={(e) => setReason(e.target.value)}
                  onKeyDown={(e) => {
                    if (e.key !== "Escape") return;
                    // The box's own Escape: it closes, not the card it sits in.
                    e.stopPropagation();
                    e.preventDefault();
                    close(key);
                  }}
                />
                {actions.acknowledge.error && <p role="alert" className="text-hazard">{errText(actions.acknowledge.error)}</p>}
                <button type="submit" data-testid={`ack-submit-${f.code}`} disabled={!reason.trim() || actions.acknowledge.isPending} className={`${btn} bg-ink text-white`}>
                  Record acknowledgement
                </button>
              </form>
            )}
          </li>
        );
      })}
    </ul>
  );
}

export function ReviewThread({ buildId, linkageId, subject, me }: Props) {
  const comments = useComments(buildId, linkageId, subject);
  const acks = useAcknowledgements(buildId, linkageId);
  const actions = useReviewActions(buildId, linkageId);
  const mine = comments.comments;
  const roots = mine.filter((c) => !c.parentId);
  // Over every thread of the subject, not only the pages loaded.
  const open = comments.unresolved[`${subject.type}:${subject.id}`] ?? 0;
  const findings = (acks.data?.findings ?? []).filter((f) => f.subject.type === subject.type && f.subject.id === subject.id);
  const what = subject.type === "linkage" ? "the linkage as a whole" : `this ${subject.type === "joint" ? "joint" : "part"}`;
  return (
    <section data-testid="review-thread" data-subject={`${subject.type}:${subject.id}`} className="space-y-2 text-ink">
      {subject.type === "linkage" && <ReviewPanel buildId={buildId} linkageId={linkageId} me={me} unresolved={comments.unresolved} names={comments.unresolvedNames} />}
      <h4 className="flex items-center gap-2 text-[12px] font-semibold">
        Review of {what}
        <span data-testid="review-open-count" data-count={open} className={`rounded-full px-1.5 text-[10px] ${open ? "bg-caution/15 text-caution" : "bg-ink/5 text-ink-soft"}`}>
          {open} open
        </span>
      </h4>
      {subject.type !== "linkage" && <SubjectFindingsReview findings={findings} me={me} actions={actions} />}
      {comments.isLoading ? (
        <p className="text-[11px] text-ink-soft">Loading comments…</p>
      ) : comments.error && !comments.data ? (
        <p role="alert" className="text-[11px] text-hazard">{errText(comments.error)}</p>
      ) : roots.length === 0 ? (
        <p className="text-[11px] text-ink-soft">No comments on {what} yet.</p>
      ) : (
        <ul className="space-y-2">
          {roots.map((r) => (
            <Thread key={r.id} root={r} replies={mine.filter((c) => c.parentId === r.id)} me={me} actions={actions} />
          ))}
          <li><LoadMore shown={roots.length} total={comments.total} noun="threads" hasMore={!!comments.hasNextPage} loading={comments.isFetchingNextPage} error={comments.isFetchNextPageError ? comments.error : null} onMore={() => void comments.fetchNextPage()} /></li>
        </ul>
      )}
      {me.canComment && (
        <Composer
          testId="comment"
          placeholder={`Comment on ${what}… (links are fine; @name tells someone)`}
          submitLabel="Add comment"
          busy={actions.comment.isPending}
          error={errText(actions.comment.error)}
          onSubmit={(body) => actions.comment.mutateAsync({ subject, body })}
        />
      )}
    </section>
  );
}

export default ReviewThread;
