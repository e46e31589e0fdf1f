/**
 * The other half of the part-kind registry: each kind's props schema (`<kind>/schema.ts`), by kind. The node
 * schema (../schema.ts) is made from this; the server validates every graph with it, the editor loads it on
 * first use (an edit in a card, an import). A kind missing here fails the typecheck.
 */
import type { z } from "zod";
import type { NodeKind, PropsOf } from "./index";
import { props as stick } from "./stick/schema";
import { props as pedal } from "./pedal/schema";
import { props as torqueTube } from "./torqueTube/schema";
import { props as bellcrank } from "./bellcrank/schema";
import { props as idlerArm } from "./idlerArm/schema";
import { props as pushrod } from "./pushrod/schema";
import { props as controlHorn } from "./controlHorn/schema";
import { props as controlSurface } from "./controlSurface/schema";
import { props as structureMount } from "./structureMount/schema";
import { props as travelStop } from "./travelStop/schema";
import { props as controlWheel } from "./controlWheel/schema";
import { props as cablePedal } from "./cablePedal/schema";
import { props as cableSector } from "./cableSector/schema";
import { props as cable } from "./cable/schema";
import { props as turnbuckle } from "./turnbuckle/schema";
import { props as pulley } from "./pulley/schema";
import { props as fairlead } from "./fairlead/schema";

/** Each kind's props schema; its output must be the props type its first half was declared with. */
export const KIND_SCHEMAS = {
  stick, pedal, torqueTube, bellcrank, idlerArm, pushrod, controlHorn, controlSurface, structureMount, travelStop,
  controlWheel, cablePedal, cableSector, cable, turnbuckle, pulley, fairlead,
} satisfies { [K in NodeKind]: z.ZodType<PropsOf<K>> & z.ZodObject };

export type KindSchemas = typeof KIND_SCHEMAS;
