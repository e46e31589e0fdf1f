/** Unified fine threads (domain.md §3). [published: ASME B1.1 / handbook tables] */
import type { SourceTag } from "../analysis/types";
import { SRC } from "./sources";

export type ThreadName = "10-32" | "1/4-28" | "5/16-24" | "3/8-24" | "7/16-20" | "1/2-20";

export type ThreadRow = {
  thread: ThreadName;
  /** Basic major diameter, in. */
  majorDiameter: number;
  /** Threads per inch. */
  tpi: number;
  /** Tensile stress area as tabulated, in². */
  tensileStressArea: number;
  source: SourceTag;
};

/** A_t = 0.7854 (D − 0.9743/n)², in² (ASME B1.1). */
export function tensileStressArea(majorDiameter: number, tpi: number): number {
  const d = majorDiameter - 0.9743 / tpi;
  return 0.7854 * d * d;
}

export const THREAD_TABLE: readonly ThreadRow[] = [
  { thread: "10-32", majorDiameter: 0.19, tpi: 32, tensileStressArea: 0.02, source: SRC.threads },
  { thread: "1/4-28", majorDiameter: 0.25, tpi: 28, tensileStressArea: 0.0364, source: SRC.threads },
  { thread: "5/16-24", majorDiameter: 0.3125, tpi: 24, tensileStressArea: 0.058, source: SRC.threads },
  { thread: "3/8-24", majorDiameter: 0.375, tpi: 24, tensileStressArea: 0.0878, source: SRC.threads },
  { thread: "7/16-20", majorDiameter: 0.4375, tpi: 20, tensileStressArea: 0.1187, source: SRC.threads },
  { thread: "1/2-20", majorDiameter: 0.5, tpi: 20, tensileStressArea: 0.1599, source: SRC.threads },
];

export const THREADS_BY_NAME: Readonly<Record<ThreadName, ThreadRow>> = Object.fromEntries(
  THREAD_TABLE.map((r) => [r.thread, r]),
) as Record<ThreadName, ThreadRow>;
