"use client";
/**
 * The picture of the whole linkage with its title block: downloaded as a PNG, or kept on the server as the
 * revision's picture for the build log (unsaved changes are saved first; a picture belongs to a saved revision).
 */
import { useCallback, useState } from "react";
import { useReactFlow, type Node } from "@xyflow/react";
import { subjectName } from "@/shared/linkage/names";
import type { ControlSystem } from "@/shared/linkage/schema";
import { uploadFile } from "@/components/api-client";
import type { EditorStore } from "./store";
import { downloadBlob, pictureFileName } from "./download";
import { nodeLines } from "./nodes";
import { CAUTION } from "./panels/Findings";
import type { UnitSystem } from "./units";
import type { useAutosave } from "./useAutosave";

export type PicturePhase =
  | { phase: "idle" }
  | { phase: "saving" | "rendering" | "uploading"; revision?: number }
  | { phase: "kept"; revision: number; url: string }
  | { phase: "error"; message: string };

export function pictureUrl(buildId: string, linkageId: string, revision: number) {
  return `/api/builds/${encodeURIComponent(buildId)}/linkages/${encodeURIComponent(linkageId)}/revisions/${revision}/picture`;
}

export function fmtDate(iso: string) {
  const d = new Date(iso);
  if (Number.isNaN(d.getTime())) return iso;
  return d.toISOString().slice(0, 16).replace("T", " ") + " UTC";
}

type Opts = {
  store: EditorStore;
  root: React.RefObject<HTMLDivElement | null>;
  autosave: ReturnType<typeof useAutosave>;
  buildId: string;
  linkageId: string;
  buildName: string;
  linkageName: string;
  system: ControlSystem;
  unitSystem: UnitSystem;
  /** When the revision the editor opened was saved (the title block's date until the next save). */
  openedAt: string;
};

export function usePicture(o: Opts) {
  const { store, root, autosave, buildName, linkageName, system, unitSystem, openedAt } = o;
  const rf = useReactFlow();
  const [exporting, setExporting] = useState(false);
  const [picture, setPicture] = useState<PicturePhase>({ phase: "idle" });

  /** The picture of the whole linkage with its title block, as it is in the store now. */
  const renderPng = useCallback(
    async (d?: { date?: string }) => {
      const el = root.current?.querySelector<HTMLElement>(".react-flow__viewport");
      if (!el) throw new Error("the canvas is not on the page");
      const s = store.getState();
      const lm = s.report?.summary.lowestMargin;
      // The drawing code and html-to-image load on first use, not with the editor.
      const { exportLinkagePng } = await import("./export");
      const blob = await exportLinkagePng({
        viewportEl: el,
        nodes: rf.getNodes() as Node[],
        title: {
          buildName,
          linkageName,
          system,
          revision: s.revision,
          dirty: s.dirty,
          date: d?.date ?? fmtDate(autosave.lastSavedAt ?? openedAt),
          summary: s.report?.summary ?? null,
          lowestMarginText: lm ? `${lm.value.toFixed(2)} at ${subjectName(s, lm.subject)} (${lm.what})` : undefined,
          caution: CAUTION,
        },
        scene: { joints: s.joints, worstByNode: s.worstByNode, worstByJoint: s.worstByJoint, lines: (n) => nodeLines(n, unitSystem, s.meta.system) },
      });
      return { blob, revision: s.revision };
    },
    [store, root, rf, buildName, linkageName, system, autosave.lastSavedAt, openedAt, unitSystem],
  );

  const exportPicture = useCallback(async () => {
    setExporting(true);
    try {
      const { blob, revision } = await renderPng();
      downloadBlob(blob, pictureFileName(buildName, linkageName, revision));
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
      const url = pictureUrl(o.buildId, o.linkageId, revision);
      await uploadFile(url, blob, pictureFileName(buildName, linkageName, revision));
      setPicture({ phase: "kept", revision, url });
    } catch (e) {
      setPicture({ phase: "error", message: e instanceof Error ? e.message : String(e) });
    }
  }, [store, autosave, renderPng, o.buildId, o.linkageId, buildName, linkageName]);

  const keeping = picture.phase === "saving" || picture.phase === "rendering" || picture.phase === "uploading";
  return { exporting, keeping, picture, exportPicture, keepPicture, dismiss: () => setPicture({ phase: "idle" }) };
}
