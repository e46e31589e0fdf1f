/**
 * US ↔ SI conversion at the edges, through mathjs units (the engine computes in lbf, in, in·lbf, psi).
 * mathjs defines 1 lbf = 4.4482216152605 N exactly, so lbf→N and in·lbf→N·m are exact.
 */
import { unit } from "mathjs";

export type UnitSystem = "US" | "SI";
export type QuantityKind = "force" | "length" | "torque" | "stress" | "area" | "angle";

/** The unit of each kind in each system, as mathjs names them, and as shown. */
const UNITS: Record<QuantityKind, { US: [string, string]; SI: [string, string] }> = {
  force: { US: ["lbf", "lbf"], SI: ["N", "N"] },
  length: { US: ["in", "in"], SI: ["mm", "mm"] },
  torque: { US: ["lbf in", "in·lbf"], SI: ["N m", "N·m"] },
  stress: { US: ["psi", "psi"], SI: ["MPa", "MPa"] },
  area: { US: ["in^2", "in²"], SI: ["mm^2", "mm²"] },
  angle: { US: ["deg", "°"], SI: ["deg", "°"] },
};

/** Convert a value of `kind` from one system to the other. */
export function convert(value: number, kind: QuantityKind, from: UnitSystem, to: UnitSystem): number {
  if (from === to || kind === "angle") return value;
  return unit(value, UNITS[kind][from][0]).toNumber(UNITS[kind][to][0]);
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
  return UNITS[kind][system][1];
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
