/**
 * The demo's yaw run of the fictional "Larkspur LX-2": two rudder pedals on a floor cross-tube, a cable from
 * each pedal aft — the left over a pulley, the right through a fairlead — a turnbuckle at the aft end of each,
 * both on the rudder horn, and a travel stop at the right pedal. Plausible hardware everywhere and exactly
 * one fault a reviewer would catch: the right turnbuckle shows five threads at its aft end (at most three
 * are allowed), so it is screwed too far out. Dimensions, ratings and the rigging range are invented for the demo.
 */
import type { Joint, JointHardware, LinkageGraph, LinkageNode } from "./linkage/schema";
import { FORMAT_VERSION } from "./linkage/schema";

/** The joint the demo's fault is on: the right turnbuckle (a part, not a joint). */
export const DEMO_RUDDER_FAULT_PART = "rd-tb-right";

type Member = NonNullable<NonNullable<JointHardware["holes"]>["from"]>;
/** A 4130N clevis at a cable terminal or pedal arm, two 0.09 in cheeks, 0.375 in edge distance (invented). */
const CLEVIS: Member = { material: "4130N", thickness: 0.18, edgeDistance: 0.375, cheeks: 2 };
/** A 4130N pivot bracket, two 0.125 in cheeks, 0.75 in edge distance (invented). */
const BRACKET: Member = { material: "4130N", thickness: 0.25, edgeDistance: 0.75, cheeks: 2 };

function hw(over: Partial<JointHardware>): JointHardware {
  return { fit: "clamped", shear: "double", spacers: 0, torqueStripe: true, photos: [], note: "", ...over };
}
/** A cable terminal or turnbuckle eye in a clevis on an AN3 bolt. */
const terminal = (): JointHardware => hw({
  bolt: { size: "AN3", material: "steel", grip: 0.5, stack: 0.5, threadsProtruding: 2 },
  nut: { type: "castellatedCotter", pattern: "shear", cotterPinNew: true },
  washerUnderHead: { outsideDiameter: 0.438, thickness: 0.032 },
  washerUnderNut: { outsideDiameter: 0.438, thickness: 0.032 },
  bearing: "none",
  holes: { from: CLEVIS, to: CLEVIS },
});
/** A pivot on a ball bearing, AN5 bolt clamped on the inner race (invented bearing rating). */
const pivot = (): JointHardware => hw({
  bearing: "ballBearing", bearingRating: 4000,
  bolt: { size: "AN5", material: "steel", grip: 1.25, stack: 1.25, threadsProtruding: 2 },
  nut: { type: "selfLockingMetal", pattern: "tension", dragTorque: 8 }, // invented demo drag
  washerUnderHead: { outsideDiameter: 0.75, thickness: 0.063 },
  washerUnderNut: { outsideDiameter: 0.75, thickness: 0.063 },
  torque: 120, // AC 43.13-1B table 7-1: 5/16-24 tension nut 100–140 in·lbf, plus the 8 in·lbf drag
  holes: { from: BRACKET, to: BRACKET },
});
/** Where a cable passes a pulley or fairlead: nothing bolted, the guide carries it. */
const passing = (): JointHardware => ({ fit: "clamped", shear: "double", torqueStripe: false, photos: [], note: "" });
/** An AN3 through a clevis: the fairlead block and the pedal stop (double shear). */
const hornBolts = (): JointHardware => hw({
  bolt: { size: "AN3", material: "steel", grip: 0.5, stack: 0.5, threadsProtruding: 2 },
  nut: { type: "selfLockingMetal", pattern: "tension", dragTorque: 3 }, // invented demo drag
  washerUnderHead: { outsideDiameter: 0.438, thickness: 0.032 },
  washerUnderNut: { outsideDiameter: 0.438, thickness: 0.032 },
  torque: 25, // AC 43.13-1B table 7-1: 10-32 tension nut 20–25 in·lbf, plus the 3 in·lbf drag
  holes: { from: { material: "4130N", thickness: 0.125, edgeDistance: 0.38 }, to: { material: "2024-T3", thickness: 0.19, edgeDistance: 0.38 } },
});

/** The horn on the rudder spar: AN4 bolts through the horn and the spar doubler, two members (single shear). */
const hornOnSpar = (): JointHardware => hw({
  shear: "single",
  spacers: 0,
  bolt: { size: "AN4", material: "steel", grip: 0.375, stack: 0.375, threadsProtruding: 2 },
  nut: { type: "selfLockingMetal", pattern: "tension", dragTorque: 8 }, // invented demo drag
  washerUnderHead: { outsideDiameter: 0.5, thickness: 0.063 },
  washerUnderNut: { outsideDiameter: 0.5, thickness: 0.063 },
  torque: 65, // AC 43.13-1B table 7-1: 1/4-28 tension nut 50–70 in·lbf, plus the 8 in·lbf drag
  holes: { from: { material: "4130N", thickness: 0.125, edgeDistance: 0.5 }, to: { material: "2024-T3", thickness: 0.19, edgeDistance: 0.5 } },
});

const at = (x: number, y: number) => ({ x, y });
const j = (id: string, from: [string, string], to: [string, string], hardware: JointHardware): Joint =>
  ({ id, from: { node: from[0], port: from[1] }, to: { node: to[0], port: to[1] }, hardware });

