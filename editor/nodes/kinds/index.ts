/**
 * The editor's half of the part-kind registry: one list, one file per kind beside this one (glyph, card
 * lines, form fields). The shared half (schema, ports, name, hint, defaults, engine role) is
 * shared/linkage/kinds/. `nodeTypes`, the parts tray, the card and the properties form read this list.
 */
import type { NodeKind } from "@/shared/linkage/kinds";
import type { EditorKindDef } from "./types";
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

export type { EditorKindDef } from "./types";

export const EDITOR_KIND_LIST = [
  stick, controlWheel, pedal, cablePedal, torqueTube, bellcrank, cableSector, idlerArm, pushrod,
  cable, turnbuckle, pulley, fairlead, controlHorn, controlSurface, structureMount, travelStop,
] as const;

// Every kind of the shared registry has its editor file (a kind missing here fails the typecheck).
type Covered = (typeof EDITOR_KIND_LIST)[number]["kind"];
const everyKindCovered: [NodeKind] extends [Covered] ? true : never = true;
void everyKindCovered;

/** By kind, typed loosely so a card or form can call it for any part. */
export const EDITOR_KINDS = Object.fromEntries(EDITOR_KIND_LIST.map((d) => [d.kind, d])) as unknown as Record<NodeKind, EditorKindDef>;
