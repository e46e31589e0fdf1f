/**
 * The hardware list of a build: every part the joint cards of the current revisions call for, grouped
 * into lines by an identity key, with quantities and where each is used. Pure.
 */
import { AN_BOLTS_BY_SIZE, boltMaterialOf, type AnBoltSize } from "../hardware";
import type { Joint, LinkageGraph } from "../linkage/schema";
import { jointName, partName } from "../linkage/names";
import { cableHardware } from "./cable-records";

export const HARDWARE_STATES = ["to_order", "ordered", "received", "installed", "inspected"] as const;
export type HardwareState = (typeof HARDWARE_STATES)[number];
export const HARDWARE_STATE_LABEL: Record<HardwareState, string> = {
  to_order: "To order", ordered: "Ordered", received: "Received", installed: "Installed", inspected: "Inspected",
};

export const HARDWARE_KINDS = ["rodEnd", "jamNut", "bolt", "clevisPin", "nut", "washer", "cotterPin", "cable", "cableTerminal", "turnbuckle", "pulley", "fairlead"] as const;
export type HardwareKind = (typeof HARDWARE_KINDS)[number];
export const HARDWARE_KIND_LABEL: Record<HardwareKind, string> = {
  rodEnd: "Rod end", jamNut: "Jam nut", bolt: "Bolt", clevisPin: "Clevis pin", nut: "Nut", washer: "Washer", cotterPin: "Cotter pin",
  cable: "Cable", cableTerminal: "Cable terminal", turnbuckle: "Turnbuckle", pulley: "Pulley", fairlead: "Fairlead",
};
/** Where a line is used: at a joint, or (cable-system parts) the part itself; `jointId` is then the part's id. */
export type WhereUsed = { linkageId: string; linkageName: string; jointId: string; where: string };
export type HardwareLine = {
  /** Stable identity of the line: the same part in two joints is one line. */
  key: string;
  kind: HardwareKind;
  description: string;
  partNumber: string | null;
  quantity: number;
  usedIn: WhereUsed[];
};

const n3 = (v: number | undefined) => (v === undefined ? "?" : String(Number(v.toFixed(3))));
const NUT_LABEL: Record<string, string> = {
  selfLockingMetal: "all-metal self-locking nut", selfLockingInsert: "nylon-insert self-locking nut", castellatedCotter: "castellated nut",
  plainSafetyWire: "plain nut (safety-wired)", plain: "plain nut",
};

function boltThread(j: Joint) {
  const b = j.hardware.bolt;
  if (!b || b.size === "custom") return null;
  return AN_BOLTS_BY_SIZE[b.size as AnBoltSize]?.thread ?? null;
}

/** The parts one joint calls for: [key, kind, description, partNumber, count]. */
export function jointParts(j: Joint): [string, HardwareKind, string, string | null, number][] {
  const hw = j.hardware;
  const out: [string, HardwareKind, string, string | null, number][] = [];
  const re = hw.rodEnd;
  if (re) {
    const pn = re.partNumber?.trim() || null;
    // An unrecorded hand is listed as such: a jam nut of the wrong hand does not go on.
    const hand = re.hand ?? "hand not recorded";
    out.push([pn ? `rodEnd|${pn.toLowerCase()}` : `rodEnd|${re.thread}|${hand}|${re.shank}|${n3(re.ballBore)}`, "rodEnd",
      `Rod end ${re.thread} ${re.hand ?? "(hand not recorded)"} ${re.shank}, bore ${n3(re.ballBore)} in`, pn, 1]);
    // Every threaded rod end needs its jam nut, fitted yet or not: the one the check asks for is on the list to get.
    out.push([`jamNut|${re.thread}|${hand}`, "jamNut", re.hand ? `Jam nut ${re.thread} ${re.hand}` : `Jam nut ${re.thread}, hand not recorded (the rod end's hand)`, null, 1]);
  }
  const b = hw.bolt;
  if (b) {
    const name = b.size === "custom" ? `Bolt Ø${n3(b.diameter)} in` : `${b.size} bolt`;
    const material = boltMaterialOf(b) ?? "material not recorded";
    out.push([`bolt|${b.size}|${n3(b.diameter)}|${n3(b.grip)}|${material}`, "bolt", `${name}, grip ${n3(b.grip)} in, ${material}`, null, 1]);
  }
  const pin = hw.clevisPin;
  if (pin) {
    out.push([`clevisPin|${n3(pin.diameter)}`, "clevisPin", `Clevis pin Ø${n3(pin.diameter)} in`, null, 1]);
    // Held by a cotter pin alone (a nut's own cotter pin is listed with the nut).
    if (pin.retention === "cotterPinOnly") out.push([`cotterPin|pin|${n3(pin.diameter)}`, "cotterPin", `Cotter pin for Ø${n3(pin.diameter)} in clevis pin`, null, 1]);
  }
  const nut = hw.nut;
  if (nut && nut.type !== "none") {
    const th = boltThread(j) ?? "?";
    const pattern = nut.pattern ?? "pattern not recorded";
    out.push([`nut|${nut.type}|${pattern}|${th}`, "nut", `${NUT_LABEL[nut.type] ?? nut.type} ${th} (${pattern})`, null, 1]);
    if (nut.type === "castellatedCotter") out.push([`cotterPin|${th}`, "cotterPin", `Cotter pin for ${th} castellated nut`, null, 1]);
  }
  const washers = [hw.washerUnderHead, hw.washerUnderNut].filter(Boolean) as { outsideDiameter: number; thickness?: number }[];
  const boltD = b ? (b.size === "custom" ? b.diameter : AN_BOLTS_BY_SIZE[b.size as AnBoltSize]?.diameter) : undefined;
  for (const w of washers) {
    out.push([`washer|${n3(boltD)}|${n3(w.outsideDiameter)}|${n3(w.thickness)}`, "washer",
      `Washer for Ø${n3(boltD)} in, OD ${n3(w.outsideDiameter)} in, ${n3(w.thickness)} in thick`, null, 1]);
  }
  return out;
}

export function hardwareList(linkages: { id: string; name: string; graph: LinkageGraph }[]): HardwareLine[] {
  const lines = new Map<string, HardwareLine>();
  for (const l of linkages) {
    for (const j of l.graph.joints) {
      const where = jointName(j, l.graph.nodes);
      for (const [key, kind, description, partNumber, count] of jointParts(j)) {
        let line = lines.get(key);
        if (!line) lines.set(key, (line = { key, kind, description, partNumber, quantity: 0, usedIn: [] }));
        line.quantity += count;
        line.usedIn.push({ linkageId: l.id, linkageName: l.name, jointId: j.id, where });
      }
    }
    for (const n of l.graph.nodes) {
      for (const [key, kind, description, count] of cableHardware(n)) {
        let line = lines.get(key);
        if (!line) lines.set(key, (line = { key, kind, description, partNumber: null, quantity: 0, usedIn: [] }));
        line.quantity += count;
        // A cable's two terminals are one place: name it once.
        const last = line.usedIn[line.usedIn.length - 1];
        if (!(last && last.linkageId === l.id && last.jointId === n.id)) line.usedIn.push({ linkageId: l.id, linkageName: l.name, jointId: n.id, where: partName(n) });
      }
    }
  }
  return [...lines.values()].sort((a, b) => HARDWARE_KINDS.indexOf(a.kind) - HARDWARE_KINDS.indexOf(b.kind) || a.description.localeCompare(b.description));
}
