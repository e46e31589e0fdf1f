"use client";
import dynamic from "next/dynamic";
import type { ComponentProps } from "react";
import type LinkageEditorType from "@/editor/LinkageEditor";
import { ReviewThread, type ReviewMe } from "@/components/review/ReviewThread";
import { ReviewMarkers } from "@/components/review/ReviewMarkers";
import { EditorReviewBar } from "@/components/review/EditorReviewBar";

// The canvas measures the DOM: render it in the browser only.
const LinkageEditor = dynamic(() => import("@/editor/LinkageEditor"), {
  ssr: false,
  loading: () => <div className="flex h-[calc(100vh-3.5rem)] items-center justify-center text-ink-soft">Opening the linkage…</div>,
});

type Props = ComponentProps<typeof LinkageEditorType> & { review?: Omit<ReviewMe, "canComment"> };

export function EditorScreen({ review, ...props }: Props) {
  if (!review) return <LinkageEditor {...props} />;
  const me: ReviewMe = { ...review, canComment: props.canComment };
  return (
    <div className="flex h-[calc(100vh-3.5rem)] flex-col">
      <EditorReviewBar buildId={props.buildId} linkageId={props.linkageId} />
      <div className="relative min-h-0 flex-1">
        <LinkageEditor {...props} fill reviewSlot={(subject) => <ReviewThread key={`${subject.type}:${subject.id}`} buildId={props.buildId} linkageId={props.linkageId} subject={subject} me={me} />} />
        <ReviewMarkers buildId={props.buildId} linkageId={props.linkageId} />
      </div>
    </div>
  );
}
