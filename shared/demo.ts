/**
 * The demo scenario: the pitch run of the fictional "Larkspur LX-2" — control stick → forward pushrod →
 * bellcrank under the seat → aft pushrod → elevator horn → elevator, with structure mounts at the pivots
 * and hinges. Plausible hardware everywhere and exactly one deliberately wrong joint ("j-aft-horn": no jam
 * nut, and a retaining washer smaller than the rod end's housing bore) so findings show on first open.
 * Part numbers and dimensions are invented for the demo.
 *
 * Also generateLinkage(n): a valid chain-and-branches linkage of exactly n parts, for benchmarks and tests.
 */
import type { Joint, JointHardware, LinkageGraph, LinkageNode } from "./linkage/schema";
import { FORMAT_VERSION } from "./linkage/schema";

type RodEnd = NonNullable<JointHardware["rodEnd"]>;

/** A 1/4-28 male rod end (invented part), ball bore 1/4 in. */
function rodEnd(hand: "RH" | "LH", rating = 4200): RodEnd {
  return {
    shank: "male", thread: "1/4-28", hand, ballBore: 0.25, ballDiameter: 0.531, housingBore: 0.5,
    ratedUltimate: rating, ratedMisalignment: 12, hasWitnessHole: true, partNumber: `LW-SRE4M-${hand}`,
    ballWidth: 0.375, bodyMaterial: "alloySteel",
  };
}

type Member = NonNullable<NonNullable<JointHardware["holes"]>["from"]>;
/** A 4130N fork, 0.125 in each cheek, the hole 0.5 in from its edge (invented demo bracket). */
const FORK: Member = { material: "4130N", thickness: 0.25, edgeDistance: 0.5, cheeks: 2 };
/** A 4130N pivot bracket, two 0.125 in cheeks, 0.75 in edge distance (invented demo bracket). */
const BRACKET: Member = { material: "4130N", thickness: 0.25, edgeDistance: 0.75, cheeks: 2 };

function hw(over: Partial<JointHardware>): JointHardware {
  return { fit: "clamped", shear: "double", spacers: 0, torqueStripe: true, photos: [], note: "", ...over };
}

/** A rod end clamped in a double-shear clevis on an AN4 bolt: the good, complete joint card. */
function rodEndJoint(hand: "RH" | "LH", rating?: number): JointHardware {
  return hw({
    rodEnd: rodEnd(hand, rating),
    jamNut: { fitted: true, tightened: true },
    engagement: { witnessHoleVerified: true },
    bolt: { size: "AN4", material: "steel", grip: 0.75, stack: 0.75, threadsProtruding: 2 },
    nut: { type: "selfLockingMetal", pattern: "tension", dragTorque: 8 }, // invented demo drag: 50–70 + 8 in·lbf
    washerUnderHead: { outsideDiameter: 0.625, thickness: 0.063 },
    washerUnderNut: { outsideDiameter: 0.5, thickness: 0.063 },
    torque: 60,
    holes: { from: FORK, to: FORK },
    spacers: 0,
  });
}

/** A pivot on a sealed ball bearing clamped by the bolt: a self-locking nut is fine here (AC 43.13-1B 7-64d). */
function ballPivot(size: "AN4" | "AN5", torque: number): JointHardware {
  return hw({
    bearing: "ballBearing",
    bolt: { size, material: "steel", grip: 1.25, stack: 1.25, threadsProtruding: 2 },
    nut: { type: "selfLockingMetal", pattern: "tension", dragTorque: 8 }, // invented demo drag
    washerUnderHead: { outsideDiameter: 0.75, thickness: 0.063 },
    washerUnderNut: { outsideDiameter: 0.75, thickness: 0.063 },
    torque,
    bearingRating: 3000, // invented demo bearing
    holes: { from: BRACKET, to: BRACKET },
  });
}

/** A pivot turning on a plain bushing: castellated nut and a new cotter pin, snugged, not torqued. */
function bushingPivot(size: "AN5" | "AN6"): JointHardware {
  return hw({
    bearing: "plainBushing",
    bolt: { size, material: "steel", grip: 1.5, stack: 1.5, threadsProtruding: 2 },
    nut: { type: "castellatedCotter", pattern: "shear", cotterPinNew: true },
    washerUnderHead: { outsideDiameter: 0.875, thickness: 0.063 },
    washerUnderNut: { outsideDiameter: 0.875, thickness: 0.063 },
    holes: { from: { ...BRACKET, bushing: "steel" }, to: BRACKET },
  });
}

