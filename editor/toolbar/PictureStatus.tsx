"use client";
/**
 * Where keeping the picture for the build log has got to (saving, drawing, uploading, kept, or why not). The
 * chip shows a few words, so it fits the toolbar's row beside the other tools at 1440 px; a screen reader and
 * the tooltip get the whole sentence.
 */
import type { PicturePhase } from "../usePicture";

/** The chip's words: `short` shown, `full` spoken and in the tooltip. */
export function pictureStatusText(state: PicturePhase): { short: string; full: string } {
  switch (state.phase) {
    case "saving":
      return { short: "Saving first…", full: "Saving your changes first (the picture belongs to a saved revision)…" };
    case "rendering":
      return { short: `Drawing revision ${state.revision}…`, full: `Drawing the picture of revision ${state.revision}…` };
    case "uploading":
      return { short: `Uploading revision ${state.revision}…`, full: `Uploading the picture of revision ${state.revision}…` };
    case "kept":
      return { short: `Kept with revision ${state.revision}`, full: `Kept with revision ${state.revision} for the build log` };
    case "error":
      return { short: `Not kept: ${state.message}`, full: `Picture not kept: ${state.message}` };
    default:
      return { short: "", full: "" };
  }
}

export function PictureStatus({ state, onDismiss }: { state: PicturePhase; onDismiss: () => void }) {
  if (state.phase === "idle") return null;
  const busy = state.phase === "saving" || state.phase === "rendering" || state.phase === "uploading";
  const { short, full } = pictureStatusText(state);
  return (
    <span
      data-testid="picture-status"
      data-phase={state.phase}
      role={state.phase === "error" ? "alert" : "status"}
      aria-live="polite"
      className={`flex max-w-[13rem] items-center gap-1 rounded-full px-2 py-0.5 text-[11px] font-medium ${
        state.phase === "error" ? "bg-hazard/10 text-hazard" : state.phase === "kept" ? "bg-ok/10 text-ok" : "bg-advisory/10 text-advisory"
      }`}
      title={full}
    >
      <span className="sr-only">{full}</span>
      <span className="min-w-0 truncate" aria-hidden="true">{short}</span>
      {state.phase === "kept" && (
        <a href={state.url} target="_blank" rel="noreferrer" className="shrink-0 underline" data-testid="picture-view" aria-label={`View the picture of revision ${state.revision}`}>
          view
        </a>
      )}
      {!busy && (
        <button type="button" onClick={onDismiss} className="ml-0.5 shrink-0 leading-none" aria-label="Dismiss">
          ×
        </button>
      )}
    </span>
  );
}
