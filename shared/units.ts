/**
 * US ↔ SI conversion at the edges (the engine computes in lbf, in, in·lbf, psi), by exact factors:
 * the inch is 25.4 mm exactly and the pound-force 4.4482216152605 N exactly (0.45359237 kg × 9.80665 m/s²,
 * NIST SP 811 appendix B), so every factor below is exact to the digits a double holds.
 */

export type UnitSystem = "US" | "SI";
export type QuantityKind = "force" | "length" | "torque" | "stress" | "area" | "angle";

const IN_MM = 25.4; // NIST SP 811 B.8: inch = 2.54 × 10⁻² m exactly
const LBF_N = 4.4482216152605; // NIST SP 811 B.8: pound-force (avoirdupois pound × standard gravity) exactly

/** The label of each kind in each system, and how many SI units one US unit is. */
const UNITS: Record<QuantityKind, { US: string; SI: string; siPerUs: number }> = {
  force: { US: "lbf", SI: "N", siPerUs: LBF_N },
  length: { US: "in", SI: "mm", siPerUs: IN_MM },
  torque: { US: "in·lbf", SI: "N·m", siPerUs: (IN_MM / 1000) * LBF_N },
  stress: { US: "psi", SI: "MPa", siPerUs: LBF_N / (IN_MM * IN_MM) }, // N/mm² = MPa
  area: { US: "in²", SI: "mm²", siPerUs: IN_MM * IN_MM },
  angle: { US: "°", SI: "°", siPerUs: 1 },
};

/** Convert a value of `kind` from one system to the other. */
export function convert(value: number, kind: QuantityKind, from: UnitSystem, to: UnitSystem): number {
  if (from === to || kind === "angle") return value;
  return from === "US" ? value * UNITS[kind].siPerUs : value / UNITS[kind].siPerUs;
}

/** US (engine) value → SI. */
export const toSI = (value: number, kind: QuantityKind) => convert(value, kind, "US", "SI");
/** SI value → US (engine). */
export const fromSI = (value: number, kind: QuantityKind) => convert(value, kind, "SI", "US");

export const lbfToN = (v: number) => toSI(v, "force");
export const nToLbf = (v: number) => fromSI(v, "force");
export const inToMm = (v: number) => toSI(v, "length");
export const mmToIn = (v: number) => fromSI(v, "length");
export const inLbfToNm = (v: number) => toSI(v, "torque");
export const nmToInLbf = (v: number) => fromSI(v, "torque");
export const psiToMPa = (v: number) => toSI(v, "stress");
export const mpaToPsi = (v: number) => fromSI(v, "stress");

export function unitLabel(kind: QuantityKind, system: UnitSystem): string {
  return UNITS[kind][system];
}

/**
 * A US engine value shown in the user's system, e.g. formatQuantity(167, "force", "SI") → "742.9 N".
 * Three significant figures at least, never fewer than the whole units; thousands separated by commas.
 */
export function formatQuantity(value: number, kind: QuantityKind, system: UnitSystem, digits?: number): string {
  const v = convert(value, kind, "US", system);
  const sep = kind === "angle" ? "" : " ";
  return `${formatNumber(v, digits)}${sep}${unitLabel(kind, system)}`;
}

export function formatNumber(v: number, digits?: number): string {
  if (!Number.isFinite(v)) return String(v);
  const a = Math.abs(v);
  const d = digits ?? (a === 0 ? 0 : a >= 1000 ? 0 : a >= 100 ? 1 : a >= 10 ? 1 : a >= 1 ? 2 : Math.min(6, 2 - Math.floor(Math.log10(a))));
  const s = a.toFixed(d);
  const [int, frac] = s.split(".");
  const grouped = int.replace(/\B(?=(\d{3})+(?!\d))/g, ",");
  return (v < 0 && Number(s) !== 0 ? "−" : "") + grouped + (frac ? `.${frac}` : "");
}

/** The units a finding's prose may carry a number in (the engine writes US), longest first so "in·lbf" is not read as "in". */
const PROSE_UNITS: { us: string; kind: QuantityKind | "ksi" | "fahrenheit" }[] = [
  { us: "in·lbf", kind: "torque" },
  { us: "in²", kind: "area" },
  { us: "lbf", kind: "force" },
  { us: "ksi", kind: "ksi" },
  { us: "psi", kind: "stress" },
  { us: "°F", kind: "fahrenheit" },
  { us: "in", kind: "length" },
];
const NUM = "[−-]?\\d[\\d,]*(?:\\.\\d+)?";
const PROSE_RE = new RegExp(
  `(${NUM})(?:(\\s*(?:–|-|to)\\s*)(${NUM}))?\\s(${PROSE_UNITS.map((u) => u.us).join("|")})(?![\\p{L}\\d²·])`,
  "gu",
);
const parseNum = (s: string) => Number(s.replace(/,/g, "").replace("−", "-"));

/**
 * A sentence the engine wrote in US units, with each "number unit" (and "a–b unit" range) in `system`:
 * "0.438 in across" → "11.1 mm across", "20–25 in·lbf" → "2.26–2.82 N·m", "125 ksi" → "861.8 MPa", "−20 °F" →
 * "−28.9 °C". Text in quotes (a part's own name) is left as it is. US text comes back unchanged.
 */
export function measuresInText(text: string, system: UnitSystem): string {
  if (system === "US") return text;
  // Quoted names are kept: split on them and convert only the text between.
  return text
    .split(/("[^"]*"|“[^”]*”)/)
    .map((part, i) => (i % 2 === 1 ? part : part.replace(PROSE_RE, (_m, a: string, sep: string | undefined, b: string | undefined, unit: string) => {
      const u = PROSE_UNITS.find((x) => x.us === unit)!;
      const one = (s: string): string => {
        const v = parseNum(s);
        if (u.kind === "fahrenheit") return formatNumber(((v - 32) * 5) / 9, 1);
        if (u.kind === "ksi") return formatNumber(convert(v * 1000, "stress", "US", "SI"));
        return formatNumber(convert(v, u.kind, "US", "SI"));
      };
      const label = u.kind === "fahrenheit" ? "°C" : u.kind === "ksi" ? "MPa" : unitLabel(u.kind, "SI");
      return `${one(a)}${sep && b !== undefined ? `${sep}${one(b)}` : ""} ${label}`;
    })))
    .join("");
}
