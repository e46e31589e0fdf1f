/**
 * Brings DATABASE_URL (else the local app database) to the latest migration, then seeds the demo with --seed.
 * All pending migrations run in one transaction (Knex does this on PostgreSQL when none opts out), so a
 * migration that fails leaves the schema and the data as they were; this says which one failed and exits 1.
 *   node --import tsx scripts/migrate.ts [--seed]
 * LW_MIGRATIONS_DIR points at another migrations folder (the tests use one with a migration that fails on purpose).
 */
import knex from "knex";
import config from "../knexfile";

const seed = process.argv.includes("--seed");
const k = knex({ ...config, pool: { min: 0, max: 2 } });
let current: string | null = null;

async function main() {
  const [done, pending] = (await k.migrate.list()) as [unknown[], { file: string }[]];
  if (pending.length === 0) console.log(`Schema up to date (${done.length} migrations).`);
  else {
    console.log(`${pending.length} migration${pending.length === 1 ? "" : "s"} to run: ${pending.map((m) => m.file).join(", ")}`);
    try {
      await k.migrate.latest({ beforeEach: async (_trx: unknown, [m]: { file: string }[]) => void (current = m.file) } as never);
    } catch (e) {
      const msg = e instanceof Error ? e.message : String(e);
      console.error(`\n✗ Migration ${current ?? "(before the first one)"} failed: ${msg}`);
      console.error(
        pending.length > 1
          ? `  None of the ${pending.length} pending migrations was kept: they ran in one transaction, rolled back. The schema and data are as they were.`
          : "  It ran in a transaction, rolled back: the schema and data are as they were.",
      );
      console.error("  Fix that migration (or update to a version where it is fixed) and start again.");
      process.exitCode = 1;
      return;
    }
    console.log(`Migrated: ${pending.map((m) => m.file).join(", ")}`);
  }
  if (seed) {
    await k.seed.run();
    console.log("Demo seeded.");
  }
}

main()
  .catch((e) => {
    console.error(`✗ ${e instanceof Error ? e.message : e}`);
    process.exitCode = 1;
  })
  .finally(() => k.destroy());
