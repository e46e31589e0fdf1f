/**
 * The registry of part kinds: one list, one folder per kind beside this one. NodeKind, PORTS, port sides and
 * names, display names, hints, default props and the engine's roles all come from here; the props schemas
 * (and with them the node schema) from schemas.ts. This half loads no schema library: the editor draws a
 * linkage from it and loads the schemas on first use.
 * To add a kind: write `<kind>/index.ts` with `defineKind` and `<kind>/schema.ts` with its props, add it to
 * KIND_LIST here and to KIND_SCHEMAS in schemas.ts, then its editor file (editor/nodes/kinds/) — see
 * DEVELOPERS.md "Add a part kind".
 */
import type { ControlSystem } from "../format";
import type { EngineInfo, KindDef, PortDef, Role, Side } from "./types";
import { stick } from "./stick";
import { pedal } from "./pedal";
import { torqueTube } from "./torqueTube";
import { bellcrank } from "./bellcrank";
import { idlerArm } from "./idlerArm";
import { pushrod } from "./pushrod";
import { controlHorn } from "./controlHorn";
import { controlSurface } from "./controlSurface";
import { structureMount } from "./structureMount";
import { travelStop } from "./travelStop";
import { controlWheel } from "./controlWheel";
import { cablePedal } from "./cablePedal";
import { cableSector } from "./cableSector";
import { cable } from "./cable";
import { turnbuckle } from "./turnbuckle";
import { pulley } from "./pulley";
import { fairlead } from "./fairlead";

export { defineKind, ROLE_PORTS } from "./types";
export type { EngineInfo, KindDef, PilotForces, PortDef, Role, Side } from "./types";

/** Every part kind, in the order the parts tray lists them. */
export const KIND_LIST = [
  stick, controlWheel, pedal, cablePedal, torqueTube, bellcrank, cableSector, idlerArm, pushrod,
  cable, turnbuckle, pulley, fairlead, controlHorn, controlSurface, structureMount, travelStop,
] as const;

type Def = (typeof KIND_LIST)[number];
export type NodeKind = Def["kind"];
export type KindOf<K extends NodeKind> = Extract<Def, { kind: K }>;
/** The props of a part of kind K, after defaults (the output type of its schema). */
export type PropsOf<K extends NodeKind> = ReturnType<KindOf<K>["defaults"]>;

export const NODE_KINDS: NodeKind[] = KIND_LIST.map((d) => d.kind);
export const KINDS = Object.fromEntries(KIND_LIST.map((d) => [d.kind, d])) as { [K in NodeKind]: KindOf<K> };

const each = <T>(f: (d: KindDef) => T) => Object.fromEntries(KIND_LIST.map((d) => [d.kind, f(d as unknown as KindDef)])) as Record<NodeKind, T>;

/** Where joints attach on each kind. `pivot` joins a part to its mount; others carry links. */
export const PORTS: Record<NodeKind, readonly string[]> = each((d) => Object.keys(d.ports));
/** Where each port sits on the part's card. */
export const PORT_SIDES: Record<NodeKind, Record<string, Side>> = each((d) => Object.fromEntries(Object.entries(d.ports).map(([p, v]) => [p, v.side])));
export const KIND_NAMES: Record<NodeKind, string> = each((d) => d.name);
export const KIND_HINTS: Record<NodeKind, string> = each((d) => d.hint);
/** The engine's view of each kind, typed loosely so a loop over mixed parts can call it. */
export const ENGINE: Record<NodeKind, EngineInfo<any>> = each((d) => d.engine as EngineInfo<any>); // eslint-disable-line @typescript-eslint/no-explicit-any
export const ROLES: Record<NodeKind, Role> = each((d) => d.engine.role);

/** A kind's role, or undefined for a kind the registry does not know (graphs that skipped the schema). */
export function roleOf(kind: string): Role | undefined {
  return (ROLES as Record<string, Role | undefined>)[kind];
}

/** A port of a kind, or undefined when the kind has no such port. */
export function portDef(kind: string, port: string): PortDef | undefined {
  const d = (KINDS as unknown as Record<string, KindDef | undefined>)[kind];
  return d && Object.prototype.hasOwnProperty.call(d.ports, port) ? d.ports[port] : undefined;
}

/** Props a freshly placed part of `kind` starts with, defaults applied (a new object each time). */
export function defaultProps<K extends NodeKind>(kind: K, system: ControlSystem = "other"): PropsOf<K> {
  const d = KINDS[kind] as unknown as KindDef;
  return d.defaults(system) as PropsOf<K>;
}
