"use client";
/**
 * The cards of the inspector: a part's properties form and a joint's hardware card, with the findings of
 * each. Loaded when a part or joint is first opened (editor/panels/Inspector.tsx): the form library, the
 * photo panel and the joint checks are not part of the editor's first load.
 */
import { useCallback, useMemo, useState } from "react";
import { z } from "zod";
import { hardwareSchema, nodeSchema, type NodeKind } from "@/shared/linkage/schema";
import { AN_BOLTS_BY_SIZE } from "@/shared/hardware";
import { useEditorConfig, useEditorStore, useEditorStoreApi, useEditorValue } from "../context";
import { KIND_NAMES } from "@/shared/linkage/kinds";
import { jointName, partName } from "@/shared/linkage/names";
import { inputText } from "../units";
import { KindGlyph } from "../nodes/glyphs";
import { SchemaForm } from "./SchemaForm";
import { jointCardSections, nodeSections } from "./specs";
import { FindingItem } from "./Findings";
import { JointEvidence, SuggestPart, type RecordsTarget } from "./JointExtras";
import { JointChecks } from "./JointChecks";
import { ReturnCableOffer } from "./ReturnCableOffer";
import { CableEndFields } from "./CableEndFields";
import { CARD_TITLE_ID } from "./card-title";
import { jointCoverage, jointResult, jointSort, type Coverage, type JointSort } from "../joints/coverage";
import { partCoverage, type PartCoverage } from "../nodes/coverage";

const formSchemas = new Map<NodeKind, z.ZodType>();
function nodeFormSchema(kind: NodeKind) {
  let s = formSchemas.get(kind);
  if (!s) {
    const opt = nodeSchema.options.find((o) => o.shape.kind.value === kind)!;
    s = z.object({ label: opt.shape.label, props: opt.shape.props });
    formSchemas.set(kind, s);
  }
  return s;
}

function SubjectFindings({ subjectKey, coverage }: { subjectKey: string; coverage: Coverage | PartCoverage | undefined }) {
  const findings = useEditorStore((s) => s.findingsBySubject[subjectKey] ?? []);
  if (findings.length === 0) {
    // A joint or part says what "no findings" means there: all checked (the only green line), partly, checked at
    // its joints, values to enter, not checked yet, or nothing of its own to check. Never a green all-clear where
    // nothing was checked.
    if (!coverage) return null;
    return (
      <p data-testid="subject-findings-none" data-coverage={coverage.state} className={`rounded px-2 py-1 text-[11px] ${COVERAGE_TONE[coverage.state]}`}>
        {coverage.text}
      </p>
    );
  }
  return (
    <ul data-testid="subject-findings" className="space-y-1">
      {findings.map((f, i) => (
        <FindingItem key={`${f.code}-${i}`} f={f} compact />
      ))}
    </ul>
  );
}

const COVERAGE_TONE: Record<Coverage["state"] | PartCoverage["state"], string> = {
  checked: "bg-ok/10 text-ok",
  atJoints: "border border-ink/10 bg-paper text-ink-soft",
  toEnter: "border border-caution/30 bg-caution/5 text-ink",
  partly: "border border-caution/30 bg-caution/5 text-ink",
  notChecked: "border border-caution/30 bg-caution/10 text-caution",
  nothingHere: "border border-ink/10 bg-paper text-ink-soft",
  pending: "border border-ink/10 bg-paper text-ink-soft",
};

/**
 * The part's values still at the starting values it was placed with (the check uses none of them), in one
 * line, and the builder's way to say they are right as they are.
 */
