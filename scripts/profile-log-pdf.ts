// Profiles the full-log PDF of `npm run bench:scale`'s long build in this process (after a bench run has seeded it):
//   LW_S3_PORT=… node --conditions=react-server --cpu-prof --import tsx scripts/profile-log-pdf.ts
import { localDbUrl } from "../db/local-cluster.cjs";

async function main() {
  const env = process.env as Record<string, string>;
  env.DATABASE_URL = localDbUrl("linkwright_bench_scale", "test");
  env.LW_SERVICES_MODE = "bench";
  const { startLocalServices } = await import("./services.mjs");
  const services = await startLocalServices(env);
  const { KINDS } = await import("@/lib/jobs/kinds");
  const { toBuild } = await import("@/db/builds");
  const { db } = await import("@/db");
  const row = await db("builds").where({ name: "Ten-year build (bench)" }).first();
  const build = toBuild(row);
  await import("@/lib/records-pdf");
  const c0 = process.cpuUsage();
  const t0 = performance.now();
  let last = t0;
  const r = await KINDS["log-pdf"].run({ build, params: {}, progress: async (_f: number, msg: string) => { const t = performance.now(); if (t - last > 2000) { console.log(((t - t0) / 1000).toFixed(1), msg); last = t; } } } as never);
  const cpu = process.cpuUsage(c0); console.log("cpu", ((cpu.user + cpu.system) / 1e6).toFixed(1), "s");
  console.log("total", ((performance.now() - t0) / 1000).toFixed(1), "s", ((r as { body: Buffer }).body.length / 1e6).toFixed(1), "MB");
  (await import("node:fs")).writeFileSync("/tmp/prof/log.pdf", (r as { body: Buffer }).body);
  await db.destroy();
  await services.stop?.();
}
main();