/**
 * Clamped bolted attachment, AN4: the horn to the spar (two members, so single shear) or a stop bolted through a
 * clevis on the stick (double shear).
 */
function boltedClamp(shear: "single" | "double" = "single"): JointHardware {
  return hw({
    shear,
    bolt: { size: "AN4", material: "steel", grip: 0.375, stack: 0.375, threadsProtruding: 2 },
    nut: { type: "selfLockingMetal", pattern: "tension", dragTorque: 8 }, // invented demo drag: 50–70 + 8 in·lbf
    washerUnderHead: { outsideDiameter: 0.5, thickness: 0.063 },
    washerUnderNut: { outsideDiameter: 0.5, thickness: 0.063 },
    torque: 65,
    spacers: 0,
    // The horn's steel base and the surface's 2024-T3 spar doubler.
    holes: { from: { material: "4130N", thickness: 0.125, edgeDistance: 0.38 }, to: { material: "2024-T3", thickness: 0.19, edgeDistance: 0.38 } },
  });
}

function joint(id: string, from: [string, string], to: [string, string], hardware: JointHardware): Joint {
  return { id, from: { node: from[0], port: from[1] }, to: { node: to[0], port: to[1] }, hardware };
}

export const DEMO_WRONG_JOINT = "j-aft-horn";

export function demoPitchLinkage(): LinkageGraph {
  const y = 200;
  const nodes: LinkageNode[] = [
    { id: "stick", kind: "stick", label: "Control stick", position: { x: 0, y },
      props: { gripArm: 20, attachArm: 6, axis: "pitch", travelFwd: 12, travelAft: 15 } },
    { id: "pushrod-fwd", kind: "pushrod", label: "Forward pushrod", position: { x: 220, y },
      props: { material: "4130N", outsideDiameter: 0.75, wall: 0.035, length: 30 } },
    { id: "bellcrank", kind: "bellcrank", label: "Bellcrank under the seat", position: { x: 440, y },
      props: { inputArm: 3, outputArm: 4, armAngle: 90 } },
    { id: "pushrod-aft", kind: "pushrod", label: "Aft pushrod", position: { x: 660, y },
      props: { material: "6061-T6", outsideDiameter: 1.5, wall: 0.058, length: 72 } },
    { id: "horn", kind: "controlHorn", label: "Elevator horn", position: { x: 880, y },
      props: { hornArm: 5, linkAngle: 90, boltCount: 2, boltSpacing: 1.5 } },
    { id: "elevator", kind: "controlSurface", label: "Elevator", position: { x: 1100, y },
      props: { travelUp: 25, travelDown: 20 } },
    { id: "mount-stick", kind: "structureMount", label: "Seat-frame stick mount", position: { x: 0, y: 380 }, props: { note: "Welded lugs on the seat frame" } },
    { id: "mount-bellcrank", kind: "structureMount", label: "Bellcrank bracket", position: { x: 440, y: 380 }, props: { note: "Bracket riveted to the seat rib" } },
    { id: "mount-tail", kind: "structureMount", label: "Stabilizer rear spar", position: { x: 1100, y: 380 }, props: { note: "Hinge brackets on the stabilizer rear spar" } },
    { id: "stop-stick", kind: "travelStop", label: "Stick stop", position: { x: 0, y: 20 }, props: { stopAt: 12, arm: 8 } },
  ];
  const wrong = hw({
    // The deliberate mistake: single shear on the horn, no jam nut, and a 0.438 in washer under the
    // head on a rod end whose housing bore is 0.500 in.
    rodEnd: rodEnd("LH"),
    engagement: { witnessHoleVerified: true },
    shear: "single",
    freeSide: "head",
    bolt: { size: "AN4", material: "steel", grip: 0.5, stack: 0.5, threadsProtruding: 2 },
    nut: { type: "selfLockingMetal", pattern: "tension", dragTorque: 8 }, // invented demo drag
    washerUnderHead: { outsideDiameter: 0.438, thickness: 0.063 },
    washerUnderNut: { outsideDiameter: 0.5, thickness: 0.063 },
    torque: 60,
    holes: { from: FORK, to: { material: "4130N", thickness: 0.125, edgeDistance: 0.5 } },
    spacers: 0,
  });
  const joints: Joint[] = [
    joint("j-stick-pivot", ["stick", "pivot"], ["mount-stick", "mount"], bushingPivot("AN5")),
    joint("j-stick-fwd", ["stick", "attach"], ["pushrod-fwd", "a"], rodEndJoint("RH")),
    joint("j-fwd-bellcrank", ["pushrod-fwd", "b"], ["bellcrank", "in"], rodEndJoint("LH")),
    joint("j-bellcrank-pivot", ["bellcrank", "pivot"], ["mount-bellcrank", "mount"], ballPivot("AN5", 120)),
    joint("j-bellcrank-aft", ["bellcrank", "out"], ["pushrod-aft", "a"], rodEndJoint("RH")),
    joint(DEMO_WRONG_JOINT, ["pushrod-aft", "b"], ["horn", "attach"], wrong),
    joint("j-horn-elevator", ["horn", "surface"], ["elevator", "horn"], boltedClamp()),
    joint("j-elevator-hinge", ["elevator", "hinge"], ["mount-tail", "mount"], { ...ballPivot("AN4", 60), hingeLoad: 150 }), // invented demo hinge load
    joint("j-stick-stop", ["stop-stick", "contact"], ["stick", "attach"], boltedClamp("double")),
  ];
  return { formatVersion: FORMAT_VERSION, name: "Larkspur LX-2 pitch", system: "pitch", nodes, joints };
}

