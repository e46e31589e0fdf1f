/**
 * The invented demo scenario: build "Larkspur LX-2", owner Dana Ortiz, reviewer Sam Okafor, viewer
 * Lee Park, with a pitch linkage that has one deliberately wrong joint and a yaw cable run with one fault (a turnbuckle
 * with too many threads showing). Idempotent: run it any number of times.
 */
import type { Knex } from "knex";
import bcrypt from "bcryptjs";
import { DEMO_BUILD, DEMO_USERS } from "../demo-accounts";
import { demoPitchLinkage } from "../../shared/demo";
import { demoRudderLinkage } from "../../shared/demo-rudder";
import { analyze } from "../../shared/analysis";

export async function seed(knex: Knex): Promise<void> {
  const ids: Record<string, string> = {};
  for (const u of DEMO_USERS) {
    const found = await knex("users").whereRaw("lower(email) = lower(?)", [u.email]).first("id");
    if (found) ids[u.email] = found.id;
    else {
      const [row] = await knex("users")
        .insert({ email: u.email, name: u.name, password_hash: await bcrypt.hash(u.password, 10), is_site_admin: u.isSiteAdmin })
        .returning("id");
      ids[u.email] = row.id;
    }
  }
  const owner = ids[DEMO_USERS[0].email];
  const existing = await knex("builds as b")
    .join("memberships as m", "m.build_id", "b.id")
    .where({ "b.name": DEMO_BUILD.name, "m.user_id": owner, "m.role": "owner" })
    .first("b.id");
  if (existing) return;

  await knex.transaction(async (trx) => {
    const [build] = await trx("builds").insert({ ...DEMO_BUILD, created_by: owner }).returning("id");
    for (const u of DEMO_USERS) if (u.role) await trx("memberships").insert({ build_id: build.id, user_id: ids[u.email], role: u.role });
    const graph = demoPitchLinkage();
    const [linkage] = await trx("linkages")
      .insert({ build_id: build.id, name: graph.name || "Pitch — stick to elevator", system: "pitch", current_revision: 1 })
      .returning("id");
    await trx("linkage_revisions").insert({
      linkage_id: linkage.id,
      revision: 1,
      graph: JSON.stringify(graph),
      analysis: JSON.stringify(analyze(graph)),
      author_id: owner,
    });
    const rudder = demoRudderLinkage();
    const [yaw] = await trx("linkages").insert({ build_id: build.id, name: rudder.name, system: "yaw", current_revision: 1 }).returning("id");
    await trx("linkage_revisions").insert({ linkage_id: yaw.id, revision: 1, graph: JSON.stringify(rudder), analysis: JSON.stringify(analyze(rudder)), author_id: owner });
    // A few log entries and a small build parts library, so the records pages are not empty on first look.
    const day = (daysAgo: number) => new Date(Date.now() - daysAgo * 86_400_000).toISOString().slice(0, 10);
    await trx("log_entries").insert([
      { build_id: build.id, date: day(9), hours: 3.5, title: "Stick assembly and seat-frame pivot", text: "Reamed the pivot lugs, fitted the bushing and the AN5 pivot bolt with a castellated nut and a new cotter pin.", systems: ["pitch"], author_id: owner },
      { build_id: build.id, date: day(4), hours: 2.25, title: "Forward pushrod cut and rod ends fitted", text: "Cut the tube to length, tapped both ends, one right-hand and one left-hand rod end. Jam nuts snug for now.", systems: ["pitch"], author_id: owner },
      { build_id: build.id, date: day(1), hours: 1.5, title: "Aft pushrod to the elevator horn", text: "First fit of the aft pushrod at the horn. Still to do: jam nut and the retaining washer under the bolt head.", systems: ["pitch"], author_id: owner, linkage_id: linkage.id, revision: 1 },
    ]);
    // Invented parts for the demo only: the numbers are not any maker's.
    const rodEnd = (partNumber: string, hand: "RH" | "LH", thread: string, ballBore: number, ratedUltimate: number) => ({
      build_id: build.id, kind: "rodEnd", part_number: partNumber, description: `Demo rod end ${thread} ${hand} (invented rating)`,
      spec: JSON.stringify({ thread, hand, shank: "male", ballBore, ballDiameter: ballBore * 2, housingBore: ballBore * 2, ratedUltimate, ratedMisalignment: 10, hasWitnessHole: true }),
    });
    await trx("parts").insert([
      rodEnd("LW-DEMO-RE4-RH", "RH", "1/4-28", 0.25, 3600),
      rodEnd("LW-DEMO-RE4-LH", "LH", "1/4-28", 0.25, 3600),
      rodEnd("LW-DEMO-RE4H-RH", "RH", "1/4-28", 0.25, 5200),
      rodEnd("LW-DEMO-RE5-RH", "RH", "5/16-24", 0.3125, 6100),
    ]);
    await trx("audit_events").insert({ build_id: build.id, user_id: owner, action: "demo.seed", detail: JSON.stringify({}) });
  });
}
