/**
 * What one part kind is: its ports (with the side of the card each sits on and the name a person reads), its
 * display name and one-line hint, the props a freshly placed part starts with, and what the load-path engine
 * needs to know of it (its role in the run) — `<kind>/index.ts`; and its props schema — `<kind>/schema.ts`.
 * One folder per kind in this folder, collected in index.ts (the first halves) and schemas.ts (the schemas);
 * everything else (the node schema, NodeKind, PORTS, names, hints) is derived from those two lists. The first
 * half does not load the schema library, so the editor can draw a linkage before it needs a schema.
 */
import type { ControlSystem } from "../format";

export type Side = "left" | "right" | "top" | "bottom";

export type PortDef = {
  side: Side;
  /** How a person reads the port in a joint's name: "attach", "pivot", "B". */
  name: string;
  /** An end of the part named by a letter: written right after the part ("Aft pushrod B"), not after a comma. */
  end?: true;
};

/** Design pilot forces of the build's settings, limit, lbf (shared/analysis/types.ts). */
export type PilotForces = {
  pitchStick: number; rollStick: number; yawPedal: number; other: number;
  /** Wheel, pitch (lbf) and roll (in·lbf per inch of wheel diameter). */
  pitchWheel: number; rollWheel: number;
};

/**
 * The part's role in the run, and the numbers the engine reads for that role. Each role uses fixed port
 * names (ROLE_PORTS): a kind that takes a role must have them.
 */
export type EngineInfo<P> =
  /** The pilot moves it: the design force goes in at the grip and out at `attach`; it turns on `pivot`. */
  | { role: "input"; arms: (p: P) => [grip: number, attach: number]; pilotForce: (p: P, system: ControlSystem, forces: PilotForces) => number }
  /** Turns on `pivot`: a force on `in` leaves `out` in the ratio of the arms (and back). */
  | { role: "crank"; arms: (p: P) => [input: number, output: number]; pivotLoad: (fIn: number, fOut: number, p: P) => number }
  /** Carries a force along itself from end `a` to end `b`. */
  | { role: "link" }
  /** Takes a link on `attach` and turns it into a hinge moment on the surface joined at `surface`. */
  | { role: "horn"; effectiveArm: (p: P) => number }
  /** The end of the run: the horn joins at `horn`, the hinges at `hinge`. */
  | { role: "surface" }
  /** The airframe (ground): reacts whatever reaches it; left out of the loop check. */
  | { role: "mount" }
  /** Limits travel; reacts whatever reaches it. */
  | { role: "stop" }
  /** Carries tension only, from end `a` to end `b` (a cable, a turnbuckle); pulleys and fairleads hang on `run` when it has one. */
  | { role: "tension" }
  /** Turns a cable joined at `cable` through `turn` degrees; reacts the resultant on its other ports (shared/analysis/cables.ts). */
  | { role: "guide"; turn: (p: P) => number | undefined };

export type Role = EngineInfo<unknown>["role"];

export const ROLE_PORTS: Record<Role, readonly string[]> = {
  input: ["attach", "pivot"],
  crank: ["in", "out", "pivot"],
  link: ["a", "b"],
  horn: ["attach", "surface"],
  surface: ["horn", "hinge"],
  mount: ["mount"],
  stop: ["contact"],
  tension: ["a", "b"],
  guide: ["cable"],
};

/** A part kind's first half; P is the props type its schema (`<kind>/schema.ts`) gives after defaults. */
export type KindDef<K extends string = string, P = Record<string, unknown>> = {
  kind: K;
  /** Display name: "Control stick". */
  name: string;
  /** One line for the parts tray: what the part is for. */
  hint: string;
  /** In the order the ports are listed (and spread along a shared side). */
  ports: Record<string, PortDef>;
  /**
   * Props a freshly placed part starts with: plausible light-aircraft numbers the builder then corrects.
   * Complete, in the schema's key order: every field the schema would default is given, so a new part needs
   * no schema (tests/editor/kinds.test.ts checks that the schema gives back exactly these).
   */
  defaults: (system: ControlSystem) => P;
  engine: EngineInfo<P>;
};

/**
 * Declare a part kind's first half, with the props type of its schema: `defineKind<Props>()({ kind, … })`
 * (keeps the literal kind and the props type for the derived union).
 */
export function defineKind<P>() {
  return <const K extends string>(def: KindDef<K, P>): KindDef<K, P> => def;
}
