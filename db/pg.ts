/**
 * The project's own PostgreSQL clusters: finds (or installs) Debian's binaries, inits a cluster in a
 * git-ignored folder, starts it on 127.0.0.1 and creates the role and databases. Idempotent.
 *   node --import tsx db/pg.ts up [test] | stop [test] | status | url [test]
 * Two clusters (db/local-cluster.cjs): "app" (LW_PG_PORT) holds a person's records and runs with
 * PostgreSQL's durable defaults; "test" (LW_TEST_PG_PORT) is only for `npm test` and trades
 * durability for speed. Both are closed: over TCP only the app role, with its password
 * (scram-sha-256); the superuser only over the Unix socket, inside the 0700 data folder, for the OS
 * account that runs the server (`postgres` when we are root). A cluster made before this (trust
 * everywhere, fsync off on the command line) is brought to this state in place on the next `up`.
 * No Docker. The server refuses to run as root, so as root every server command runs as `postgres`.
 */
import { execFileSync, spawnSync } from "node:child_process";
import { existsSync, mkdirSync, readdirSync, chmodSync, readFileSync, writeFileSync, appendFileSync } from "node:fs";
import { createHash } from "node:crypto";
import path from "node:path";
import os from "node:os";
import local from "./local-cluster.cjs";

export const PG_PORT = local.APP_PG_PORT;
export const TEST_PG_PORT = local.TEST_PG_PORT;
export const PG_ROLE = local.PG_ROLE;
export const APP_DB = process.env.LW_APP_DB || "linkwright";
export const TEST_DB = process.env.LW_TEST_DB || "linkwright_test";
const ROOT = path.resolve(__dirname, "..");
const isRoot = process.getuid?.() === 0;

export type Cluster = { name: string; port: number; dir: string; durable: boolean };

export const databaseUrl = (db: string, cluster: "app" | "test" = "app") => local.localDbUrl(db, cluster);

function log(msg: string) {
  process.stderr.write(`[postgres] ${msg}\n`);
}

function findBinDir(): string | null {
  const fromConfig = spawnSync("pg_config", ["--bindir"], { encoding: "utf8" });
  const candidates: string[] = [];
  if (fromConfig.status === 0) candidates.push(fromConfig.stdout.trim());
  if (existsSync("/usr/lib/postgresql")) {
    for (const v of readdirSync("/usr/lib/postgresql").sort((a, b) => Number(b) - Number(a)))
      candidates.push(`/usr/lib/postgresql/${v}/bin`);
  }
  return candidates.find((d) => existsSync(path.join(d, "initdb")) && existsSync(path.join(d, "pg_ctl"))) ?? null;
}

export function ensureBinaries(): string {
  let bin = findBinDir();
  if (bin) return bin;
  log("PostgreSQL binaries not found: installing Debian's postgresql package (apt-get)…");
  execFileSync("apt-get", ["update"], { stdio: "inherit" });
  execFileSync("apt-get", ["install", "-y", "--no-install-recommends", "postgresql"], {
    stdio: "inherit",
    env: { ...process.env, DEBIAN_FRONTEND: "noninteractive" },
  });
  bin = findBinDir();
  if (!bin) throw new Error("PostgreSQL was installed but initdb/pg_ctl are still not found");
  return bin;
}

/** The OS account the server runs as, the only one allowed in as superuser (over the socket). */
const serverAccount = () => (isRoot ? "postgres" : os.userInfo().username);

/** Run a command as the postgres user when we are root, else as ourselves (the account the server runs as). */
export function asPg(cmd: string, args: string[], opts: { allowFail?: boolean } = {}) {
  const [file, argv] = isRoot ? ["runuser", ["-u", "postgres", "--", cmd, ...args]] : [cmd, args];
  const r = spawnSync(file, argv, { encoding: "utf8" });
  if (r.status !== 0 && !opts.allowFail) {
    throw new Error(`${cmd} ${args.join(" ")} failed (${r.status}): ${r.stderr || r.stdout}`);
  }
  return r;
}

function postgresCanUse(dir: string): boolean {
  if (!isRoot) return true;
  // Every folder above the data folder must be enterable by postgres.
  return spawnSync("runuser", ["-u", "postgres", "--", "test", "-x", dir], { encoding: "utf8" }).status === 0;
}

/** The data folder: .data/pg-<port> (app) or .data/pg-test-<port> (test) when postgres can reach it, else one named after this checkout. */
export function dataDir(port: number, kind: "app" | "test" = "app"): string {
  const override = kind === "app" ? process.env.LW_PG_DATA : process.env.LW_TEST_PG_DATA;
  if (override) return override;
  const folder = kind === "app" ? `pg-${port}` : `pg-test-${port}`;
  if (postgresCanUse(ROOT)) return path.join(ROOT, ".data", folder);
  const tag = createHash("sha1").update(ROOT).digest("hex").slice(0, 8);
  const base = isRoot ? "/var/lib/postgresql" : os.tmpdir();
  return path.join(base, kind === "app" ? `linkwright-${tag}-${port}` : `linkwright-${tag}-test-${port}`); // the app's name is the one earlier versions used
}

