"use client";
import dynamic from "next/dynamic";
import type { ComponentProps } from "react";
import type LinkageEditorType from "@/editor/LinkageEditor";

// The canvas measures the DOM: render it in the browser only.
const LinkageEditor = dynamic(() => import("@/editor/LinkageEditor"), {
  ssr: false,
  loading: () => <div className="flex h-[calc(100vh-3.5rem)] items-center justify-center text-ink-soft">Opening the linkage…</div>,
});

export function EditorScreen(props: ComponentProps<typeof LinkageEditorType>) {
  return <LinkageEditor {...props} />;
}
