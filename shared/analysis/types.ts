/** The report of the load-path check. Every number is US customary: lbf, in, in·lbf, psi, degrees. */
import { z } from "zod";
import type { MotionReport } from "./motion/types";

import type { Severity } from "./severity";

export { SEVERITIES, type Severity } from "./severity";

/** Where a source tag points: a published text, a rule of the trade, or a value recalled from memory. */
export type SourceTag = { kind: "published" | "commonPractice" | "fromMemory"; text: string };

export type Subject = { type: "node" | "joint" | "linkage"; id: string };

export type FindingNumber = { label: string; value: number; unit: string };

export type Finding = {
  /** Stable code of our own naming, e.g. "jam-nut-missing". */
  code: string;
  severity: Severity;
  subject: Subject;
  /** Plain-language reason a builder understands. */
  message: string;
  numbers: FindingNumber[];
  source: SourceTag;
};

export type PushrodResult = {
  nodeId: string;
  limitAxial: number; // lbf, the largest magnitude under the design force (push or pull)
  ultimateAxial: number; // lbf
  columnAllowable: number; // lbf, Euler or Johnson
  columnMode: "euler" | "johnson";
  tensionAllowable: number; // lbf
  /** Null when not checked: see `todo`. */
  marginCompression: number | null;
  marginTension: number | null;
  /** Added fields (engine v1): the section and slenderness the allowables were computed from. */
  area: number; // in²
  slenderness: number; // KL/r, K = 1
  /** True when no input drives this pushrod (its loads are 0, not computed). */
  driven: boolean;
  /** What to enter before its margins are computed (its tube, or a part its load passes through, still at starting values); null when checked. Engine v2.1. */
  todo: string | null;
};

export type JointResult = {
  jointId: string;
  /** False when the load rests on something not entered (see `todo`): radialLimit is then not the builder's. Engine v2.1; absent in older reports. */
  loadKnown?: boolean;
  radialLimit: number; // lbf
  radialUltimate: number; // lbf, including the special factors in use
  rodEndRating: number | null; // lbf
  rodEndMargin: number | null;
  boltShearAllowable: number | null; // lbf
  boltMargin: number | null;
  /** Added fields (engine v1). What the joint does in the run. */
  role: JointRole;
  /** The one special factor on bearing at this joint (14 CFR 23.619: only the highest applies): its value… */
  specialFactor: number;
  /** …and which factor it is, with its source. */
  factor: SpecialFactor;
  /** Added fields (engine v2): every check the joint's hardware calls for, computed or not checked. */
  checks: JointCheck[];
  /** The computed check with the lowest margin (null when none could be computed). */
  governing: { check: CheckId; label: string; margin: number } | null;
  /** What to enter so the checks not made can be made (empty when every check was computed). */
  todo: string[];
};

export type CheckId =
  | "rodEndRating" | "boltShear" | "pinShear" | "boltBending" | "bearingFrom" | "bearingTo"
  | "tearOutFrom" | "tearOutTo" | "bearingRating" | "threadTension";

export type JointCheck = {
  id: CheckId;
  /** In words: "bearing at the hole in Bellcrank". */
  label: string;
  status: "computed" | "notChecked";
  /** Required ultimate (lbf, or in·lbf for bending) with `factor` applied; null when not known. */
  required: number | null;
  allowable: number | null;
  unit: "lbf" | "in·lbf";
  margin: number | null;
  /** The factor on the limit load beyond the ultimate factor: the fitting factor or the special factor used. */
  factor: number;
  /** For a check not made: what to enter. */
  todo: string | null;
  /** How the allowable was found, in words (material, e/D, shape factor…). */
  basis: string;
  source: SourceTag;
};

export type SpecialFactor = { value: number; name: string; source: SourceTag };

/** Which design case set the limit loads (14 CFR 23.395 / 23.397(b)). */
export type DesignCase = {
  governing: "maximumPilotForce" | "hingeMoment" | "minimumPilotForce";
  /** Loads are the maximum pilot force's × this (1 unless hinge moments lowered them). */
  scale: number;
  text: string;
  /** With dual controls: the single-pilot full-force case was checked too, and the larger load kept everywhere. */
  singlePilotChecked: boolean;
};

export type JointRole = "link" | "pivot" | "hornMount" | "hinge" | "stop" | "other";