/**
 * A valid linkage of exactly nodeCount parts (minimum 7): a stick with its stop driving a chain of bellcranks
 * (each with its mount), splitting into branches, each branch ending at a horn and a surface hinged on a
 * mount. Arm ratios alternate 3:4 and 4:3 so loads stay bounded however long the chain. Hardware is
 * complete and correct, so a generated linkage has no retention findings. Positions are laid out on a grid.
 */
export function generateLinkage(nodeCount: number): LinkageGraph {
  const n = Math.max(7, Math.floor(nodeCount));
  const nodes: LinkageNode[] = [];
  const joints: Joint[] = [];
  let jn = 0;
  const addJoint = (from: [string, string], to: [string, string], h: JointHardware) => joints.push(joint(`j${jn++}`, from, to, h));
  const pos = (col: number, row: number) => ({ x: col * 220, y: 200 + row * 180 });

  // Budget: stick + mount + stop = 3, each unit (pushrod, bellcrank, mount) = 3, each branch end
  // (pushrod, horn, surface, mount) = 4, and up to 2 extra hinge mounts of padding.
  let branches = Math.max(1, Math.floor((n - 6) / 250) + 1);
  let units = Math.floor((n - 3 - 4 * branches) / 3);
  while (branches > 1 && units < branches - 1) { branches--; units = Math.floor((n - 3 - 4 * branches) / 3); }
  const pad = n - 3 - 4 * branches - 3 * units;

  nodes.push({ id: "stick", kind: "stick", label: "Stick", position: pos(0, 0), props: { gripArm: 20, attachArm: 6, axis: "pitch", travelFwd: 15, travelAft: 15 } });
  nodes.push({ id: "m-stick", kind: "structureMount", label: "", position: pos(0, 1), props: { note: "" } });
  addJoint(["stick", "pivot"], ["m-stick", "mount"], ballPivot("AN5", 120));
  nodes.push({ id: "stop", kind: "travelStop", label: "", position: pos(0, -1), props: { stopAt: 15, arm: 8 } });
  addJoint(["stop", "contact"], ["stick", "attach"], boltedClamp("double"));

  // Open ends waiting for a pushrod: [node id, port, column, row].
  const open: [string, string, number, number][] = [["stick", "attach", 0, 0]];
  let hand: "RH" | "LH" = "RH";
  const other = (h: "RH" | "LH") => (h === "RH" ? "LH" : "RH");
  const addPushrod = (id: string, col: number, row: number, from: [string, string]) => {
    nodes.push({ id, kind: "pushrod", label: "", position: pos(col, row), props: { material: "4130N", outsideDiameter: 1, wall: 0.049, length: 24 } });
    addJoint(from, [id, "a"], rodEndJoint(hand, 6000));
    return other(hand);
  };
  // Units are spread over the branches; branch k > 0 splits off the out arm of crank k-1 of branch 0.
  const perBranch = new Array(branches).fill(Math.floor(units / branches));
  for (let i = 0; i < units % branches; i++) perBranch[i]++;
  const splitPoints: [string, number][] = [];
  let uid = 0;
  const buildBranch = (start: [string, string, number, number], count: number, row: number, isMain: boolean) => {
    let [fromId, fromPort, col] = start;
    for (let u = 0; u < count; u++, uid++) {
      const pr = `p${uid}`, bc = `b${uid}`, mt = `m${uid}`;
      addPushrod(pr, col + 1, row, [fromId, fromPort]);
      nodes.push({ id: bc, kind: "bellcrank", label: "", position: pos(col + 2, row), props: uid % 2 ? { inputArm: 4, outputArm: 3, armAngle: 90 } : { inputArm: 3, outputArm: 4, armAngle: 90 } });
      addJoint([pr, "b"], [bc, "in"], rodEndJoint("LH", 6000));
      nodes.push({ id: mt, kind: "structureMount", label: "", position: pos(col + 2, row + 1), props: { note: "" } });
      addJoint([bc, "pivot"], [mt, "mount"], ballPivot("AN5", 120));
      if (isMain) splitPoints.push([bc, col + 2]);
      fromId = bc; fromPort = "out"; col += 2;
    }
    return [fromId, fromPort, col] as const;
  };
  const ends: (readonly [string, string, number, number])[] = [];
  const main = buildBranch(open[0], perBranch[0], 0, true);
  ends.push([...main, 0]);
  for (let b = 1; b < branches; b++) {
    // Split off crank b-1 of the main branch (reusing cranks when branches outnumber them), or the stick.
    const [sp, col] = splitPoints.length ? splitPoints[(b - 1) % splitPoints.length] : ["stick", 0];
    const port = splitPoints.length ? "out" : "attach";
    const row = 2 * b;
    ends.push([...buildBranch([sp, port, col, row], perBranch[b], row, false), row]);
  }
  let padLeft = pad;
  ends.forEach(([fromId, fromPort, col, row], i) => {
    const pr = `pe${i}`, hn = `h${i}`, sf = `s${i}`, mt = `ms${i}`;
    hand = "RH";
    addPushrod(pr, col + 1, row, [fromId, fromPort]);
    nodes.push({ id: hn, kind: "controlHorn", label: "", position: pos(col + 2, row), props: { hornArm: 2.5, linkAngle: 90, boltCount: 2, boltSpacing: 1.5 } });
    addJoint([pr, "b"], [hn, "attach"], rodEndJoint("LH", 6000));
    nodes.push({ id: sf, kind: "controlSurface", label: "", position: pos(col + 3, row), props: { travelUp: 25, travelDown: 20 } });
    addJoint([hn, "surface"], [sf, "horn"], boltedClamp());
    nodes.push({ id: mt, kind: "structureMount", label: "", position: pos(col + 3, row + 1), props: { note: "" } });
    addJoint([sf, "hinge"], [mt, "mount"], { ...ballPivot("AN4", 60), hingeLoad: 150 }); // invented, as the demo's
    for (; padLeft > 0 && i === 0; padLeft--) {
      const extra = `mh${padLeft}`;
      nodes.push({ id: extra, kind: "structureMount", label: "", position: pos(col + 3 + padLeft, row + 1), props: { note: "" } });
      addJoint([sf, "hinge"], [extra, "mount"], { ...ballPivot("AN4", 60), hingeLoad: 150 });
    }
  });
  return { formatVersion: FORMAT_VERSION, name: `generated ${n}`, system: "pitch", nodes, joints };
}

