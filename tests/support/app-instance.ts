/**
 * An app server of a test's own (`next start` of the test build on another port, same database, bucket and
 * mail sink as the shared test server), for tests that kill or restart the app: the shared server stays up.
 * Its output (and its export worker's) goes to tests/artifacts/<name>.log.
 */
import { spawn, type ChildProcess } from "node:child_process";
import { mkdirSync, openSync, readFileSync } from "node:fs";
import path from "node:path";
import { DIST_DIR, TEST_DB_URL, TEST_S3_ENDPOINT, TEST_SECRET, TEST_SMTP_URL } from "./env";
import { nextStartArgs } from "../../scripts/next-start.mjs";

const ROOT = path.resolve(__dirname, "../..");

export type AppInstance = { url: string; log: string; proc: ChildProcess; stopped: Promise<void> };

/** Starts it and waits until it answers; `again` appends to the log of an earlier start instead of starting a new one. */
export async function startApp(port: number, name: string, o: { again?: boolean; env?: Record<string, string> } = {}): Promise<AppInstance> {
  mkdirSync(path.join(ROOT, "tests/artifacts"), { recursive: true });
  const log = path.join(ROOT, "tests/artifacts", `${name}.log`);
  const out = openSync(log, o.again ? "a" : "w");
  const url = `http://127.0.0.1:${port}`;
  const proc = spawn(process.execPath, nextStartArgs("127.0.0.1", port), {
    cwd: ROOT,
    stdio: ["ignore", out, out],
    env: {
      ...process.env,
      NODE_ENV: "production",
      NEXT_TELEMETRY_DISABLED: "1",
      NEXT_DIST_DIR: DIST_DIR,
      DATABASE_URL: TEST_DB_URL,
      NEXTAUTH_SECRET: TEST_SECRET,
      NEXTAUTH_URL: url,
      SMTP_URL: TEST_SMTP_URL,
      S3_ENDPOINT: TEST_S3_ENDPOINT,
      S3_BUCKET: "linkwright",
      S3_REGION: "us-east-1",
      S3_ACCESS_KEY_ID: "S3RVER",
      S3_SECRET_ACCESS_KEY: "S3RVER",
      ...o.env,
    },
  });
  const stopped = new Promise<void>((r) => proc.once("exit", () => r()));
  const until = Date.now() + 90_000;
  for (;;) {
    if (proc.exitCode !== null || proc.signalCode) throw new Error(`the app on ${url} exited at start (${log})`);
    try {
      if ((await fetch(`${url}/api/auth/csrf`)).status < 500) break;
    } catch {}
    if (Date.now() > until) throw new Error(`the app did not answer on ${url} within 90 s (${log})`);
    await new Promise((r) => setTimeout(r, 200));
  }
  return { url, log, proc, stopped };
}

/** kill -9: no shutdown of any kind, as a crash or the OOM killer ends it. */
export async function killApp(app: AppInstance) {
  app.proc.kill("SIGKILL");
  await app.stopped;
}

export const appLog = (app: AppInstance) => readFileSync(app.log, "utf8");
