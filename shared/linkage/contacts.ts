/**
 * The joints of a cable run where nothing is bolted, one definition for the check (which asks no bolt of them,
 * shared/analysis/joints/checks.ts) and the editor (which says "nothing to check here", editor/joints/coverage.ts):
 *   passThrough  anything on a guide's cable port: a cable over a pulley's groove or through a fairlead;
 *   screwedEnds  a cable's swaged terminal screwed into a turnbuckle's barrel.
 * Every other joint is held by a bolt or a pin — a cable's or turnbuckle's fork or eye on a horn, crank, pedal
 * or another fitting, two cables or two turnbuckles end to end (joined by a shackle or a pin), a part on a
 * pulley's pivot — and is asked for it.
 */
import { roleOf } from "./kinds";

export type BoltlessContact = "passThrough" | "screwedEnds";
type End = { kind: string; port: string };

/** The guide's side of a pass-through, or null. */
export function guideEnd<E extends End>(a: E, b: E): E | null {
  if (roleOf(a.kind) === "guide" && a.port === "cable") return a;
  if (roleOf(b.kind) === "guide" && b.port === "cable") return b;
  return null;
}

/** What kind of boltless joint two parts' ends make, or null when a bolt or pin holds them. */
export function boltlessContact(a: End, b: End): BoltlessContact | null {
  if (guideEnd(a, b)) return "passThrough";
  if ((a.kind === "cable" && b.kind === "turnbuckle") || (a.kind === "turnbuckle" && b.kind === "cable")) return "screwedEnds";
  return null;
}
