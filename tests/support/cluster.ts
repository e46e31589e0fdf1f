/**
 * The test cluster (LW_TEST_PG_PORT) for tests that stop or restart PostgreSQL. Only this cluster:
 * the app's cluster, which holds a person's records, is never touched by a test.
 */
import { execFile } from "node:child_process";
import path from "node:path";
import { adminSql, ensureBinaries, isReady, startCluster, stop, testCluster } from "@/db/pg";

export const TEST_CLUSTER = testCluster();

/** Stops the test cluster (fast shutdown: open connections are cut). */
export function stopTestCluster() {
  stop(TEST_CLUSTER);
}

/** Starts it again with its settings (waits until it accepts connections). */
export function startTestCluster() {
  startCluster(TEST_CLUSTER);
}

export function restartTestCluster() {
  stopTestCluster();
  startTestCluster();
}

export const testClusterRunning = () => isReady(TEST_CLUSTER);

/** A setting of the running test cluster, read as the superuser over its socket. */
export const testClusterSetting = (name: string) => adminSql(TEST_CLUSTER, `show ${name}`);

/**
 * `pg_ctl` on the test cluster without blocking this process (the helpers above wait synchronously, so
 * requests the test has in flight would not be read meanwhile): for stopping and starting PostgreSQL
 * under a running load.
 */
function pgCtlAsync(args: string[]): Promise<void> {
  const pgCtl = path.join(ensureBinaries(), "pg_ctl");
  const [file, argv] = process.getuid?.() === 0 ? ["runuser", ["-u", "postgres", "--", pgCtl, ...args]] : [pgCtl, args];
  return new Promise((resolve, reject) => execFile(file, argv, (e, _out, err) => (e ? reject(new Error(`pg_ctl ${args.join(" ")}: ${err || e.message}`)) : resolve())));
}
export const stopTestClusterAsync = () => pgCtlAsync(["-D", TEST_CLUSTER.dir, "-m", "fast", "-w", "stop"]);
export const startTestClusterAsync = () => pgCtlAsync(["-D", TEST_CLUSTER.dir, "-l", path.join(TEST_CLUSTER.dir, "server.log"), "-w", "-t", "60", "start"]);
