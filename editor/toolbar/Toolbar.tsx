"use client";
/** The editor's toolbar: title and revision, save state, and a button for each command that has one (editor/commands.ts). */
import { useStore } from "zustand";
import { useShallow } from "zustand/react/shallow";
import { COMMANDS, type Command, type CommandCtx } from "../commands";
import { SAVE_STATUS_TEXT, SAVE_STATUS_TONE, type SaveStatus } from "../presentation";
import { PictureStatus } from "./PictureStatus";
import type { PicturePhase } from "../usePicture";

function ToolButton(props: React.ButtonHTMLAttributes<HTMLButtonElement> & { kbd?: string }) {
  const { kbd, className, children, ...rest } = props;
  return (
    <button
      type="button"
      {...rest}
      title={rest.title ? `${rest.title}${kbd ? ` (${kbd})` : ""}` : undefined}
      className={`rounded px-2 py-1 text-[12px] font-medium text-ink hover:bg-ink/5 disabled:cursor-not-allowed disabled:opacity-40 aria-disabled:cursor-not-allowed aria-disabled:opacity-40 ${className ?? ""}`}
    >
      {children}
    </button>
  );
}

const Divider = () => <span className="mx-1 h-5 w-px bg-ink/10" aria-hidden="true" />;

type Props = {
  ctx: CommandCtx;
  /** `buildId`: the build's name links back to its overview (the editor's only way back to the build's pages). */
  title: { linkageName: string; system: string; buildName: string; buildId?: string; revision: number };
  /** `showConflict`: opens the conflict dialog again after it was put off ("Decide later", Escape). */
  save: { status: SaveStatus; error: { message: string } | null; showConflict?: () => void };
  picture: { state: PicturePhase; dismiss: () => void };
  importInput: { ref: React.RefObject<HTMLInputElement | null>; onChange: (e: React.ChangeEvent<HTMLInputElement>) => void };
};

export function Toolbar({ ctx, title, save, picture, importInput }: Props) {
  // A reader (reviewer, viewer) is not shown the editing buttons at all: a row of greyed-out tools only crowds a phone.
  const buttons = COMMANDS.filter((c) => c.button && !c.button.hidden?.(ctx) && (!c.edit || ctx.canEdit));
  // One subscription for every button's enabled state (a list of booleans, compared shallowly).
  const enabled = useStore(ctx.store, useShallow((s) => buttons.map((c) => (!c.edit || ctx.canEdit) && (c.enabled ? c.enabled(s, ctx) : true))));
  const group = (g: NonNullable<Command["button"]>["group"], className?: string) =>
    buttons.map((c, i) =>
      c.button!.group !== g ? null : (
        <ToolButton
          key={c.id}
          onClick={() => enabled[i] && c.perform(ctx)}
          // A button that turns itself off while it works keeps the focus (aria-disabled); the others are disabled.
          disabled={!enabled[i] && !c.button!.keepsFocus}
          aria-disabled={!enabled[i] && c.button!.keepsFocus ? true : undefined}
          title={c.label}
          kbd={c.keys}
          data-testid={c.button!.testId}
          className={className}
          aria-pressed={c.button!.pressed?.(ctx)}
        >
          {typeof c.button!.text === "function" ? c.button!.text(ctx) : c.button!.text}
        </ToolButton>
      ),
    );
  return (
    <div className="flex flex-wrap items-center gap-1 border-b border-ink/10 bg-white px-2 py-1" role="toolbar" aria-label="Linkage tools">
      <div className="mr-2 min-w-0">
        <div className="truncate text-[13px] font-semibold leading-4" data-testid="editor-title">
          {title.linkageName} <span className="font-normal text-ink-soft">· {title.system}</span>
        </div>
        <div className="text-[10px] leading-3 text-ink-soft">
          {title.buildId ? (
            <a
              href={`/builds/${encodeURIComponent(title.buildId)}`}
              data-testid="editor-build-link"
              title={`Back to ${title.buildName}: overview, checklist and log`}
              className="touch-target inline-flex items-center rounded-sm text-ink underline underline-offset-2 hover:text-advisory focus-visible:outline focus-visible:outline-2 focus-visible:outline-offset-1 focus-visible:outline-ink"
            >
              {title.buildName}
            </a>
          ) : (
            title.buildName
          )}{" "}
          · revision <span data-testid="editor-revision">{title.revision}</span>
        </div>
      </div>
      {save.status === "conflict" && save.showConflict ? (
        // A conflict put off: the chip is the way back to the choice (saving waits for it).
        <button
          type="button"
          data-testid="save-status"
          data-status={save.status}
          onClick={save.showConflict}
          title="Choose whether to load their revision or keep yours"
          className={`rounded-full px-2 py-0.5 text-[11px] font-medium underline underline-offset-2 focus-visible:outline focus-visible:outline-2 focus-visible:outline-ink ${SAVE_STATUS_TONE[save.status]}`}
        >
          {SAVE_STATUS_TEXT[save.status]} — choose…
        </button>
      ) : (
        <span
          data-testid="save-status"
          data-status={save.status}
          title={save.status === "readonly" ? "You can select and inspect this linkage and comment on it; editing is for the build's owner and builders." : undefined}
          className={`rounded-full px-2 py-0.5 text-[11px] font-medium ${SAVE_STATUS_TONE[save.status]}`}
          aria-live="polite"
        >
          {SAVE_STATUS_TEXT[save.status]}
        </span>
      )}
      {save.error && save.status === "error" && (
        <span className="max-w-[28rem] truncate text-[11px] text-hazard" title={save.error.message} data-testid="save-error">
          {save.error.message}
        </span>
      )}
      <Divider />
      {ctx.canEdit && (
        <>
          {group("edit")}
          <Divider />
        </>
      )}
      {group("file")}
      <input ref={importInput.ref} type="file" accept=".json,application/json" className="hidden" data-testid="import-input" onChange={importInput.onChange} />
      <PictureStatus state={picture.state} onDismiss={picture.dismiss} />
      {group("view")}
      <span className="ml-auto" />
      {group("help")}
    </div>
  );
}
