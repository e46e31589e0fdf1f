/**
 * The test cluster (LW_TEST_PG_PORT) for tests that stop or restart PostgreSQL. Only this cluster:
 * the app's cluster, which holds a person's records, is never touched by a test.
 */
import { adminSql, isReady, startCluster, stop, testCluster } from "@/db/pg";

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
