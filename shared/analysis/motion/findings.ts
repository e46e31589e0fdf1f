/**
 * Rules over a swept chain (domain.md §5; 14 CFR 23.675 for stops). Each finding names the input position
 * where it happens, so the builder can move the stick there and look.
 */
import { SRC } from "../../hardware";
import type { Finding, SourceTag } from "../types";
import { finding, fmt, jointSubject, nodeSubject, num } from "../format";
import { type Ctx, jointLabel, nodeLabel } from "../context";
import { TRANSMISSION_MAX, TRANSMISSION_MIN } from "../kinematics";
import { type ChainSweep, mu as muDeg, TOGGLE_SIN } from "./sweep";
import type { LinkageGeometry } from "../../linkage/geometry";
import { senseReversed, type MotionChainSummary } from "./types";

export const MOTION_SRC = {
  closure: { kind: "published", text: "four-bar loop closure (mechanism-design texts)" },
  stops: { kind: "published", text: "14 CFR 23.675 (stops positively limit the range of motion)" },
  designTravel: { kind: "commonPractice", text: "rig the surface to the designer's travel within its tolerance" },
} as const satisfies Record<string, SourceTag>;

/** Swept travel this far past the card's before it is a finding, degrees. // common practice, no source: a rigging tolerance */
export const SURFACE_TRAVEL_SLACK = 1;

/**
 * Below this much surface movement at a travel end, which way the surface went is not read, degrees.
 * // common practice, no source: half a degree is about what a builder can see at the trailing edge.
 */
export const SENSE_MIN_DEFLECTION = 0.5;

type Sense = NonNullable<MotionChainSummary["sense"]>;
/** The sense and the step it was read at (the forward end where it moves the surface enough, else the back end). */
export type SenseReading = { sense: Sense; k: number };

/** Which axis's control sense a run has in the geometry: pitch or roll from a stick or wheel, yaw from pedals; else null. */
export function senseAxis(system: string, inputKind: string): "pitch" | "roll" | "yaw" | null {
  const stickLike = inputKind === "stick" || inputKind === "controlWheel";
  if (system === "pitch" && stickLike) return "pitch";
  if (system === "roll" && stickLike) return "roll";
  if (system === "yaw" && inputKind === "pedal") return "yaw";
  return null;
}

/**
 * Control sense of a run (SRC.controlSense, the 14 CFR 23.779 table: elevator rearward for nose up, aileron right for right
 * wing down, right pedal forward for nose right): which way the surface's trailing edge goes with the input's
 * forward turn (pitch: stick forward; roll: stick right; yaw: the recorded pedal pushed), read at the ends of the
 * travel the run has, against the way it must go. Pitch: down on a tail behind the wing, up on a canard ahead of
 * it (a tail where the geometry does not say). Roll: up on the right wing's aileron, down on the left's. Yaw: to
 * the side of the pushed pedal. Null when the run has no axis here (senseAxis), when a roll run's wing or a yaw
 * run's pedal is not recorded (the run's notes ask for it), or when neither end moves the surface by
 * SENSE_MIN_DEFLECTION or the two ends move it the same way (then the run is not a lever one way and the other,
 * and other findings say why).
 */
export function controlSense(ctx: Ctx, sw: ChainSweep, ends: Ends, geo: LinkageGeometry): SenseReading | null {
  const input = ctx.nodes[sw.chain.input];
  const axis = senseAxis(ctx.graph.system, input.kind);
  if (!axis || (axis === "roll" && !geo.rollSide) || (axis === "yaw" && !geo.yawPedal)) return null;
  const f = sw.theta[ends.ef] > 0 ? sw.deflection[ends.ef] : 0;
  const b = sw.theta[ends.eb] < 0 ? sw.deflection[ends.eb] : 0;
  const fOk = Math.abs(f) >= SENSE_MIN_DEFLECTION, bOk = Math.abs(b) >= SENSE_MIN_DEFLECTION;
  if (!fOk && !bOk) return null;
  if (fOk && bOk && Math.sign(f) === Math.sign(b)) return null;
  // The trailing edge goes the surface's "up" (yaw: right) way with the input's forward turn.
  const plus = fOk ? f > 0 : b < 0;
  const k = fOk ? ends.ef : ends.eb;
  if (axis === "roll") {
    const side = geo.rollSide!;
    return { sense: { axis, right: plus ? "up" : "down", expected: side === "right" ? "up" : "down", side }, k };
  }
  if (axis === "yaw") {
    const pedal = geo.yawPedal!;
    return { sense: { axis, pushed: plus ? "right" : "left", expected: pedal, pedal }, k };
  }
  const surface = geo.pitchSurface ?? "tail";
  return { sense: { axis, forward: plus ? "up" : "down", expected: surface === "canard" ? "up" : "down", surface, surfaceRecorded: geo.pitchSurface !== undefined }, k };
}

