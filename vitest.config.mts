import path from "node:path";
import { fileURLToPath } from "node:url";
import { readdirSync } from "node:fs";
import { defineConfig } from "vitest/config";

const here = path.dirname(fileURLToPath(import.meta.url));

/**
 * Tests of pure code (no database, no server, no browser): they share nothing, so two run at once (the machine's
 * two cores), before the rest. A test in these folders that needs the server, the database or the local
 * services is named in `SERVER_TESTS_IN_PURE`.
 */
const PURE_DIRS = ["tests/shared", "tests/editor", "tests/lib"];
const SERVER_TESTS_IN_PURE = ["tests/lib/s3-keys.test.ts"]; // the S3 fake
const PURE = PURE_DIRS.flatMap((d) => readdirSync(path.join(here, d), { recursive: true, encoding: "utf8" }).map((f) => `${d}/${f.split(path.sep).join("/")}`))
  .filter((f) => f.endsWith(".test.ts") && !SERVER_TESTS_IN_PURE.includes(f));

export default defineConfig({
  resolve: {
    tsconfigPaths: true,
    // db/ and lib/ modules guard against reaching the browser; tests run them in Node on purpose.
    alias: { "server-only": path.resolve(here, "tests/support/empty.ts") },
  },
  test: {
    environment: "node",
    testTimeout: 60_000,
    hookTimeout: 180_000,
    projects: [
      { extends: true, test: { name: "pure", include: PURE, maxWorkers: 2 } },
      {
        extends: true,
        // Route, browser, database and script tests share one server, database, bucket and mail sink (and some
        // stop the database or compare whole-database snapshots): one file at a time, after the pure ones.
        test: { name: "server", include: ["tests/**/*.test.ts"], exclude: PURE, fileParallelism: false, globalSetup: ["tests/global-setup.ts"] },
      },
    ],
  },
});
