/** Shared by the review panel, its threads and its history: a moment as people read it, and a section heading's style. */
export const when = (iso: string) => new Date(iso).toLocaleString("en-CA", { dateStyle: "medium", timeStyle: "short" });
export const heading = "text-[11px] font-semibold uppercase tracking-wide text-ink-soft";
