/** Field builders every part kind and the joint hardware share: lengths in inches, angles in degrees, forces in lbf. */
import { z } from "zod";
import { SYSTEMS, TUBE_MATERIALS } from "./format";

export { SYSTEMS, TUBE_MATERIALS, type ControlSystem } from "./format";

export const inches = (what: string) =>
  z.number({ error: `${what} must be a number (in)` }).positive(`${what} must be greater than 0 in`).max(1000, `${what} over 1000 in is not a control part`);
export const degrees = (what: string) =>
  z.number({ error: `${what} must be a number (°)` }).min(-360, `${what} below −360°`).max(360, `${what} above 360°`);
export const force = (what: string) =>
  z.number({ error: `${what} must be a number (lbf)` }).positive(`${what} must be greater than 0 lbf`).max(1_000_000, `${what} is out of range`);

export const systemSchema = z.enum(SYSTEMS);
export const tubeMaterialSchema = z.enum(TUBE_MATERIALS);
/** A temperature in °F (cable rigging tension is measured at one). */
export const fahrenheit = (what: string) =>
  z.number({ error: `${what} must be a number (°F)` }).min(-100, `${what} below −100 °F`).max(200, `${what} above 200 °F`);
/** A whole count of threads. */
export const threadCount = (what: string) =>
  z.number({ error: `${what} must be a number` }).int(`${what} is a whole number of threads`).min(0, `${what} cannot be negative`).max(50, `${what} over 50`);
