/**
 * What `npm run backup` and `npm run restore` share: where the database and the bucket are, the
 * PostgreSQL client programs, hashing, progress lines and the manifest's shape.
 * Targets: DATABASE_URL (else the local app cluster's database) and S3_* (else the local S3 fake that
 * `npm start` runs; started here for the length of the command when it is not running).
 */
import { spawn } from "node:child_process";
import { createHash } from "node:crypto";
import { createReadStream } from "node:fs";
import net from "node:net";
import path from "node:path";
import { S3Client } from "@aws-sdk/client-s3";
import { APP_DB, appCluster, ensureBinaries, up } from "../db/pg";
import { localDbUrl } from "../db/local-cluster.cjs";

export const FORMAT = "linkwright-backup";
export const VERSION = 1;
export const MANIFEST = "manifest.json";
export const MANIFEST_SUM = "manifest.sha256"; // the last entry: a file cut short lacks it
export const DUMP = "database.dump";

export type ObjectEntry = { key: string; file: string; bytes: number; sha256: string; contentType: string | null };
export type Manifest = {
  format: typeof FORMAT;
  version: number;
  createdAt: string;
  database: { file: string; bytes: number; sha256: string; tables: Record<string, number>; migrations: string[] };
  bucket: string;
  objects: ObjectEntry[];
  /** Keys the database names that the bucket did not have when the backup was taken. */
  missing: string[];
};

export type Targets = { dbUrl: string; dbLabel: string; s3: S3Client; bucket: string; s3Label: string; stop(): Promise<void> };

const portOpen = (port: number) =>
  new Promise<boolean>((resolve) => {
    const s = net.connect(port, "127.0.0.1");
    s.once("connect", () => (s.destroy(), resolve(true)));
    s.once("error", () => resolve(false));
  });

export async function targets(): Promise<Targets> {
  let dbUrl = process.env.DATABASE_URL;
  if (!dbUrl) {
    up(appCluster(), [APP_DB]);
    dbUrl = localDbUrl(APP_DB, "app");
  }
  const u = new URL(dbUrl);
  const dbLabel = `${u.hostname}:${u.port || 5432}${u.pathname}`;
  let stop = async () => {};
  const env: Record<string, string | undefined> = { ...process.env };
  if (!env.S3_ENDPOINT) {
    const port = Number(env.LW_S3_PORT || 4569);
    if (await portOpen(port)) {
      Object.assign(env, { S3_ENDPOINT: `http://127.0.0.1:${port}`, S3_BUCKET: "linkwright", S3_REGION: "us-east-1", S3_ACCESS_KEY_ID: "S3RVER", S3_SECRET_ACCESS_KEY: "S3RVER" });
    } else {
      const { startLocalServices } = await import("./services.mjs");
      const services = await startLocalServices({ ...env, SMTP_URL: "smtp://unused.invalid", LW_SERVICES_MODE: "dev" });
      Object.assign(env, services.env);
      stop = async () => void (await services.stop());
    }
  }
  if (!env.S3_BUCKET) throw new Error("S3_BUCKET is not set");
  const s3 = new S3Client({
    endpoint: env.S3_ENDPOINT,
    region: env.S3_REGION || "us-east-1",
    forcePathStyle: true,
    credentials: { accessKeyId: env.S3_ACCESS_KEY_ID || "", secretAccessKey: env.S3_SECRET_ACCESS_KEY || "" },
  });
  return { dbUrl, dbLabel, s3, bucket: env.S3_BUCKET, s3Label: `${env.S3_ENDPOINT}/${env.S3_BUCKET}`, stop: async () => (s3.destroy(), stop()) };
}

/**
 * Runs pg_dump / pg_restore / psql against a connection string without putting its password on the
 * command line (other accounts can read command lines): it goes in PGPASSWORD.
 */
export function pgTool(tool: "pg_dump" | "pg_restore" | "psql", args: string[], dbUrl?: string): Promise<{ code: number; stderr: string }> {
  const env: NodeJS.ProcessEnv = { ...process.env };
  const argv = [...args];
  if (dbUrl) {
    const u = new URL(dbUrl);
    if (u.password) env.PGPASSWORD = decodeURIComponent(u.password);
    u.password = "";
    argv.push(tool === "psql" ? u.toString() : `--dbname=${u.toString()}`);
  }
  const bin = path.join(ensureBinaries(), tool);
  return new Promise((resolve, reject) => {
    const p = spawn(bin, argv, { env, stdio: ["ignore", "ignore", "pipe"] });
    let stderr = "";
    p.stderr.on("data", (c) => (stderr += c));
    p.once("error", reject);
    p.once("close", (code) => resolve({ code: code ?? 1, stderr }));
  });
}

export async function sha256File(file: string) {
  const h = createHash("sha256");
  let bytes = 0;
  for await (const c of createReadStream(file)) {
    h.update(c as Buffer);
    bytes += (c as Buffer).length;
  }
  return { sha256: h.digest("hex"), bytes };
}

export const mb = (n: number) => `${(n / 1048576).toFixed(1)} MB`;

/** One progress line: rewritten in place on a terminal, printed every `every` steps (and the last) otherwise. */
export function progress(label: string, total: number, every = 25) {
  const tty = process.stdout.isTTY;
  return (done: number, bytes: number) => {
    const line = `  ${label} ${done}/${total} (${mb(bytes)})`;
    if (tty) process.stdout.write(`\r${line}${done === total ? "\n" : ""}`);
    else if (done === total || done % every === 0) console.log(line);
  };
}
