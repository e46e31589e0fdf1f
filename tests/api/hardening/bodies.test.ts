/**
 * Bodies and encodings, sent over raw HTTP so the bytes are exactly as written:
 *  - the 5 MB body cap (uploads: their own caps) is counted while the body streams in, and the answer
 *    comes before a large body has been sent; a Content-Length that is already too large is refused at once;
 *  - an image whose header declares too many pixels is refused before it is decoded;
 *  - deep nesting is a 400, NUL characters and lone UTF-16 surrogates in any string are a 400 naming the field;
 *  - a bad percent-encoding in a path or query, or a damaged cookie, is a JSON 400 (or the usual 401), never a 500.
 */
import { randomUUID } from "node:crypto";
import { deflateSync } from "node:zlib";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { makeBuild, makeUser, snapshot, testDb } from "../../support/db";
import { signIn, type Client } from "../../support/http";
import { rawRequest, streamBody, type RawResponse } from "../../support/raw-http";

const MB = 1024 * 1024;
let owner: Client;
let buildId: string;
let linkageId: string;
beforeAll(async () => {
  const u = await makeUser("bodies");
  ({ buildId, linkageId } = await makeBuild({ owner: u }));
  owner = await signIn(u.email);
});
afterAll(() => testDb.destroy());

const L = () => `/api/builds/${buildId}/linkages/${linkageId}`;

/** The one error shape: JSON `{error: {code, message}}` with the code's status. */
function expectApiError(res: RawResponse, status: number, code: string) {
  expect(res.headers["content-type"], res.text.slice(0, 200)).toMatch(/^application\/json/);
  expect(res.status, res.text.slice(0, 200)).toBe(status);
  expect(res.body.error.code).toBe(code);
  expect(typeof res.body.error.message).toBe("string");
}

describe("the body cap is counted while the body streams in", () => {
  // 100 MB planned; the cap is 5 MB. Answering before 20 MB have gone out shows the server stopped reading
  // near the cap instead of reading the whole body first (the socket's buffers hold a few MB more).
  const TOTAL = 100 * MB;
  const EARLY = 20 * MB;

  it("a large chunked sign-up body gets a 413 before it is all sent", async () => {
    const res = await streamBody({ method: "POST", path: "/api/sign-up", headers: { "content-type": "application/json" }, first: '{"name":"', fill: 0x61, total: TOTAL });
    expectApiError(res, 413, "too_large");
    expect(res.body.error.message).toBe("The request body is larger than 5 MB.");
    expect(res.sent).toBeLessThan(EARLY);
  });

  it("the same on a signed-in JSON route", async () => {
    const res = await streamBody({ method: "PATCH", path: L(), headers: { "content-type": "application/json", cookie: owner.cookie }, first: '{"name":"', fill: 0x61, total: TOTAL });
    expectApiError(res, 413, "too_large");
    expect(res.sent).toBeLessThan(EARLY);
  });

  it("the same on the sign-in form", async () => {
    const res = await streamBody({ method: "POST", path: "/api/auth/callback/credentials", headers: { "content-type": "application/x-www-form-urlencoded" }, first: "email=", fill: 0x61, total: TOTAL });
    expectApiError(res, 413, "too_large");
    expect(res.sent).toBeLessThan(EARLY);
  });

  it("an upload over its cap, raw or as a form, gets a 413 before it is all sent", async () => {
    const raw = await streamBody({ method: "POST", path: `/api/builds/${buildId}/files`, headers: { "content-type": "image/png", cookie: owner.cookie }, total: TOTAL });
    expectApiError(raw, 413, "too_large");
    expect(raw.sent).toBeLessThan(40 * MB); // the files route takes up to 20 MB
    const boundary = "----lw" + randomUUID().replace(/-/g, "");
    const form = await streamBody({
      method: "POST",
      path: `/api/builds/${buildId}/files`,
      headers: { "content-type": `multipart/form-data; boundary=${boundary}`, cookie: owner.cookie },
      first: `--${boundary}\r\nContent-Disposition: form-data; name="file"; filename="big.pdf"\r\nContent-Type: application/pdf\r\n\r\n%PDF-1.4\n`,
      total: TOTAL,
    });
    expectApiError(form, 413, "too_large");
    expect(form.sent).toBeLessThan(40 * MB);
  });

  it("a Content-Length over the cap is refused before any of the body is read", async () => {
    // Only the head is sent: an answer proves the server did not wait for 400 MB that never come.
    for (const [path, type, cookie] of [
      ["/api/sign-up", "application/json", ""],
      ["/api/auth/callback/credentials", "application/x-www-form-urlencoded", ""],
      [`/api/builds/${buildId}/files`, "image/png", owner.cookie],
    ]) {
      const res = await rawRequest(`POST ${path} HTTP/1.1\r\nHost: 127.0.0.1\r\nContent-Type: ${type}\r\nContent-Length: ${400 * MB}${cookie ? `\r\nCookie: ${cookie}` : ""}`);
      expectApiError(res, 413, "too_large");
    }
  });

  it("a body just under the cap is still read and validated", async () => {
    const res = await owner.request("PATCH", L(), { name: "x".repeat(4 * MB) });
    expect(res.status).toBe(400);
    expect(res.body.error.fields).toHaveProperty("name");
  });
});

