/**
 * HTTP at the byte level, for tests whose point is what exactly is sent: a request written to a socket
 * as given (bad percent-encodings, raw bytes in a header), and a large body streamed in chunks that
 * stops as soon as the server answers.
 */
import http from "node:http";
import net from "node:net";
import { TEST_PORT } from "./env";

export type RawResponse = { status: number; headers: Record<string, string>; text: string; body: any };

function parseBody(text: string, headers: Record<string, string>) {
  let body: any = text;
  if ((headers["content-type"] ?? "").includes("json")) try { body = JSON.parse(text); } catch {}
  return body;
}

/** Takes a chunked body apart (the server answers without a length when it streams). */
function dechunk(buf: Buffer): Buffer {
  const out: Buffer[] = [];
  let i = 0;
  while (i < buf.length) {
    const eol = buf.indexOf("\r\n", i);
    if (eol < 0) break;
    const size = parseInt(buf.subarray(i, eol).toString("latin1"), 16);
    if (!size) break;
    out.push(buf.subarray(eol + 2, eol + 2 + size));
    i = eol + 2 + size + 2;
  }
  return Buffer.concat(out);
}

/**
 * Writes `head` (request line and headers, lines joined by CRLF, no final blank line) and `body` to a
 * fresh connection exactly as given (latin1: one char, one byte), with `Connection: close`, and reads
 * the answer until the server closes.
 */
export function rawRequest(head: string, body: Buffer | string = ""): Promise<RawResponse> {
  return new Promise((resolve, reject) => {
    const chunks: Buffer[] = [];
    const s = net.connect(TEST_PORT, "127.0.0.1", () => {
      // Not end(): the server takes a half-closed connection as a client that went away.
      s.write(Buffer.from(`${head}\r\nConnection: close\r\n\r\n`, "latin1"));
      if (body.length) s.write(typeof body === "string" ? Buffer.from(body, "latin1") : body);
    });
    s.setTimeout(30_000, () => s.destroy(new Error("no answer within 30 s")));
    s.on("data", (d) => chunks.push(d));
    s.on("error", reject);
    s.on("close", () => {
      const all = Buffer.concat(chunks);
      const end = all.indexOf("\r\n\r\n");
      if (end < 0) return reject(new Error(`no complete answer: ${JSON.stringify(all.toString("latin1").slice(0, 200))}`));
      const [statusLine, ...lines] = all.subarray(0, end).toString("latin1").split("\r\n");
      const headers: Record<string, string> = {};
      for (const l of lines) {
        const c = l.indexOf(":");
        headers[l.slice(0, c).trim().toLowerCase()] = l.slice(c + 1).trim();
      }
      let rest: Buffer = all.subarray(end + 4);
      if (/chunked/i.test(headers["transfer-encoding"] ?? "")) rest = dechunk(rest);
      const text = rest.toString("utf8");
      resolve({ status: Number(statusLine.split(" ")[1]), headers, text, body: parseBody(text, headers) });
    });
  });
}

/**
 * Streams a body of up to `total` bytes in `chunk`-sized pieces (chunked, no Content-Length unless
 * `headers` gives one) and stops writing the moment the answer starts. `sent` is how many body bytes
 * had been written by then: far below `total` when the server answered early.
 */
export function streamBody(o: {
  method: string;
  path: string;
  headers?: Record<string, string>;
  first?: Buffer | string;
  fill?: number;
  total: number;
  chunk?: number;
}): Promise<RawResponse & { sent: number }> {
  const size = o.chunk ?? 64 * 1024;
  const filler = Buffer.alloc(size, o.fill ?? 0x20);
  return new Promise((resolve, reject) => {
    let sent = 0;
    let answered = false;
    const req = http.request({ host: "127.0.0.1", port: TEST_PORT, method: o.method, path: o.path, headers: o.headers ?? {} });
    req.setTimeout(120_000, () => req.destroy(new Error("no answer within 120 s")));
    req.on("response", (res) => {
      answered = true;
      const at = sent;
      const parts: Buffer[] = [];
      res.on("data", (d) => parts.push(d));
      res.on("end", () => {
        const headers = Object.fromEntries(Object.entries(res.headers).map(([k, v]) => [k, String(v)]));
        const text = Buffer.concat(parts).toString("utf8");
        req.destroy();
        resolve({ status: res.statusCode ?? 0, headers, text, body: parseBody(text, headers), sent: at });
      });
    });
    // After the answer the server may close while we still write: that is the point, not a failure.
    req.on("error", (e) => { if (!answered) reject(e); });
    const pump = () => {
      while (!answered && sent < o.total) {
        const piece = sent === 0 && o.first ? Buffer.from(o.first) : filler;
        sent += piece.length;
        if (!req.write(piece)) return void req.once("drain", pump);
      }
      if (!answered) req.end();
    };
    pump();
  });
}
