"use client";
/** The live findings list (grouped by severity), the summary strip and the caution. */
import { memo, useState } from "react";
import type { AnalysisSettings, Finding } from "@/shared/analysis/types";
import { SEVERITIES, type Severity } from "@/shared/analysis/severity";
import type { ControlSystem } from "@/shared/linkage/schema";
import { useEditorConfig, useEditorStore } from "../context";
import { useFocusSubject } from "../canvas/viewport";
import { subjectName } from "@/shared/linkage/names";
import { fmt, fmtUnit } from "../units";
import { measuresInText } from "@/shared/units";
import { marginText, SEVERITY_BG, SEVERITY_NAMES, SEVERITY_TEXT, SOURCE_NAMES, severityCount } from "../presentation";

export const CAUTION =
  "Linkwright's numbers aid your own engineering and the designer's data — they do not replace them. Follow the kit or plans designer's instructions, the airworthiness regulations and a qualified inspector; defer to local rules and licensed practice.";

export { SEVERITY_NAMES };

export const FindingItem = memo(function FindingItem({ f, compact, onPick }: { f: Finding; compact?: boolean; onPick?: (f: Finding) => void }) {
  const { unitSystem } = useEditorConfig();
  const where = useEditorStore((s) => subjectName(s, f.subject));
  const body = (
    <>
      <span className="flex items-start gap-1.5">
        <span className={`mt-1 h-2 w-2 shrink-0 rounded-sm ${SEVERITY_BG[f.severity]}`} aria-hidden="true" />
        <span className="min-w-0">
          {!compact && <span className="block text-[10px] font-medium uppercase tracking-wide text-ink-soft">{where}</span>}
          <span className="block text-[12px] leading-4 text-ink">{measuresInText(f.message, unitSystem)}</span>
          {f.numbers.length > 0 && (
            <span className="mt-0.5 flex flex-wrap gap-x-2 text-[11px] tabular-nums text-ink-soft">
              {f.numbers.map((n, i) => (
                <span key={i}>
                  {n.label} <b className="font-semibold text-ink">{fmtUnit(n.value, n.unit, unitSystem)}</b>
                </span>
              ))}
            </span>
          )}
          <span className="mt-0.5 block text-[10px] italic leading-3 text-ink-soft">
            {SOURCE_NAMES[f.source.kind]}: {f.source.text}
          </span>
        </span>
      </span>
    </>
  );
  return (
    <li data-testid="finding" data-code={f.code} data-severity={f.severity} data-subject={`${f.subject.type}:${f.subject.id}`}>
      {onPick ? (
        <button type="button" onClick={() => onPick(f)} className="w-full rounded px-1.5 py-1 text-left hover:bg-paper focus:outline-none focus-visible:ring-2 focus-visible:ring-ink">
          {body}
        </button>
      ) : (
        <div className="rounded border border-ink/10 bg-white px-1.5 py-1">{body}</div>
      )}
    </li>
  );
});

/** One empty list for "no report yet", so a selector returns the same value until the report comes. */
const NONE: Finding[] = [];

export function FindingsList() {
  const { findings, error, ready } = useEditorStore((s) => ({ findings: s.report?.findings ?? NONE, error: s.analysisError, ready: s.report !== null }));
  const focus = useFocusSubject();
  const [open, setOpen] = useState<Record<Severity, boolean>>({ hazard: true, caution: true, advisory: true });
  return (
    <div data-testid="findings" className="flex min-h-0 flex-col">
      <div className="flex items-center justify-between border-b border-ink/10 px-3 py-1.5">
        <h3 className="text-[11px] font-semibold uppercase tracking-wider text-ink-soft">Findings (live)</h3>
        <span className="text-[11px] text-ink-soft" data-testid="findings-count">
          {findings.length}
        </span>
      </div>
      <div className="min-h-0 flex-1 overflow-y-auto px-2 py-1">
        {error && <p className="rounded bg-hazard/10 px-2 py-1 text-[11px] text-hazard">The live check failed: {error}</p>}
        {!ready && !error && <p className="px-1 py-2 text-[11px] text-ink-soft">The live check has not run yet.</p>}
        {ready && findings.length === 0 && <p className="px-1 py-2 text-[11px] text-ok">No findings. Keep checking against the plans and your inspector.</p>}
        {SEVERITIES.map((sev) => {
          const list = findings.filter((f) => f.severity === sev);
          if (list.length === 0) return null;
          return (
            <section key={sev} data-testid={`findings-${sev}`} className="mb-1">
              <button
                type="button"
                onClick={() => setOpen((o) => ({ ...o, [sev]: !o[sev] }))}
                aria-expanded={open[sev]}
                className={`flex min-h-6 w-full items-center gap-1 px-1 py-1 text-[11px] font-semibold ${SEVERITY_TEXT[sev]}`}
              >
                <span aria-hidden="true">{open[sev] ? "▾" : "▸"}</span> {SEVERITY_NAMES[sev]} · {list.length}
              </button>
              {open[sev] && (
                <ul className="space-y-0.5">
                  {list.map((f, i) => (
                    <FindingItem key={`${f.code}-${f.subject.id}-${i}`} f={f} onPick={(x) => focus(x.subject)} />
                  ))}
                </ul>
              )}
            </section>
          );
        })}
      </div>
    </div>
  );
}

