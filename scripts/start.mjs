// `npm start`: everything a fresh clone needs, then the app on http://127.0.0.1:3000.
import { spawn } from "node:child_process";
import { PG_PORT, ROOT, authSecret, dbUrl, ensurePackages, migrate, run, startPostgres, step } from "./setup.mjs";
import { nextStartArgs } from "./next-start.mjs";

const PORT = Number(process.env.PORT || 3000);
const URL = `http://127.0.0.1:${PORT}`;
const APP_DB = process.env.LW_APP_DB || "linkwright";

ensurePackages();
// With DATABASE_URL set, that database is migrated and served; the local cluster starts only when it is the target.
const given = process.env.DATABASE_URL ? new globalThis.URL(process.env.DATABASE_URL) : null;
if (!given || (["127.0.0.1", "localhost"].includes(given.hostname) && Number(given.port) === PG_PORT)) {
  // A password in DATABASE_URL becomes the app role's password on the local cluster.
  if (given?.password && !process.env.LW_PG_PASSWORD) process.env.LW_PG_PASSWORD = decodeURIComponent(given.password);
  startPostgres();
}
const databaseUrl = process.env.DATABASE_URL || dbUrl(APP_DB);
migrate(databaseUrl, { label: given ? `the database in DATABASE_URL (${given.host}${given.pathname})` : `${APP_DB}` });

const env = {
  ...process.env,
  NEXT_TELEMETRY_DISABLED: "1",
  NODE_ENV: "production",
  DATABASE_URL: databaseUrl,
  NEXTAUTH_URL: process.env.NEXTAUTH_URL || URL,
  NEXTAUTH_SECRET: authSecret(),
};

const { startLocalServices } = await import("./services.mjs");
const services = await startLocalServices(env);

if (process.env.LW_SKIP_BUILD !== "1") {
  step("Building the app (next build)");
  run(process.execPath, ["node_modules/next/dist/bin/next", "build"], { env });
}

step(`Serving on ${URL}`);
const server = spawn(process.execPath, nextStartArgs("127.0.0.1", PORT), { cwd: ROOT, env, stdio: ["ignore", "pipe", "inherit"] });
let printed = false;
server.stdout.on("data", async (chunk) => {
  process.stdout.write(chunk);
  if (!printed && /ready|started|Local:/i.test(String(chunk))) {
    printed = true;
    const { tsImport } = await import("tsx/esm/api");
    const { DEMO_USERS } = await tsImport("../db/demo-accounts.ts", import.meta.url);
    console.log(`\nLinkwright is running at ${URL}\n\nDemo sign-ins (invented demo data, for this machine only):`);
    for (const u of DEMO_USERS) console.log(`  ${u.name.padEnd(11)} ${(u.role ?? "site admin").padEnd(9)} ${u.email.padEnd(28)} ${u.password}`);
    if (services.summary) console.log(`\n${services.summary}`);
    console.log("\nCaution: Linkwright's numbers aid your own engineering; follow the designer's instructions, the regulations and a qualified inspector.\nPress Ctrl+C to stop.");
  }
});
const stop = () => { server.kill("SIGTERM"); services.stop?.(); };
process.on("SIGINT", stop);
process.on("SIGTERM", stop);
server.on("exit", (code) => { services.stop?.(); process.exit(code ?? 0); });
