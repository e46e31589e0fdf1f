/**
 * The linkage format, version 1: one control run as a graph of parts (nodes) and joints (edges).
 * US customary units throughout: lengths in inches, forces in lbf, torque in in·lbf, angles in degrees.
 * The same document is stored with every revision and is the import/export file of a linkage.
 * See README.md beside this file for the fields and an example.
 */
import { z } from "zod";
import { inches, force, systemSchema } from "./fields";
import { NODE_KINDS, PORTS, roleOf, type NodeKind } from "./kinds";
import { KIND_SCHEMAS, type KindSchemas } from "./kinds/schemas";
import { geometrySchema } from "./geometry";
import { jointExtraFields, nutExtraFields, rodEndExtraFields } from "./joint-extras";
import { FORMAT_VERSION, GRAPH_LIMITS } from "./format";

export { FORMAT_VERSION, GRAPH_LIMITS, defaultHardware, emptyGraph, serializeLinkage } from "./format";

const id = z.string().min(1, "id is empty").max(64, "id is longer than 64 characters");

export { SYSTEMS, systemSchema, TUBE_MATERIALS, tubeMaterialSchema, type ControlSystem } from "./fields";
export { PLATE_MATERIALS, BUSHING_MATERIALS, ROD_END_BODIES, CLEVIS_RETENTION, type Member } from "./joint-extras";
export { NODE_KINDS, PORTS, KINDS, type NodeKind, type PropsOf } from "./kinds";

const position = z.object({ x: z.number().finite(), y: z.number().finite() });
const label = z.string().max(80, "label is longer than 80 characters").default("");

/**
 * The node schema of one kind: the common fields and that kind's props (shared/linkage/kinds/<kind>/schema.ts).
 * `unentered`: the props still at the starting values the editor placed the part with — the builder has not
 * entered them. The check takes nothing from them: a margin that would depend on one reads "not checked" and
 * names it. Absent (as in files and revisions made before it existed), every value counts as entered.
 */
const node = <K extends string, P extends z.ZodObject>(kind: K, props: P) => {
  const keys = Object.keys(props.shape) as [string, ...string[]];
  return z.object({
    id, kind: z.literal(kind), label, position, props,
    unentered: z.array(z.enum(keys, { error: `unentered names a value a ${kind} does not have` })).max(keys.length, "unentered repeats a value").optional(),
  });
};
type AnyNodeSchema = { [K in NodeKind]: ReturnType<typeof node<K, KindSchemas[K]>> }[NodeKind];

export const nodeSchema = z.discriminatedUnion(
  "kind",
  NODE_KINDS.map((k) => node(k, KIND_SCHEMAS[k] as z.ZodObject)) as unknown as [AnyNodeSchema, ...AnyNodeSchema[]],
);
export type LinkageNode = z.infer<typeof nodeSchema>;

export const THREADS = ["10-32", "1/4-28", "5/16-24", "3/8-24", "7/16-20", "1/2-20"] as const;
export const threadSchema = z.enum(THREADS);
export const AN_BOLTS = ["AN3", "AN4", "AN5", "AN6", "AN7", "AN8"] as const;

export const rodEndSchema = z.object({
  shank: z.enum(["male", "female"]).default("male"),
  thread: threadSchema,
  /** No default: a jam nut is bought by the rod end's hand, so an unrecorded hand is asked for, never taken as RH. */
  hand: z.enum(["RH", "LH"]).optional(),
  ballBore: inches("ball bore"),
  ballDiameter: inches("ball diameter").optional(),
  /** Bore of the housing (eye) the ball sits in; a retaining washer must be larger. */
  housingBore: inches("housing bore").optional(),
  /** Rated ultimate radial static load, lbf. */
  ratedUltimate: force("rated ultimate radial load").optional(),
  /** Rated misalignment, ± degrees. */
  ratedMisalignment: z.number().min(0).max(45).optional(),
  /** Length of the threaded shank (male) or of the internal thread (female), in: sets the rigging range. */
  threadLength: inches("thread length").optional(),
  hasWitnessHole: z.boolean().default(true),
  partNumber: z.string().max(60).optional(),
  ...rodEndExtraFields,
});

export const boltSchema = z.object({
  size: z.enum([...AN_BOLTS, "custom"]),
  /** Shank diameter, in; filled from the AN size when not custom. */
  diameter: inches("bolt diameter").optional(),
  /**
   * No default. Unentered, an AN size is taken as steel — the AN bolt without a "DD" in its part number is alloy
   * steel (from memory) — and a custom bolt's shear and bending are not checked.
   */
  material: z.enum(["steel", "aluminium"]).optional(),
  /** Grip length (unthreaded shank), in. */
  grip: inches("grip").optional(),
  /** Thickness of everything clamped between head and nut, in. */
  stack: inches("stack").optional(),
  /** Whole threads showing past the nut. */
  threadsProtruding: z.number().min(0).max(50).optional(),
});

export const NUT_TYPES = ["selfLockingMetal", "selfLockingInsert", "castellatedCotter", "plainSafetyWire", "plain", "none"] as const;
export const nutSchema = z.object({
  type: z.enum(NUT_TYPES),
  /** Tension or shear (thin) nut, for the torque table: no default — unentered, the torque is not judged against a range. */
  pattern: z.enum(["tension", "shear"]).optional(),
  cotterPinNew: z.boolean().optional(),
  ...nutExtraFields,
});

