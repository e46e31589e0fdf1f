/**
 * Optional geometry of a linkage (format version 1; a file without it reads as before). One plane (side or
 * plan view), airframe coordinates in inches from a datum the builder names, x to the right and y up in the
 * view. For each part that turns about a pivot (stick, pedal, crank, control horn — a horn turns about its
 * surface's hinge line): the pivot position and the angle of each arm at neutral, degrees counter-clockwise
 * from +x, keyed by the port the arm carries (`attach`, `in`, `out`; a stick or pedal may add `grip`), and
 * an optional out-of-plane offset of each attach point (inches, + toward the viewer). A pushrod's length
 * follows from its two attach points. `designTravel` is the surface travel the designer gives, with its
 * tolerance; `inputForward` and `surfaceUp` say which way of turning, in the view, is forward and up.
 * `pitchSurface` says whether a pitch run's surface is a tail behind the wing or a canard ahead of it (which way
 * its trailing edge must go when the stick goes forward); not recorded, a tail is taken and the report says so.
 * On a roll run `inputForward` is the way the input turns when the stick goes right (the wheel turns right) and
 * `rollSide` the wing whose aileron the run drives; on a yaw run `inputForward` is the way the input turns when
 * the `yawPedal` pedal is pushed forward, and `surfaceUp` the way the rudder turns when its trailing edge goes
 * right. Without `rollSide` or `yawPedal` the run's control sense is not read, and the report says what to enter.
 */
import { z } from "zod";

const coord = (what: string) =>
  z.number({ error: `${what} must be a number (in)` }).finite().min(-10_000, `${what} below −10,000 in`).max(10_000, `${what} above 10,000 in`);
const angle = z.number({ error: "an arm angle must be a number (°)" }).min(-360, "arm angle below −360°").max(360, "arm angle above 360°");
const offset = z.number({ error: "an offset must be a number (in)" }).min(-100, "offset below −100 in").max(100, "offset above 100 in");
const portKey = z.string().min(1).max(32);
const rotation = z.enum(["ccw", "cw"]);

export const GEOMETRY_PORTS = ["attach", "in", "out", "grip"] as const;

export const partGeometrySchema = z.object({
  pivot: z.object({ x: coord("pivot x"), y: coord("pivot y") }),
  /** Arm angle at neutral by port, ° counter-clockwise from +x. */
  arms: z.partialRecord(z.enum(GEOMETRY_PORTS), angle).default({}),
  /** Out-of-plane offset of the attach point on each port, in (+ toward the viewer). */
  offsets: z.partialRecord(z.enum(GEOMETRY_PORTS), offset).default({}),
});
export type PartGeometry = z.infer<typeof partGeometrySchema>;

export const designTravelSchema = z.object({
  up: z.number().min(0, "up travel below 0°").max(90, "up travel above 90°"),
  down: z.number().min(0, "down travel below 0°").max(90, "down travel above 90°"),
  tolerance: z.number().min(0, "tolerance below 0°").max(10, "tolerance above 10°").default(1),
});

export const geometrySchema = z
  .object({
    plane: z.enum(["side", "plan"]).default("side"),
    /** What the coordinates are measured from, e.g. "firewall face, top longeron". */
    datum: z.string().max(80, "datum is longer than 80 characters").default(""),
    /** Per node id: pivot and arm angles at neutral. */
    parts: z.record(z.string().min(1).max(64), partGeometrySchema).default({}),
    /** Which way the input turns, in the view, when it moves forward (stick) or is pushed (pedal). */
    inputForward: rotation.default("ccw"),
    /** Which way the surface turns, in the view, when it deflects up (or right). */
    surfaceUp: rotation.default("ccw"),
    designTravel: designTravelSchema.optional(),
    /** A pitch run's surface: a tail behind the wing (stick forward, trailing edge down) or a canard ahead of it (up). */
    pitchSurface: z.enum(["tail", "canard"]).optional(),
    /** A roll run's aileron: on the right wing (stick right, trailing edge up) or the left (down). */
    rollSide: z.enum(["left", "right"]).optional(),
    /** A yaw run: the pedal whose push forward is the input's forward turn (its side is the way the rudder's trailing edge must go). */
    yawPedal: z.enum(["left", "right"]).optional(),
  })
  .superRefine((g, ctx) => {
    const n = Object.keys(g.parts).length;
    if (n > 10_000) ctx.addIssue({ code: "custom", path: ["parts"], message: `geometry of ${n} parts; at most 10,000` });
  });
export type LinkageGeometry = z.infer<typeof geometrySchema>;

export function emptyGeometry(): LinkageGeometry {
  return { plane: "side", datum: "", parts: {}, inputForward: "ccw", surfaceUp: "ccw" };
}
