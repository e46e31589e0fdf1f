/**
 * Reading request bodies within bounds, for every route (JSON, forms, uploads, the sign-in form):
 *  - the size cap is counted while the body streams in, and a Content-Length already over it is refused
 *    before a byte is read, so a huge body is never held whole;
 *  - JSON is checked for depth in one pass over the text before it is parsed, and its strings are then
 *    walked without recursion for characters Postgres cannot store (NUL, a lone UTF-16 surrogate).
 * Nothing here recurses, and each step is linear in the body's size.
 */
import type { z } from "zod";
import { ApiError, fieldError, invalid } from "./errors";

export const MAX_BODY_BYTES = 5 * 1024 * 1024;
/** Deeper JSON than this is refused before it is parsed; no request of ours nests past about 8. */
export const MAX_JSON_DEPTH = 64; // common practice, no source

export const bodyTooLarge = () => new ApiError("too_large", "The request body is larger than 5 MB.");

/**
 * The body's bytes, at most `max` of them: a declared Content-Length over `max` is refused at once, and
 * the count is checked after every chunk, so reading stops at the first chunk past the cap.
 */
export async function readBodyCapped(req: Request, max: number, tooLarge: () => ApiError = bodyTooLarge): Promise<Buffer> {
  const declared = req.headers.get("content-length");
  if (declared !== null && Number(declared) > max) throw tooLarge();
  if (!req.body) return Buffer.alloc(0);
  const reader = req.body.getReader();
  const chunks: Uint8Array[] = [];
  let n = 0;
  for (;;) {
    let r: ReadableStreamReadResult<Uint8Array>;
    try {
      r = await reader.read();
    } catch {
      throw new ApiError("invalid_input", "The request body could not be read to its end.");
    }
    if (r.done) break;
    n += r.value.byteLength;
    if (n > max) {
      // Stop reading: the rest is never taken in (the answer goes out now).
      reader.cancel().catch(() => {});
      throw tooLarge();
    }
    chunks.push(r.value);
  }
  return Buffer.concat(chunks, n);
}

const utf8 = new TextDecoder("utf-8", { fatal: true });

/** A body's bytes as text: UTF-8, nothing else. */
export function decodeBody(bytes: Uint8Array): string {
  try {
    return utf8.decode(bytes);
  } catch {
    throw new ApiError("invalid_json", "The request body is not valid UTF-8 text.");
  }
}

/** The body as text (UTF-8, nothing else), capped. */
export async function readTextCapped(req: Request, max = MAX_BODY_BYTES): Promise<string> {
  return decodeBody(await readBodyCapped(req, max));
}

/** Whether brackets nest deeper than `max` anywhere in a JSON text (strings skipped), in one pass. */
export function nestsDeeperThan(text: string, max: number): boolean {
  let depth = 0;
  let inString = false;
  for (let i = 0; i < text.length; i++) {
    const c = text.charCodeAt(i);
    if (inString) {
      if (c === 0x5c) i++; // a backslash escapes the next character
      else if (c === 0x22) inString = false;
    } else if (c === 0x22) inString = true;
    else if (c === 0x5b || c === 0x7b) {
      if (++depth > max) return true;
    } else if (c === 0x5d || c === 0x7d) depth--;
  }
  return false;
}

/** A high surrogate not followed by a low one, or a low one not preceded by a high one. */
const LONE_SURROGATE = /[\uD800-\uDBFF](?![\uDC00-\uDFFF])|(?<![\uD800-\uDBFF])[\uDC00-\uDFFF]/;

/** What is wrong with a string for Postgres, or null: NUL, or half of a surrogate pair (not UTF-16 text). */
function badText(s: string): string | null {
  if (s.includes("\u0000")) return "must not contain NUL characters";
  if (LONE_SURROGATE.test(s)) return "must not contain a broken character (half of a UTF-16 surrogate pair)";
  return null;
}

/** A place in the walked value: its key and its parent's place (the path is built only when needed). */
type Place = { key: string; up: Place | null } | null;
const pathOf = (p: Place): string => {
  const keys: string[] = [];
  for (let q = p; q; q = q.up) keys.push(q.key);
  return keys.reverse().join(".");
};

/**
 * The first string or key (path and why) that Postgres text and jsonb cannot store, walked with a stack
 * instead of recursion, in time linear in the value's size. A key's problem is reported at `path._`.
 */
export function badStringIn(root: unknown): { path: string; message: string } | null {
  const stack: { v: unknown; at: Place }[] = [{ v: root, at: null }];
  while (stack.length) {
    const { v, at } = stack.pop()!;
    if (typeof v === "string") {
      const why = badText(v);
      if (why) return { path: pathOf(at) || "_", message: why };
    } else if (v && typeof v === "object") {
      const entries = Object.entries(v);
      // Pushed in reverse so the walk reads them in order (the first bad field is named).
      for (let i = entries.length - 1; i >= 0; i--) {
        const [k, x] = entries[i];
        const why = badText(k);
        if (why) return { path: pathOf({ key: "_", up: at }), message: why };
        stack.push({ v: x, at: { key: k, up: at } });
      }
    }
  }
  return null;
}

/**
 * JSON text → value: too deep is a 400 before parsing, malformed a 400, and a string Postgres cannot
 * store a 400 naming its field. Empty text is `undefined`.
 */
export function parseJsonText(text: string): unknown {
  if (!text.length) return undefined;
  if (nestsDeeperThan(text, MAX_JSON_DEPTH)) {
    throw new ApiError("invalid_json", `The request body is nested too deeply: at most ${MAX_JSON_DEPTH} levels of brackets.`);
  }
  let json: unknown;
  try {
    json = JSON.parse(text);
  } catch {
    throw new ApiError("invalid_json", "The request body is not valid JSON.");
  }
  // NUL and lone surrogates can only come in as escapes (\u0000, \udXXX): the text was strict UTF-8.
  if (/\\u(0000|[dD][89a-fA-F])/.test(text)) {
    const bad = badStringIn(json);
    if (bad) throw fieldError(bad.path, bad.message);
  }
  return json;
}

/** JSON text → a value of `schema` (parseJsonText's refusals, then a 400 naming the fields that do not fit). */
export function parseJsonWith<S extends z.ZodTypeAny>(text: string, schema: S): z.infer<S> {
  const r = schema.safeParse(parseJsonText(text));
  if (!r.success) throw invalid(r.error);
  return r.data;
}

/**
 * The body of a request handed on to code that reads it whole itself (next-auth's sign-in and sign-out
 * forms): capped as it streams in, and a JSON body checked as every route's is. Returns the bytes.
 */
export async function readSmallBody(req: Request, max: number): Promise<Buffer> {
  const bytes = await readBodyCapped(req, max, () => new ApiError("too_large", `The request body is larger than ${Math.round(max / 1024)} kB.`));
  if ((req.headers.get("content-type") || "").includes("application/json")) {
    let text: string;
    try {
      text = utf8.decode(bytes);
    } catch {
      throw new ApiError("invalid_json", "The request body is not valid UTF-8 text.");
    }
    parseJsonText(text);
  }
  return bytes;
}