/** A PNG whose header says width × height, 1-bit grey, every row blank: a few kB that decode to `w × h` pixels. */
function pngBomb(width: number, height: number) {
  const crcTable = Array.from({ length: 256 }, (_, n) => {
    let c = n;
    for (let k = 0; k < 8; k++) c = c & 1 ? 0xedb88320 ^ (c >>> 1) : c >>> 1;
    return c >>> 0;
  });
  const crc = (b: Buffer) => {
    let c = 0xffffffff;
    for (const x of b) c = crcTable[(c ^ x) & 0xff] ^ (c >>> 8);
    return (c ^ 0xffffffff) >>> 0;
  };
  const chunk = (type: string, data: Buffer) => {
    const len = Buffer.alloc(4);
    len.writeUInt32BE(data.length);
    const td = Buffer.concat([Buffer.from(type, "latin1"), data]);
    const c = Buffer.alloc(4);
    c.writeUInt32BE(crc(td));
    return Buffer.concat([len, td, c]);
  };
  const ihdr = Buffer.alloc(13);
  ihdr.writeUInt32BE(width, 0);
  ihdr.writeUInt32BE(height, 4);
  ihdr[8] = 1; // bit depth
  ihdr[9] = 0; // grey
  const raw = Buffer.alloc((1 + Math.ceil(width / 8)) * height); // filter byte 0 and blank pixels, row by row
  return Buffer.concat([Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]), chunk("IHDR", ihdr), chunk("IDAT", deflateSync(raw, { level: 9 })), chunk("IEND", Buffer.alloc(0))]);
}

describe("an image is checked before it is decoded", () => {
  it("a small file declaring 15,000 × 15,000 pixels is refused without decoding it, and nothing is stored", async () => {
    const bomb = pngBomb(15_000, 15_000);
    expect(bomb.length).toBeLessThan(MB);
    const before = await snapshot();
    const res = await rawRequest(`POST /api/builds/${buildId}/files HTTP/1.1\r\nHost: 127.0.0.1\r\nContent-Type: image/png\r\nX-File-Name: bomb.png\r\nContent-Length: ${bomb.length}\r\nCookie: ${owner.cookie}`, bomb);
    expectApiError(res, 413, "too_large");
    expect(res.body.error.message).toMatch(/15000 × 15000 pixels/);
    expect(await snapshot()).toEqual(before);
  });
});

describe("deep nesting", () => {
  const deep = (n: number, inner = "0") => "[".repeat(n) + inner + "]".repeat(n);

  it("100,000 nested arrays are a 400 on an unauthenticated route", async () => {
    for (const body of [deep(100_000), `{"name":${deep(100_000, '"\\u0000"')}}`, `{"a":`.repeat(100_000) + "1" + "}".repeat(100_000)]) {
      const res = await rawRequest(`POST /api/sign-up HTTP/1.1\r\nHost: 127.0.0.1\r\nContent-Type: application/json\r\nContent-Length: ${body.length}`, body);
      expectApiError(res, 400, "invalid_json");
      expect(res.body.error.message).toMatch(/nested too deeply/);
    }
  });

  it("the limit is 64 levels: 64 is read (and then validated), 65 is refused", async () => {
    const ok = await owner.request("PATCH", L(), undefined, `{"name":${deep(63)}}`);
    expect(ok.status).toBe(400);
    expect(ok.body.error.code).toBe("invalid_input");
    const no = await owner.request("PATCH", L(), undefined, `{"name":${deep(64)}}`);
    expect(no.body.error.code).toBe("invalid_json");
  });

  it("brackets inside strings do not count", async () => {
    const name = `[[[{{{${"[".repeat(100)} "\\ ]`;
    const res = await owner.request("PATCH", L(), { name });
    expect(res.status).toBe(200);
    expect(res.body.linkage.name).toBe(name);
  });
});