export const appCluster = (): Cluster => ({ name: "app", port: PG_PORT, dir: dataDir(PG_PORT, "app"), durable: true });
export const testCluster = (): Cluster => ({ name: "test", port: TEST_PG_PORT, dir: dataDir(TEST_PG_PORT, "test"), durable: false });

/**
 * This cluster is up: its own socket in its data folder answers. (A server of another checkout on the same TCP
 * port does not count: asking 127.0.0.1 would take it for this one.)
 */
export function isReady(c: Cluster, bin = ensureBinaries()) {
  return spawnSync(path.join(bin, "pg_isready"), ["-h", c.dir, "-p", String(c.port)], { encoding: "utf8" }).status === 0;
}

/** SQL as the superuser, over the Unix socket in the data folder. */
export function adminSql(c: Cluster, sql: string, db = "postgres", bin = ensureBinaries()) {
  return asPg(path.join(bin, "psql"), ["-h", c.dir, "-p", String(c.port), "-U", "postgres", "-d", db, "-v", "ON_ERROR_STOP=1", "-qtAc", sql]).stdout.trim();
}

/** The settings each cluster runs with, kept in <data>/linkwright.conf (included from postgresql.conf). */
function settings(c: Cluster): Record<string, string> {
  const fast = c.durable ? "on" : "off"; // the test cluster may lose its data in a crash: it is rebuilt every run
  return {
    listen_addresses: "'127.0.0.1'",
    port: String(c.port),
    unix_socket_directories: `'${c.dir}'`,
    unix_socket_permissions: "0700",
    max_connections: "200",
    password_encryption: "'scram-sha-256'",
    fsync: fast,
    full_page_writes: fast,
    synchronous_commit: fast,
  };
}

const HBA = `# Written by db/pg.ts (edit it there). Other local accounts get nothing without the app role's password.
# TYPE  DATABASE  USER        ADDRESS       METHOD
local   all       postgres                  peer map=server
local   all       all                       scram-sha-256
host    all       ${PG_ROLE}  127.0.0.1/32  scram-sha-256
`;

/** Writes a file when its content differs; says whether it did. */
function writeIfChanged(file: string, content: string) {
  if (existsSync(file) && readFileSync(file, "utf8") === content) return false;
  writeFileSync(file, content);
  if (isRoot) execFileSync("chown", ["postgres:postgres", file]);
  return true;
}

/** Config files of the cluster; true when authentication rules changed (a reload is due). */
function writeConfig(c: Cluster) {
  const s = settings(c);
  writeIfChanged(path.join(c.dir, "linkwright.conf"), "# Written by db/pg.ts on every start (edit it there).\n" + Object.entries(s).map(([k, v]) => `${k} = ${v}`).join("\n") + "\n");
  const main = path.join(c.dir, "postgresql.conf");
  if (!readFileSync(main, "utf8").includes("include_if_exists = 'linkwright.conf'")) appendFileSync(main, "\ninclude_if_exists = 'linkwright.conf'\n");
  const hba = writeIfChanged(path.join(c.dir, "pg_hba.conf"), HBA);
  const ident = writeIfChanged(path.join(c.dir, "pg_ident.conf"), `# Written by db/pg.ts: the OS account that runs the server may sign in as postgres.\nserver  ${serverAccount()}  postgres\n`);
  return hba || ident;
}

/** Settings the running server differs on (a command-line -c from older versions counts as a difference). */
function drift(c: Cluster, bin: string) {
  const s = settings(c);
  const names = Object.keys(s).map((n) => `'${n}'`).join(",");
  const rows = adminSql(c, `select name, setting, source from pg_settings where name in (${names})`, "postgres", bin).split("\n");
  const out: string[] = [];
  for (const row of rows) {
    const [name, setting, source] = row.split("|");
    const want = s[name].replace(/^'|'$/g, "");
    const same = name === "unix_socket_permissions" ? Number(setting) === parseInt(want, 8) || setting === want : setting === want;
    if (!same || source === "command line") out.push(`${name}=${setting}${source === "command line" ? " (command line)" : ""}`);
  }
  return out;
}

function start(c: Cluster, bin: string) {
  log(`starting the ${c.name} cluster on 127.0.0.1:${c.port} (${c.durable ? "durable" : "fsync off, for tests only"})`);
  try {
    asPg(path.join(bin, "pg_ctl"), ["-D", c.dir, "-l", path.join(c.dir, "server.log"), "-w", "-t", "60", "start"]);
  } catch (e) {
    const taken = spawnSync(path.join(bin, "pg_isready"), ["-h", "127.0.0.1", "-p", String(c.port)], { encoding: "utf8" }).status === 0;
    if (taken) throw new Error(`Port ${c.port} is already used by another PostgreSQL server (another checkout?). Stop it, or give this checkout other ports: LW_PG_PORT (the test cluster takes LW_PG_PORT + 100).`);
    throw e;
  }
}

