/**
 * A newcomer's starting run: the usual pitch run of a light aircraft — control stick → forward pushrod →
 * bellcrank → aft pushrod → elevator horn → elevator, with structure mounts at the stick's pivot, the
 * bellcrank's pivot and the hinge, and a travel stop at the stick — every part at a placeholder size (to be
 * replaced with the plans' dimensions, and marked unentered until it is) and every joint's hardware blank, so
 * the check says what to enter.
 */
import { hardwareSchema, nodeSchema, FORMAT_VERSION, type Joint, type JointHardware, type LinkageGraph, type LinkageNode, type NodeKind } from "./linkage/schema";
import { defaultProps } from "./linkage/kinds";

export const STARTER_NAME = "Pitch — stick to elevator";

export function starterPitchRun(name = STARTER_NAME): LinkageGraph {
  // Every value is a placeholder, so every one is marked unentered: the check computes no margin from them
  // and says, part by part, what to enter (shared/analysis/unentered.ts).
  const part = (id: string, kind: NodeKind, label: string, x: number, y: number, props: Record<string, unknown> = {}): LinkageNode => {
    const all = { ...defaultProps(kind, "pitch"), ...props };
    const unentered = Object.keys(all).filter((k) => k !== "note");
    return nodeSchema.parse({ id, kind, label, position: { x, y }, props: all, ...(unentered.length ? { unentered } : {}) });
  };
  // Placeholder tubes a run of this size usually needs (not the kind's bare default, which would buckle here): replace with the plans' own.
  const tube = { material: "4130N", outsideDiameter: 0.75, wall: 0.049, length: 30 };
  const blank = () => hardwareSchema.parse({}) as JointHardware;
  const j = (id: string, from: [string, string], to: [string, string]): Joint => ({ id, from: { node: from[0], port: from[1] }, to: { node: to[0], port: to[1] }, hardware: blank() });
  const nodes = [
    part("stick", "stick", "Control stick", 0, 0),
    part("pushrod-fwd", "pushrod", "Forward pushrod", 240, 0, tube),
    part("bellcrank", "bellcrank", "Bellcrank", 480, 0),
    part("pushrod-aft", "pushrod", "Aft pushrod", 720, 0, tube),
    part("horn", "controlHorn", "Elevator horn", 960, 0),
    part("elevator", "controlSurface", "Elevator", 1200, 0),
    part("mount-stick", "structureMount", "Stick pivot bracket", 0, 220),
    part("mount-bellcrank", "structureMount", "Bellcrank bracket", 480, 220),
    part("mount-hinge", "structureMount", "Elevator hinge brackets", 1200, 220),
    part("stop", "travelStop", "Stick stop", 0, -200),
  ];
  const joints = [
    j("j-stick-pivot", ["stick", "pivot"], ["mount-stick", "mount"]),
    j("j-stick-fwd", ["stick", "attach"], ["pushrod-fwd", "a"]),
    j("j-fwd-bellcrank", ["pushrod-fwd", "b"], ["bellcrank", "in"]),
    j("j-bellcrank-pivot", ["bellcrank", "pivot"], ["mount-bellcrank", "mount"]),
    j("j-bellcrank-aft", ["bellcrank", "out"], ["pushrod-aft", "a"]),
    j("j-aft-horn", ["pushrod-aft", "b"], ["horn", "attach"]),
    j("j-horn-elevator", ["horn", "surface"], ["elevator", "horn"]),
    j("j-hinge", ["elevator", "hinge"], ["mount-hinge", "mount"]),
    j("j-stop", ["stop", "contact"], ["stick", "attach"]),
  ];
  return { formatVersion: FORMAT_VERSION, name, system: "pitch", nodes, joints };
}
