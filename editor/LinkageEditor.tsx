"use client";
/**
 * The linkage editor screen: parts tray | canvas | inspector + findings, with the toolbar, the summary strip,
 * autosave with revisions, the linkage file and the picture for the build log. Each job has its module:
 * commands.ts (every command, for the toolbar, the keys and the sheet), toolbar/, useLinkageFile.ts,
 * usePicture.ts, useAutosave.ts, Canvas.tsx, store/.
 */
import "@xyflow/react/dist/style.css";
import { useCallback, useEffect, useMemo, useRef, useState } from "react";
import { ReactFlowProvider } from "@xyflow/react";
import dynamic from "next/dynamic";
import { useStore } from "zustand";
import type { ControlSystem, LinkageGraph } from "@/shared/linkage/schema";
import type { AnalysisSettings } from "@/shared/analysis/types";
import { analyze } from "@/shared/analysis";
import { EditorConfigContext, EditorStoreContext } from "./context";
import { createEditorStore, type EditorStore } from "./store";
import Canvas, { useFitAll } from "./Canvas";
import PartsTray from "./panels/PartsTray";
import Inspector, { type ReviewSlot } from "./panels/Inspector";
import { CAUTION, FindingsList, SummaryStrip } from "./panels/Findings";
import { useAutosave } from "./useAutosave";
import { ConflictDialog } from "./panels/ConflictDialog";
// The shortcuts sheet loads when it is first opened.
const ShortcutsSheet = dynamic(() => import("./panels/ShortcutsSheet").then((m) => m.ShortcutsSheet), { ssr: false });
import { readDeepLink } from "./view";
import { handleKey, type CommandCtx } from "./commands";
import { Toolbar } from "./toolbar/Toolbar";
import { useLinkageFile } from "./useLinkageFile";
import { usePicture } from "./usePicture";

export { pictureUrl } from "./usePicture";

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

function ImportErrors({ errors, onDismiss }: { errors: string[]; onDismiss: () => void }) {
  return (
    <div role="alert" data-testid="import-errors" className="border-b border-hazard/30 bg-hazard/5 px-3 py-1.5 text-[12px] text-hazard">
      <div className="flex items-center justify-between">
        <b>The file was not imported — nothing changed:</b>
        <button type="button" className="text-[11px] underline" onClick={onDismiss}>
          dismiss
        </button>
      </div>
      <ul className="list-disc pl-5">
        {errors.map((m, i) => (
          <li key={i}>{m}</li>
        ))}
      </ul>
    </div>
  );
}

function EditorInner(props: LinkageEditorProps & { store: EditorStore }) {
  const { store, canEdit, buildName, linkageName, system } = props;
  const fitAll = useFitAll();
  const rootRef = useRef<HTMLDivElement>(null);
  const [sheet, setSheet] = useState(false);
  const [geoOpen, setGeoOpen] = useState(false);
  const sheetRef = useRef(sheet);
  sheetRef.current = sheet;
  // The deep link (?select= / ?focus=) is read once, when the editor opens.
  const [deepLink] = useState(() => (typeof window === "undefined" ? null : readDeepLink(window.location.search, props.initial.graph)));
  const opening = deepLink && "subject" in deepLink ? deepLink.subject : null;
  useEffect(() => {
    if (deepLink && "missing" in deepLink) store.getState().setNotice(`The link points at ${deepLink.missing}, which is not in revision ${props.initial.revision} of this linkage.`);
  }, [deepLink, store, props.initial.revision]);
  const autosave = useAutosave({ store, buildId: props.buildId, linkageId: props.linkageId, enabled: canEdit });
  const notice = useStore(store, (s) => s.notice);
  const revision = useStore(store, (s) => s.revision);
  const file = useLinkageFile(store, linkageName, fitAll);
  const picture = usePicture({ store, root: rootRef, autosave, buildId: props.buildId, linkageId: props.linkageId, buildName, linkageName, system, unitSystem: props.unitSystem, openedAt: props.initial.createdAt });

  useEffect(() => store.getState().setSettings(props.settings), [store, props.settings]);

  // A notice (e.g. a refused joint) fades after a few seconds.
  useEffect(() => {
    if (!notice) return;
    const t = setTimeout(() => store.getState().setNotice(null), 4000);
    return () => clearTimeout(t);
  }, [notice, store]);

  const { saveNow } = autosave;
  const { exportPicture, keepPicture, exporting, keeping } = picture;
  const ctx: CommandCtx = useMemo(
    () => ({
      store,
      canEdit,
      fitAll,
      saveNow,
      toggleSheet: () => setSheet((v) => !v),
      sheetOpen: () => sheetRef.current,
      closeSheet: () => setSheet(false),
      openImport: file.openImport,
      exportFile: file.exportFile,
      exportPicture: () => void exportPicture(),
      keepPicture: () => void keepPicture(),
      toggleGeometry: () => setGeoOpen((v) => !v),
      geometryOpen: geoOpen,
      pictureBusy: { exporting, keeping },
    }),
    [store, canEdit, fitAll, saveNow, file.openImport, file.exportFile, exportPicture, keepPicture, exporting, keeping, geoOpen],
  );

  // Keyboard: one handler over the command list (editor/commands.ts).
  useEffect(() => {
    const onKey = (e: KeyboardEvent) => handleKey(e, ctx);
    window.addEventListener("keydown", onKey);
    return () => window.removeEventListener("keydown", onKey);
  }, [ctx]);

  const closeSheet = useCallback(() => setSheet(false), []);
  return (
    <div ref={rootRef} className={`flex ${props.fill ? "h-full" : "h-[calc(100vh-3.5rem)]"} min-h-0 flex-col overflow-hidden bg-paper text-ink`} data-testid="linkage-editor">
      <Toolbar
        ctx={ctx}
        title={{ linkageName, system, buildName, revision }}
        save={{ status: autosave.status, error: autosave.error }}
        picture={{ state: picture.picture, dismiss: picture.dismiss }}
        importInput={file.input}
      />
      <SummaryStrip system={system} settings={props.settings} />
      {file.importErrors && <ImportErrors errors={file.importErrors} onDismiss={file.dismissErrors} />}
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
      {sheet && <ShortcutsSheet onClose={closeSheet} readOnly={!canEdit} />}
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
