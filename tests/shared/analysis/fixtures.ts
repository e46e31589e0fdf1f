/**
 * Fixture builders for the engine tests. goodRun() is a complete, correct short pitch run (stick →
 * pushrod → horn → elevator, mounted pivots and hinge) that must produce no findings at all; each
 * retention test changes one thing on one joint with withHardware().
 */
import type { Joint, JointHardware, LinkageGraph, LinkageNode } from "@/shared/linkage/schema";
import { graphSchema } from "@/shared/linkage/schema";

export type RodEnd = NonNullable<JointHardware["rodEnd"]>;

export function rodEnd(over: Partial<RodEnd> = {}): RodEnd {
  return {
    shank: "male", thread: "1/4-28", hand: "RH", ballBore: 0.25, ballDiameter: 0.531, housingBore: 0.5,
    ratedUltimate: 5000, ratedMisalignment: 12, hasWitnessHole: true,
    ballWidth: 0.375, bodyMaterial: "alloySteel", ...over,
  };
}

export type Member = NonNullable<NonNullable<JointHardware["holes"]>["from"]>;
/** A 4130N fork, 0.125 in each cheek, hole 0.5 in from the edge (e/D 2.0 for an AN4). */
export const steelFork: Member = { material: "4130N", thickness: 0.25, edgeDistance: 0.5, cheeks: 2 };

export function hardware(over: Partial<JointHardware> = {}): JointHardware {
  return { fit: "clamped", shear: "double", spacers: 0, torqueStripe: true, photos: [], note: "", ...over };
}

/** A complete, correct rod-end joint: AN4 in double shear, jam nut tight, witness hole checked. */
export function goodRodEndJoint(over: Partial<JointHardware> = {}, re: Partial<RodEnd> = {}): JointHardware {
  return hardware({
    rodEnd: rodEnd(re),
    jamNut: { fitted: true, tightened: true },
    engagement: { witnessHoleVerified: true },
    bolt: { size: "AN4", material: "steel", grip: 0.75, stack: 0.75, threadsProtruding: 2 },
    nut: { type: "selfLockingMetal", pattern: "tension", dragTorque: 8 }, // fixture drag, above the 3.5/6.5 in·lbf minimums
    washerUnderHead: { outsideDiameter: 0.625, thickness: 0.063 },
    washerUnderNut: { outsideDiameter: 0.5, thickness: 0.063 },
    torque: 60, // AC 43.13-1B table 7-1: 1/4-28 tension nut 50–70 in·lbf, plus the 8 in·lbf drag
    // The member each side: the rod end's own side is its eye (covered by the rating), the other a steel fork.
    holes: { from: steelFork, to: steelFork },
    spacers: 0,
    ...over,
  });
}

export function goodBallPivot(over: Partial<JointHardware> = {}): JointHardware {
  return hardware({
    bearing: "ballBearing",
    bolt: { size: "AN5", material: "steel", grip: 1.25, stack: 1.25, threadsProtruding: 2 },
    nut: { type: "selfLockingMetal", pattern: "tension", dragTorque: 8 }, // fixture drag, above the 3.5/6.5 in·lbf minimums
    washerUnderHead: { outsideDiameter: 0.75, thickness: 0.063 },
    washerUnderNut: { outsideDiameter: 0.75, thickness: 0.063 },
    torque: 120, // AC 43.13-1B table 7-1: 5/16-24 tension nut 100–140 in·lbf, plus the 8 in·lbf drag
    bearingRating: 4000, // fixture part: the maker's rated radial load
    // The turning part's side is the bearing's housing (its rating); the mount is a 4130N bracket, e/D 2.0 for an AN5.
    holes: { from: { material: "4130N", thickness: 0.25, edgeDistance: 0.625, cheeks: 2 }, to: { material: "4130N", thickness: 0.25, edgeDistance: 0.625, cheeks: 2 } },
    ...over,
  });
}

export function goodClamp(over: Partial<JointHardware> = {}): JointHardware {
  return hardware({
    bolt: { size: "AN3", material: "steel", grip: 0.5, stack: 0.5, threadsProtruding: 2 },
    nut: { type: "selfLockingMetal", pattern: "tension", dragTorque: 3 }, // fixture drag, above the 2 in·lbf minimum
    washerUnderHead: { outsideDiameter: 0.438, thickness: 0.032 },
    washerUnderNut: { outsideDiameter: 0.438, thickness: 0.032 },
    torque: 25, // AC 43.13-1B table 7-1: 10-32 tension nut 20–25 in·lbf, plus the 3 in·lbf drag
    // The horn's steel base and the surface's 2024-T3 spar doubler, e/D 2.0 for an AN3.
    holes: { from: { material: "4130N", thickness: 0.125, edgeDistance: 0.38 }, to: { material: "2024-T3", thickness: 0.19, edgeDistance: 0.38 } },
    ...over,
  });
}