/**
 * Why a run's control sense was not read from the geometry, for its notes: what to enter where that is the
 * reason, else why the sweep could not read it.
 */
export function senseNotReadWhy(system: string, inputKind: string, geo: LinkageGeometry): string {
  const axis = senseAxis(system, inputKind);
  if (axis === "roll" && !geo.rollSide) return "set in the geometry which wing's aileron this run drives";
  if (axis === "yaw" && !geo.yawPedal) return "set in the geometry which pedal, pushed forward, turns the input its forward way";
  if (axis === "roll") return "the aileron does not go one way with the stick right and the other way with it left";
  if (axis === "yaw") return "the rudder does not go one way with one pedal pushed and the other way with the other";
  if (axis === "pitch") return "the surface does not go one way with the input forward and the other way with it back";
  return "only a pitch or roll run from a stick or wheel, or a yaw run from pedals, is";
}

/** The input's two ways in the geometry's words: its forward turn and the other (see shared/linkage/geometry.ts). */
export type InputWords = readonly [forward: string, back: string];
const FORWARD_BACK: InputWords = ["forward", "back"];
/** Pitch and others: forward / back; roll: right / left (the stick); yaw: the recorded pedal forward / the other one. */
export function inputWordsFor(system: string, geo: Pick<LinkageGeometry, "yawPedal"> | undefined): InputWords {
  if (system === "roll") return ["right", "left"];
  if (system === "yaw" && geo?.yawPedal) return [`${geo.yawPedal} pedal forward`, `${geo.yawPedal === "right" ? "left" : "right"} pedal forward`];
  return FORWARD_BACK;
}

/** "12.5° forward", "3.0° back", "neutral" (a roll run: "12.5° right"). */
export function atInput(theta: number, words: InputWords = FORWARD_BACK): string {
  if (Math.abs(theta) < 0.05) return "neutral";
  return `${fmt(Math.abs(theta), 1)}° ${theta > 0 ? words[0] : words[1]}`;
}

/** Steps eb..ef (inclusive) are the travel the run really has; stopBack/stopForward: a travel stop ends it there. */
export type Ends = { eb: number; ef: number; stopBack: boolean; stopForward: boolean };

