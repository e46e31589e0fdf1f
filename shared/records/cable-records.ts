/**
 * What the cable system adds to a linkage's records: the checklist items of its cables, turnbuckles, pulleys
 * and fairleads (one group per part), and its lines on the build's hardware list. Pure.
 */
import { CABLE_SRC, MAX_FAIRLEAD_TURN, MAX_TURNBUCKLE_THREADS } from "../hardware/cables";
import type { LinkageGraph, LinkageNode } from "../linkage/schema";
import { partName } from "../linkage/names";
import type { SourceTag } from "../analysis/types";

/** AC 43.13-1B chapter 7, section 8 (control cables and turnbuckles): inspection of cables where they pass pulleys and fairleads. */
const CABLE_WEAR: SourceTag = { kind: "fromMemory", text: "AC 43.13-1B 7-149: cables inspected over their length, closely where they pass pulleys and fairleads (broken wires, wear, corrosion); paragraph recalled" };
const TERMINALS: SourceTag = { kind: "fromMemory", text: "AC 43.13-1B 7-150 to 7-153: swaged terminals and sleeves gauged after swaging; paragraphs recalled" };

export type CablePartItem = { code: CablePartCode; text: string; source: SourceTag };
export const CABLE_PART_CODES = ["cable-tension", "cable-terminals", "cable-wear", "turnbuckle-safety", "turnbuckle-free", "pulley-guards", "fairlead-turn"] as const;
export type CablePartCode = (typeof CABLE_PART_CODES)[number];

const TERMINAL_WORD: Record<string, string> = { swaged: "swaged terminal", nicopress: "nicopress sleeve", thimble: "thimble and bushing" };
const fmt = (v: number) => String(Number(v.toFixed(3)));

/** What the cable's card holds of the last rigging, so the inspector compares the new reading with it. */
function recorded(p: Extract<LinkageNode, { kind: "cable" }>["props"]): string {
  // One reading per circuit is enough for the check (the circuit's cables share it); this one may be on the other cable.
  if (p.riggingTension === undefined) return " No reading on this cable's card.";
  return ` On the cable's card: ${fmt(p.riggingTension)} lbf${p.riggingTemperature !== undefined ? ` at ${fmt(p.riggingTemperature)} °F` : ", temperature not recorded"}.`;
}

/** The checklist items of one part of a cable system (none for other kinds). */
export function cablePartItems(n: LinkageNode): CablePartItem[] {
  switch (n.kind) {
    case "cable": {
      const p = n.props;
      const range = p.tensionMin !== undefined && p.tensionMax !== undefined ? ` — the designer's range is ${fmt(p.tensionMin)} to ${fmt(p.tensionMax)} lbf${p.rangeTemperature !== undefined ? ` at ${fmt(p.rangeTemperature)} °F` : ""}` : "";
      return [
        { code: "cable-tension", text: `Rigging tension measured with a tensiometer on this cable, reading and air temperature written here${range}.${recorded(p)}`, source: CABLE_SRC.rigging },
        { code: "cable-terminals", text: `Terminals (A: ${TERMINAL_WORD[p.terminalA] ?? p.terminalA}, B: ${TERMINAL_WORD[p.terminalB] ?? p.terminalB}) made and gauged as their maker says; no kinks or broken wires at the terminal.`, source: TERMINALS },
        { code: "cable-wear", text: `${p.size} in ${p.construction.replace("x", "×")} cable wiped along its length with a cloth, closely at each pulley and fairlead: no broken wires, flattened strands or corrosion.`, source: CABLE_WEAR },
      ];
    }
    case "turnbuckle":
      return [
        { code: "turnbuckle-safety", text: `Barrel safetied (${n.props.locking === "clip" ? "a locking clip at each end" : n.props.locking === "wire" ? "safety wire" : "locking clips or safety wire"}), and no more than ${MAX_TURNBUCKLE_THREADS} threads showing at either end of the barrel.`, source: CABLE_SRC.turnbuckleSafety },
        { code: "turnbuckle-free", text: "At both ends of the travel the turnbuckle lines up with its cable and does not bind against the part it joins.", source: CABLE_SRC.turnbuckleBind },
      ];
    case "pulley":
      return [{ code: "pulley-guards", text: `Pulley turns freely, its groove is made for the cable and lines up with it, and the guards are in place, closer to the flange than the cable's diameter.`, source: CABLE_SRC.pulleyFit }];
    case "fairlead":
      return [{ code: "fairlead-turn", text: `The cable passes the fairlead without turning by more than ${MAX_FAIRLEAD_TURN}° and without rubbing marks; the fairlead is secure.`, source: CABLE_SRC.fairlead }];
    default:
      return [];
  }
}

/** The parts of a cable system in a graph, in graph order, with their items. */
export function cableParts(g: LinkageGraph): { node: LinkageNode; where: string; items: CablePartItem[] }[] {
  const out = [];
  for (const n of g.nodes) {
    const items = cablePartItems(n);
    if (items.length) out.push({ node: n, where: partName(n), items });
  }
  return out;
}

/** The hardware-list parts one cable-system part is: [key, kind, description, count]. */
export function cableHardware(n: LinkageNode): [string, "cable" | "cableTerminal" | "turnbuckle" | "pulley" | "fairlead", string, number][] {
  switch (n.kind) {
    case "cable": {
      const p = n.props;
      const out: [string, "cable" | "cableTerminal", string, number][] = [
        [`cable|${p.size}|${p.construction}|${p.material}|${p.length === undefined ? "?" : fmt(p.length)}`, "cable",
          `Control cable ${p.size} in ${p.construction.replace("x", "×")} ${p.material === "stainless" ? "stainless" : "carbon"} steel, ${p.length === undefined ? "length not recorded" : `${fmt(p.length)} in terminal to terminal`}`, 1],
      ];
      for (const t of [p.terminalA, p.terminalB]) out.push([`cableTerminal|${t}|${p.size}`, "cableTerminal", `${(TERMINAL_WORD[t] ?? t).replace(/^./, (c) => c.toUpperCase())} for ${p.size} in cable`, 1]);
      return out;
    }
    case "turnbuckle":
      return [[`turnbuckle|${n.props.size}|${n.props.locking ?? "?"}`, "turnbuckle", `Turnbuckle for ${n.props.size} in cable${n.props.locking === "clip" ? ", with two locking clips" : n.props.locking === "wire" ? ", safety-wired" : ""}`, 1]];
    case "pulley":
      return [[`pulley|${fmt(n.props.diameter)}|${n.props.grooveFor ?? "?"}|${n.props.bearing}`, "pulley", `Pulley ${fmt(n.props.diameter)} in, ${n.props.bearing} bearing${n.props.grooveFor ? `, groove for ${n.props.grooveFor} in cable` : ""}`, 1]];
    case "fairlead":
      return [["fairlead", "fairlead", "Fairlead", 1]];
    default:
      return [];
  }
}
