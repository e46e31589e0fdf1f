/** The sign-off state of a linkage in a word and a colour: none, signed (this revision), stale (an earlier one). */
type Status = { state: "none" | "signed" | "stale"; latest: { revision: number; reviewer: { name: string }; createdAt: string } | null };

export function SignoffBadge({ status, currentRevision, compact = false }: { status: Status; currentRevision: number; compact?: boolean }) {
  const l = status.latest;
  const tone = status.state === "signed" ? "border-ok/40 bg-ok/10 text-ok" : status.state === "stale" ? "border-caution/50 bg-caution/10 text-caution" : "border-ink/15 bg-ink/5 text-ink-soft";
  const text =
    status.state === "none"
      ? "Not signed off"
      : status.state === "signed"
        ? `Signed off · r${l!.revision} by ${l!.reviewer.name}`
        : `Sign-off stale · r${l!.revision} by ${l!.reviewer.name}, now r${currentRevision}`;
  return (
    <span data-testid="signoff-status" data-state={status.state} data-revision={l?.revision ?? ""} className={`inline-flex items-center gap-1 rounded border px-1.5 py-0.5 text-[11px] font-medium ${tone}`} title={l ? new Date(l.createdAt).toLocaleString("en-CA") : undefined}>
      {status.state === "signed" ? "✓" : status.state === "stale" ? "!" : "○"} {compact && status.state !== "none" ? text.split(" ·")[0] : text}
    </span>
  );
}
