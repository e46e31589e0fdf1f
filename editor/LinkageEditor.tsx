"use client";
/**
 * The linkage editor screen: parts tray | canvas | inspector + findings, with a toolbar, the
 * summary strip, autosave with revisions, import/export and picture export for the build log.
 */
import "@xyflow/react/dist/style.css";
import { useCallback, useEffect, useRef, useState } from "react";
import { ReactFlowProvider, useReactFlow, type Node } from "@xyflow/react";
import { useStore } from "zustand";
import { useShallow } from "zustand/react/shallow";
import type { ControlSystem, LinkageGraph } from "@/shared/linkage/schema";
import { parseLinkageFile, serializeLinkage } from "@/shared/linkage/io";
import dynamic from "next/dynamic";
import type { AnalysisSettings } from "@/shared/analysis/types";
import { analyze } from "@/shared/analysis";
import { EditorConfigContext, EditorStoreContext } from "./context";
import { createEditorStore, toGraph, type EditorStore } from "./store";
import Canvas, { GRID, useFitAll } from "./Canvas";
import { nodeLines } from "./nodes";
import PartsTray from "./panels/PartsTray";
import Inspector, { type ReviewSlot } from "./panels/Inspector";
import { CAUTION, FindingsList, SummaryStrip } from "./panels/Findings";
import { subjectName } from "@/shared/linkage/names";
import { useAutosave, type SaveStatus } from "./useAutosave";
import { downloadBlob, exportLinkagePng, fileSafe } from "./export";
import { ConflictDialog } from "./panels/ConflictDialog";
import { ShortcutsSheet } from "./panels/ShortcutsSheet";
import { readDeepLink } from "./view";
import { uploadFile } from "@/components/api-client";

/** The geometry view and its chart library load only when it is opened (the editor's first load stays as it was). */
const GeometryPanel = dynamic(() => import("./geometry/GeometryPanel"), { ssr: false, loading: () => <p className="p-3 text-[12px] text-ink-soft">Loading the geometry view…</p> });

export type LinkageEditorProps = {
  buildId: string;
  buildName: string;
  linkageId: string;
  linkageName: string;
  system: ControlSystem;
  initial: { revision: number; graph: LinkageGraph; authorName: string; createdAt: string };
  canEdit: boolean;
  canComment: boolean;
  unitSystem: "US" | "SI";
  settings: AnalysisSettings;
  /** Rendered under the joint card: the review thread of the selection. */
  reviewSlot?: ReviewSlot;
  /** Fill the parent's height (the page puts a review strip above the editor) instead of the screen under the header. */
  fill?: boolean;
};

export function pictureUrl(buildId: string, linkageId: string, revision: number) {
  return `/api/builds/${encodeURIComponent(buildId)}/linkages/${encodeURIComponent(linkageId)}/revisions/${revision}/picture`;
}

type PicturePhase =
  | { phase: "idle" }
  | { phase: "saving" | "rendering" | "uploading"; revision?: number }
  | { phase: "kept"; revision: number; url: string }
  | { phase: "error"; message: string };

const STATUS_TEXT: Record<SaveStatus, string> = {
  saved: "All changes saved",
  saving: "Saving…",
  unsaved: "Unsaved changes",
  offline: "Offline — will retry",
  conflict: "Someone else saved",
  error: "Not saved",
  readonly: "Read-only",
};
const STATUS_TONE: Record<SaveStatus, string> = {
  saved: "bg-ok/10 text-ok",
  saving: "bg-advisory/10 text-advisory",
  unsaved: "bg-caution/10 text-caution",
  offline: "bg-caution/15 text-caution",
  conflict: "bg-hazard/10 text-hazard",
  error: "bg-hazard/10 text-hazard",
  readonly: "bg-ink/5 text-ink-soft",
};

function isTyping(t: EventTarget | null) {
  const el = t as HTMLElement | null;
  if (!el || !el.tagName) return false;
  return el.tagName === "INPUT" || el.tagName === "TEXTAREA" || el.tagName === "SELECT" || el.isContentEditable;
}

function fmtDate(iso: string) {
  const d = new Date(iso);
  if (Number.isNaN(d.getTime())) return iso;
  return d.toISOString().slice(0, 16).replace("T", " ") + " UTC";
}

function ToolButton(props: React.ButtonHTMLAttributes<HTMLButtonElement> & { kbd?: string }) {
  const { kbd, className, children, ...rest } = props;
  return (
    <button
      type="button"
      {...rest}
      title={rest.title ? `${rest.title}${kbd ? ` (${kbd})` : ""}` : undefined}
      className={`rounded px-2 py-1 text-[12px] font-medium text-ink hover:bg-ink/5 disabled:cursor-not-allowed disabled:opacity-40 ${className ?? ""}`}
    >
      {children}
    </button>
  );
}