/**
 * A worst case for fan-in (benchmarks and the hardening tests): `sticks` sticks (one the chain's own), each
 * on its own mount, all driving the first pushrod of generateLinkage's chain; `parts` parts in all.
 */
export function fanInLinkage(sticks: number, parts = 2 * sticks + 60): LinkageGraph {
  const g = generateLinkage(Math.max(7, parts - 2 * (sticks - 1)));
  const first = g.joints.find((j) => j.from.node === "stick" && j.from.port === "attach" && j.to.port === "a")!;
  for (let i = 1; i < sticks; i++) {
    g.nodes.push({ id: `fan-s${i}`, kind: "stick", label: "", position: { x: -220, y: i * 180 }, props: { gripArm: 20, attachArm: 6, axis: "pitch", travelFwd: 15, travelAft: 15 } });
    g.nodes.push({ id: `fan-m${i}`, kind: "structureMount", label: "", position: { x: -440, y: i * 180 }, props: { note: "" } });
    g.joints.push(joint(`fan-jp${i}`, [`fan-s${i}`, "pivot"], [`fan-m${i}`, "mount"], ballPivot("AN5", 120)));
    g.joints.push(joint(`fan-ja${i}`, [`fan-s${i}`, "attach"], [first.to.node, "a"], rodEndJoint("RH", 6000)));
  }
  return { ...g, name: `fan-in ${sticks}` };
}
