/**
 * A complete, correct rudder circuit (no findings at all): two pedals with cable arms, a cable from each over a
 * pulley (left) or through a fairlead (right), a turnbuckle at the aft end of each, both on the rudder horn.
 * Each test changes one thing. Node ids: pedalL, pedalR, cableL, cableR, pulley, fairlead, tbL, tbR, horn,
 * rudder, floor, fin, stop (on the right pedal, 6 in from its pivot). Numbers are plausible light-aircraft values, invented for the tests.
 */
import type { LinkageGraph, LinkageNode } from "@/shared/linkage/schema";
import { GOOD_HINGE_LOAD, goodBallPivot, goodClamp, graph, horn, j, mount, stop, surface } from "./fixtures";

type Props<K extends LinkageNode["kind"]> = Extract<LinkageNode, { kind: K }>["props"];
let x = 0;
const at = () => ({ x: (x += 200), y: 300 });

export const cablePedal = (id: string, over: Partial<Props<"cablePedal">> = {}): LinkageNode =>
  ({ id, kind: "cablePedal", label: id, position: at(), props: { pedalArm: 9, cableArm: 3, travel: 20, ...over } });
export const cable = (id: string, over: Partial<Props<"cable">> = {}): LinkageNode =>
  ({ id, kind: "cable", label: id, position: at(), props: { size: "1/8", construction: "7x19", material: "carbon", terminalA: "swaged", terminalB: "swaged", ...over } });
export const turnbuckle = (id: string, over: Partial<Props<"turnbuckle">> = {}): LinkageNode =>
  ({ id, kind: "turnbuckle", label: id, position: at(), props: { size: "1/8", threadsShowingA: 2, threadsShowingB: 2, locking: "clip", travelCheck: "free", ...over } });
export const pulley = (id: string, over: Partial<Props<"pulley">> = {}): LinkageNode =>
  ({ id, kind: "pulley", label: id, position: at(), props: { diameter: 3, grooveFor: "1/8", wrapAngle: 30, bearing: "ball", guards: "fitted", guardGap: 0.05, ratedLoad: 1200, ...over } });
export const fairlead = (id: string, over: Partial<Props<"fairlead">> = {}): LinkageNode =>
  ({ id, kind: "fairlead", label: id, position: at(), props: { turnAngle: 2, ...over } });

/** The rigging record on the left cable: 30 lbf at 70 °F, the designer's range 25–35 lbf at 70 °F (invented). */
export const RIGGED = { riggingTension: 30, riggingTemperature: 70, tensionMin: 25, tensionMax: 35, rangeTemperature: 70 };

/**
 * A cable terminal on a pedal or horn arm: the terminal turns on the bolt as the arm swings, so a castellated nut
 * with a new cotter pin, snugged (AC 43.13-1B 7-64a: no self-locking nut on a bolt subject to rotation).
 */
export const terminalBolt = () => goodClamp({ nut: { type: "castellatedCotter", pattern: "shear", cotterPinNew: true }, torque: undefined, bearing: "none" });

export function rudderCircuit(): LinkageGraph {
  return graph(
    [
      cablePedal("pedalL"), cablePedal("pedalR"), mount("floor"), mount("fin"),
      cable("cableL", RIGGED), cable("cableR"), pulley("pulley"), fairlead("fairlead"),
      turnbuckle("tbL"), turnbuckle("tbR"), horn("horn", 3), surface("rudder"), stop("stop", 6),
    ],
    [
      j("pivL", ["pedalL", "pivot"], ["floor", "mount"], goodBallPivot()),
      j("pivR", ["pedalR", "pivot"], ["floor", "mount"], goodBallPivot()),
      j("pedL", ["pedalL", "attach"], ["cableL", "a"], terminalBolt()),
      j("pedR", ["pedalR", "attach"], ["cableR", "a"], terminalBolt()),
      j("overP", ["cableL", "run"], ["pulley", "cable"], { fit: "clamped", shear: "double", torqueStripe: false, photos: [], note: "" }),
      j("pulleyAxle", ["pulley", "pivot"], ["floor", "mount"], goodBallPivot()),
      j("thruF", ["cableR", "run"], ["fairlead", "cable"], { fit: "clamped", shear: "double", torqueStripe: false, photos: [], note: "" }),
      j("fairMount", ["fairlead", "mount"], ["floor", "mount"], goodClamp()),
      j("tbLa", ["cableL", "b"], ["tbL", "a"], { fit: "clamped", shear: "double", torqueStripe: false, photos: [], note: "" }),
      j("tbRa", ["cableR", "b"], ["tbR", "a"], { fit: "clamped", shear: "double", torqueStripe: false, photos: [], note: "" }),
      j("hornL", ["tbL", "b"], ["horn", "attach"], terminalBolt()),
      j("hornR", ["tbR", "b"], ["horn", "attach"], terminalBolt()),
      j("hornMount", ["horn", "surface"], ["rudder", "horn"], goodClamp()),
      j("hinge", ["rudder", "hinge"], ["fin", "mount"], goodBallPivot({ hingeLoad: GOOD_HINGE_LOAD })),
      j("stopR", ["stop", "contact"], ["pedalR", "attach"], goodClamp()),
    ],
    "yaw",
  );
}

/** Props of node `id` in a copy of g, patched. */
export function withProps(g: LinkageGraph, id: string, patch: Record<string, unknown>): LinkageGraph {
  const copy: LinkageGraph = structuredClone(g);
  const n = copy.nodes.find((k) => k.id === id);
  if (!n) throw new Error(`fixture has no part ${id}`);
  Object.assign(n.props, patch);
  for (const [k, v] of Object.entries(patch)) if (v === undefined) delete (n.props as Record<string, unknown>)[k];
  return copy;
}

/** A roll wheel (D = 12 in) with a 1.5 in drum driving an aileron sector through two cables. */
export function wheelRun(props: Record<string, unknown> = {}): LinkageGraph {
  return graph(
    [{ id: "wheel", kind: "controlWheel", label: "Wheel", position: { x: 0, y: 0 }, props: { axis: "roll", diameter: 12, columnArm: 20, attachArm: 1.5, ...props } },
      mount("m"), cable("l", RIGGED), cable("r"), horn("horn", 3), surface("ail")],
    [
      j("wp", ["wheel", "pivot"], ["m", "mount"], goodBallPivot()),
      j("l1", ["wheel", "attach"], ["l", "a"], goodClamp()), j("r1", ["wheel", "attach"], ["r", "a"], goodClamp()),
      j("l2", ["l", "b"], ["horn", "attach"], goodClamp()), j("r2", ["r", "b"], ["horn", "attach"], goodClamp()),
      j("hm", ["horn", "surface"], ["ail", "horn"], goodClamp()), j("hinge", ["ail", "hinge"], ["m", "mount"], goodBallPivot({ hingeLoad: GOOD_HINGE_LOAD })),
    ],
    "roll",
  );
}