export function j(id: string, from: [string, string], to: [string, string], hw: JointHardware): Joint {
  return { id, from: { node: from[0], port: from[1] }, to: { node: to[0], port: to[1] }, hardware: hw };
}

let x = 0;
const at = () => ({ x: (x += 220), y: 200 });

export const stick = (id: string, gripArm: number, attachArm: number, extra: Partial<Extract<LinkageNode, { kind: "stick" }>["props"]> = {}): LinkageNode =>
  ({ id, kind: "stick", label: "", position: at(), props: { gripArm, attachArm, axis: "pitch", travelFwd: 15, travelAft: 15, ...extra } });
export const mount = (id: string): LinkageNode => ({ id, kind: "structureMount", label: "", position: at(), props: { note: "" } });
export const pushrod = (id: string, material: "4130N" | "6061-T6" | "2024-T3", outsideDiameter: number, wall: number, length: number): LinkageNode =>
  ({ id, kind: "pushrod", label: "", position: at(), props: { material, outsideDiameter, wall, length } });
export const bellcrank = (id: string, inputArm: number, outputArm: number, armAngle = 90): LinkageNode =>
  ({ id, kind: "bellcrank", label: "", position: at(), props: { inputArm, outputArm, armAngle } });
export const horn = (id: string, hornArm: number, linkAngle = 90, bolts: { boltCount?: number; boltSpacing?: number } = { boltCount: 2, boltSpacing: 1.5 }): LinkageNode =>
  ({ id, kind: "controlHorn", label: "", position: at(), props: { hornArm, linkAngle, ...bolts } });
export const stop = (id: string, arm: number | undefined, stopAt = 15): LinkageNode =>
  ({ id, kind: "travelStop", label: "", position: at(), props: { stopAt, ...(arm === undefined ? {} : { arm }) } });
export const surface = (id: string): LinkageNode => ({ id, kind: "controlSurface", label: "", position: at(), props: { travelUp: 25, travelDown: 20 } });

export function graph(nodes: LinkageNode[], joints: Joint[], system: LinkageGraph["system"] = "pitch"): LinkageGraph {
  return { formatVersion: 1, name: "fixture", system, nodes, joints };
}

/** The designer's limit hinge load on the good run's hinge, lbf (invented test value). */
export const GOOD_HINGE_LOAD = 100;

/**
 * Stick (grip 20 in, attach 5 in) → pushrod 4130N 1.000 × 0.049 × 24 in → horn 2 in → elevator.
 * Joint ids: "pivot", "rodA" (stick–pushrod a, RH), "rodB" (pushrod b–horn, LH), "horn", "hinge", "stop"
 * (a stop 10 in from the stick's pivot, bolted to the stick's attach port).
 */
export function goodRun(): LinkageGraph {
  return graph(
    [stick("stick", 20, 5), mount("m1"), pushrod("rod", "4130N", 1, 0.049, 24), horn("hornpart", 2), surface("elev"), mount("m2"), stop("stop", 10)],
    [
      j("pivot", ["stick", "pivot"], ["m1", "mount"], goodBallPivot()),
      j("rodA", ["stick", "attach"], ["rod", "a"], goodRodEndJoint({}, { hand: "RH" })),
      j("rodB", ["rod", "b"], ["hornpart", "attach"], goodRodEndJoint({}, { hand: "LH" })),
      j("horn", ["hornpart", "surface"], ["elev", "horn"], goodClamp()),
      j("hinge", ["elev", "hinge"], ["m2", "mount"], goodBallPivot({ bolt: { size: "AN4", material: "steel", grip: 1.25, stack: 1.25, threadsProtruding: 2 }, torque: 60, hingeLoad: GOOD_HINGE_LOAD })),
      j("stop", ["stop", "contact"], ["stick", "attach"], goodClamp()),
    ],
  );
}

/** A deep copy of g with joint `id`'s hardware replaced by patch(old). */
export function withHardware(g: LinkageGraph, id: string, patch: (hw: JointHardware) => JointHardware): LinkageGraph {
  const copy: LinkageGraph = structuredClone(g);
  const jt = copy.joints.find((k) => k.id === id);
  if (!jt) throw new Error(`fixture has no joint ${id}`);
  jt.hardware = patch(jt.hardware);
  return copy;
}

/** Parse through the schema (as every real caller does) and fail loudly if a fixture is invalid. */
export function valid(g: LinkageGraph): LinkageGraph {
  const r = graphSchema.safeParse(g);
  if (!r.success) throw new Error(`invalid fixture: ${JSON.stringify(r.error.issues)}`);
  return r.data;
}
