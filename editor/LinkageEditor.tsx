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
import type { Report } from "@/shared/analysis/types";
import { EditorConfigContext, EditorStoreContext } from "./context";
import { createEditorStore, type EditorStore } from "./store";
import Canvas, { useFitAll, useFocusSubject } from "./Canvas";
import PartsTray from "./panels/PartsTray";
import Inspector, { CARD_TITLE_ID, type ReviewSlot } from "./panels/Inspector";
import { RunList } from "./panels/RunList";
import { FindingsAnnouncer } from "./panels/FindingsAnnouncer";
import type { SubjectRef } from "./store";
import { CAUTION, FindingsList, SummaryStrip } from "./panels/Findings";
import { useAutosave, type RemoteRevision } from "./useAutosave";
// The shortcuts sheet, the join dialog and the conflict dialog load when they are first opened.
const ShortcutsSheet = dynamic(() => import("./panels/ShortcutsSheet").then((m) => m.ShortcutsSheet), { ssr: false });
const JoinDialog = dynamic(() => import("./panels/JoinDialog").then((m) => m.JoinDialog), { ssr: false });
const ConflictDialog = dynamic(() => import("./panels/ConflictDialog").then((m) => m.ConflictDialog), { ssr: false });
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
  initial: { revision: number; graph: LinkageGraph; authorName: string; createdAt: string; /** The server's check of this revision with the build's settings. */ report?: Report | null };
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

/** Run `f` on the next frames until it returns true (React commits the selection, React Flow mounts a part). */
function untilFrame(f: () => boolean, frames = 120) {
  const step = (n: number) => requestAnimationFrame(() => { if (!f() && n > 0) step(n - 1); });
  step(frames);
}
const PHONE = "(max-width: 767px)";

/** The one selected part or joint, if exactly one thing is selected first. */
function selectedSubject(store: EditorStore): SubjectRef | null {
  const sel = store.getState().selection;
  return sel.nodes.length ? { type: "node", id: sel.nodes[0] } : sel.joints.length ? { type: "joint", id: sel.joints[0] } : null;
}
/** A part's or joint's focusable element in the list or on the canvas (null while not drawn). */
function subjectElement(subject: SubjectRef, list: boolean) {
  return list
    ? document.querySelector<HTMLElement>(`[data-run-item="${subject.type}:${CSS.escape(subject.id)}"]`)
    : document.querySelector<HTMLElement>(`.react-flow__${subject.type === "node" ? "node" : "edge"}[data-id="${CSS.escape(subject.id)}"]`);
}