export function chainFindings(ctx: Ctx, sw: ChainSweep, ends: Ends, geo: LinkageGeometry, reading: SenseReading | null, out: Finding[]): void {
  const ch = sw.chain;
  const { eb, ef } = ends;
  const input = ctx.nodes[ch.input];
  const words = inputWordsFor(ctx.graph.system, geo);
  for (let s = 0; s < ch.stages.length; s++) {
    const st = ch.stages[s];
    const rod = ctx.nodes[st.rod];
    let lo = Infinity, hi = -Infinity, loAt = 0, hiAt = 0, toggleAt: number | null = null;
    const sA0 = Math.sign(sw.crossA[s][sw.neutral]);
    for (let k = eb; k <= ef; k++) {
      if (!sw.ok[k]) continue;
      for (let e = 0; e < 2; e++) {
        const mu = -(e ? sw.cosB[s][k] : sw.cosA[s][k]); // −cos μ rises with μ: compare that, convert once
        if (mu < lo) { lo = mu; loAt = sw.theta[k]; }
        if (mu > hi) { hi = mu; hiAt = sw.theta[k]; }
      }
      const nearA = Math.abs(sw.crossA[s][k]) < TOGGLE_SIN * st.a * st.b;
      const nearB = Math.abs(sw.crossB[s][k]) < TOGGLE_SIN * st.c * st.b;
      const flipped = sA0 !== 0 && Math.sign(sw.crossA[s][k]) === -sA0;
      if (toggleAt === null && (nearA || nearB || flipped)) toggleAt = sw.theta[k];
    }
    lo = muDeg(-lo);
    hi = muDeg(-hi);
    if (toggleAt !== null) {
      out.push(finding("motion-over-centre", "hazard", nodeSubject(rod.id),
        `At ${atInput(toggleAt, words)} of ${nodeLabel(input)} the pushrod ${nodeLabel(rod)} falls in line with a crank arm (toggle): there the run can lock, or pass over centre and drive the surface the wrong way. Change the arm angles, the pivot positions or the travel so it stays clear of the line over the whole travel.`,
        SRC.transmission, [num("input position", toggleAt, "°")]));
    } else if (lo < TRANSMISSION_MIN || hi > TRANSMISSION_MAX) {
      const bad = lo < TRANSMISSION_MIN ? { v: lo, at: loAt } : { v: hi, at: hiAt };
      out.push(finding("motion-transmission-angle", "caution", nodeSubject(rod.id),
        `Over the travel the angle between ${nodeLabel(rod)} and the arms it joins runs from ${fmt(lo, 1)}° to ${fmt(hi, 1)}° (${fmt(bad.v, 1)}° at ${atInput(bad.at, words)} of ${nodeLabel(input)}), outside 40°–140°: the rod pushes along the arm more than around the pivot, so loads and free play rise there. Move a pivot or change an arm angle to bring it inside the band.`,
        SRC.transmission, [num("minimum transmission angle", lo, "°"), num("maximum transmission angle", hi, "°"), num("input position", bad.at, "°")]));
    }
    // Rod-end misalignment: the rod's angle to the plane the bolts are square to (constant in planar motion).
    // Offsets not entered: not judged (the run's notes ask for them), never read as in line.
    const mis = (Math.asin(Math.min(1, Math.abs(st.dz) / st.length)) * 180) / Math.PI;
    if (st.dzKnown) for (const j of [st.jointA, st.jointB]) {
      const rated = ctx.joints[j].hardware?.rodEnd?.ratedMisalignment;
      if (rated !== undefined && mis > rated)
        out.push(finding("motion-misalignment", "hazard", jointSubject(ctx.joints[j].id),
          `${nodeLabel(rod)} leaves the plane of its arms by ${fmt(st.dz, 2)} in over its ${fmt(st.length, 2)} in length, so the rod end at ${jointLabel(ctx, j)} works at ${fmt(mis, 1)}° of misalignment, beyond its rated ±${fmt(rated, 1)}°. The ball housing bears on the shank and bends it. Bring the attach points into line (spacers) or fit a rod end rated for the angle.`,
          SRC.misalignment, [num("misalignment", mis, "°"), num("rated misalignment", rated, "°")]));
    }
  }
  for (const [fail, stage, dir] of [[sw.failForward, sw.failStageForward, "forward"], [sw.failBack, sw.failStageBack, "back"]] as const) {
    if (fail === null) continue;
    const limit = dir === "forward" ? ch.travelForward : ch.travelBack;
    // A travel stop met before the chain runs out is what limits the travel: then the run is fine.
    if (dir === "forward" ? ends.stopForward : ends.stopBack) continue;
    const rod = ctx.nodes[ch.stages[stage].rod];
    out.push(finding("motion-cannot-assemble", "hazard", nodeSubject(rod.id),
      `${nodeLabel(input)} cannot reach its ${dir === "forward" ? words[0] : words[1]} stop (${fmt(limit, 1)}°): at ${atInput(fail, words)} ${nodeLabel(rod)} can no longer join its two arms — a crank runs out of travel and the run jams before the stop. Set the input's stop short of this point, or change the arm lengths or pivot positions so the run reaches its stop.`,
      MOTION_SRC.closure, [num("input position", fail, "°"), num("input stop", dir === "forward" ? limit : -limit, "°")]));
  }
  // The surface's own travel on its card: swept past it, the surface would reach its limits before the input
  // reaches its stops, so something other than the stops would stop the run (14 CFR 23.675).
  if (ch.surface >= 0) {
    const surf = ctx.nodes[ch.surface];
    if (surf.kind === "controlSurface") {
      let up = 0, down = 0, upAt = 0, downAt = 0;
      for (let k = eb; k <= ef; k++) {
        if (!sw.ok[k]) continue;
        const v = sw.deflection[k];
        if (v > up) { up = v; upAt = sw.theta[k]; }
        if (-v > down) { down = -v; downAt = sw.theta[k]; }
      }
      for (const [got, at, card, word] of [[up, upAt, surf.props.travelUp, "up"], [down, downAt, surf.props.travelDown, "down"]] as const) {
        if (got > card + SURFACE_TRAVEL_SLACK)
          out.push(finding("motion-surface-past-travel", "caution", nodeSubject(surf.id),
            `Over the input's travel ${nodeLabel(surf)} swings ${fmt(got, 1)}° ${word} (at ${atInput(at, words)} of ${nodeLabel(input)}), past the ${fmt(card, 1)}° ${word} travel on its card: it would reach its limit before the input reaches its stop, so the surface or its hinges, not the stops, would end the travel. Set the input's stops (or the arm ratios) so the surface stops at its travel, or correct the travel on its card.`,
            MOTION_SRC.stops, [num(`${word} travel swept`, got, "°"), num(`${word} travel on the card`, card, "°"), num("input position", at, "°")]));
      }
    }
  }
  if (reading && senseReversed(reading.sense)) out.push(senseFinding(ctx, sw, ends, reading));
  const dt = geo.designTravel;
  if (dt && ch.surface >= 0) {
    const a = sw.deflection[eb], b = sw.deflection[ef];
    const up = Math.max(a, b, 0), down = Math.max(-Math.min(a, b), 0);
    const surf = ctx.nodes[ch.surface];
    for (const [got, want, word] of [[up, dt.up, "up"], [down, dt.down, "down"]] as const) {
      if (Math.abs(got - want) > dt.tolerance + 1e-9)
        out.push(finding("motion-surface-travel", "caution", nodeSubject(surf.id),
          `At the stops ${nodeLabel(surf)} moves ${fmt(got, 1)}° ${word}; the designer's travel is ${fmt(want, 1)}° ± ${fmt(dt.tolerance, 1)}°. ${got > want ? "Too much travel: reset the stops or the arm lengths" : "Not enough travel: the stops or the arm ratios cut it short"} before flight, then measure it on the aircraft.`,
          MOTION_SRC.designTravel, [num(`${word} travel at the stops`, got, "°"), num(`designer's ${word} travel`, want, "°"), num("tolerance", dt.tolerance, "°")]));
    }
  }
}

