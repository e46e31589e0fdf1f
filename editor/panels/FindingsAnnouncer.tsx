"use client";
/** A polite live region: after an edit, what changed in the live findings (editor/a11y.ts findingsChange). */
import { useEffect, useRef, useState } from "react";
import type { Finding } from "@/shared/analysis/types";
import { useEditorValue } from "../context";
import { findingsChange } from "../a11y";

export function FindingsAnnouncer() {
  const report = useEditorValue((s) => s.report);
  const prev = useRef<readonly Finding[] | null>(null);
  const [text, setText] = useState("");
  useEffect(() => {
    if (!report) return;
    // The first run is what the linkage opened with: nothing changed yet.
    if (prev.current) {
      const msg = findingsChange(prev.current, report.findings);
      if (msg) setText(msg);
    }
    prev.current = report.findings;
  }, [report]);
  return (
    <div role="status" aria-live="polite" aria-atomic="true" className="sr-only" data-testid="findings-announcer">
      {text}
    </div>
  );
}
