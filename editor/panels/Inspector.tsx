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
        <div data-testid="review-slot" className="border-t border-ink/10 pt-2">
          {reviewSlot(subject)}
        </div>
      )}
    </div>
  );
}
