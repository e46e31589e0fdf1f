/**
 * The invented demo scenario: build "Larkspur LX-2", owner Dana Ortiz, reviewer Sam Okafor, viewer
 * Lee Park, with a pitch linkage that has one deliberately wrong joint. Idempotent: run it any number of times.
 */
import type { Knex } from "knex";
import bcrypt from "bcryptjs";
import { DEMO_BUILD, DEMO_USERS } from "../demo-accounts";
import { demoPitchLinkage } from "../../shared/demo";
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
    await trx("audit_events").insert({ build_id: build.id, user_id: owner, action: "demo.seed", detail: JSON.stringify({}) });
  });
}