function StartingValues({ id, count }: { id: string; count: number }) {
  const api = useEditorStoreApi();
  const { readOnly } = useEditorConfig();
  if (count === 0) return null;
  const one = count === 1;
  return (
    <div className="flex flex-wrap items-center gap-x-2 gap-y-1 rounded border border-caution/30 bg-caution/5 px-2 py-1.5 text-[11px]" data-testid="starting-values">
      <p className="min-w-0 flex-1 basis-48 text-ink" id={`starting-values-${id}`}>
        {one
          ? "1 value is still the starting value: the check does not use it until you enter yours or confirm it."
          : `${count} values are still the starting values: the check uses none of them until you enter yours or confirm them.`}
      </p>
      {!readOnly && (
        <button
          type="button"
          data-testid="btn-confirm-values"
          aria-describedby={`starting-values-${id}`}
          className="min-h-8 shrink-0 rounded border border-ink/30 bg-white px-2 py-1 text-[12px] font-medium text-ink hover:bg-paper"
          onClick={() => {
            // The button goes with the line: the focus goes to the card's title rather than to the page.
            if (api.getState().confirmValues(id).ok) document.getElementById(CARD_TITLE_ID)?.focus();
          }}
        >
          {one ? "This value is right" : "These values are right"}
        </button>
      )}
    </div>
  );
}

export function NodeInspector({ id }: { id: string }) {
  const api = useEditorStoreApi();
  const { unitSystem, readOnly } = useEditorConfig();
  // Only the kind: the node object changes on every drag frame, and the form must not re-render for moves.
  const kind = useEditorValue((s) => s.nodes.find((n) => n.id === id)?.kind);
  const epoch = useEditorValue((s) => s.epoch);
  const [pending, setPending] = useState(0);
  const onValid = useCallback(
    (v: { label: string; props: unknown }) => {
      setPending(0);
      api.getState().updateNode(id, v, { coalesce: `node:${id}` });
    },
    [api, id],
  );
  // The form's starting values only change when the node changes from outside the form.
  // eslint-disable-next-line react-hooks/exhaustive-deps
  const value = useMemo(() => {
    const node = api.getState().nodes.find((n) => n.id === id);
    return node ? { label: node.label, props: node.props } : null;
  }, [id, epoch, unitSystem]);
  const system = useEditorValue((s) => s.meta.system);
  const sections = useMemo(() => (kind ? nodeSections(kind, system) : []), [kind, system]);
  // Read live (a string, so moves do not re-render the form): an edit or the button below unmarks a value.
  const unentered = useEditorValue((s) => s.nodes.find((n) => n.id === id)?.unentered?.join(" ") ?? "");
  const starting = useMemo(() => new Set(unentered ? unentered.split(" ").map((k) => `props.${k}`) : []), [unentered]);
  const label = useEditorValue((s) => {
    const n = s.nodes.find((x) => x.id === id);
    return n ? partName(n) : "";
  });
  // What the live check covers here (a string, so the card re-renders only when that changes).
  const coverageJson = useEditorValue((s) => {
    const n = s.nodes.find((x) => x.id === id);
    return n ? JSON.stringify(partCoverage(n, s.joints, s.nodes, s.report)) : "";
  });
  const coverage = useMemo(() => (coverageJson ? (JSON.parse(coverageJson) as PartCoverage) : undefined), [coverageJson]);
  if (!kind || !value) return null;
  return (
    <div className="space-y-2" data-testid="node-form-panel">
      <h3 id={CARD_TITLE_ID} tabIndex={-1} data-subject={`node:${id}`} className="flex items-center gap-1.5 text-sm font-semibold text-ink">
        <KindGlyph kind={kind} /> {KIND_NAMES[kind]}
        <span className="ml-auto min-w-0 truncate text-[11px] font-normal text-ink-soft" data-part-id={id}>{label}</span>
      </h3>
      <SubjectFindings subjectKey={`node:${id}`} coverage={coverage} />
      <ReturnCableOffer />
      <StartingValues id={id} count={starting.size} />
      <SchemaForm
        key={`${id}:${epoch}:${unitSystem}`}
        testId="node-form"
        schema={nodeFormSchema(kind)}
        sections={sections}
        value={value as Record<string, unknown>}
        unitSystem={unitSystem}
        disabled={readOnly}
        onValid={onValid as never}
        onInvalid={setPending}
        starting={starting}
      />
      {pending > 0 && <span className="sr-only">{pending} fields need attention</span>}
    </div>
  );
}

