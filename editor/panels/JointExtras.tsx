"use client";
/**
 * The joint card's records: the evidence photos of the joint (the build-records component, shared with
 * the checklist) and "Suggest a part" from the build's and the user's parts libraries.
 * Both talk to the records API about the joint as it is in the saved revision.
 */
import { useCallback, useState } from "react";
import { useQuery } from "@tanstack/react-query";
import type { Joint, JointHardware } from "@/shared/linkage/schema";
import type { PartSpec } from "@/shared/records/parts";
import type { SuggestResult, Suggestion } from "@/shared/records/suggest";
import { api } from "@/components/api-client";
import { jointKeys } from "@/components/query-keys";
import { JointPhotos } from "@/components/records/JointPhotos";
import { indexById, jointName } from "@/shared/linkage/names";
import { useEditorConfig, useEditorStore, useEditorStoreApi } from "../context";
import { fmt } from "../units";

export type RecordsTarget = { buildId: string; linkageId: string };

const jointUrl = (t: RecordsTarget, jointId: string) =>
  `/api/builds/${encodeURIComponent(t.buildId)}/linkages/${encodeURIComponent(t.linkageId)}/joints/${encodeURIComponent(jointId)}`;

/** Whether the joint is in the saved revision (the records API only knows saved joints), and unchanged since. */
function useSavedState(jointId: string) {
  return useEditorStore((s) => {
    const saved = s.saved.joints.find((j) => j.id === jointId);
    const cur = s.joints.find((j) => j.id === jointId);
    return { inSaved: !!saved, changed: !!saved && saved !== cur, revision: s.revision };
  });
}

export function JointEvidence({ target, jointId }: { target: RecordsTarget; jointId: string }) {
  const { readOnly } = useEditorConfig();
  const { inSaved } = useSavedState(jointId);
  const name = useEditorStore((s) => {
    const j = indexById(s.joints).get(jointId);
    return j ? jointName(j, s.nodes) : "";
  });
  return (
    <section className="relative rounded border border-ink/10 bg-white" data-testid="joint-evidence">
      <header className="border-b border-ink/5 px-2 py-1">
        <h4 className="text-[11px] font-semibold uppercase tracking-wide text-ink-soft">Evidence photos</h4>
      </header>
      <div className="p-2">
        {inSaved ? (
          <JointPhotos buildId={target.buildId} linkageId={target.linkageId} jointId={jointId} jointName={name} canEdit={!readOnly} canRemove />
        ) : (
          <p className="text-[11px] text-ink-soft" data-testid="joint-evidence-unsaved">
            This joint is not saved yet; photos attach once it is (autosave runs a moment after the last change, or press Save).
          </p>
        )}
      </div>
    </section>
  );
}

function marginText(m: number) {
  if (!Number.isFinite(m)) return "load not known";
  return `${m >= 0 ? "+" : ""}${m.toFixed(2)}`;
}

/** The joint's hardware with the rod end (or bolt) taken from a library part's spec. */
export function applySuggestion(hw: JointHardware, s: Suggestion): JointHardware {
  const part = s.part;
  if (part.kind === "rodEnd") {
    const spec = part.spec as PartSpec<"rodEnd">;
    const cur = hw.rodEnd;
    return {
      ...hw,
      rodEnd: {
        ...cur, // what the library part does not say (ball width, body material, …) stays as recorded
        shank: spec.shank,
        thread: spec.thread,
        hand: spec.hand,
        ballBore: spec.ballBore,
        ballDiameter: spec.ballDiameter ?? cur?.ballDiameter,
        housingBore: spec.housingBore ?? cur?.housingBore,
        ratedUltimate: spec.ratedUltimate,
        ratedMisalignment: spec.ratedMisalignment ?? cur?.ratedMisalignment,
        hasWitnessHole: spec.hasWitnessHole,
        partNumber: part.partNumber,
      },
    };
  }
  if (part.kind === "bolt") {
    const spec = part.spec as PartSpec<"bolt">;
    return { ...hw, bolt: { ...hw.bolt, size: spec.size as NonNullable<JointHardware["bolt"]>["size"], diameter: spec.diameter ?? hw.bolt?.diameter, material: spec.material, grip: spec.grip ?? hw.bolt?.grip } };
  }
  return hw;
}

function SuggestionRow({ s, canPick, onPick }: { s: Suggestion; canPick: boolean; onPick: (s: Suggestion) => void }) {
  const { unitSystem } = useEditorConfig();
  const lib = (s.part as Suggestion["part"] & { library?: "build" | "personal" }).library;
  return (
    <li className="flex items-center gap-2 py-1" data-testid="suggestion" data-part={s.part.partNumber} data-margin={Number.isFinite(s.margin) ? s.margin.toFixed(4) : "inf"}>
      <span className="min-w-0 flex-1">
        <span className="block truncate font-mono text-[11px] font-semibold text-ink">{s.part.partNumber}</span>
        <span className="block truncate text-[10px] text-ink-soft">
          {s.what === "rod end rating" ? "rated" : "shear"} {fmt(s.capacity, "force", unitSystem)}
          {lib ? ` · ${lib === "build" ? "build library" : "my library"}` : ""}
          {s.part.description ? ` · ${s.part.description}` : ""}
        </span>
      </span>
      <span className={`shrink-0 rounded px-1 text-[11px] font-semibold tabular-nums ${s.margin >= 0.5 ? "bg-ok/10 text-ok" : "bg-caution/10 text-caution"}`} title="margin of safety: capacity ÷ required ultimate load − 1" data-testid="suggestion-margin">
        {marginText(s.margin)}
      </span>
      {canPick && (
        <button type="button" onClick={() => onPick(s)} className="shrink-0 rounded border border-ink/20 px-1.5 py-0.5 text-[11px] hover:bg-ink/5" data-testid="suggestion-use">
          Use
        </button>
      )}
    </li>
  );
}

