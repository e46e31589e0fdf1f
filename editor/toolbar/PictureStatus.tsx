"use client";
/** Where keeping the picture for the build log has got to (saving, drawing, uploading, kept, or why not). */
import type { PicturePhase } from "../usePicture";

export function PictureStatus({ state, onDismiss }: { state: PicturePhase; onDismiss: () => void }) {
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
