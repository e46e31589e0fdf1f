/** Where the tests find the app and the database: the test cluster (LW_TEST_PG_PORT, default LW_PG_PORT + 100), never the app's. */
import { localDbUrl, TEST_PG_PORT as CLUSTER_PORT } from "../../db/local-cluster.cjs";

export const TEST_PORT = Number(process.env.LW_TEST_PORT || 3100);
export const APP_URL = `http://127.0.0.1:${TEST_PORT}`;
export const TEST_PG_PORT = CLUSTER_PORT;
export const TEST_DB = process.env.LW_TEST_DB || "linkwright_test";
export const TEST_DB_URL = process.env.DATABASE_URL || localDbUrl(TEST_DB, "test");
/** Another database on the test cluster. */
export const testClusterUrl = (db: string) => localDbUrl(db, "test");
export const DIST_DIR = process.env.NEXT_DIST_DIR || ".next-test";
/** The session secret the test server runs with (`npm test` passes the checkout's own). */
export const TEST_SECRET = process.env.NEXTAUTH_SECRET || "test-secret-not-for-production-use-only";
/** The test-mode local services (scripts/services.mjs with LW_SERVICES_MODE=test). */
export const TEST_SMTP_URL = `smtp://127.0.0.1:${process.env.LW_SMTP_PORT || 2526}`;
export const TEST_S3_ENDPOINT = `http://127.0.0.1:${process.env.LW_S3_PORT || 4570}`;
