"use client";
/** Small inputs of the geometry view: a number field that keeps what is typed until it is a number. */
import { useEffect, useState } from "react";

export function NumField(props: { label: string; value: number | undefined; onChange: (v: number | undefined) => void; disabled?: boolean; testId?: string; unit: string; optional?: boolean }) {
  const [text, setText] = useState(props.value === undefined ? "" : String(props.value));
  const [focused, setFocused] = useState(false);
  useEffect(() => {
    if (!focused) setText(props.value === undefined ? "" : String(props.value));
  }, [props.value, focused]);
  return (
    <label className="flex min-w-0 flex-col text-[10px] leading-3 text-ink-soft">
      <span>{props.label} ({props.unit})</span>
      <input
        type="number" step="any" inputMode="decimal" value={text} disabled={props.disabled} data-testid={props.testId} aria-label={`${props.label} (${props.unit})`}
        className="w-full min-w-0 rounded border border-ink/15 bg-white px-1 py-0.5 text-[12px] text-ink disabled:bg-paper"
        onFocus={() => setFocused(true)}
        onBlur={() => setFocused(false)}
        onChange={(e) => {
          setText(e.target.value);
          if (e.target.value === "" && props.optional) return props.onChange(undefined);
          const n = Number(e.target.value);
          if (e.target.value !== "" && Number.isFinite(n)) props.onChange(n);
        }}
      />
    </label>
  );
}
