"use client";
/** The linkage file: export the current graph as a .json file, and import one (refused with its errors, or it replaces the graph, undoably). */
import { useCallback, useRef, useState } from "react";
import { serializeLinkage } from "@/shared/linkage/format";
import type { ParseResult } from "@/shared/linkage/io";
import { toGraph, type EditorStore } from "./store";
import { downloadBlob, fileSafe } from "./download";

export function useLinkageFile(store: EditorStore, linkageName: string, afterImport: () => void) {
  const fileRef = useRef<HTMLInputElement>(null);
  const [importErrors, setImportErrors] = useState<string[] | null>(null);

  const exportFile = useCallback(() => {
    const g = toGraph(store.getState());
    downloadBlob(new Blob([serializeLinkage(g)], { type: "application/json" }), `${fileSafe(linkageName)}.linkage.json`);
  }, [store, linkageName]);

  const importFile = useCallback(
    async (file: File) => {
      // The file's check needs the graph schema, loaded on the first import.
      let r: ParseResult;
      try {
        const [{ parseLinkageFile }, text] = await Promise.all([import("@/shared/linkage/io"), file.text()]);
        r = parseLinkageFile(text);
      } catch {
        setImportErrors([`${file.name}:`, "the file could not be checked (the page's script did not load; are you offline?)"]);
        return;
      }
      if (!r.ok) {
        const shown = r.errors.slice(0, 20).map((i) => (i.path ? `${i.path}: ${i.message}` : i.message));
        if (r.errors.length > 20) shown.push(`…and ${r.errors.length - 20} more`);
        setImportErrors([`${file.name}:`, ...shown]);
        return;
      }
      setImportErrors(null);
      store.getState().replaceGraph(r.graph);
      store.getState().setNotice(`Imported ${r.graph.nodes.length} parts and ${r.graph.joints.length} joints from ${file.name} (undo to go back).`);
      setTimeout(afterImport, 50);
    },
    [store, afterImport],
  );

  /** The hidden file input the Import command opens. */
  const input = {
    ref: fileRef,
    onChange: (e: React.ChangeEvent<HTMLInputElement>) => {
      const f = e.target.files?.[0];
      if (f) void importFile(f);
      e.target.value = "";
    },
  };
  const openImport = useCallback(() => fileRef.current?.click(), []);
  return { exportFile, importFile, openImport, input, importErrors, dismissErrors: () => setImportErrors(null) };
}
