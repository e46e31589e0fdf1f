"use client";
/** The per-mount editor store, handed down through React context. */
import { createContext, useContext } from "react";
import { useStore } from "zustand";
import { useShallow } from "zustand/react/shallow";
import type { EditorState, EditorStore } from "./store";

export const EditorStoreContext = createContext<EditorStore | null>(null);

export function useEditorStoreApi(): EditorStore {
  const store = useContext(EditorStoreContext);
  if (!store) throw new Error("useEditorStore must be used inside the linkage editor");
  return store;
}

/** Subscribe to a slice of the editor state; the slice is compared shallowly. */
export function useEditorStore<T>(selector: (s: EditorState) => T): T {
  const store = useEditorStoreApi();
  return useStore(store, useShallow(selector));
}

/**
 * Subscribe to one value that the store keeps by reference (a primitive, or an object it only replaces
 * when it changes), compared with Object.is. Cheaper than useEditorStore for the hundreds of parts and
 * joints on the canvas, whose selectors all run on every store change (every drag frame).
 */
export function useEditorValue<T>(selector: (s: EditorState) => T): T {
  return useStore(useEditorStoreApi(), selector);
}

export type EditorConfig = {
  unitSystem: "US" | "SI";
  readOnly: boolean;
};
export const EditorConfigContext = createContext<EditorConfig>({ unitSystem: "US", readOnly: false });
export const useEditorConfig = () => useContext(EditorConfigContext);