export type SurfaceResult = {
  nodeId: string;
  /** Hinge moment put in by the control run at the design force, limit, in·lbf. */
  hingeMomentLimit: number;
  driven: boolean;
  /** The designer's hinge moment, when given, and the limit it asks of the run (125 %, 14 CFR 23.395). */
  designHingeMoment: number | null;
  /** How this surface's case came out: which of 23.395 or the 23.397(b) bounds governs. */
  loadCase: DesignCase["governing"] | null;
};

/** A cable or turnbuckle (engine v1, added): its tension and, for a cable, its strength. */
export type CableResult = {
  nodeId: string;
  kind: "cable" | "turnbuckle";
  /** Tension of the pulling cable at the design force, limit, lbf. */
  limitTension: number;
  /** limit × ultimate factor × the cable-system factor, lbf. */
  ultimateRequired: number;
  /** The circuit's rigging tension, lbf; null when none is recorded. */
  pretension: number | null;
  /** One of the two cables of a closed circuit. */
  inCircuit: boolean;
  /** Minimum breaking strength from the table, lbf; null when the table has no row (or a turnbuckle). */
  breakingStrength: number | null;
  /** The lower of its two terminals' efficiencies. */
  terminalEfficiency: number | null;
  /** Breaking strength × terminal efficiency, lbf. */
  allowable: number | null;
  /** Null when not checked: no table row, a circuit without a rigging tension, or a cable not driven or with no tension. */
  margin: number | null;
  driven: boolean;
};

export type Summary = {
  hazard: number;
  caution: number;
  advisory: number;
  lowestMargin: { value: number; subject: Subject; what: string } | null;
};

export type Report = {
  engineVersion: string;
  findings: Finding[];
  pushrods: PushrodResult[];
  joints: JointResult[];
  summary: Summary;
  /** The settings the numbers were computed with (shown next to every result). */
  settings: AnalysisSettings;
  /** Added fields (engine v1). */
  surfaces: SurfaceResult[];
  /** Cables and turnbuckles (added, engine v1). */
  cables: CableResult[];
  /** Simplifying assumptions behind the numbers, in plain words (shown with the results). */
  assumptions: string[];
  /** The standing caution that goes with every result. */
  notice: string;
  /** Added field (engine v1): the motion check — swept runs, or what to enter for it (never a pass when absent). */
  motion?: MotionReport;
  /** Added fields (engine v2). */
  designCase: DesignCase;
  /** Settings below the published forces or factors: shown with every result. */
  settingsCautions: string[];
};

/** Design pilot forces and factors (domain.md §1), one set per build, with the published defaults. */
export const settingsSchema = z.object({
  pilotForce: z
    .object({
      pitchStick: z.number().positive().default(167), // 14 CFR 23.397(b)
      rollStick: z.number().positive().default(67), // 14 CFR 23.397(b)
      yawPedal: z.number().positive().default(200), // 14 CFR 23.397(b)
      /** Used for flap, trim and other inputs. */
      other: z.number().positive().default(100), // common practice, no source: 23.397(b) gives no force for flap, trim or other inputs; enter the designer's
      /** Wheel, pitch (symmetric), lbf: 200 maximum, 100 minimum. */
      pitchWheel: z.number().positive().default(200), // 14 CFR 23.397(b); below 100 is a finding (shared/analysis/cables.ts)
      /** Wheel, roll: the couple is this × the wheel diameter D, in·lbf per in: 50·D maximum, 40·D minimum. */
      rollWheel: z.number().positive().default(50), // 14 CFR 23.397(b); below 40 is a finding (shared/analysis/cables.ts)
    })
    .default({ pitchStick: 167, rollStick: 67, yawPedal: 200, other: 100, pitchWheel: 200, rollWheel: 50 }), // the same values, sources above
  ultimateFactor: z.number().min(1).max(5).default(1.5), // 14 CFR 23.303
  fittingFactor: z.number().min(1).max(5).default(1.15), // 14 CFR 23.625
  /** Special factor on plain bearings in push-pull joints with angular motion. */
  bearingFactor: z.number().min(1).max(10).default(3.33), // 14 CFR 23.693
  /** Apply the bearing factor to spherical rod ends too (a matter of interpretation). */
  bearingFactorOnRodEnds: z.boolean().default(false),
  /** Special factor on joints in cable systems (and the cables' breaking strength against it). */
  cableFactor: z.number().min(1).max(10).default(2.0), // 14 CFR 23.693
  dualControls: z.boolean().default(false),
});
export type AnalysisSettings = z.infer<typeof settingsSchema>;
export const DEFAULT_SETTINGS: AnalysisSettings = settingsSchema.parse({});