export function LinkageFindings() {
  const findings = useEditorStore((s) => s.report?.findings.filter((f) => f.subject.type === "linkage") ?? []);
  if (findings.length === 0) return null;
  return (
    <ul className="space-y-1">
      {findings.map((f, i) => (
        <FindingItem key={`${f.code}-${i}`} f={f} compact />
      ))}
    </ul>
  );
}

export function designForceFor(system: ControlSystem, settings: AnalysisSettings): { label: string; value: number } {
  if (system === "pitch") return { label: "stick, pitch", value: settings.pilotForce.pitchStick };
  if (system === "roll") return { label: "stick, roll", value: settings.pilotForce.rollStick };
  if (system === "yaw") return { label: "pedal", value: settings.pilotForce.yawPedal };
  return { label: "input", value: settings.pilotForce.other };
}

export function SummaryStrip({ system, settings }: { system: ControlSystem; settings: AnalysisSettings }) {
  const { unitSystem } = useEditorConfig();
  const { summary, where, motion, loadCase, belowMin } = useEditorStore((s) => ({
    summary: s.report?.summary ?? null,
    loadCase: s.report?.designCase ?? null,
    belowMin: s.report?.settingsCautions?.length ?? 0,
    motion: !s.report?.motion ? null : s.report.motion.checked ? "checked" : "not checked",
    where: s.report?.summary.lowestMargin ? subjectName(s, s.report.summary.lowestMargin.subject) : "",
  }));
  const focus = useFocusSubject();
  const df = designForceFor(system, settings);
  const lm = summary?.lowestMargin;
  return (
    <div data-testid="summary-strip" className="flex flex-wrap items-center gap-x-4 gap-y-0.5 border-b border-ink/10 bg-white px-3 py-1 text-[11px] text-ink-soft">
      <span data-testid="summary-margin">
        Lowest margin:{" "}
        {lm ? (
          <button type="button" className={`touch-target font-semibold underline-offset-2 hover:underline ${lm.value < 0 ? "text-hazard" : "text-ink"}`} onClick={() => focus(lm.subject)}>
            {marginText(lm.value)} at {where} ({lm.what})
          </button>
        ) : (
          <span className="text-ink">—</span>
        )}
      </span>
      <span className="flex items-center gap-2" data-testid="summary-counts">
        {SEVERITIES.map((sev) => (
          <span key={sev} className={`flex items-center gap-1 ${summary && summary[sev] > 0 ? SEVERITY_TEXT[sev] : ""}`} data-testid={`count-${sev}`} data-count={summary?.[sev] ?? 0}>
            <span className={`h-2 w-2 rounded-sm ${SEVERITY_BG[sev]}`} aria-hidden="true" />
            {severityCount(summary?.[sev] ?? 0, sev)}
          </span>
        ))}
      </span>
      {loadCase && loadCase.governing !== "maximumPilotForce" && (
        <span data-testid="load-case" title={loadCase.text} className="text-ink">
          Loads: {loadCase.governing === "hingeMoment" ? "125 % hinge moment" : "minimum pilot force"} ({Math.round(loadCase.scale * 100)} %)
        </span>
      )}
      {belowMin > 0 && (
        <span data-testid="settings-below-minimum" className="font-semibold text-caution" title="See the caution in the findings">
          Settings below the published minimums
        </span>
      )}
      {motion && (
        <span data-testid="motion-status" title={motion === "checked" ? "The run is swept through its travel (Geometry)" : "Enter the pivots and arm angles in Geometry to sweep the run through its travel"}
          className={motion === "checked" ? "text-ink" : "text-caution"}>
          Motion {motion}
        </span>
      )}
      <span title="The build's design settings (change them on the build overview)">
        Design force ({df.label}) <b className="text-ink">{fmt(df.value, "force", unitSystem)}</b> · ultimate ×{settings.ultimateFactor} · fitting ×{settings.fittingFactor} · bearing ×
        {settings.bearingFactor}
        {settings.bearingFactorOnRodEnds ? " (rod ends too)" : ""}
        {settings.dualControls ? " · dual controls" : ""}
      </span>
    </div>
  );
}
