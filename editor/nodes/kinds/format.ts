/** Helpers the kinds' card lines, glyphs and forms share. */
import { toDisplay, unitLabel, type UnitSystem } from "../../units";

/** A bare number in display units, trimmed: 18, 0.5, 0.035 (in) or 457, 12.7 (mm). */
export const len = (v: number, u: UnitSystem) => {
  const d = toDisplay(v, "length", u);
  const s = d.toFixed(u === "SI" ? (d < 10 ? 1 : 0) : 3);
  return s.includes(".") ? s.replace(/0+$/, "").replace(/\.$/, "") : s;
};
/** The length unit shown: in or mm. */
export const lu = (u: UnitSystem) => unitLabel("length", u);
/** "×1.33": the output over the input arm. */
export const ratio = (a: number, b: number) => (a > 0 ? `×${(b / a).toFixed(2)}` : "");
/** "in 3 · out 4 in". */
export const arms = (a: number, b: number, u: UnitSystem, names = ["in", "out"]) => `${names[0]} ${len(a, u)} · ${names[1]} ${len(b, u)} ${lu(u)}`;

/** The stroke style of every glyph. */
export const STROKE = { fill: "none", stroke: "currentColor", strokeWidth: 1.6, strokeLinecap: "round" as const, strokeLinejoin: "round" as const };

/** Options of an enum field: [value, shown] pairs. */
export const opts = <T extends string>(xs: readonly T[], names?: Partial<Record<T, string>>) => xs.map((x) => [x, names?.[x] ?? x] as const);

/** The two arm fields every crank has. */
export const CRANK_ARMS = [
  { type: "number", path: "props.inputArm", label: "Input arm", q: "length", required: true },
  { type: "number", path: "props.outputArm", label: "Output arm", q: "length", required: true },
] as const;