export function demoRudderLinkage(): LinkageGraph {
  const cable = (id: string, label: string, y: number, rigged: boolean): LinkageNode => ({
    id, kind: "cable", label, position: at(420, y),
    props: {
      size: "1/8", construction: "7x19", material: "carbon", length: 118, terminalA: "swaged", terminalB: "swaged",
      // Invented rigging range for the demo: 25–35 lbf at 70 °F; measured 30 lbf at 68 °F on the left cable.
      tensionMin: 25, tensionMax: 35, rangeTemperature: 70,
      ...(rigged ? { riggingTension: 30, riggingTemperature: 68 } : {}),
    },
  });
  const turnbuckle = (id: string, label: string, y: number, aftThreads: number): LinkageNode => ({
    id, kind: "turnbuckle", label, position: at(700, y),
    props: { size: "1/8", threadsShowingA: 2, threadsShowingB: aftThreads, locking: "clip", travelCheck: "free" },
  });
  const nodes: LinkageNode[] = [
    { id: "rd-pedal-left", kind: "cablePedal", label: "Left rudder pedal", position: at(0, 0), props: { pedalArm: 9, cableArm: 3, travel: 20 } },
    { id: "rd-pedal-right", kind: "cablePedal", label: "Right rudder pedal", position: at(0, 320), props: { pedalArm: 9, cableArm: 3, travel: 20 } },
    { id: "rd-floor", kind: "structureMount", label: "Floor cross-tube", position: at(-200, 160), props: { note: "pedal pivots, pulley bracket and fairlead block" } },
    cable("rd-cable-left", "Left rudder cable", 0, true),
    cable("rd-cable-right", "Right rudder cable", 320, false),
    { id: "rd-pulley", kind: "pulley", label: "Pulley at the seat frame", position: at(-200, -150), props: { diameter: 3, grooveFor: "1/8", wrapAngle: 30, bearing: "ball", guards: "fitted", guardGap: 0.05, ratedLoad: 1200 } },
    { id: "rd-fairlead", kind: "fairlead", label: "Fairlead at the rear bulkhead", position: at(200, 180), props: { turnAngle: 2 } },
    turnbuckle("rd-tb-left", "Left turnbuckle", 0, 2),
    turnbuckle(DEMO_RUDDER_FAULT_PART, "Right turnbuckle", 320, 5),
    { id: "rd-horn", kind: "controlHorn", label: "Rudder horn", position: at(960, 160), props: { hornArm: 3, linkAngle: 90, boltCount: 2, boltSpacing: 1.5 } },
    { id: "rd-rudder", kind: "controlSurface", label: "Rudder", position: at(1200, 160), props: { travelUp: 25, travelDown: 25 } },
    { id: "rd-fin", kind: "structureMount", label: "Fin spar", position: at(1200, 360), props: { note: "rudder hinges" } },
    { id: "rd-stop", kind: "travelStop", label: "Right pedal stop", position: at(220, 470), props: { stopAt: 20, arm: 6 } },
  ];
  const joints: Joint[] = [
    j("rd-j-pivot-left", ["rd-pedal-left", "pivot"], ["rd-floor", "mount"], pivot()),
    j("rd-j-pivot-right", ["rd-pedal-right", "pivot"], ["rd-floor", "mount"], pivot()),
    j("rd-j-pedal-left", ["rd-pedal-left", "attach"], ["rd-cable-left", "a"], terminal()),
    j("rd-j-pedal-right", ["rd-pedal-right", "attach"], ["rd-cable-right", "a"], terminal()),
    j("rd-j-over-pulley", ["rd-cable-left", "run"], ["rd-pulley", "cable"], passing()),
    j("rd-j-pulley-axle", ["rd-pulley", "pivot"], ["rd-floor", "mount"], pivot()),
    j("rd-j-thru-fairlead", ["rd-cable-right", "run"], ["rd-fairlead", "cable"], passing()),
    j("rd-j-fairlead-block", ["rd-fairlead", "mount"], ["rd-floor", "mount"], hornBolts()),
    j("rd-j-tb-left", ["rd-cable-left", "b"], ["rd-tb-left", "a"], passing()),
    j("rd-j-tb-right", ["rd-cable-right", "b"], [DEMO_RUDDER_FAULT_PART, "a"], passing()),
    j("rd-j-horn-left", ["rd-tb-left", "b"], ["rd-horn", "attach"], terminal()),
    j("rd-j-horn-right", [DEMO_RUDDER_FAULT_PART, "b"], ["rd-horn", "attach"], terminal()),
    j("rd-j-horn-spar", ["rd-horn", "surface"], ["rd-rudder", "horn"], hornOnSpar()),
    j("rd-j-hinge", ["rd-rudder", "hinge"], ["rd-fin", "mount"], { ...pivot(), hingeLoad: 120 }), // invented demo hinge load
    j("rd-j-stop", ["rd-stop", "contact"], ["rd-pedal-right", "attach"], hornBolts()),
  ];
  return { formatVersion: FORMAT_VERSION, name: "Yaw — pedals to rudder", system: "yaw", nodes, joints };
}
