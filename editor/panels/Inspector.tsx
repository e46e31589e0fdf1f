"use client";
/** The right-hand inspector: the node properties form or the joint card of the selection, with its findings. */
import dynamic from "next/dynamic";
import { useEditorConfig, useEditorStore, useEditorStoreApi } from "../context";
import { LinkageFindings } from "./Findings";
import type { RecordsTarget } from "./JointExtras";
import { CARD_TITLE_ID } from "./card-title";
import { loadSchema } from "../store/schema";

export { CARD_TITLE_ID };

const loadingCard = () => <p className="p-1 text-[12px] text-ink-soft" data-testid="card-loading">Opening the card…</p>;
/**
 * The cards load when a part or joint is first opened (the form library, the photo panel and the graph schema
 * are not in the first load); a card shows once the schema its edits are checked with has loaded too.
 */
const cards = () => Promise.all([import("./Cards"), loadSchema()]).then(([m]) => m);
const NodeInspector = dynamic(() => cards().then((m) => m.NodeInspector), { ssr: false, loading: loadingCard });
const JointInspector = dynamic(() => cards().then((m) => m.JointInspector), { ssr: false, loading: loadingCard });

export type ReviewSlot = (sel: { type: "node" | "joint" | "linkage"; id: string }) => React.ReactNode;

function LinkageOverview({ linkageName }: { linkageName: string }) {
  const { readOnly } = useEditorConfig();
  const { nodes, joints, sel } = useEditorStore((s) => ({ nodes: s.nodes.length, joints: s.joints.length, sel: s.selection.nodes.length + s.selection.joints.length }));
  return (
    <div className="space-y-2 text-[12px] text-ink" data-testid="linkage-overview">
      <h3 id={CARD_TITLE_ID} tabIndex={-1} data-subject="linkage" className="text-sm font-semibold">{linkageName}</h3>
      <p className="text-ink-soft">
        {nodes} part{nodes === 1 ? "" : "s"}, {joints} joint{joints === 1 ? "" : "s"}
        {sel > 1 ? ` · ${sel} selected` : ""}.
      </p>
      <p className="text-ink-soft">
        {readOnly
          ? "Choose a part or a joint to read its card, its findings and its comments."
          : "Choose a part to enter its dimensions, or a joint to fill in its hardware card."}{" "}
        On the diagram, Tab to it and press Enter; or press L for the list of the run.
      </p>
      <LinkageFindings />
    </div>
  );
}

/**
 * Leaves the part's or joint's card for the whole linkage (its sign-off, revisions and comments): the touch and
 * pointer way to what Escape does, with the focus on the linkage's heading.
 */
function BackToLinkage() {
  const api = useEditorStoreApi();
  return (
    <button
      type="button"
      data-testid="card-close"
      className="-mt-1 flex min-h-11 items-center gap-1 rounded px-1 text-[12px] font-medium text-advisory hover:bg-paper hover:underline md:min-h-7"
      onClick={() => {
        api.getState().select(null);
        const focusHeading = (n: number) =>
          requestAnimationFrame(() => {
            const h = document.getElementById(CARD_TITLE_ID);
            if (h?.dataset.subject === "linkage") h.focus();
            else if (n > 0) focusHeading(n - 1);
          });
        focusHeading(30);
      }}
    >
      <span aria-hidden="true">←</span> Back to the whole linkage
    </button>
  );
}

/** Run `f` on the next frames until it returns true. */
function onFrames(f: () => boolean, frames: number) {
  const step = (n: number) => requestAnimationFrame(() => { if (!f() && n > 0) step(n - 1); });
  step(frames);
}
const ACK_OPEN = "ack-open-", ACK_REASON = "ack-reason-";
const testIdOf = (t: EventTarget | null, prefix: string, tag: string): [HTMLElement, string] | null => {
  const el = t instanceof Element ? t.closest<HTMLElement>(`${tag}[data-testid^="${prefix}"]`) : null;
  return el ? [el, el.dataset.testid!.slice(prefix.length)] : null;
};

/**
 * The focus in the review thread under the card (components/review): "Acknowledge…" opens a finding's reason
 * box and the focus goes into it; Escape in the box (or the button again) closes it with the focus back on
 * the button; once the acknowledgement is recorded the focus goes to that finding's Withdraw button.
 */
function reviewSlotFocus() {
  const find = (root: ParentNode, id: string) => root.querySelector<HTMLElement>(`[data-testid="${CSS.escape(id)}"]`);
  return {
    onClick(e: React.MouseEvent<HTMLElement>) {
      const hit = testIdOf(e.target, ACK_OPEN, "button");
      if (!hit) return;
      const slot = e.currentTarget;
      const [button, code] = hit;
      if (find(slot, ACK_REASON + code)) return; // it was open: it closes, the focus stays on the button
      onFrames(() => {
        const box = find(slot, ACK_REASON + code);
        if (!box || !button.isConnected) return !button.isConnected;
        box.focus();
        return true;
      }, 30);
    },
    onKeyDown(e: React.KeyboardEvent<HTMLElement>) {
      if (e.key !== "Escape") return;
      const hit = testIdOf(e.target, ACK_REASON, "textarea");
      if (!hit) return;
      // The box's own Escape: close it (not the card) and go back to the button that opened it.
      e.stopPropagation();
      e.preventDefault();
      const button = find(e.currentTarget, ACK_OPEN + hit[1]);
      button?.click();
      button?.focus();
    },
    onSubmit(e: React.FormEvent<HTMLElement>) {
      const form = e.target as HTMLElement;
      const box = form.querySelector?.<HTMLElement>(`textarea[data-testid^="${ACK_REASON}"]`);
      const item = form.closest<HTMLElement>("li");
      if (!box || !item) return;
      // Recorded, the box goes away: the focus goes to the finding's Withdraw button rather than to the page.
      onFrames(() => {
        if (form.isConnected) return false;
        if (document.activeElement && document.activeElement !== document.body) return true;
        const next = item.isConnected ? item.querySelector<HTMLElement>("button") : null;
        next?.focus();
        return true;
      }, 600);
    },
  };
}
const SLOT_FOCUS = reviewSlotFocus();

export default function Inspector({
  buildId,
  linkageId,
  linkageName,
  reviewSlot,
}: {
  /** With a build id, the joint card shows the records of the joint (photos, suggested parts). */
  buildId?: string;
  linkageId: string;
  linkageName: string;
  reviewSlot?: ReviewSlot;
}) {
  const sel = useEditorStore((s) => s.selection);
  const single =
    sel.nodes.length + sel.joints.length === 1
      ? sel.nodes.length === 1
        ? ({ type: "node", id: sel.nodes[0] } as const)
        : ({ type: "joint", id: sel.joints[0] } as const)
      : null;
  const subject = single ?? ({ type: "linkage", id: linkageId } as const);
  return (
    <div className="space-y-3 p-3" data-testid="inspector">
      {single && <BackToLinkage />}
      {single?.type === "node" && <NodeInspector id={single.id} />}
      {single?.type === "joint" && <JointInspector id={single.id} records={buildId ? { buildId, linkageId } : undefined} />}
      {!single && <LinkageOverview linkageName={linkageName} />}
      {reviewSlot && (
        <div data-testid="review-slot" className="border-t border-ink/10 pt-2" onClick={SLOT_FOCUS.onClick} onKeyDown={SLOT_FOCUS.onKeyDown} onSubmit={SLOT_FOCUS.onSubmit}>
          {reviewSlot(subject)}
        </div>
      )}
    </div>
  );
}