/** The hazard of a run rigged the wrong way round, in its axis's words, read where the sense was read. */
function senseFinding(ctx: Ctx, sw: ChainSweep, ends: Ends, { sense, k }: SenseReading): Finding {
  const ch = sw.chain;
  const input = ctx.nodes[ch.input];
  const surf = nodeLabel(ctx.nodes[ch.surface >= 0 ? ch.surface : ch.horn]);
  const atEnd = k === ends.ef;
  const by = `${fmt(Math.abs(sw.deflection[k]), 1)}°`;
  const numbers = [num("surface deflection", sw.deflection[k], "°"), num("input position", sw.theta[k], "°")];
  const check = (dirs: string) => `Check which side of each pivot the pushrods attach and the arm angles, and that the geometry's ${dirs} directions match this view`;
  if (sense.axis === "roll") {
    const went = sw.deflection[k] > 0 ? "up" : "down";
    const moved = `moving ${nodeLabel(input)} ${atEnd ? "right" : "left"} takes the trailing edge of ${surf}, the ${sense.side} wing's aileron, ${by} ${went} (at ${fmt(Math.abs(sw.theta[k]), 1)}° ${atEnd ? "right" : "left"})`;
    return finding("control-sense-reversed", "hazard", nodeSubject(input.id),
      `In the geometry, ${moved}. Stick right must raise the right aileron's trailing edge and lower the left one's, to roll right: this run is rigged the wrong way round (reversed roll control). ${check("stick-right and up")} and that the wing named there is this aileron's; then move the stick on the aircraft and watch both ailerons.`,
      SRC.controlSense, numbers);
  }
  if (sense.axis === "yaw") {
    const pushedPedal = atEnd ? sense.pedal : sense.pedal === "right" ? "left" : "right";
    const went = sw.deflection[k] > 0 ? "right" : "left";
    const moved = `pushing the ${pushedPedal} pedal of ${nodeLabel(input)} forward takes the trailing edge of ${surf} ${by} ${went}`;
    return finding("control-sense-reversed", "hazard", nodeSubject(input.id),
      `In the geometry, ${moved}. A pedal pushed forward must take the rudder's trailing edge to its own side, to yaw the nose that way: this run is rigged the wrong way round (reversed yaw control). ${check("pedal-pushed and trailing-edge-right")} and that the pedal named there is the one that turns the input that way; then push each pedal on the aircraft and watch the rudder.`,
      SRC.controlSense, numbers);
  }
  const moved = `${atEnd ? "pushing" : "pulling"} ${nodeLabel(input)} ${atEnd ? "forward" : "back"} moves the trailing edge of ${surf} ${by} ${sw.deflection[k] > 0 ? "up" : "down"} (at ${atInput(sw.theta[k])})`;
  const must = sense.surface === "tail" ? "On a tail behind the wing, stick forward must take the trailing edge down to lower the nose" : "On a canard ahead of the wing, stick forward must take the trailing edge up to lower the nose";
  return finding("control-sense-reversed", "hazard", nodeSubject(input.id),
    `In the geometry, ${moved}. ${must}: this run is rigged the wrong way round (reversed pitch control). ${sense.surfaceRecorded ? "" : "The geometry does not say tail or canard, so a tail was taken; if the surface is a canard, set that in the geometry. "}${check("forward and up")}; then move the stick on the aircraft and watch the surface.`,
    SRC.controlSense, numbers);
}