export function SuggestPart({ target, joint }: { target: RecordsTarget; joint: Joint }) {
  const storeApi = useEditorStoreApi();
  const { unitSystem, readOnly } = useEditorConfig();
  const { inSaved, changed, revision } = useSavedState(joint.id);
  const [open, setOpen] = useState(false);
  const [applied, setApplied] = useState<string | null>(null);
  const q = useQuery({
    queryKey: jointKeys.suggestions(target.linkageId, joint.id, revision),
    queryFn: () => api<SuggestResult & { revision: number; analysisStored: boolean }>(`${jointUrl(target, joint.id)}/suggestions`),
    enabled: open && inSaved,
    staleTime: 30_000,
  });
  const pick = useCallback(
    (s: Suggestion) => {
      const st = storeApi.getState();
      const cur = st.joints.find((j) => j.id === joint.id);
      if (!cur) return;
      const r = st.updateJointHardware(joint.id, applySuggestion(cur.hardware, s), { external: true });
      if (r.ok) {
        setApplied(s.part.partNumber);
        st.setNotice(`Filled the ${s.part.kind === "rodEnd" ? "rod end" : "bolt"} from ${s.part.partNumber} (undo to go back).`);
      } else st.setNotice(`${s.part.partNumber} could not be used here: ${r.reason}`);
    },
    [storeApi, joint.id],
  );
  const data = q.data;
  return (
    <section className="rounded border border-ink/10 bg-white" data-testid="suggest-part">
      <header className="flex items-center justify-between border-b border-ink/5 px-2 py-1">
        <h4 className="text-[11px] font-semibold uppercase tracking-wide text-ink-soft">Parts that fit</h4>
        <button
          type="button"
          onClick={() => setOpen((v) => !v)}
          className="touch-target rounded border border-ink/20 px-1.5 py-0.5 text-[11px] font-medium text-ink hover:bg-ink/5"
          aria-expanded={open}
          data-testid="btn-suggest-part"
        >
          {open ? "Hide" : "Suggest a part"}
        </button>
      </header>
      {open && (
        <div className="space-y-1 p-2 text-[11px]" data-testid="suggest-results">
          {!inSaved ? (
            <p className="text-ink-soft">Save the linkage first: suggestions use the loads of the saved revision.</p>
          ) : q.isLoading ? (
            <p className="text-ink-soft">Looking through the parts libraries…</p>
          ) : q.isError ? (
            <p role="alert" className="text-hazard" data-testid="suggest-error">
              {q.error instanceof Error ? q.error.message : "The suggestions could not be loaded."}
            </p>
          ) : data ? (
            <>
              <p className="text-ink-soft" data-testid="suggest-required">
                {data.required !== null ? (
                  <>
                    Needs <b className="text-ink">{fmt(data.required, "force", unitSystem)}</b> ultimate at this joint (revision {data.revision}
                    {data.analysisStored ? "" : ", checked now"}).
                  </>
                ) : (
                  <>No load is known at this joint yet, so parts are listed by fit only.</>
                )}
                {data.fit.thread && (
                  <>
                    {" "}
                    Fit: {data.fit.thread} {data.fit.hand ?? ""}
                    {data.fit.bore !== undefined ? `, bore ${fmt(data.fit.bore, "length", unitSystem)}` : ""}.
                  </>
                )}
              </p>
              {changed && <p className="text-caution">You have changed this joint since the last save; the list is for the saved hardware.</p>}
              {data.rodEnds.length === 0 && data.bolts.length === 0 ? (
                <p className="text-ink-soft" data-testid="suggest-none">
                  No part in your libraries fits and carries the load. Add parts on the Parts library page.
                </p>
              ) : (
                <>
                  {data.rodEnds.length > 0 && (
                    <div>
                      <div className="text-[10px] font-semibold uppercase tracking-wide text-ink-soft">Rod ends, best margin first</div>
                      <ul className="divide-y divide-ink/5">
                        {data.rodEnds.map((s) => (
                          <SuggestionRow key={s.part.id} s={s} canPick={!readOnly} onPick={pick} />
                        ))}
                      </ul>
                    </div>
                  )}
                  {data.bolts.length > 0 && (
                    <div>
                      <div className="text-[10px] font-semibold uppercase tracking-wide text-ink-soft">Bolts, best margin first</div>
                      {!data.planesEntered && (
                        <p className="text-ink-soft" data-testid="suggest-single-shear">Bolts are rated in single shear: this joint&apos;s shear planes are not entered.</p>
                      )}
                      <ul className="divide-y divide-ink/5">
                        {data.bolts.map((s) => (
                          <SuggestionRow key={s.part.id} s={s} canPick={!readOnly} onPick={pick} />
                        ))}
                      </ul>
                    </div>
                  )}
                </>
              )}
              {data.nearMisses.length > 0 && (
                <details>
                  <summary className="cursor-pointer text-ink-soft">{data.nearMisses.length} close but not fitting</summary>
                  <ul className="mt-1 space-y-0.5">
                    {data.nearMisses.map((m) => (
                      <li key={m.part.id} className="text-ink-soft">
                        <span className="font-mono">{m.part.partNumber}</span>: {m.reason}
                      </li>
                    ))}
                  </ul>
                </details>
              )}
              {applied && (
                <p className="text-ok" data-testid="suggest-applied">
                  Filled from {applied}. Check it against the part in your hand.
                </p>
              )}
            </>
          ) : null}
        </div>
      )}
    </section>
  );
}
