/**
 * A one-stage run for the motion tests: a stick (input) driving a control horn through one pushrod, pivots
 * placed to scale. Arm lengths and angles are the test's; the pushrod's length follows from the geometry.
 */
import type { LinkageGraph } from "@/shared/linkage/schema";
import type { LinkageGeometry } from "@/shared/linkage/geometry";
import { graphSchema } from "@/shared/linkage/schema";
import { goodBallPivot, goodClamp, goodRodEndJoint } from "./fixtures";

export type Bar = {
  /** Driver arm a on pivot O2, follower arm c on pivot O4, angles at neutral in degrees. */
  a: number; c: number; o2: [number, number]; o4: [number, number]; alpha: number; beta: number;
  back?: number; forward?: number; dzA?: number; dzB?: number;
};

export function barRun(bar: Bar, extra: Partial<LinkageGeometry> = {}): LinkageGraph {
  const r = Math.PI / 180;
  const ax = bar.o2[0] + bar.a * Math.cos(bar.alpha * r), ay = bar.o2[1] + bar.a * Math.sin(bar.alpha * r);
  const bx = bar.o4[0] + bar.c * Math.cos(bar.beta * r), by = bar.o4[1] + bar.c * Math.sin(bar.beta * r);
  const length = Math.hypot(bx - ax, by - ay, (bar.dzB ?? 0) - (bar.dzA ?? 0));
  return graphSchema.parse({
    formatVersion: 1, name: "bar", system: "pitch",
    nodes: [
      { id: "stick", kind: "stick", label: "Stick", position: { x: 0, y: 0 }, props: { gripArm: 20, attachArm: bar.a, travelFwd: bar.forward ?? 15, travelAft: bar.back ?? 15 } },
      { id: "rod", kind: "pushrod", label: "Rod", position: { x: 0, y: 0 }, props: { material: "4130N", outsideDiameter: 0.75, wall: 0.049, length } },
      { id: "horn", kind: "controlHorn", label: "Horn", position: { x: 0, y: 0 }, props: { hornArm: bar.c } },
      { id: "elevator", kind: "controlSurface", label: "Elevator", position: { x: 0, y: 0 }, props: {} },
      { id: "m1", kind: "structureMount", label: "", position: { x: 0, y: 0 }, props: {} },
      { id: "m2", kind: "structureMount", label: "", position: { x: 0, y: 0 }, props: {} },
    ],
    joints: [
      { id: "j-pivot", from: { node: "stick", port: "pivot" }, to: { node: "m1", port: "mount" }, hardware: goodBallPivot() },
      { id: "j-a", from: { node: "stick", port: "attach" }, to: { node: "rod", port: "a" }, hardware: goodRodEndJoint() },
      { id: "j-b", from: { node: "rod", port: "b" }, to: { node: "horn", port: "attach" }, hardware: goodRodEndJoint({}, { hand: "LH" }) },
      { id: "j-horn", from: { node: "horn", port: "surface" }, to: { node: "elevator", port: "horn" }, hardware: goodClamp() },
      { id: "j-hinge", from: { node: "elevator", port: "hinge" }, to: { node: "m2", port: "mount" }, hardware: goodBallPivot() },
    ],
    geometry: {
      plane: "side", datum: "test",
      parts: {
        stick: { pivot: { x: bar.o2[0], y: bar.o2[1] }, arms: { attach: bar.alpha }, offsets: bar.dzA !== undefined ? { attach: bar.dzA } : {} },
        horn: { pivot: { x: bar.o4[0], y: bar.o4[1] }, arms: { attach: bar.beta }, offsets: bar.dzB !== undefined ? { attach: bar.dzB } : {} },
      },
      ...extra,
    },
  });
}
