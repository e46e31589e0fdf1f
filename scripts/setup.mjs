// The set-up shared by `npm start` and `npm test`: packages, PostgreSQL, migrations, seed, secret.
// Plain Node (no packages): it runs before anything is installed.
import { spawnSync } from "node:child_process";
import { createHash, randomBytes } from "node:crypto";
import { existsSync, mkdirSync, readFileSync, rmSync, writeFileSync } from "node:fs";
import path from "node:path";
import { fileURLToPath } from "node:url";

import local from "../db/local-cluster.cjs";

export const ROOT = path.resolve(path.dirname(fileURLToPath(import.meta.url)), "..");
export const PG_PORT = local.APP_PG_PORT;
export const TEST_PG_PORT = local.TEST_PG_PORT;
/** A database on the local app cluster, or on the test cluster with cluster = "test". */
export const dbUrl = (db, cluster = "app") => local.localDbUrl(db, cluster);

export function step(title) {
  process.stdout.write(`\n▸ ${title}\n`);
}

export function run(cmd, args, opts = {}) {
  const r = spawnSync(cmd, args, { cwd: ROOT, stdio: "inherit", ...opts, env: { ...process.env, NEXT_TELEMETRY_DISABLED: "1", ...(opts.env || {}) } });
  if (r.status !== 0) {
    console.error(`\n✗ ${cmd} ${args.join(" ")} failed (exit ${r.status ?? r.signal})`);
    process.exit(r.status || 1);
  }
  return r;
}

const tsx = (script, args = [], env = {}) => run(process.execPath, ["--import", "tsx", script, ...args], { env });

/** npm ci when node_modules is missing or older than package-lock.json. */
export function ensurePackages() {
  const lock = readFileSync(path.join(ROOT, "package-lock.json"));
  const hash = createHash("sha256").update(lock).digest("hex");
  const stamp = path.join(ROOT, "node_modules", ".linkwright-lock-hash");
  if (existsSync(stamp) && readFileSync(stamp, "utf8") === hash) return;
  step("Installing packages (npm ci)");
  run("npm", ["ci", "--no-audit", "--no-fund"], { env: { PLAYWRIGHT_SKIP_BROWSER_DOWNLOAD: "1" } });
  rmSync(stamp, { force: true }); // a new file, not a write through a hard link another checkout's node_modules may share
  writeFileSync(stamp, hash);
}

export function ensureDebianPackage(binary, pkg) {
  if (existsSync(binary)) return;
  step(`Installing Debian's ${pkg}`);
  const sudo = process.getuid?.() === 0 ? [] : ["sudo"];
  const apt = (args) => run(sudo[0] || "apt-get", sudo.length ? ["apt-get", ...args] : args, { env: { DEBIAN_FRONTEND: "noninteractive" } });
  apt(["update"]);
  apt(["install", "-y", "--no-install-recommends", pkg]);
}

/** The app cluster (durable) or, with "test", the test cluster (fsync off, for `npm test` only). */
export function startPostgres(cluster = "app") {
  const port = cluster === "test" ? TEST_PG_PORT : PG_PORT;
  step(`Starting PostgreSQL (${cluster} cluster) on 127.0.0.1:${port}`);
  tsx("db/pg.ts", cluster === "test" ? ["up", "test"] : ["up"]);
}

/** Migrates one database (a failed migration is rolled back, named, and stops the caller), then seeds the demo. */
export function migrate(url, { seed = true, label = "the database" } = {}) {
  step(`Migrating ${label}${seed ? " and seeding the demo" : ""}`);
  tsx("scripts/migrate.ts", seed ? ["--seed"] : [], { DATABASE_URL: url });
}

/** A per-checkout secret for next-auth, kept in the git-ignored .data folder. */
export function authSecret() {
  if (process.env.NEXTAUTH_SECRET) return process.env.NEXTAUTH_SECRET;
  const file = path.join(ROOT, ".data", "nextauth-secret");
  if (!existsSync(file)) {
    mkdirSync(path.dirname(file), { recursive: true });
    writeFileSync(file, randomBytes(32).toString("base64url"), { mode: 0o600 });
  }
  return readFileSync(file, "utf8").trim();
}
