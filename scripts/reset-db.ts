/** Drops and recreates one database of the local test cluster (tests start from nothing). Never touches the app cluster. */
import { adminSql, testCluster, up } from "../db/pg";

const name = process.argv[2];
if (!name || !/^[a-z_][a-z0-9_]*_test$|^linkwright_[a-z0-9_]+$/.test(name)) {
  console.error("usage: reset-db.ts <name ending in _test>");
  process.exit(2);
}
const cluster = testCluster();
up(cluster, []);
adminSql(cluster, `drop database if exists ${name} with (force)`);
up(cluster, [name]);
