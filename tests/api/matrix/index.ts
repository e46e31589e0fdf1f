/** Every feature's rows of the authorization matrix and its malformed-input cases, in one place. */
import { rows as foundation } from "./foundation";
import { rows as review, badInput as reviewBadInput } from "./review";
import { rows as records, badInput as recordsBadInput } from "./records";
import type { BadInput, Row } from "./types";

export const MATRIX: Record<string, Row> = { ...foundation, ...review, ...records };
export const BAD_INPUT: BadInput = { ...reviewBadInput, ...recordsBadInput };