/** Starts a cluster made by up() (e.g. after a test stopped it). */
export function startCluster(c: Cluster) {
  const bin = ensureBinaries();
  if (!isReady(c, bin)) start(c, bin);
}

export function up(c: Cluster = appCluster(), databases: string[] = [c.name === "test" ? TEST_DB : APP_DB]) {
  const bin = ensureBinaries();
  const { dir } = c;
  const fresh = !existsSync(path.join(dir, "PG_VERSION"));
  if (fresh) {
    mkdirSync(dir, { recursive: true });
    if (isRoot) {
      if (dir.startsWith(path.join(ROOT, ".data"))) chmodSync(path.join(ROOT, ".data"), 0o755);
      execFileSync("chown", ["-R", "postgres:postgres", dir]);
    }
    chmodSync(dir, 0o700);
    log(`initialising the ${c.name} cluster in ${dir}`);
    asPg(path.join(bin, "initdb"), ["-D", dir, "--auth-local=peer", "--auth-host=scram-sha-256", "-U", "postgres", "-E", "UTF8", "--locale=C"]);
  }
  const authChanged = writeConfig(c);
  if (!isReady(c, bin)) start(c, bin);
  else {
    const differs = drift(c, bin);
    if (differs.length) {
      log(`restarting the ${c.name} cluster to apply its settings (was ${differs.join(", ")})`);
      asPg(path.join(bin, "pg_ctl"), ["-D", dir, "-m", "fast", "-w", "stop"]);
      start(c, bin);
    } else if (authChanged) {
      log(`closing the ${c.name} cluster to other accounts (pg_hba.conf rewritten, reloaded)`);
      asPg(path.join(bin, "pg_ctl"), ["-D", dir, "reload"]);
    }
  }
  const password = local.pgPassword().replace(/'/g, "''");
  const hasRole = adminSql(c, `select 1 from pg_roles where rolname = '${PG_ROLE}'`, "postgres", bin) === "1";
  // Always (re)set: a cluster made before this had a fixed password known to everyone.
  adminSql(c, hasRole ? `alter role ${PG_ROLE} with login password '${password}'` : `create role ${PG_ROLE} login createdb password '${password}'`, "postgres", bin);
  for (const db of databases) {
    if (!/^[a-z_][a-z0-9_]*$/.test(db)) throw new Error(`bad database name ${db}`);
    const exists = adminSql(c, `select 1 from pg_database where datname = '${db}'`, "postgres", bin) === "1";
    if (!exists) {
      adminSql(c, `create database ${db} owner ${PG_ROLE}`, "postgres", bin);
      log(`created database ${db} in the ${c.name} cluster`);
    }
  }
  return { dir, port: c.port };
}

export function stop(c: Cluster = appCluster()) {
  const bin = ensureBinaries();
  if (!existsSync(path.join(c.dir, "PG_VERSION"))) return log(`no ${c.name} cluster in ${c.dir}`);
  asPg(path.join(bin, "pg_ctl"), ["-D", c.dir, "-m", "fast", "-w", "stop"], { allowFail: true });
  log(`stopped the ${c.name} cluster`);
}

function status(c: Cluster) {
  const bin = ensureBinaries();
  if (!isReady(c, bin)) return `${c.name}: not running (port ${c.port}, data in ${c.dir})`;
  const fsync = adminSql(c, "show fsync", "postgres", bin);
  return `${c.name}: running on 127.0.0.1:${c.port}, fsync=${fsync}, data in ${c.dir}`;
}

if (typeof __filename !== "undefined" && process.argv[1] && path.resolve(process.argv[1]) === path.resolve(__filename)) {
  const [cmd = "up", arg] = process.argv.slice(2);
  const c = arg === "test" ? testCluster() : appCluster();
  if (cmd === "up") {
    up(c);
    log(`ready: postgres://${PG_ROLE}@127.0.0.1:${c.port}/${c.name === "test" ? TEST_DB : APP_DB} (password in ${process.env.LW_PG_PASSWORD ? "LW_PG_PASSWORD" : local.PASSWORD_FILE}; data in ${c.dir})`);
  } else if (cmd === "stop") stop(c);
  else if (cmd === "status") console.log([status(appCluster()), status(testCluster())].join("\n"));
  else if (cmd === "url") console.log(databaseUrl(arg === "test" ? TEST_DB : APP_DB, arg === "test" ? "test" : "app"));
  else {
    console.error("usage: db/pg.ts up [test] | stop [test] | status | url [test]");
    process.exit(2);
  }
}