function PictureStatus({ state, onDismiss }: { state: PicturePhase; onDismiss: () => void }) {
  if (state.phase === "idle") return null;
  const busy = state.phase === "saving" || state.phase === "rendering" || state.phase === "uploading";
  const text =
    state.phase === "saving"
      ? "Saving your changes first (the picture belongs to a saved revision)…"
      : state.phase === "rendering"
        ? `Drawing the picture of revision ${state.revision}…`
        : state.phase === "uploading"
          ? `Uploading the picture of revision ${state.revision}…`
          : state.phase === "kept"
            ? `Kept with revision ${state.revision} for the build log`
            : state.phase === "error"
              ? `Picture not kept: ${state.message}`
              : "";
  return (
    <span
      data-testid="picture-status"
      data-phase={state.phase}
      role={state.phase === "error" ? "alert" : "status"}
      aria-live="polite"
      className={`flex max-w-[26rem] items-center gap-1 truncate rounded-full px-2 py-0.5 text-[11px] font-medium ${
        state.phase === "error" ? "bg-hazard/10 text-hazard" : state.phase === "kept" ? "bg-ok/10 text-ok" : "bg-advisory/10 text-advisory"
      }`}
      title={text}
    >
      <span className="truncate">{text}</span>
      {state.phase === "kept" && (
        <a href={state.url} target="_blank" rel="noreferrer" className="underline" data-testid="picture-view">
          view
        </a>
      )}
      {!busy && (
        <button type="button" onClick={onDismiss} className="ml-0.5 leading-none" aria-label="Dismiss">
          ×
        </button>
      )}
    </span>
  );
}

