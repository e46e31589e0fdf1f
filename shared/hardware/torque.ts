/**
 * Nut torque, AC 43.13-1B table 7-1 (fine threads), in·lbf, to which the nut's drag torque is added.
 * Rows 10-32 to 3/8-24 are in domain.md [published]; 7/16-20 and 1/2-20 and the maximum-allowable column
 * (`ceiling`), first recalled, agree figure for figure with the table as TM 9-6150-228-13&P (table H-1) reproduces it.
 */
import type { SourceTag } from "../analysis/types";
import { SRC } from "./sources";
import type { ThreadName } from "./threads";

export type TorqueRange = { min: number; max: number };
/** `ceiling`: the table's maximum allowable tightening torque, tension and shear nut (checked against TM 9-6150-228-13&P table H-1). */
export type TorqueRow = { thread: ThreadName; tension: TorqueRange; shear: TorqueRange; ceiling: { tension: number; shear: number }; source: SourceTag };

export const TORQUE_TABLE: readonly TorqueRow[] = [
  { thread: "10-32", tension: { min: 20, max: 25 }, shear: { min: 12, max: 15 }, ceiling: { tension: 40, shear: 25 }, source: SRC.torqueTable },
  { thread: "1/4-28", tension: { min: 50, max: 70 }, shear: { min: 30, max: 40 }, ceiling: { tension: 100, shear: 60 }, source: SRC.torqueTable },
  { thread: "5/16-24", tension: { min: 100, max: 140 }, shear: { min: 60, max: 85 }, ceiling: { tension: 225, shear: 140 }, source: SRC.torqueTable },
  { thread: "3/8-24", tension: { min: 160, max: 190 }, shear: { min: 95, max: 110 }, ceiling: { tension: 390, shear: 240 }, source: SRC.torqueTable },
  { thread: "7/16-20", tension: { min: 450, max: 500 }, shear: { min: 270, max: 300 }, ceiling: { tension: 840, shear: 500 }, source: SRC.torqueTableReproduced },
  { thread: "1/2-20", tension: { min: 480, max: 690 }, shear: { min: 290, max: 410 }, ceiling: { tension: 1100, shear: 660 }, source: SRC.torqueTableReproduced },
];

export const TORQUE_BY_THREAD: Readonly<Partial<Record<ThreadName, TorqueRow>>> = Object.fromEntries(
  TORQUE_TABLE.map((r) => [r.thread, r]),
);

export function torqueRange(thread: ThreadName, pattern: "tension" | "shear"): (TorqueRange & { source: SourceTag }) | null {
  const row = TORQUE_BY_THREAD[thread];
  return row ? { ...row[pattern], source: row.source } : null;
}