describe("characters Postgres cannot store", () => {
  it("a lone UTF-16 surrogate in a string is a 400 naming the field, and changes nothing", async () => {
    const before = await snapshot();
    for (const [body, field] of [
      [`{"name":"a\\ud800b","email":"s-${randomUUID().slice(0, 6)}@tests.linkwright.test","password":"long enough password"}`, "name"],
      [`{"name":"ok","email":"t-${randomUUID().slice(0, 6)}@tests.linkwright.test","password":"long enough \\udc00 password"}`, "password"],
    ]) {
      const res = await rawRequest(`POST /api/sign-up HTTP/1.1\r\nHost: 127.0.0.1\r\nContent-Type: application/json\r\nContent-Length: ${body.length}`, body);
      expectApiError(res, 400, "invalid_input");
      expect(Object.keys(res.body.error.fields)).toEqual([field]);
    }
    const rename = await owner.request("PATCH", L(), undefined, '{"name":"Pitch \\udc00 run"}');
    expect(rename.status).toBe(400);
    expect(rename.body.error.fields).toHaveProperty("name");
    // In a key too, and deep in a graph.
    const graph = (await owner.request("GET", `${L()}/graph`)).body.graph;
    const put = await owner.request("PUT", `${L()}/graph`, undefined, JSON.stringify({ baseRevision: 1, graph }).replace('"nodes":[', '"\\ud83d":1,"nodes":['));
    expect(put.status).toBe(400);
    expect(put.body.error.fields).toHaveProperty("graph._");
    expect(await snapshot()).toEqual(before);
  });

  it("a surrogate pair (an emoji) is an ordinary character", async () => {
    const res = await owner.request("PATCH", L(), undefined, '{"name":"Pitch run \\ud83d\\ude80"}');
    expect(res.status).toBe(200);
    expect(res.body.linkage.name).toBe("Pitch run \u{1F680}");
  });

  it("a body that is not UTF-8 is a 400", async () => {
    const body = Buffer.concat([Buffer.from('{"name":"'), Buffer.from([0xff, 0xfe]), Buffer.from('"}')]);
    const res = await rawRequest(`PATCH ${L()} HTTP/1.1\r\nHost: 127.0.0.1\r\nContent-Type: application/json\r\nCookie: ${owner.cookie}\r\nContent-Length: ${body.length}`, body);
    expectApiError(res, 400, "invalid_json");
    expect(res.body.error.message).toMatch(/UTF-8/);
  });
});

describe("bad percent-encoding and damaged cookies", () => {
  const get = (path: string, extra = "") => rawRequest(`GET ${path} HTTP/1.1\r\nHost: 127.0.0.1${extra}`);

  it("a bad percent-encoding in a path is a JSON 400, on API routes and pages, with or without a body", async () => {
    for (const path of ["/api/builds/%E0%A4%A/linkages", "/api/builds/%ZZ", `/api/builds/${buildId}/linkages/%C0%AF`, "/builds/%E0%A4%A", "/%"]) {
      const res = await get(path, `\r\nCookie: ${owner.cookie}`);
      expectApiError(res, 400, "invalid_input");
      expect(res.body.error.message).toMatch(/percent/i);
    }
    const body = '{"name":"x"}';
    const res = await rawRequest(`PATCH /api/builds/${buildId}/linkages/%E0%A4%A HTTP/1.1\r\nHost: 127.0.0.1\r\nContent-Type: application/json\r\nCookie: ${owner.cookie}\r\nContent-Length: ${body.length}`, body);
    expectApiError(res, 400, "invalid_input");
  });

  it("a bad percent-encoding in a query is a JSON 400; a good one is read", async () => {
    for (const q of ["q=%ZZ", "q=%E0%A4%A", "q=ok&kind=%"]) {
      const res = await get(`/api/parts?${q}`, `\r\nCookie: ${owner.cookie}`);
      expectApiError(res, 400, "invalid_input");
      expect(res.body.error.message).toMatch(/percent/i);
    }
    const res = await get(`/api/builds/${buildId}/files?kind=%70hoto`, `\r\nCookie: ${owner.cookie}`);
    expect(res.status).toBe(200);
  });

  it("a damaged session cookie is a JSON 401 (signed out), not an error", async () => {
    for (const cookie of ["next-auth.session-token=garbage", "next-auth.session-token=%E0%A4%A", "next-auth.session-token=\xff\xfe\x80", `${owner.cookie}x`]) {
      expectApiError(await get("/api/me", `\r\nCookie: ${cookie}`), 401, "unauthorized");
    }
  });

  it("a cookie header with control characters is a JSON 400", async () => {
    for (const cookie of ["a=\x01b", "next-auth.session-token=a\x7f"]) {
      const res = await get("/api/me", `\r\nCookie: ${cookie}`);
      expectApiError(res, 400, "invalid_input");
    }
  });

  it("malformed JSON sent to the sign-in route is a JSON 400", async () => {
    const body = '{"email":';
    const res = await rawRequest(`POST /api/auth/callback/credentials HTTP/1.1\r\nHost: 127.0.0.1\r\nContent-Type: application/json\r\nContent-Length: ${body.length}`, body);
    expectApiError(res, 400, "invalid_json");
  });
});