function EditorInner(props: LinkageEditorProps & { store: EditorStore }) {
  const { store, canEdit, buildName, linkageName, system } = props;
  const fitAll = useFitAll();
  const focusSubject = useFocusSubject();
  // On a phone the run opens as a list (the diagram one tap away); elsewhere as the diagram.
  const [listOpen, setListOpen] = useState(() => typeof window !== "undefined" && window.matchMedia?.(PHONE).matches);
  const listRef = useRef(listOpen);
  listRef.current = listOpen;
  const [joinFor, setJoinFor] = useState<string | null>(null);
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
  // The conflict the builder put off ("Decide later", Escape): its dialog stays closed until the save chip opens it
  // again; a newer conflict opens it at once.
  const [conflictLater, setConflictLater] = useState<RemoteRevision | null>(null);
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
      openCard: (subject: SubjectRef) => {
        store.getState().select(subject);
        const want = `${subject.type}:${subject.id}`;
        untilFrame(() => {
          const h = document.getElementById(CARD_TITLE_ID);
          if (!h || h.dataset.subject !== want) return false;
          h.focus();
          return true;
        });
      },
      returnFocus: (from: EventTarget | null) => {
        const el = from as Element | null;
        if (!el || typeof el.closest !== "function" || !el.closest("[data-card-panel]")) return false;
        const subject = selectedSubject(store);
        if (!subject) return false;
        const find = () => subjectElement(subject, listRef.current);
        const now = find();
        if (now) now.focus();
        else {
          // Not drawn (off screen): bring it into view, then focus it once React Flow has mounted it.
          if (!listRef.current) focusSubject(subject, { duration: 0 });
          untilFrame(() => { const t = find(); t?.focus(); return !!t; });
        }
        return true;
      },
      openJoin: () => {
        const sel = store.getState().selection.nodes;
        if (sel.length === 1) setJoinFor(sel[0]);
      },
      toggleList: () => {
        // The focused part, joint or row goes with the view it was in: the focus moves to the selection in the
        // other view (or to the view itself) rather than to the page. A focus elsewhere (toolbar, card) stays.
        const was = document.activeElement;
        const lost = !was || was === document.body || !!was.closest("#main");
        setListOpen((v) => !v);
        if (!lost) return;
        const subject = selectedSubject(store);
        let frames = 0;
        untilFrame(() => {
          const t = subject ? subjectElement(subject, listRef.current) : null;
          if (t) t.focus();
          else if (!subject || ++frames > 30) document.getElementById("main")?.focus();
          else return false;
          return true;
        });
      },
      listOpen,
    }),
    [store, canEdit, fitAll, saveNow, file.openImport, file.exportFile, exportPicture, keepPicture, exporting, keeping, geoOpen, focusSubject, listOpen],
  );

  // On a phone the run opens as a list: a deep-linked subject (a comment's link, a finding's) opens its card
  // there, once, as a tap on it would; in the diagram the canvas centres and selects it (canvas/viewport.ts).
  const openedLink = useRef(false);
  useEffect(() => {
    if (openedLink.current || !opening) return;
    openedLink.current = true;
    if (listRef.current) ctx.openCard(opening);
  }, [opening, ctx]);

  // Keyboard: one handler over the command list (editor/commands.ts).
  useEffect(() => {
    const onKey = (e: KeyboardEvent) => handleKey(e, ctx);
    window.addEventListener("keydown", onKey);
    return () => window.removeEventListener("keydown", onKey);
  }, [ctx]);

  const closeSheet = useCallback(() => setSheet(false), []);
  return (
    <div ref={rootRef} className={`flex ${props.fill ? "md:h-full" : "md:h-[calc(100vh-3.5rem)]"} flex-col bg-paper text-ink md:min-h-0 md:overflow-hidden`} data-testid="linkage-editor" data-view={listOpen ? "list" : "diagram"}>
      <Toolbar
        ctx={ctx}
        title={{ linkageName, system, buildName, buildId: props.buildId, revision }}
        save={{ status: autosave.status, error: autosave.error, showConflict: () => setConflictLater(null) }}
        picture={{ state: picture.picture, dismiss: picture.dismiss }}
        importInput={file.input}
      />
      <SummaryStrip system={system} settings={props.settings} />
      {file.importErrors && <ImportErrors errors={file.importErrors} onDismiss={file.dismissErrors} />}
      <div className="flex flex-col md:min-h-0 md:flex-1 md:flex-row">
        {canEdit && <div className="hidden md:flex"><PartsTray /></div>}
        <main id="main" tabIndex={-1} className={`relative min-w-0 md:flex-1 ${listOpen ? "" : "h-[70vh] md:h-auto"} ${geoOpen ? "hidden lg:block" : ""}`} aria-label={listOpen ? "Parts and joints of the linkage" : "Linkage canvas"}>
          {listOpen ? <RunList onOpen={ctx.openCard} /> : <Canvas opening={opening} />}
          <FindingsAnnouncer />
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
        <aside className="flex w-full shrink-0 flex-col border-t border-ink/10 bg-paper md:w-[360px] md:border-l md:border-t-0" aria-label="Card and findings" data-card-panel>
          <div className="md:min-h-0 md:flex-[3] md:overflow-y-auto">
            <Inspector buildId={props.buildId} linkageId={props.linkageId} linkageName={linkageName} reviewSlot={props.reviewSlot} />
          </div>
          <div className="flex flex-col border-t border-ink/10 bg-white md:min-h-0 md:flex-[2]">
            <FindingsList />
          </div>
          <p className="border-t border-ink/10 bg-paper px-3 py-1.5 text-[10px] leading-3 text-ink-soft" data-testid="caution">
            {CAUTION}
          </p>
        </aside>
      </div>
      {sheet && <ShortcutsSheet onClose={closeSheet} readOnly={!canEdit} />}
      {joinFor && (
        <JoinDialog
          nodeId={joinFor}
          onClose={() => {
            const id = joinFor;
            setJoinFor(null);
            untilFrame(() => { const t = document.querySelector<HTMLElement>(listOpen ? `[data-run-item="node:${CSS.escape(id)}"]` : `.react-flow__node[data-id="${CSS.escape(id)}"]`); t?.focus(); return !!t; });
          }}
          onJoined={(jointId) => {
            setJoinFor(null);
            ctx.openCard({ type: "joint", id: jointId });
          }}
        />
      )}
      {autosave.conflict && conflictLater !== autosave.conflict && (
        <ConflictDialog current={autosave.conflict} onLoadTheirs={autosave.loadTheirs} onKeepMine={autosave.keepMine} onLater={() => setConflictLater(autosave.conflict)} />
      )}
    </div>
  );
}

export default function LinkageEditor(props: LinkageEditorProps) {
  const [store] = useState(() =>
    createEditorStore(
      { ...props.initial.graph, name: props.initial.graph.name || props.linkageName, system: props.initial.graph.system ?? props.system },
      {
        revision: props.initial.revision, readOnly: !props.canEdit, settings: props.settings, analysisDelay: 120,
        // The engine is fetched on the first change; until then the findings are the server's report of this revision.
        initialReport: props.initial.report ?? null,
        loadAnalyze: () => import("@/shared/analysis").then((m) => m.analyze),
      },
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
