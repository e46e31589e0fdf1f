import { forwardRef } from "react";
import { CAUTION_TEXT } from "@/shared/caution";

type Tone = "primary" | "secondary" | "danger" | "ghost";
const tones: Record<Tone, string> = {
  primary: "bg-ink text-white hover:bg-ink/90 disabled:bg-ink/40",
  secondary: "border border-ink/20 bg-white text-ink hover:bg-ink/5 disabled:opacity-50",
  danger: "bg-hazard text-white hover:bg-hazard/90 disabled:opacity-50",
  ghost: "text-ink hover:bg-ink/5 disabled:opacity-50",
};

export const Button = forwardRef<HTMLButtonElement, React.ButtonHTMLAttributes<HTMLButtonElement> & { tone?: Tone; size?: "sm" | "md" }>(
  function Button({ tone = "primary", size = "md", className = "", ...rest }, ref) {
    const pad = size === "sm" ? "px-2 py-1 text-xs" : "px-3 py-1.5 text-sm";
    return <button ref={ref} className={`inline-flex items-center gap-1 rounded font-medium transition-colors ${pad} ${tones[tone]} ${className}`} {...rest} />;
  },
);

export const inputClass =
  "w-full rounded border border-ink/20 bg-white px-2 py-1.5 text-sm text-ink placeholder:text-ink-soft/60 focus:border-advisory focus:outline-none aria-[invalid=true]:border-hazard";

export const Input = forwardRef<HTMLInputElement, React.InputHTMLAttributes<HTMLInputElement>>(function Input({ className = "", ...rest }, ref) {
  return <input ref={ref} className={`${inputClass} ${className}`} {...rest} />;
});

export const Select = forwardRef<HTMLSelectElement, React.SelectHTMLAttributes<HTMLSelectElement>>(function Select({ className = "", ...rest }, ref) {
  return <select ref={ref} className={`${inputClass} ${className}`} {...rest} />;
});

export function Field({ label, htmlFor, error, hint, children }: { label: string; htmlFor: string; error?: string; hint?: string; children: React.ReactNode }) {
  return (
    <div className="space-y-1">
      <label htmlFor={htmlFor} className="block text-xs font-semibold uppercase tracking-wide text-ink-soft">{label}</label>
      {children}
      {error ? <p role="alert" className="text-xs text-hazard">{error}</p> : hint ? <p className="text-xs text-ink-soft">{hint}</p> : null}
    </div>
  );
}

export function Card({ title, actions, children, className = "" }: { title?: React.ReactNode; actions?: React.ReactNode; children: React.ReactNode; className?: string }) {
  return (
    <section className={`rounded-lg border border-ink/10 bg-white ${className}`}>
      {title || actions ? (
        <header className="flex flex-wrap items-center justify-between gap-2 border-b border-ink/10 px-4 py-2">
          <h2 className="text-sm font-semibold">{title}</h2>
          <div className="flex flex-wrap gap-2">{actions}</div>
        </header>
      ) : null}
      <div className="p-4">{children}</div>
    </section>
  );
}

export function EmptyState({ title, children, action }: { title: string; children: React.ReactNode; action?: React.ReactNode }) {
  return (
    <div className="rounded-lg border border-dashed border-ink/25 bg-white/60 p-8 text-center">
      <h3 className="text-base font-semibold">{title}</h3>
      <div className="mx-auto mt-2 max-w-prose text-ink-soft">{children}</div>
      {action ? <div className="mt-4">{action}</div> : null}
    </div>
  );
}

/** The one caution text, kept in shared/ so server-made exports (PDFs) print the same words. */
export { CAUTION_TEXT };

export function Caution({ className = "" }: { className?: string }) {
  return (
    <p role="note" className={`rounded border border-caution/30 bg-caution/5 px-3 py-2 text-xs text-ink ${className}`}>
      <strong className="font-semibold text-caution">Caution. </strong>
      {CAUTION_TEXT}
    </p>
  );
}

export function Badge({ tone = "neutral", children }: { tone?: "neutral" | "hazard" | "caution" | "advisory" | "ok"; children: React.ReactNode }) {
  const map = {
    neutral: "bg-ink/5 text-ink-soft",
    hazard: "bg-hazard/10 text-hazard",
    caution: "bg-caution/10 text-caution",
    advisory: "bg-advisory/10 text-advisory",
    ok: "bg-ok/10 text-ok",
  };
  return <span className={`inline-flex items-center rounded px-1.5 py-0.5 text-xs font-medium ${map[tone]}`}>{children}</span>;
}

/** A page's main landmark: the skip link's target (id "main"), focusable from it without a frame. */
export function Main({ className = "", children, ...rest }: React.HTMLAttributes<HTMLElement>) {
  return (
    <main id="main" tabIndex={-1} className={className} {...rest}>
      {children}
    </main>
  );
}

/** A table that may be wider than a phone: it scrolls in its own box, the first column kept (globals.css). */
export function TableBox({ children, className = "" }: { children: React.ReactNode; className?: string }) {
  return <div className={`table-box ${className}`}>{children}</div>;
}
