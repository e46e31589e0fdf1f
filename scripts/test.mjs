// `npm test`: the same set-up as `npm start` on a cluster of its own (LW_TEST_PG_PORT, fsync off) with a fresh test database, then every test.
import { spawn, spawnSync } from "node:child_process";
import { existsSync, mkdirSync, readFileSync } from "node:fs";
import path from "node:path";
import { ROOT, TEST_PG_PORT, authSecret, dbUrl, ensureDebianPackage, ensurePackages, migrate, run, startPostgres, step } from "./setup.mjs";

// Two `npm test` runs in one checkout would share the test database, port and build folder:
// the second waits for the first (flock from util-linux).
if (!process.env.LW_TEST_LOCKED && existsSync("/usr/bin/flock")) {
  mkdirSync(path.join(ROOT, ".data"), { recursive: true });
  const r = spawnSync("/usr/bin/flock", [path.join(ROOT, ".data", "npm-test.lock"), process.execPath, ...process.argv.slice(1)], {
    stdio: "inherit",
    env: { ...process.env, LW_TEST_LOCKED: "1" },
  });
  process.exit(r.status ?? 1);
}

const TEST_DB = process.env.LW_TEST_DB || "linkwright_test";
const started = Date.now();

ensurePackages();
ensureDebianPackage("/usr/bin/chromium", "chromium");
ensureDebianPackage("/usr/bin/pdftoppm", "poppler-utils");
startPostgres("test");

const env = {
  NODE_ENV: "production",
  NEXT_DIST_DIR: process.env.NEXT_DIST_DIR || ".next-test",
  DATABASE_URL: dbUrl(TEST_DB, "test"),
  NEXTAUTH_SECRET: authSecret(),
};
// The build does not touch the database: it runs while the test database is made, migrated and seeded.
step("Building the app for the browser and route tests (.next-test), meanwhile the test database");
const build = spawn(process.execPath, ["node_modules/next/dist/bin/next", "build"], { cwd: ROOT, stdio: "inherit", env: { ...process.env, NEXT_TELEMETRY_DISABLED: "1", ...env } });
const built = new Promise((resolve) => build.once("exit", (code, signal) => resolve(code ?? signal)));
process.on("exit", () => { if (build.exitCode === null && build.signalCode === null) build.kill(); }); // a failed migration stops the build too

step(`Recreating the test database ${TEST_DB} (test cluster, port ${TEST_PG_PORT})`);
run(process.execPath, ["--import", "tsx", "scripts/reset-db.ts", TEST_DB]);
migrate(dbUrl(TEST_DB, "test"), { label: TEST_DB });
const buildExit = await built;
if (buildExit !== 0) {
  console.error(`\n✗ next build failed (exit ${buildExit})`);
  process.exit(typeof buildExit === "number" ? buildExit : 1);
}

step("Running the tests (vitest)");
mkdirSync(path.join(ROOT, "tests/artifacts"), { recursive: true });
const report = path.join(ROOT, "tests/artifacts/vitest-report.json");
const r = spawnSync(
  process.execPath,
  ["node_modules/vitest/vitest.mjs", "run", "--reporter=default", "--reporter=json", `--outputFile.json=${report}`, ...process.argv.slice(2)],
  { cwd: ROOT, stdio: "inherit", env: { ...process.env, ...env, NODE_ENV: "test", LW_BUILT: "1", NEXT_TELEMETRY_DISABLED: "1" } },
);

let passed = 0, failed = 0, skipped = 0;
if (existsSync(report)) {
  const j = JSON.parse(readFileSync(report, "utf8"));
  passed = j.numPassedTests ?? 0;
  failed = (j.numFailedTests ?? 0) + (j.numFailedTestSuites && !j.numFailedTests ? j.numFailedTestSuites : 0);
  skipped = (j.numPendingTests ?? 0) + (j.numTodoTests ?? 0);
}
const minutes = ((Date.now() - started) / 60000).toFixed(1);
console.log(`\nnpm test took ${minutes} min`);
console.log(`${passed} passed, ${failed} failed${skipped ? `, ${skipped} skipped` : ""}`);
process.exit(r.status === 0 && failed === 0 && passed > 0 ? 0 : 1);
