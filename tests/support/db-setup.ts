/**
 * Once per vitest run: the test database is up and migrated, the app is built, and `next start`
 * serves it on 127.0.0.1:TEST_PORT for the route and browser tests. `npm test` does the set-up
 * before vitest (LW_BUILT=1); running vitest alone does it here.
 */
import { spawn, spawnSync, type ChildProcess } from "node:child_process";
import { existsSync, mkdirSync, openSync } from "node:fs";
import path from "node:path";
import { APP_URL, DIST_DIR, TEST_DB, TEST_DB_URL, TEST_PORT, TEST_SECRET } from "./env";
import { nextStartArgs } from "../../scripts/next-start.mjs";

const ROOT = path.resolve(__dirname, "../..");
let server: ChildProcess | null = null;

function sh(args: string[], env: Record<string, string> = {}) {
  const r = spawnSync(process.execPath, args, { cwd: ROOT, stdio: "inherit", env: { ...process.env, NEXT_TELEMETRY_DISABLED: "1", ...env } });
  if (r.status !== 0) throw new Error(`${args.join(" ")} failed`);
}

async function waitFor(url: string, ms: number) {
  const until = Date.now() + ms;
  while (Date.now() < until) {
    try {
      const r = await fetch(url);
      if (r.status < 500) return;
    } catch {}
    await new Promise((r) => setTimeout(r, 250));
  }
  throw new Error(`the app did not answer on ${url} within ${ms} ms`);
}

export async function prepareTestDatabase() {
  const secret = TEST_SECRET;
  const env = { DATABASE_URL: TEST_DB_URL, NEXT_DIST_DIR: DIST_DIR, NEXTAUTH_SECRET: secret };
  if (process.env.LW_BUILT !== "1") {
    sh(["--import", "tsx", "db/pg.ts", "up", "test"], { LW_TEST_DB: TEST_DB });
    sh(["--import", "tsx", "scripts/migrate.ts", "--seed"], env);
    if (!existsSync(path.join(ROOT, DIST_DIR, "BUILD_ID"))) sh(["node_modules/next/dist/bin/next", "build"], { ...env, NODE_ENV: "production" });
  }
  if (process.env.LW_NO_SERVER === "1") return;
  const { startLocalServices } = await import("../../scripts/services.mjs");
  const services = await startLocalServices({ ...process.env, ...env, LW_SERVICES_MODE: "test" });
  mkdirSync(path.join(ROOT, "tests/artifacts"), { recursive: true });
  const log = openSync(path.join(ROOT, "tests/artifacts/next-server.log"), "w");
  server = spawn(process.execPath, nextStartArgs("127.0.0.1", TEST_PORT), {
    cwd: ROOT,
    env: { ...process.env, ...services.env, ...env, NODE_ENV: "production", NEXTAUTH_URL: APP_URL, NEXT_TELEMETRY_DISABLED: "1" },
    stdio: ["ignore", log, log],
  });
  await waitFor(`${APP_URL}/api/auth/csrf`, 60_000);
  return async () => {
    server?.kill("SIGTERM");
    await services.stop?.();
  };
}