function EditorInner(props: LinkageEditorProps & { store: EditorStore }) {
  const { store, canEdit, buildName, linkageName, system } = props;
  const rf = useReactFlow();
  const fitAll = useFitAll();
  const rootRef = useRef<HTMLDivElement>(null);
  const fileRef = useRef<HTMLInputElement>(null);
  const [sheet, setSheet] = useState(false);
  const [geoOpen, setGeoOpen] = useState(false);
  const [importErrors, setImportErrors] = useState<string[] | null>(null);
  const [exporting, setExporting] = useState(false);
  const [picture, setPicture] = useState<PicturePhase>({ phase: "idle" });
  // The deep link (?select= / ?focus=) is read once, when the editor opens.
  const [deepLink] = useState(() => (typeof window === "undefined" ? null : readDeepLink(window.location.search, props.initial.graph)));
  const opening = deepLink && "subject" in deepLink ? deepLink.subject : null;
  useEffect(() => {
    if (deepLink && "missing" in deepLink) store.getState().setNotice(`The link points at ${deepLink.missing}, which is not in revision ${props.initial.revision} of this linkage.`);
  }, [deepLink, store, props.initial.revision]);
  const autosave = useAutosave({ store, buildId: props.buildId, linkageId: props.linkageId, enabled: canEdit });
  const { canUndo, canRedo, hasSel, notice, revision } = useStore(
    store,
    useShallow((s) => ({
      canUndo: s.past.length > 0,
      canRedo: s.future.length > 0,
      hasSel: s.selection.nodes.length + s.selection.joints.length > 0,
      notice: s.notice,
      revision: s.revision,
    })),
  );

  useEffect(() => store.getState().setSettings(props.settings), [store, props.settings]);

  // A notice (e.g. a refused joint) fades after a few seconds.
  useEffect(() => {
    if (!notice) return;
    const t = setTimeout(() => store.getState().setNotice(null), 4000);
    return () => clearTimeout(t);
  }, [notice, store]);

  const exportJson = useCallback(() => {
    const g = toGraph(store.getState());
    downloadBlob(new Blob([serializeLinkage(g)], { type: "application/json" }), `${fileSafe(linkageName)}.linkage.json`);
  }, [store, linkageName]);

  const importFile = useCallback(
    async (file: File) => {
      const r = parseLinkageFile(await file.text());
      if (!r.ok) {
        const shown = r.errors.slice(0, 20).map((i) => (i.path ? `${i.path}: ${i.message}` : i.message));
        if (r.errors.length > 20) shown.push(`…and ${r.errors.length - 20} more`);
        setImportErrors([`${file.name}:`, ...shown]);
        return;
      }
      setImportErrors(null);
      store.getState().replaceGraph(r.graph);
      store.getState().setNotice(`Imported ${r.graph.nodes.length} parts and ${r.graph.joints.length} joints from ${file.name} (undo to go back).`);
      setTimeout(() => fitAll(), 50);
    },
    [store, fitAll],
  );

  /** The picture of the whole linkage with its title block, as it is in the store now. */
  const renderPng = useCallback(
    async (o?: { date?: string }) => {
      const el = rootRef.current?.querySelector<HTMLElement>(".react-flow__viewport");
      if (!el) throw new Error("the canvas is not on the page");
      const s = store.getState();
      const lm = s.report?.summary.lowestMargin;
      const blob = await exportLinkagePng({
        viewportEl: el,
        nodes: rf.getNodes() as Node[],
        title: {
          buildName,
          linkageName,
          system,
          revision: s.revision,
          dirty: s.dirty,
          date: o?.date ?? fmtDate(autosave.lastSavedAt ?? props.initial.createdAt),
          summary: s.report?.summary ?? null,
          lowestMarginText: lm ? `${lm.value.toFixed(2)} at ${subjectName(s, lm.subject)} (${lm.what})` : undefined,
          caution: CAUTION,
        },
        scene: { joints: s.joints, worstByNode: s.worstByNode, worstByJoint: s.worstByJoint, lines: (n) => nodeLines(n, props.unitSystem) },
      });
      return { blob, revision: s.revision };
    },
    [store, rf, buildName, linkageName, system, autosave.lastSavedAt, props.initial.createdAt, props.unitSystem],
  );

  const exportPng = useCallback(async () => {
    setExporting(true);
    try {
      const { blob, revision } = await renderPng();
      downloadBlob(blob, `${fileSafe(buildName)}-${fileSafe(linkageName)}-r${revision}.png`);
    } catch (e) {
      store.getState().setNotice(`The picture could not be made: ${e instanceof Error ? e.message : String(e)}`);
    } finally {
      setExporting(false);
    }
  }, [store, renderPng, buildName, linkageName]);

  /**
   * Keeps the picture on the server as the revision's picture for the build log. A picture belongs to
   * a saved revision, so unsaved changes are saved first (and nothing is uploaded if that fails).
   */
  const keepPicture = useCallback(async () => {
    const before = store.getState();
    let justSaved = false;
    try {
      if (before.dirty || autosave.status === "saving") {
        setPicture({ phase: "saving" });
        const rev = await autosave.saveAndWait();
        justSaved = rev !== before.revision;
      }
      const revision = store.getState().revision;
      setPicture({ phase: "rendering", revision });
      const { blob } = await renderPng(justSaved ? { date: fmtDate(new Date().toISOString()) } : undefined);
      if (store.getState().revision !== revision) throw new Error("the linkage was saved again while the picture was drawn; keep it again");
      setPicture({ phase: "uploading", revision });
      const url = pictureUrl(props.buildId, props.linkageId, revision);
      await uploadFile(url, blob, `${fileSafe(buildName)}-${fileSafe(linkageName)}-r${revision}.png`);
      setPicture({ phase: "kept", revision, url });
    } catch (e) {
      setPicture({ phase: "error", message: e instanceof Error ? e.message : String(e) });
    }
  }, [store, autosave, renderPng, props.buildId, props.linkageId, buildName, linkageName]);

  // Keyboard: editing keys only when not typing in a field; Ctrl/Cmd+S everywhere.
  useEffect(() => {
    const onKey = (e: KeyboardEvent) => {
      const mod = e.ctrlKey || e.metaKey;
      const k = e.key.toLowerCase();
      if (mod && k === "s") {
        e.preventDefault();
        autosave.saveNow();
        return;
      }
      if (isTyping(e.target)) return;
      if (e.key === "Escape") {
        if (sheet) setSheet(false);
        else store.getState().select(null);
        return;
      }
      if (e.key === "?" || (e.shiftKey && e.key === "/")) {
        e.preventDefault();
        setSheet((v) => !v);
        return;
      }
      const s = store.getState();
      if (mod && k === "a") {
        e.preventDefault();
        s.selectAll();
        return;
      }
      if (mod && k === "c") return s.copy();
      if (!mod && k === "f") return void fitAll({ duration: 200 });
      if (e.key === "]" || e.key === "[") {
        e.preventDefault();
        if (s.nodes.length === 0) return;
        const cur = s.nodes.findIndex((n) => n.id === s.selection.nodes[0]);
        const next = (cur + (e.key === "]" ? 1 : -1) + s.nodes.length) % s.nodes.length;
        s.select({ type: "node", id: s.nodes[next < 0 ? 0 : next].id });
        return;
      }
      if (!canEdit) return;
      if (mod && k === "z") {
        e.preventDefault();
        return e.shiftKey ? s.redo() : s.undo();
      }
      if (mod && k === "y") {
        e.preventDefault();
        return s.redo();
      }
      if (mod && k === "v") return s.paste();
      if (mod && k === "d") {
        e.preventDefault();
        return s.duplicate();
      }
      if (e.key === "Delete" || e.key === "Backspace") {
        e.preventDefault();
        return s.deleteSelection();
      }
      const step = e.shiftKey ? GRID * 5 : GRID;
      const arrows: Record<string, [number, number]> = { ArrowLeft: [-step, 0], ArrowRight: [step, 0], ArrowUp: [0, -step], ArrowDown: [0, step] };
      if (arrows[e.key] && s.selection.nodes.length > 0) {
        e.preventDefault();
        s.nudge(...arrows[e.key]);
      }
    };
    window.addEventListener("keydown", onKey);
    return () => window.removeEventListener("keydown", onKey);
  }, [store, rf, fitAll, canEdit, autosave, sheet]);

  const s = store.getState;
  const geometryButton = (
    <ToolButton onClick={() => setGeoOpen((v) => !v)} aria-pressed={geoOpen} title="The run to scale: pivots, arm angles and its motion through the travel" data-testid="btn-geometry">
      Geometry
    </ToolButton>
  );
  return (
    <div ref={rootRef} className={`flex ${props.fill ? "h-full" : "h-[calc(100vh-3.5rem)]"} min-h-0 flex-col overflow-hidden bg-paper text-ink`} data-testid="linkage-editor">
      <div className="flex flex-wrap items-center gap-1 border-b border-ink/10 bg-white px-2 py-1" role="toolbar" aria-label="Linkage tools">
        <div className="mr-2 min-w-0">
          <div className="truncate text-[13px] font-semibold leading-4" data-testid="editor-title">
            {linkageName} <span className="font-normal text-ink-soft">· {system}</span>
          </div>
          <div className="text-[10px] leading-3 text-ink-soft">
            {buildName} · revision <span data-testid="editor-revision">{revision}</span>
          </div>
        </div>
        <span
          data-testid="save-status"
          data-status={autosave.status}
          title={autosave.status === "readonly" ? "You can select and inspect this linkage and comment on it; editing is for the build's owner and builders." : undefined}
          className={`rounded-full px-2 py-0.5 text-[11px] font-medium ${STATUS_TONE[autosave.status]}`} aria-live="polite">
          {STATUS_TEXT[autosave.status]}
        </span>
        {autosave.error && autosave.status === "error" && (
          <span className="max-w-[28rem] truncate text-[11px] text-hazard" title={autosave.error.message} data-testid="save-error">
            {autosave.error.message}
          </span>
        )}
        <span className="mx-1 h-5 w-px bg-ink/10" aria-hidden="true" />
        <ToolButton onClick={() => s().undo()} disabled={!canEdit || !canUndo} title="Undo" kbd="Ctrl/⌘ Z" data-testid="btn-undo">
          Undo
        </ToolButton>
        <ToolButton onClick={() => s().redo()} disabled={!canEdit || !canRedo} title="Redo" kbd="Ctrl/⌘ Shift Z" data-testid="btn-redo">
          Redo
        </ToolButton>
        <ToolButton onClick={() => s().duplicate()} disabled={!canEdit || !hasSel} title="Duplicate the selected parts" kbd="Ctrl/⌘ D">
          Duplicate
        </ToolButton>
        <ToolButton onClick={() => s().deleteSelection()} disabled={!canEdit || !hasSel} title="Delete the selection" kbd="Del" data-testid="btn-delete">
          Delete
        </ToolButton>
        <ToolButton onClick={() => fitAll({ duration: 200 })} title="Fit the whole linkage in view" kbd="F">
          Fit
        </ToolButton>
        <span className="mx-1 h-5 w-px bg-ink/10" aria-hidden="true" />
        <ToolButton onClick={() => autosave.saveNow()} disabled={!canEdit} title="Save now" kbd="Ctrl/⌘ S" data-testid="btn-save">
          Save
        </ToolButton>
        <ToolButton onClick={() => fileRef.current?.click()} disabled={!canEdit} title="Replace this linkage with a .json linkage file" data-testid="btn-import">
          Import…
        </ToolButton>
        <input
          ref={fileRef}
          type="file"
          accept=".json,application/json"
          className="hidden"
          data-testid="import-input"
          onChange={(e) => {
            const f = e.target.files?.[0];
            if (f) void importFile(f);
            e.target.value = "";
          }}
        />
        <ToolButton onClick={exportJson} title="Download the linkage file (.json)" data-testid="btn-export-json">
          Export file
        </ToolButton>
        <ToolButton onClick={() => void exportPng()} disabled={exporting} title="Download a picture of the whole linkage with its title block" data-testid="btn-export-png">
          {exporting ? "Drawing…" : "Picture (PNG)"}
        </ToolButton>
        {canEdit && (
          <ToolButton
            onClick={() => void keepPicture()}
            disabled={picture.phase === "saving" || picture.phase === "rendering" || picture.phase === "uploading"}
            title="Keep the picture on the server as this revision's picture for the build log (unsaved changes are saved first)"
            data-testid="btn-keep-picture"
          >
            Keep for the log
          </ToolButton>
        )}
        <PictureStatus state={picture} onDismiss={() => setPicture({ phase: "idle" })} />
        {geometryButton}
        <ToolButton onClick={() => setSheet(true)} className="ml-auto" title="Keyboard shortcuts" kbd="?" data-testid="btn-shortcuts">
          Keys ?
        </ToolButton>
      </div>
      <SummaryStrip system={system} settings={props.settings} />
      {importErrors && (
        <div role="alert" data-testid="import-errors" className="border-b border-hazard/30 bg-hazard/5 px-3 py-1.5 text-[12px] text-hazard">
          <div className="flex items-center justify-between">
            <b>The file was not imported — nothing changed:</b>
            <button type="button" className="text-[11px] underline" onClick={() => setImportErrors(null)}>
              dismiss
            </button>
          </div>
          <ul className="list-disc pl-5">
            {importErrors.map((m, i) => (
              <li key={i}>{m}</li>
            ))}
          </ul>
        </div>
      )}
      <div className="flex min-h-0 flex-1">
        {canEdit && <PartsTray />}
        <main className={`relative min-w-0 flex-1 ${geoOpen ? "hidden lg:block" : ""}`} aria-label="Linkage canvas">
          <Canvas opening={opening} />
          {notice && (
            <div role="status" data-testid="notice" className="pointer-events-none absolute bottom-4 left-1/2 z-10 max-w-lg -translate-x-1/2 rounded bg-ink px-3 py-1.5 text-[12px] text-white shadow-lg">
              {notice.text}
            </div>
          )}
        </main>
        {geoOpen && (
          <div className="min-w-0 flex-1 border-l border-ink/10 lg:max-w-[560px]">
            <GeometryPanel onClose={() => setGeoOpen(false)} />
          </div>
        )}
        <aside className="flex w-[360px] shrink-0 flex-col border-l border-ink/10 bg-paper" aria-label="Inspector and findings">
          <div className="min-h-0 flex-[3] overflow-y-auto">
            <Inspector buildId={props.buildId} linkageId={props.linkageId} linkageName={linkageName} reviewSlot={props.reviewSlot} />
          </div>
          <div className="flex min-h-0 flex-[2] flex-col border-t border-ink/10 bg-white">
            <FindingsList />
          </div>
          <p className="border-t border-ink/10 bg-paper px-3 py-1.5 text-[10px] leading-3 text-ink-soft" data-testid="caution">
            {CAUTION}
          </p>
        </aside>
      </div>
      {sheet && <ShortcutsSheet onClose={() => setSheet(false)} readOnly={!canEdit} />}
      {autosave.conflict && autosave.difference && (
        <ConflictDialog current={autosave.conflict} difference={autosave.difference} onLoadTheirs={autosave.loadTheirs} onKeepMine={autosave.keepMine} />
      )}
    </div>
  );
}

export default function LinkageEditor(props: LinkageEditorProps) {
  const [store] = useState(() =>
    createEditorStore(
      { ...props.initial.graph, name: props.initial.graph.name || props.linkageName, system: props.initial.graph.system ?? props.system },
      { revision: props.initial.revision, readOnly: !props.canEdit, settings: props.settings, analyze, analysisDelay: 120 },
    ),
  );
  return (
    <EditorStoreContext.Provider value={store}>
      <EditorConfigContext.Provider value={{ unitSystem: props.unitSystem, readOnly: !props.canEdit }}>
        <ReactFlowProvider>
          <EditorInner {...props} store={store} />
        </ReactFlowProvider>
      </EditorConfigContext.Provider>
    </EditorStoreContext.Provider>
  );
}
