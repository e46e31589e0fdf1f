import "server-only";
import { db } from "./index";
import { getRevision } from "./linkages";
import { hardwareList, type HardwareState } from "@/shared/records/hardware";

export async function buildHardware(buildId: string) {
  const linkages = await db("linkages").where({ build_id: buildId }).select("id", "name").orderBy("name");
  const withGraphs = [];
  for (const l of linkages) {
    const rev = await getRevision(l.id);
    if (rev) withGraphs.push({ id: l.id as string, name: l.name as string, graph: rev.graph });
  }
  const lines = hardwareList(withGraphs);
  const states = await db("hardware_states as h").leftJoin("users as u", "u.id", "h.updated_by").where("h.build_id", buildId).select("h.part_key", "h.state", "h.updated_at", "u.name");
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

export async function setHardwareState(buildId: string, key: string, state: HardwareState, userId: string) {
  await db("hardware_states")
    .insert({ build_id: buildId, part_key: key, state, updated_by: userId })
    .onConflict(["build_id", "part_key"])
    .merge({ state, updated_by: userId, updated_at: db.fn.now() });
}
