/** What the motion check adds to the report (engine v1 added field `motion`). Degrees, inches, lbf, in·lbf. */
import type { Subject } from "../types";

export type WorstLoad = {
  subject: Subject;
  /** What the load is: "axial", "radial", "hinge moment". */
  what: string;
  unit: "lbf" | "in·lbf";
  /** Limit load at the worst step. */
  limit: number;
  /** Input deflection of that step, ° (forward +), and the input it belongs to. */
  at: number;
  inputId: string;
};

export type MotionChainSummary = {
  inputId: string;
  hornId: string;
  surfaceId: string | null;
  steps: number;
  /** The input travel the run really has: from the input's stops, a travel stop met first, or where it stops closing. */
  travelBack: number;
  travelForward: number;
  /** Surface deflection (° up +) at those two ends, and the gearing (surface ° per input °) at neutral. */
  deflectionBack: number;
  deflectionForward: number;
  gearingNeutral: number;
  minTransmission: { value: number; at: number; rodId: string };
  maxTransmission: { value: number; at: number; rodId: string };
  /** Input deflection where a part runs out (the chain will not close), each way; null when it closes to the stop. */
  failBack: number | null;
  failForward: number | null;
  /**
   * Control sense read from the geometry (14 CFR 23.779 table), by axis:
   *  - pitch, from a stick or wheel: which way the surface's trailing edge goes when the input goes forward, and
   *    which way it must go (down on a tail, up on a canard); `surfaceRecorded` false: the geometry does not say
   *    tail or canard and a tail was taken (reports saved before roll and yaw were read carry no `axis`: pitch);
   *  - roll, from a stick or wheel: which way this aileron's trailing edge goes with the stick right (wheel turned
   *    right), and which way it must go (up on the right wing's aileron, down on the left's);
   *  - yaw, from pedals: which way the rudder's trailing edge goes when the recorded pedal is pushed, and which way
   *    it must go (the same side as the pedal).
   * Null: not read from the geometry (another kind of run, the side not recorded, or the surface hardly moves) —
   * the run's notes say why, and the checklist asks for it on the aircraft.
   */
  sense: SenseSummary | null;
  /** Per pushrod: the centre-to-centre length the geometry needs, the card's, and the rigging range if known. */
  rods: { rodId: string; needed: number; card: number; shortest: number | null; longest: number | null; misalignment: number | null }[];
};

export type MotionReport = {
  /** True when at least one run was swept. */
  checked: boolean;
  /** What to enter (or why a run cannot be swept); shown beside the results. */
  notChecked: string[];
  chains: MotionChainSummary[];
  worstLoads: WorstLoad[];
};

export type SenseSummary =
  | { axis?: "pitch"; forward: "up" | "down"; expected: "up" | "down"; surface: "tail" | "canard"; surfaceRecorded: boolean }
  | { axis: "roll"; right: "up" | "down"; expected: "up" | "down"; side: "left" | "right" }
  | { axis: "yaw"; pushed: "left" | "right"; expected: "left" | "right"; pedal: "left" | "right" };

/** Which way the trailing edge went, in the words of the sense's axis. */
export const senseGot = (s: SenseSummary) => (s.axis === "roll" ? s.right : s.axis === "yaw" ? s.pushed : s.forward);
/** True where the geometry drives the surface the wrong way round. */
export const senseReversed = (s: SenseSummary) => senseGot(s) !== s.expected;
