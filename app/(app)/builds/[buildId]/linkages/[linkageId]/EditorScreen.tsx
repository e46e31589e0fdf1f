"use client";
import dynamic from "next/dynamic";
import type { ComponentProps } from "react";
import type LinkageEditorType from "@/editor/LinkageEditor";
import type { ReviewMe } from "@/components/review/ReviewThread";
import { ReviewMarkers } from "@/components/review/ReviewMarkers";
import { EditorReviewBar } from "@/components/review/EditorReviewBar";
import { StoredFindings, StoredFindingsContext, type Stored } from "./StoredFindings";

// The canvas measures the DOM: render it in the browser only.
// Until its script is loaded, the findings stored with the revision show in its place (rendered on the server).
const LinkageEditor = dynamic(() => import("@/editor/LinkageEditor"), { ssr: false, loading: StoredFindings });
// The review thread (comments, acknowledgements, sign-off) loads beside the editor, not in its first chunks:
// it waits for its own data from the API anyway.
const ReviewThread = dynamic(() => import("@/components/review/ReviewThread").then((m) => m.ReviewThread), {
  ssr: false,
  loading: () => <p className="p-1 text-[11px] text-ink-soft">Loading the review…</p>,
});

type Props = ComponentProps<typeof LinkageEditorType> & { review?: Omit<ReviewMe, "canComment">; stored?: Stored };

export function EditorScreen({ review, stored, ...props }: Props) {
  return (
    <StoredFindingsContext.Provider value={stored ?? null}>
      {/* The page's one heading, for screen readers' heading lists: the editor's toolbar (editor/toolbar) shows the same name on screen. */}
      <h1 className="sr-only">{props.linkageName}: linkage editor</h1>
      <Screen review={review} {...props} />
    </StoredFindingsContext.Provider>
  );
}

function Screen({ review, ...props }: Omit<Props, "stored">) {
  if (!review) return <LinkageEditor {...props} />;
  const me: ReviewMe = { ...review, canComment: props.canComment };
  return (
    <div className="flex flex-col md:h-[calc(100vh-3.5rem)]">
      <EditorReviewBar buildId={props.buildId} linkageId={props.linkageId} />
      <div className="relative md:min-h-0 md:flex-1">
        <LinkageEditor {...props} fill reviewSlot={(subject) => <ReviewThread key={`${subject.type}:${subject.id}`} buildId={props.buildId} linkageId={props.linkageId} subject={subject} me={me} />} />
        <ReviewMarkers buildId={props.buildId} linkageId={props.linkageId} />
      </div>
    </div>
  );
}
