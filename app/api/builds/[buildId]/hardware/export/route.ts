import Papa from "papaparse";
import { withBuild } from "@/lib/http";
import { buildHardware } from "@/db/hardware";
import { csvResponse, slug } from "@/lib/records-http";
import { HARDWARE_STATE_LABEL } from "@/shared/records/hardware";

export const GET = withBuild("read", async ({ build }) => {
  const lines = await buildHardware(build.id);
  const csv = Papa.unparse({
    fields: ["kind", "description", "partNumber", "quantity", "state", "usedIn"],
    data: lines.map((l) => [l.kind, l.description, l.partNumber ?? "", l.quantity, HARDWARE_STATE_LABEL[l.state], l.usedIn.map((u) => `${u.linkageName}: ${u.where}`).join(" | ")]),
  }, { newline: "\r\n", escapeFormulae: true }); // no cell runs as a spreadsheet formula
  return csvResponse(csv + "\r\n", `${slug(build.name)}-hardware.csv`);
});