export function JointInspector({ id, records }: { id: string; records?: RecordsTarget }) {
  const api = useEditorStoreApi();
  const { unitSystem, readOnly } = useEditorConfig();
  const joint = useEditorStore((s) => s.joints.find((j) => j.id === id));
  const name = useEditorStore((s) => {
    const j = s.joints.find((x) => x.id === id);
    return j ? jointName(j, s.nodes) : "";
  });
  const epoch = useEditorStore((s) => s.epoch);
  // The card's sections follow the two parts' names and kinds (a string, so a drag elsewhere does not rebuild them).
  const ends = useEditorStore((s) => {
    const j = s.joints.find((x) => x.id === id);
    if (!j) return "";
    const a = s.nodes.find((n) => n.id === j.from.node), b = s.nodes.find((n) => n.id === j.to.node);
    return JSON.stringify([a?.kind, a?.label, b?.kind, b?.label, !!j.hardware.rodEnd]);
  });
  const sections = useMemo(() => {
    const s = api.getState();
    const j = s.joints.find((x) => x.id === id);
    return j ? jointCardSections(j, s.nodes) : [];
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [api, id, ends]);
  // What the live check covers here (a string, so the card re-renders only when that changes).
  const coverageJson = useEditorStore((s) => {
    const j = s.joints.find((x) => x.id === id);
    return j ? JSON.stringify([jointCoverage(j, s.nodes, jointResult(s.report, id), !!s.report), jointSort(j, s.nodes).sort]) : "";
  });
  const [coverage, sort] = useMemo(() => (coverageJson ? (JSON.parse(coverageJson) as [Coverage, JointSort["sort"]]) : [undefined, "other" as const]), [coverageJson]);
  const onValid = useCallback((v: unknown) => api.getState().updateJointHardware(id, v, { coalesce: `joint:${id}` }), [api, id]);
  // eslint-disable-next-line react-hooks/exhaustive-deps
  const value = useMemo(() => joint?.hardware ?? null, [id, epoch, unitSystem]);
  const onFieldChange = useCallback(
    (path: string, v: string | boolean, set: (p: string, val: string) => void) => {
      // Picking an AN size fills the shank diameter (and the rod-end thread is left to the builder).
      if (path === "bolt.size" && typeof v === "string" && v in AN_BOLTS_BY_SIZE) {
        set("bolt.diameter", inputText(AN_BOLTS_BY_SIZE[v as keyof typeof AN_BOLTS_BY_SIZE].diameter, "length", unitSystem));
      }
    },
    [unitSystem],
  );
  if (!joint || !value) return null;
  return (
    <div className="space-y-2" data-testid="joint-card">
      <h3 id={CARD_TITLE_ID} tabIndex={-1} data-subject={`joint:${id}`} className="text-sm font-semibold text-ink">
        Joint card
        <span className="block text-[11px] font-normal text-ink-soft">{name}</span>
      </h3>
      <SubjectFindings subjectKey={`joint:${id}`} coverage={coverage} />
      <ReturnCableOffer />
      <JointChecks jointId={id} coverage={coverage} />
      {records && joint.hardware.rodEnd && <SuggestPart target={records} joint={joint} />}
      {sort === "terminal" && (
        <p className="rounded border border-ink/10 bg-paper px-2 py-1 text-[11px] text-ink-soft" data-testid="cable-terminal-note">
          A cable&apos;s terminal: its end of the cable or turnbuckle is below (kept on that part&apos;s card too), then the bolt or clevis pin, nut and washers that hold the terminal.
        </p>
      )}
      <CableEndFields jointId={id} />
      <SchemaForm
        key={`${id}:${epoch}:${unitSystem}`}
        testId="joint-form"
        schema={hardwareSchema}
        sections={sections}
        value={value as Record<string, unknown>}
        unitSystem={unitSystem}
        disabled={readOnly}
        onValid={onValid}
        onFieldChange={onFieldChange}
      />
      {records ? (
        <JointEvidence target={records} jointId={id} />
      ) : (
        <p className="text-[10px] text-ink-soft">
          Photos: {joint.hardware.photos.length === 0 ? "none attached" : `${joint.hardware.photos.length} attached`}
        </p>
      )}
    </div>
  );
}

