/**
 * Planar four-bar motion (domain.md §5). Link names follow the common textbook convention:
 * a = input crank (link 2, angle θ2), b = coupler (link 3, θ3), c = output rocker (link 4, θ4),
 * d = ground (link 1, from the input pivot to the output pivot along the x axis). Angles in degrees,
 * measured from the ground line. Loop closure: a·e^{iθ2} + b·e^{iθ3} − c·e^{iθ4} − d = 0, solved in
 * closed form (Freudenstein's equation as a half-angle quadratic) for the open and crossed branches.
 *
 * In a control run the chain bellcrank → pushrod → horn (or crank) is such a four-bar: a = the crank's
 * output arm, b = the pushrod, c = the horn arm, d = the distance between the two pivots. The linkage
 * format holds no airframe coordinates of the pivots, so the engine cannot build d from a drawing; the
 * solver and the sweep are exported for a geometry panel and for hand checks.
 */
import { SRC } from "../hardware";
import type { Finding, Subject } from "./types";
import { finding, fmt, num } from "./format";

export type FourBar = { a: number; b: number; c: number; d: number };
export type Branch = "open" | "crossed";
export type FourBarPosition = { theta2: number; theta3: number; theta4: number; transmission: number };

const RAD = Math.PI / 180;
const norm360 = (deg: number) => ((deg % 360) + 360) % 360;

/** Position of the four-bar at input angle θ2, or null when the links cannot close (beyond toggle). */
export function solveFourBar({ a, b, c, d }: FourBar, theta2Deg: number, branch: Branch = "open"): FourBarPosition | null {
  const t2 = theta2Deg * RAD;
  const c2 = Math.cos(t2), s2 = Math.sin(t2);
  const K1 = d / a, K2 = d / c, K3 = (a * a - b * b + c * c + d * d) / (2 * a * c);
  const A = c2 - K1 - K2 * c2 + K3;
  const B = -2 * s2;
  const C = K1 - (K2 + 1) * c2 + K3;
  const disc4 = B * B - 4 * A * C;
  const K4 = d / b, K5 = (c * c - d * d - a * a - b * b) / (2 * a * b);
  const D = c2 - K1 + K4 * c2 + K5;
  const E = -2 * s2;
  const F = K1 + (K4 - 1) * c2 + K5;
  const disc3 = E * E - 4 * D * F;
  if (disc4 < -1e-12 || disc3 < -1e-12) return null;
  const sq4 = Math.sqrt(Math.max(0, disc4)), sq3 = Math.sqrt(Math.max(0, disc3));
  const sign = branch === "open" ? -1 : 1;
  const theta4 = norm360((2 * Math.atan2(-B + sign * sq4, 2 * A)) / RAD);
  const theta3 = norm360((2 * Math.atan2(-E + sign * sq3, 2 * D)) / RAD);
  return { theta2: theta2Deg, theta3, theta4, transmission: transmissionAngle(theta3, theta4) };
}

/** Transmission angle μ: the angle between coupler and rocker, 0°–180° (90° is best). */
export function transmissionAngle(theta3: number, theta4: number): number {
  let mu = Math.abs(norm360(theta4 - theta3));
  if (mu > 180) mu = 360 - mu;
  return mu;
}

export const TRANSMISSION_MIN = 40; // mechanism-design texts
export const TRANSMISSION_MAX = 140; // mechanism-design texts

export type SweepResult = {
  positions: FourBarPosition[];
  minTransmission: number;
  maxTransmission: number;
  /** The links cannot close somewhere in the travel, or pass through 0°/180° transmission. */
  toggles: boolean;
  poorTransmission: boolean;
};

/** Sweep θ2 over [from, to] in `steps` equal steps and summarise the transmission angle. */
export function sweepFourBar(bar: FourBar, fromDeg: number, toDeg: number, steps = 60, branch: Branch = "open"): SweepResult {
  const positions: FourBarPosition[] = [];
  let minT = Infinity, maxT = -Infinity, toggles = false;
  const n = Math.max(1, Math.floor(steps));
  let prevSide = 0;
  for (let i = 0; i <= n; i++) {
    const t2 = fromDeg + ((toDeg - fromDeg) * i) / n;
    const p = solveFourBar(bar, t2, branch);
    if (!p) { toggles = true; continue; }
    positions.push(p);
    minT = Math.min(minT, p.transmission);
    maxT = Math.max(maxT, p.transmission);
    if (p.transmission < 1e-6 || p.transmission > 180 - 1e-6) toggles = true;
    // Passing through toggle flips the sign of the coupler–rocker cross product.
    const side = Math.sign(Math.sin((p.theta4 - p.theta3) * RAD));
    if (prevSide !== 0 && side !== 0 && side !== prevSide) toggles = true;
    if (side !== 0) prevSide = side;
  }
  if (!positions.length) { minT = 0; maxT = 0; }
  return { positions, minTransmission: minT, maxTransmission: maxT, toggles, poorTransmission: minT < TRANSMISSION_MIN || maxT > TRANSMISSION_MAX };
}

/** Findings of a sweep for one chain (subject = the pushrod or crank it belongs to). */
export function fourBarFindings(subject: Subject, sweep: SweepResult, out: Finding[] = []): Finding[] {
  if (sweep.toggles) {
    out.push(finding("linkage-toggles", "hazard", subject,
      `Over its travel this crank–pushrod–crank chain reaches toggle (the pushrod falls in line with an arm) or cannot be assembled, so it can lock or go over centre. Change the arm lengths, the pivot spacing or the travel.`,
      SRC.transmission));
  } else if (sweep.poorTransmission) {
    out.push(finding("transmission-angle-poor", "caution", subject,
      `Over its travel the transmission angle of this chain runs from ${fmt(sweep.minTransmission, 1)}° to ${fmt(sweep.maxTransmission, 1)}°, outside 40°–140°: the pushrod pushes more along the arm than around the pivot, and the loads and free play rise. Rework the geometry.`,
      SRC.transmission, [num("minimum transmission angle", sweep.minTransmission, "°"), num("maximum transmission angle", sweep.maxTransmission, "°")]));
  }
  return out;
}
