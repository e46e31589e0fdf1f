/**
 * What the idler arm and the torque tube share: an arm in, an arm out, a pivot, and the engine's view of
 * them (a crank whose arms are taken as opposite). Each kind keeps its own name, hint, defaults and schema.
 */
export const TWO_ARM_PORTS = { in: { side: "left", name: "in" }, out: { side: "right", name: "out" }, pivot: { side: "bottom", name: "pivot" } } as const;

export const twoArmCrank = {
  role: "crank",
  arms: (p: { inputArm: number; outputArm: number }): [number, number] => [p.inputArm, p.outputArm],
  // No arm angle in the format: the arms are taken as opposite, the largest resultant (loads.ts).
  pivotLoad: (fIn: number, fOut: number) => fIn + fOut,
} as const;
