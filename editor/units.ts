/**
 * Display units for the editor. The format stores US customary values (in, lbf, in·lbf, °);
 * the user may view and type SI. The factors come from the shared units library (shared/units),
 * taken once, since every conversion here is linear.
 */
import { convert, unitLabel as sharedLabel, type QuantityKind } from "@/shared/units";

const factor = (k: QuantityKind) => convert(1, k, "US", "SI");
export type UnitSystem = "US" | "SI";
export type Quantity = "length" | "force" | "torque" | "angle" | "stress" | "count" | "ratio" | "temperature";

type Conv = { us: string; si: string; toSI: number; siDigits: number; usDigits: number };
const conv = (k: "length" | "force" | "torque" | "stress", usDigits: number, siDigits: number): Conv => ({
  us: sharedLabel(k, "US"),
  si: sharedLabel(k, "SI"),
  toSI: factor(k),
  usDigits,
  siDigits,
});
const CONV: Record<Exclude<Quantity, "count" | "ratio" | "angle" | "temperature">, Conv> = {
  length: conv("length", 3, 1),
  force: conv("force", 0, 0),
  torque: conv("torque", 0, 1),
  stress: conv("stress", 0, 1),
};

/** °F ↔ °C: the one conversion here with an offset (the format stores °F). */
const fToC = (f: number) => ((f - 32) * 5) / 9;
const cToF = (c: number) => (c * 9) / 5 + 32;

export function unitLabel(q: Quantity, sys: UnitSystem): string {
  if (q === "temperature") return sys === "SI" ? "°C" : "°F";
  if (q === "angle") return "°";
  if (q === "count" || q === "ratio") return "";
  return sys === "SI" ? CONV[q].si : CONV[q].us;
}

/** Canonical (US) value → display value. */
export function toDisplay(v: number, q: Quantity, sys: UnitSystem): number {
  if (q === "temperature") return sys === "SI" ? fToC(v) : v;
  if (sys === "US" || q === "angle" || q === "count" || q === "ratio") return v;
  return v * CONV[q].toSI;
}
/** Display value → canonical (US) value. */
export function fromDisplay(v: number, q: Quantity, sys: UnitSystem): number {
  if (q === "temperature") return sys === "SI" ? cToF(v) : v;
  if (sys === "US" || q === "angle" || q === "count" || q === "ratio") return v;
  return v / CONV[q].toSI;
}

function trim(n: number, digits: number): string {
  const s = n.toFixed(digits);
  return s.includes(".") ? s.replace(/0+$/, "").replace(/\.$/, "") : s;
}

/** A number for an input box (no unit), rounded sensibly for the unit system. */
export function inputText(v: number | undefined, q: Quantity, sys: UnitSystem): string {
  if (v === undefined || v === null || Number.isNaN(v)) return "";
  const d = toDisplay(v, q, sys);
  if (q === "angle" || q === "count" || q === "ratio" || q === "temperature") return trim(d, q === "temperature" ? 1 : 3);
  return trim(d, sys === "SI" ? Math.max(CONV[q].siDigits, 3) : Math.max(CONV[q].usDigits, 4));
}

/** "0.250 in" / "6.4 mm" */
export function fmt(v: number | undefined | null, q: Quantity, sys: UnitSystem, digits?: number): string {
  if (v === undefined || v === null || !Number.isFinite(v)) return "—";
  if (q === "angle") return `${trim(v, digits ?? 1)}°`;
  if (q === "count") return String(Math.round(v));
  if (q === "temperature") return `${trim(toDisplay(v, q, sys), digits ?? 0)} ${unitLabel(q, sys)}`;
  if (q === "ratio") return v.toFixed(digits ?? 2);
  const c = CONV[q];
  const d = toDisplay(v, q, sys);
  const dd = digits ?? (sys === "SI" ? c.siDigits : c.usDigits);
  return `${d.toFixed(dd)} ${sys === "SI" ? c.si : c.us}`;
}

/** A number from a finding, whose unit is given as text by the engine. */
export function fmtUnit(v: number, unit: string, sys: UnitSystem): string {
  const u = unit.trim();
  const q: Quantity | null =
    u === "in" ? "length" : u === "lbf" ? "force" : u === "in·lbf" || u === "in-lbf" || u === "in lbf" ? "torque" : u === "psi" ? "stress" : u === "°" || u === "deg" ? "angle" : u === "°F" ? "temperature" : null;
  if (q) {
    const digits = q === "length" ? (sys === "SI" ? 1 : 3) : undefined;
    return fmt(v, q, sys, digits);
  }
  const s = Math.abs(v) >= 100 ? v.toFixed(0) : Math.abs(v) >= 10 ? v.toFixed(1) : v.toFixed(2);
  return u ? `${s} ${u}` : s;
}

/** Parse what the user typed: "", a number, or an error message. */
export function parseTyped(text: string): { value: number | undefined } | { error: string } {
  const t = text.trim().replace(",", ".");
  if (t === "") return { value: undefined };
  // Accept simple fractions like 3/16 — builders measure in them.
  const frac = /^(\d+)\s*\/\s*(\d+)$/.exec(t);
  if (frac) {
    const den = Number(frac[2]);
    if (den === 0) return { error: "Division by zero" };
    return { value: Number(frac[1]) / den };
  }
  if (!/^[-+]?(\d+\.?\d*|\.\d+)(e[-+]?\d+)?$/i.test(t)) return { error: `"${text}" is not a number` };
  return { value: Number(t) };
}
