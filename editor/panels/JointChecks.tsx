"use client";
/**
 * The joint's checks from the live load-path check: each computed check with its margin (the governing one
 * marked), the special factor used, and the to-do of checks not made — shown apart, never as a pass.
 */
import type { JointCheck, SpecialFactor } from "@/shared/analysis/types";
import { useEditorStore } from "../context";
import type { Coverage } from "../joints/coverage";
import { marginText as signedMargin } from "../presentation";

function marginText(c: JointCheck) {
  if (c.margin === null) return "—";
  return c.margin >= 999 ? "no load" : signedMargin(c.margin);
}

/**
 * The Checks header's words for the factors the checks used (shared/analysis/joints/factors.ts): the fitting
 * factor goes on every check; where a higher special factor applies (a plain bearing with angular motion, a
 * cable-system joint, a hinge) it goes on bearing at the holes instead. Never "bearing factor 1.15": where the
 * fitting factor is the highest, no bearing factor applies here.
 */
export function jointFactorText(factor: Pick<SpecialFactor, "value" | "name">, fittingFactor: number): string {
  if (factor.name === "fitting factor") return `fitting factor ×${factor.value} on every check (no bearing factor above it applies here)`;
  return `${factor.name} ×${factor.value} on bearing; fitting factor ×${fittingFactor} on the other checks`;
}

/**
 * `coverage`: what the check covers at this joint (joints/coverage.ts). A joint with nothing of its own to
 * check (a cable over a pulley, a terminal in a turnbuckle's barrel) has no Checks box: its card says why.
 */
export function JointChecks({ jointId, coverage }: { jointId: string; coverage?: Coverage }) {
  const r = useEditorStore((s) => s.report?.joints.find((j) => j.jointId === jointId));
  const fitting = useEditorStore((s) => s.report?.settings.fittingFactor ?? 1.15);
  if (!r || !r.checks) return null;
  if (r.checks.length === 0 && coverage?.state === "nothingHere") return null;
  const done = r.checks.filter((c) => c.status === "computed");
  return (
    <section className="rounded border border-ink/10 bg-white" data-testid="joint-checks" aria-label="Checks at this joint">
      <header className="flex items-center justify-between gap-2 border-b border-ink/5 px-2 py-1">
        <h4 className="text-[11px] font-semibold uppercase tracking-wide text-ink-soft">Checks</h4>
        <span className="text-right text-[10px] text-ink-soft" data-testid="joint-factor" title={r.factor.source.text}>
          {jointFactorText(r.factor, fitting)}
        </span>
      </header>
      {r.todo.length > 0 && (
        <div className="border-b border-caution/20 bg-caution/10 px-2 py-1" data-testid="joint-todo">
          <p className="text-[11px] font-semibold text-caution">Not checked — to do</p>
          <ul className="list-disc pl-4 text-[11px] text-ink">
            {r.todo.map((t) => (
              <li key={t}>{t.charAt(0).toUpperCase() + t.slice(1)}</li>
            ))}
          </ul>
        </div>
      )}
      {done.length > 0 ? (
        <table className="w-full text-[11px]">
          <tbody>
            {done.map((c) => {
              const gov = r.governing?.check === c.id;
              return (
                <tr key={c.id} data-testid="joint-check" data-check={c.id} data-margin={c.margin ?? ""} className={gov ? "font-semibold" : ""} title={c.basis}>
                  <td className="px-2 py-0.5 text-ink">{c.label}{gov ? " · governs" : ""}</td>
                  <td className={`px-2 py-0.5 text-right tabular-nums ${c.margin !== null && c.margin < 0 ? "text-hazard" : "text-ink"}`}>{marginText(c)}</td>
                </tr>
              );
            })}
          </tbody>
        </table>
      ) : (
        r.checks.length === 0 && (
          <p className="px-2 py-1 text-[11px] text-caution" data-testid="joint-checks-empty">
            <span className="font-semibold">Not checked yet:</span> {coverage?.todo ?? "add a bolt, rod end or bearing to this joint to have it checked"}.
          </p>
        )
      )}
    </section>
  );
}
