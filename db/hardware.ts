import "server-only";
import { db } from "./index";
import { audit } from "./audit";
import type { LinkageGraph } from "@/shared/linkage/schema";
import { hardwareList, type HardwareState } from "@/shared/records/hardware";

export async function buildHardware(buildId: string) {
  // Every linkage's current graph in one query (not one per linkage), and the states beside it.
  const [withGraphs, states] = await Promise.all([
    db("linkages as l").join("linkage_revisions as r", function () { this.on("r.linkage_id", "l.id").andOn("r.revision", "l.current_revision"); })
      .where("l.build_id", buildId).orderBy("l.name").select("l.id", "l.name", "r.graph") as Promise<{ id: string; name: string; graph: LinkageGraph }[]>,
    db("hardware_states as h").leftJoin("users as u", "u.id", "h.updated_by").where("h.build_id", buildId).select("h.part_key", "h.state", "h.updated_at", "u.name"),
  ]);
  const lines = hardwareList(withGraphs);
  const byKey = new Map(states.map((s: { part_key: string; state: HardwareState; updated_at: Date; name: string | null }) => [s.part_key, s]));
  return lines.map((l) => {
    const s = byKey.get(l.key);
    return { ...l, usedInCount: l.usedIn.length, state: (s?.state ?? "to_order") as HardwareState, stateBy: s?.name ?? null, stateAt: s ? s.updated_at.toISOString() : null };
  });
}

/**
 * The list as the page shows it: each line names its first `shown` places and counts the rest (a part used at
 * hundreds of joints would otherwise make the first screen hundreds of kilobytes); `line` gives one line whole.
 */
export function listedHardware<L extends { usedIn: unknown[] }>(lines: L[], shown: number): L[] {
  return lines.map((l) => (l.usedIn.length > shown ? { ...l, usedIn: l.usedIn.slice(0, shown) } : l));
}

/** Sets one line's state and records it in the audit log, in one transaction. */
export async function setHardwareState(buildId: string, key: string, state: HardwareState, userId: string) {
  await db.transaction(async (trx) => {
    await trx("hardware_states")
      .insert({ build_id: buildId, part_key: key, state, updated_by: userId })
      .onConflict(["build_id", "part_key"])
      .merge({ state, updated_by: userId, updated_at: trx.fn.now() });
    await audit({ buildId, userId, action: "hardware.state", detail: { key, state } }, trx);
  });
}
