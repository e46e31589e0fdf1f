/** Number formatting for finding messages and the finding constructor. No Intl: fast and locale-free. */
import type { Finding, FindingNumber, Severity, SourceTag, Subject } from "./types";

/** Format with thousands separators and a sensible number of decimals. */
export function fmt(v: number, decimals?: number): string {
  if (!Number.isFinite(v)) return String(v);
  const d = decimals ?? (Math.abs(v) >= 100 ? 0 : Math.abs(v) >= 10 ? 1 : Math.abs(v) >= 1 ? 2 : 3);
  const s = Math.abs(v).toFixed(d);
  const dot = s.indexOf(".");
  let int = dot < 0 ? s : s.slice(0, dot);
  const frac = dot < 0 ? "" : s.slice(dot);
  if (int.length > 3) int = int.replace(/\B(?=(\d{3})+(?!\d))/g, ",");
  const neg = v < 0 && Number(s) !== 0;
  return (neg ? "−" : "") + int + frac;
}

/** Margin of safety as shown to a builder, two decimals with a sign. */
export function fmtMargin(ms: number): string {
  return (ms >= 0 ? "+" : "") + fmt(ms, 2);
}

export function num(label: string, value: number, unit: string): FindingNumber {
  return { label, value, unit };
}

export function finding(
  code: string,
  severity: Severity,
  subject: Subject,
  message: string,
  source: SourceTag,
  numbers: FindingNumber[] = [],
): Finding {
  return { code, severity, subject, message, numbers, source };
}

export const nodeSubject = (id: string): Subject => ({ type: "node", id });
export const jointSubject = (id: string): Subject => ({ type: "joint", id });
export const linkageSubject = (id: string): Subject => ({ type: "linkage", id });
