// Local stand-ins for hosted services, started by `npm start` and by the tests:
//  - an SMTP sink (smtp-server) on 127.0.0.1 that stores each message as JSON in .data/mail-sink-<mode>/
//  - an S3-compatible fake (s3rver) on 127.0.0.1 with one bucket, files in .data/s3-<mode>/
// In production neither runs: set SMTP_URL and the S3_* variables instead (README).
import { mkdirSync, writeFileSync } from "node:fs";
import path from "node:path";
import { fileURLToPath } from "node:url";
import { createRequire } from "node:module";

const ROOT = path.resolve(path.dirname(fileURLToPath(import.meta.url)), "..");
const require = createRequire(import.meta.url);

/**
 * The S3 fake ciphers its listing continuation tokens with single DES, which OpenSSL 3 (Node 20) no longer
 * offers, so every listing past 1,000 keys answered "internal error". Single DES is triple DES with the same
 * key three times, which OpenSSL 3 still has: map the one cipher name, in this process only, nothing else.
 */
function letTheFakeListPastOnePage() {
  const crypto = require("node:crypto");
  if (crypto.__lwDesShim) return;
  const wrap = (fn) => (alg, key, iv, opts) =>
    String(alg).toLowerCase() === "des" ? fn("des-ede3-cbc", Buffer.concat([key, key, key]), iv, opts) : fn(alg, key, iv, opts);
  crypto.createCipheriv = wrap(crypto.createCipheriv.bind(crypto));
  crypto.createDecipheriv = wrap(crypto.createDecipheriv.bind(crypto));
  crypto.__lwDesShim = true;
}

export async function startLocalServices(env = process.env) {
  // dev (npm start), test (npm test) or bench (npm run bench:scale): each its own ports and folders.
  const mode = env.LW_SERVICES_MODE === "test" || env.LW_SERVICES_MODE === "bench" ? env.LW_SERVICES_MODE : "dev";
  const out = { env: {}, summary: "", async stop() {} };
  const stops = [];

  if (!env.SMTP_URL) {
    const { SMTPServer } = require("smtp-server");
    const { simpleParser } = await import("mailparser").catch(() => ({ simpleParser: null }));
    const port = mode === "bench" ? Number(env.LW_SMTP_PORT || 2526) + 1 : Number(env.LW_SMTP_PORT || (mode === "test" ? 2526 : 2525));
    const dir = path.join(ROOT, ".data", `mail-sink-${mode}`);
    mkdirSync(dir, { recursive: true });
    let n = 0;
    const server = new SMTPServer({
      authOptional: true,
      disabledCommands: ["STARTTLS"],
      onData(stream, session, callback) {
        const chunks = [];
        stream.on("data", (c) => chunks.push(c));
        stream.on("end", async () => {
          const raw = Buffer.concat(chunks).toString("utf8");
          const parsed = simpleParser ? await simpleParser(raw).catch(() => null) : null;
          const id = `${Date.now()}-${process.pid}-${n++}`;
          writeFileSync(
            path.join(dir, `${id}.json`),
            JSON.stringify({
              id,
              receivedAt: new Date().toISOString(),
              from: session.envelope.mailFrom?.address ?? null,
              to: session.envelope.rcptTo.map((r) => r.address),
              subject: parsed?.subject ?? null,
              text: parsed?.text ?? null,
              html: parsed?.html || null,
              raw,
            }),
          );
          callback();
        });
      },
    });
    await new Promise((resolve, reject) => { server.once("error", reject); server.listen(port, "127.0.0.1", resolve); });
    stops.push(() => new Promise((r) => server.close(r)));
    out.env.SMTP_URL = `smtp://127.0.0.1:${port}`;
    out.env.LW_MAIL_SINK_DIR = dir;
    out.summary += `Mail sink: smtp://127.0.0.1:${port} (messages kept in ${path.relative(ROOT, dir)}/)\n`;
  }

  if (!env.S3_ENDPOINT) {
    letTheFakeListPastOnePage();
    const S3rver = require("s3rver");
    const port = mode === "bench" ? Number(env.LW_S3_PORT || 4570) + 1 : Number(env.LW_S3_PORT || (mode === "test" ? 4570 : 4569));
    const dir = path.join(ROOT, ".data", `s3-${mode}`);
    mkdirSync(dir, { recursive: true });
    const bucket = "linkwright";
    const s3 = new S3rver({ port, address: "127.0.0.1", directory: dir, silent: true, configureBuckets: [{ name: bucket }] });
    await s3.run();
    stops.push(() => s3.close());
    Object.assign(out.env, {
      S3_ENDPOINT: `http://127.0.0.1:${port}`,
      S3_BUCKET: bucket,
      S3_REGION: "us-east-1",
      S3_ACCESS_KEY_ID: "S3RVER",
      S3_SECRET_ACCESS_KEY: "S3RVER",
    });
    out.summary += `File store: S3-compatible fake on http://127.0.0.1:${port}, bucket ${bucket}\n`;
  }

  out.stop = async () => { for (const s of stops) await s().catch(() => {}); };
  Object.assign(env, out.env);
  return out;
}
