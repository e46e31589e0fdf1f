/** The hardware list as a CSV export (lib/jobs/kinds.ts, the archive): every line with every place, then the caution. */
import Papa from "papaparse";
import { CAUTION_CSV_ROWS } from "../caution";
import { HARDWARE_STATE_LABEL, type HardwareLine, type HardwareState } from "./hardware";

export function hardwareToCsv(lines: readonly (Pick<HardwareLine, "kind" | "description" | "partNumber" | "quantity" | "usedIn"> & { state: HardwareState })[]): string {
  const csv = Papa.unparse({
    fields: ["kind", "description", "partNumber", "quantity", "state", "usedIn"],
    data: lines.map((l) => [l.kind, l.description, l.partNumber ?? "", l.quantity, HARDWARE_STATE_LABEL[l.state], l.usedIn.map((u) => `${u.linkageName}: ${u.where}`).join(" | ")]),
  }, { newline: "\r\n", escapeFormulae: true }); // no cell runs as a spreadsheet formula
  return csv + "\r\n" + CAUTION_CSV_ROWS;
}