const washer = z.object({ outsideDiameter: inches("washer outside diameter"), thickness: inches("washer thickness").optional() });

export const hardwareSchema = z.object({
  /** Rod-end bearing at this joint (the end of a pushrod), if any. */
  rodEnd: rodEndSchema.optional(),
  jamNut: z.object({ fitted: z.boolean().default(false), tightened: z.boolean().default(false) }).optional(),
  engagement: z
    .object({ witnessHoleVerified: z.boolean().default(false), engagedLength: inches("engaged length").optional() })
    .optional(),
  bolt: boltSchema.optional(),
  nut: nutSchema.optional(),
  washerUnderHead: washer.optional(),
  washerUnderNut: washer.optional(),
  /** A split or tooth lock washer in the stack (not used in a control run: shared/analysis/retention.ts). */
  lockWasher: z.boolean().optional(),
  /** Bolt clamped tight on the inner race, or set loose so it can turn: no default — unentered at a rod end, the check says so. */
  fit: z.enum(["clamped", "freeToRotate"]).optional(),
  /** One shear plane or two: no default — unentered, the fastener's shear reads "not checked". */
  shear: z.enum(["single", "double"]).optional(),
  /** For pivots: what the part turns on. */
  bearing: z.enum(["rodEnd", "ballBearing", "plainBushing", "clevisPin", "none"]).optional(),
  /** Applied torque, in·lbf, including the nut's drag torque. */
  torque: z.number().min(0).max(10_000).optional(),
  torqueStripe: z.boolean().default(false),
  /** Ids of uploaded photos that show this joint. */
  photos: z.array(z.string().max(64)).max(50).default([]),
  note: z.string().max(2000).default(""),
  ...jointExtraFields,
});
export type JointHardware = z.infer<typeof hardwareSchema>;

const endpoint = z.object({ node: id, port: z.string().min(1).max(32) });
export const jointSchema = z.object({ id, from: endpoint, to: endpoint, hardware: hardwareSchema.default({} as never) });
export type Joint = z.infer<typeof jointSchema>;

export const graphSchema = z
  .object({
    formatVersion: z.literal(FORMAT_VERSION, { error: "formatVersion must be 1" }),
    name: z.string().max(120).default(""),
    system: systemSchema.default("other"),
    nodes: z.array(nodeSchema).max(GRAPH_LIMITS.parts, `a linkage holds at most ${GRAPH_LIMITS.parts.toLocaleString("en-US")} parts`),
    joints: z.array(jointSchema).max(GRAPH_LIMITS.joints, `a linkage holds at most ${GRAPH_LIMITS.joints.toLocaleString("en-US")} joints`),
    /** Optional: pivots to scale and arm angles (geometry.ts); without it motion is not checked. */
    geometry: geometrySchema.optional(),
  })
  .superRefine((g, ctx) => {
    const inputs = g.nodes.reduce((k, n) => (roleOf(n.kind) === "input" ? k + 1 : k), 0);
    if (inputs > GRAPH_LIMITS.inputs)
      ctx.addIssue({ code: "custom", path: ["nodes"], message: `a linkage has at most ${GRAPH_LIMITS.inputs} sticks, pedals and wheels (this one has ${inputs}); draw separate runs as separate linkages` });
    const ids = new Map<string, LinkageNode>();
    g.nodes.forEach((n, i) => {
      if (ids.has(n.id)) ctx.addIssue({ code: "custom", path: ["nodes", i, "id"], message: `duplicate node id "${n.id}"` });
      ids.set(n.id, n);
    });
    const jointIds = new Set<string>();
    g.joints.forEach((j, i) => {
      if (jointIds.has(j.id)) ctx.addIssue({ code: "custom", path: ["joints", i, "id"], message: `duplicate joint id "${j.id}"` });
      jointIds.add(j.id);
      for (const end of ["from", "to"] as const) {
        const n = ids.get(j[end].node);
        if (!n) ctx.addIssue({ code: "custom", path: ["joints", i, end, "node"], message: `joint ${j.id} refers to missing node "${j[end].node}"` });
        else if (!PORTS[n.kind].includes(j[end].port))
          ctx.addIssue({ code: "custom", path: ["joints", i, end, "port"], message: `a ${n.kind} has no port "${j[end].port}" (ports: ${PORTS[n.kind].join(", ")})` });
      }
      if (j.from.node === j.to.node) ctx.addIssue({ code: "custom", path: ["joints", i], message: `joint ${j.id} joins a part to itself` });
    });
    if (g.geometry)
      for (const [nodeId, pg] of Object.entries(g.geometry.parts)) {
        const n = ids.get(nodeId);
        if (!n) ctx.addIssue({ code: "custom", path: ["geometry", "parts", nodeId], message: `geometry for missing node "${nodeId}"` });
        else
          for (const port of [...Object.keys(pg.arms), ...Object.keys(pg.offsets)])
            if (port !== "grip" && !PORTS[n.kind].includes(port))
              ctx.addIssue({ code: "custom", path: ["geometry", "parts", nodeId], message: `a ${n.kind} has no port "${port}" for an arm (ports: ${PORTS[n.kind].join(", ")})` });
      }
  });

export type LinkageGraph = z.infer<typeof graphSchema>;
/** The shape before defaults are applied (what a file on disk may omit). */
export type LinkageGraphInput = z.input<typeof graphSchema>;
