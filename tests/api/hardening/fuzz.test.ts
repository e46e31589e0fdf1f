/**
 * Every JSON write route fuzzed over HTTP with generated bodies (fast-check): a body that is wrong in any
 * way — not JSON, not an object, nested thousands deep, a NUL or a lone surrogate in a string, a number
 * beyond double range, a wrong type, an over-long string, a body over the size cap, or a valid body with
 * one field made wrong — gets a 4xx JSON error, never a 500, and changes no row.
 *
 * The cases come from one seed (LW_FUZZ_SEED, printed with every failure), so a failure is reproduced
 * by running this file again with that seed. LW_FUZZ_CASES sets how many (default 10,000 across the routes).
 * They are sent a batch at a time, a few at once; the database is fingerprinted before and after each
 * batch, and a batch that changed it is sent again one request at a time to name the request.
 * At the end every route's valid body is sent once and must succeed: the fuzzed bodies were one field
 * away from a body the route takes, so their refusals were for that field.
 */
import { createHash, randomUUID } from "node:crypto";
import fc from "fast-check";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { demoPitchLinkage } from "@/shared/demo";
import { emptyGraph } from "@/shared/linkage/schema";
import { makeBuild, makeUser, snapshot, testDb, TEST_PASSWORD } from "../../support/db";
import { APP_URL } from "../../support/env";
import { anonymous, signIn, type Client } from "../../support/http";
import { apiRoutes } from "../../support/routes";
import { addRevision } from "../../support/review";
import { fixtureFile } from "../../support/upload";

const SEED = Number(process.env.LW_FUZZ_SEED || 20261204);
const CASES = Number(process.env.LW_FUZZ_CASES || 10_000);
const CONCURRENCY = Number(process.env.LW_FUZZ_CONCURRENCY || 4); // two cores: the server's, and the test's with the database beside it
const BATCH = 200;
const REPRO = `LW_FUZZ_SEED=${SEED} LW_FUZZ_CASES=${CASES} npx vitest run tests/api/hardening/fuzz.test.ts`;

/** POST/PUT/PATCH routes that take no JSON body, each with why (the uploads are fuzzed by their own tests). */
const NOT_JSON: Record<string, string> = {
  "POST /api/auth/[...nextauth]": "next-auth's own form posts",
  "POST /api/builds/[buildId]/exports/[jobId]/retry": "no body",
  "POST /api/invitations/[token]": "no body: the token is in the path",
  "POST /api/builds/[buildId]/files": "an upload (multipart or raw bytes)",
  "POST /api/builds/[buildId]/linkages/[linkageId]/revisions/[revision]/picture": "an upload (raw PNG)",
  "POST /api/verify/file": "an upload (a PDF)",
};

type Who = "owner" | "reviewer" | "admin" | "pw" | "anon";
type Route = { as: Who; path: () => string; body: () => Record<string, unknown>; /** The valid body once more at the end, expecting 2xx. */ control?: false };
/** A body is made only when it is sent: ten thousand of them at once would not fit in memory. */
type Case = { route: string; kind: string; make: () => string | Buffer; note: string };
type Answer = { status: number; text: string };

const clients = {} as Record<Who, Client>;
const ids = {} as Record<string, string>;
let n = 0;
const unique = (what: string) => `fuzz-${what}-${++n}-${randomUUID().slice(0, 6)}@tests.linkwright.test`;

const rodEnd = () => ({ kind: "rodEnd", partNumber: `FZ-${++n}`, description: "fuzz", spec: { thread: "1/4-28", hand: "RH", ballBore: 0.25, ratedUltimate: 4200 } }); // invented rating, no source
const csv = () => `kind,partNumber,thread,hand,ballBore,ratedUltimate\nrodEnd,FZC-${++n},1/4-28,RH,0.25,4200\n`; // invented rating, no source
const B = () => `/api/builds/${ids.build}`;
const A = () => `${B()}/linkages/${ids.demo}`; // the demo pitch run: joints, findings
const E = () => `${B()}/linkages/${ids.empty}`; // an empty run: nothing open, so a sign-off goes through

// prettier-ignore
const ROUTES: Record<string, Route> = {
  "PATCH /api/admin/users/[userId]":                                  { as: "admin", path: () => `/api/admin/users/${ids.extra}`, body: () => ({ isSiteAdmin: false }) },
  "POST /api/analyze":                                                { as: "owner", path: () => "/api/analyze", body: () => ({ graph: demoPitchLinkage() }) },
  "POST /api/builds":                                                 { as: "owner", path: () => "/api/builds", body: () => ({ name: "Fuzzed build", model: "two-seat kit", registration: "N42FZ" }) },
  "PATCH /api/builds/[buildId]":                                      { as: "owner", path: B, body: () => ({ name: "Fuzz build", model: "kit", analysisSettings: { ultimateFactor: 1.5, pilotForce: { pitchStick: 167 }, dualControls: false } }) },
  "POST /api/builds/[buildId]/exports":                               { as: "owner", path: () => `${B()}/exports`, body: () => ({ kind: "checklist-pdf", params: { linkageId: ids.demo } }) },
  "PUT /api/builds/[buildId]/hardware":                               { as: "owner", path: () => `${B()}/hardware`, body: () => ({ key: "jamNut|1/4-28|RH", state: "ordered" }) },
  "POST /api/builds/[buildId]/invitations":                           { as: "owner", path: () => `${B()}/invitations`, body: () => ({ email: unique("invite"), role: "reviewer" }) },
  "POST /api/builds/[buildId]/linkages":                              { as: "owner", path: () => `${B()}/linkages`, body: () => ({ name: "Roll run", system: "roll" }) },
  "PATCH /api/builds/[buildId]/linkages/[linkageId]":                 { as: "owner", path: E, body: () => ({ name: "Empty run, renamed", system: "yaw" }) },
  "POST /api/builds/[buildId]/linkages/[linkageId]/acknowledgements": { as: "reviewer", path: () => `${A()}/acknowledgements`, body: () => ({ code: "jam-nut-missing", subject: { type: "joint", id: "j-aft-horn" }, reason: "Safety-wired instead; see photo." }) },
  "PUT /api/builds/[buildId]/linkages/[linkageId]/checklist":         { as: "owner", path: () => `${A()}/checklist`, body: () => ({ revision: 2, jointId: "j-stick-fwd", code: "jam-nut", ticked: true, note: "marked" }) },
  "POST /api/builds/[buildId]/linkages/[linkageId]/comments":         { as: "owner", path: () => `${A()}/comments`, body: () => ({ subject: { type: "joint", id: "j-aft-horn" }, body: "Is the jam nut torqued?" }) },
  "PATCH /api/builds/[buildId]/linkages/[linkageId]/comments/[commentId]": { as: "owner", path: () => `${A()}/comments/${ids.comment}`, body: () => ({ resolved: true }) },
  "PUT /api/builds/[buildId]/linkages/[linkageId]/graph":             { as: "owner", path: () => `${E()}/graph`, body: () => ({ baseRevision: 1, graph: demoPitchLinkage() }) },
  "POST /api/builds/[buildId]/linkages/[linkageId]/joints/[jointId]/photos": { as: "owner", path: () => `${A()}/joints/j-stick-fwd/photos`, body: () => ({ fileId: ids.file }) },
  "POST /api/builds/[buildId]/linkages/[linkageId]/signoffs":         { as: "reviewer", path: () => `${E()}/signoffs`, body: () => ({ revision: 1, statement: "Inspected revision 1; nothing to add." }) },
  "POST /api/builds/[buildId]/log":                                   { as: "owner", path: () => `${B()}/log`, body: () => ({ date: "2026-11-30", hours: 2.5, title: "Fitted the aft pushrod", text: "Torqued and marked.", systems: ["pitch"], fileIds: [ids.file] }) },
  "PATCH /api/builds/[buildId]/log/[entryId]":                        { as: "owner", path: () => `${B()}/log/${ids.entry}`, body: () => ({ hours: 3, title: "Fixture entry, corrected" }) },
  "POST /api/builds/[buildId]/members":                               { as: "owner", path: () => `${B()}/members`, body: () => ({ email: unique("member"), role: "viewer" }) },
  "PATCH /api/builds/[buildId]/members/[userId]":                     { as: "owner", path: () => `${B()}/members/${ids.extra}`, body: () => ({ role: "viewer" }) },
  "POST /api/builds/[buildId]/parts":                                 { as: "owner", path: () => `${B()}/parts`, body: rodEnd },
  "PUT /api/builds/[buildId]/parts/[partId]":                         { as: "owner", path: () => `${B()}/parts/${ids.buildPart}`, body: rodEnd },
  "POST /api/builds/[buildId]/parts/import":                          { as: "owner", path: () => `${B()}/parts/import`, body: () => ({ csv: csv(), skipBadRows: false }) },
  "PATCH /api/me":                                                    { as: "owner", path: () => "/api/me", body: () => ({ unitSystem: "SI" }) },
  "PATCH /api/me/notifications":                                      { as: "owner", path: () => "/api/me/notifications", body: () => ({ notify: "none" }) },
  // An account of its own (a changed password ends its sessions), never sent valid.
  "POST /api/me/password":                                            { as: "pw", path: () => "/api/me/password", body: () => ({ currentPassword: TEST_PASSWORD, newPassword: "another long password" }), control: false },
  "POST /api/parts":                                                  { as: "owner", path: () => "/api/parts", body: rodEnd },
  "PUT /api/parts/[partId]":                                          { as: "owner", path: () => `/api/parts/${ids.ownPart}`, body: rodEnd },
  "POST /api/parts/import":                                           { as: "owner", path: () => "/api/parts/import", body: () => ({ csv: csv(), dryRun: false }) },
  "POST /api/sign-up":                                                { as: "anon", path: () => "/api/sign-up", body: () => ({ name: "Fuzz Person", email: unique("signup"), password: "a long enough password" }) },
  "POST /api/sign-up/confirm":                                        { as: "anon", path: () => "/api/sign-up/confirm", body: () => ({ token: `fuzz${randomUUID().replace(/-/g, "")}` }), control: false }, // a well-formed token no link holds: its control is sign-up.test.ts
  "POST /api/verify":                                                 { as: "anon", path: () => "/api/verify", body: () => ({ fingerprint: "0".repeat(64) }) },
};

// ---- the generators ---------------------------------------------------------------------------

/** Text written into the JSON as is (a number JSON.stringify cannot write, nesting), made only when the body is sent. */
class Raw { constructor(readonly make: () => string) {} }
const RAW = (text: string | (() => string)) => new Raw(typeof text === "string" ? () => text : text);
function toJson(v: unknown) {
  const raws: string[] = [];
  const text = JSON.stringify(v, (_, x) => (x instanceof Raw ? `\u0001RAW:${raws.push(x.make()) - 1}\u0001` : x));
  return raws.length ? text.replace(/"\\u0001RAW:(\d+)\\u0001"/g, (_, i) => raws[Number(i)]) : text;
}

type Path = (string | number)[];
function paths(v: unknown, at: Path = [], out: { path: Path; value: unknown }[] = []) {
  if (at.length) out.push({ path: at, value: v });
  if (Array.isArray(v)) v.forEach((x, i) => paths(x, [...at, i], out));
  else if (v && typeof v === "object") for (const [k, x] of Object.entries(v)) paths(x, [...at, k], out);
  return out;
}
function setAt(body: unknown, path: Path, value: unknown) {
  const copy = JSON.parse(JSON.stringify(body)) as Record<string | number, unknown>;
  let o = copy;
  for (const k of path.slice(0, -1)) o = o[k] as Record<string | number, unknown>;
  o[path[path.length - 1]] = value;
  return copy;
}
const typeOf = (v: unknown) => (v === null ? "null" : Array.isArray(v) ? "array" : typeof v);
/** A value of another JSON type than `v` (never null: a nullable field may take it). */
const WRONG: Record<string, unknown[]> = {
  string: [7, -1, 0.5, true, false, [], {}, ["x"], { x: 1 }, RAW("1e400")],
  number: ["1", "", "one", true, [], {}, [1], { n: 1 }],
  boolean: ["true", "false", 1, 0, [], {}],
  array: ["x", 7, true, {}, { 0: "x" }],
  object: ["x", 7, true, [], [{}]],
};
const insertAt = (s: string, at: number, piece: string) => s.slice(0, at % (s.length + 1)) + piece + s.slice(at % (s.length + 1));
const lone = fc.oneof(fc.integer({ min: 0xd800, max: 0xdbff }), fc.integer({ min: 0xdc00, max: 0xdfff })).map((c) => String.fromCharCode(c));
const nest = (depth: number, open: string, inner: string, close: string) => open.repeat(depth) + inner + close.repeat(depth);

/** A valid body with one field made wrong. */
function oneFieldWrong(base: Record<string, unknown>) {
  const all = paths(base);
  const strings = all.filter((p) => typeof p.value === "string");
  const numbers = all.filter((p) => typeof p.value === "number");
  const pick = <T,>(list: T[]) => fc.nat().map((i) => list[i % list.length]);
  const at = (list: typeof all, f: (p: (typeof all)[number]) => fc.Arbitrary<[unknown, string]>) =>
    pick(list).chain((p) => f(p).map(([value, note]) => ({ kind: "", make: () => toJson(setAt(base, p.path, value)), note: `${p.path.join(".")}: ${note}` })));
  const kinds: [string, fc.Arbitrary<Omit<Case, "route">>][] = [
    ["wrong type", at(all.filter((p) => p.value !== null), (p) => pick(WRONG[typeOf(p.value)]).map((v) => [v, `a ${typeOf(v)} for a ${typeOf(p.value)}`]))],
    ["deep value", at(all, () => fc.tuple(fc.integer({ min: 2, max: 30_000 }), fc.constantFrom("", "\\u0000", "\\ud800")).map(([d, inner]) => [RAW(() => nest(d, "[", `"${inner}"`, "]")), `nested ${d} deep${inner ? `, ${inner} at the bottom` : ""}`]))],
  ];
  if (strings.length) kinds.push(
    ["NUL", at(strings, (p) => fc.nat().map((i) => [insertAt(p.value as string, i, "\u0000"), "a NUL inside"]))],
    ["lone surrogate", at(strings, (p) => fc.tuple(fc.nat(), lone).map(([i, s]) => [insertAt(p.value as string, i, s), `a lone surrogate U+${s.charCodeAt(0).toString(16)}`]))],
    // Every text cap is at most 20,000 characters but the parts file's, 2 MB.
    ["over-long", at(strings, (p) => fc.constantFrom(...(p.path.includes("csv") ? [2_000_001] : [25_000, 100_000])).map((len) => [RAW(() => JSON.stringify((p.value as string) + "x".repeat(len))), `${len} more characters`]))],
  );
  if (numbers.length) kinds.push(["huge number", at(numbers, () => fc.constantFrom("1e400", "-1e400", "1" + "0".repeat(400), "9".repeat(309) + ".5e9").map((t) => [RAW(t), t.length > 12 ? `${t.slice(0, 8)}… (${t.length} digits)` : t]))]);
  return fc.oneof(...kinds.map(([kind, arb]) => arb.map((c) => ({ ...c, kind }))));
}

/** A whole body that is no object of the route's at all. */
function wholeBodyJunk(base: Record<string, unknown>) {
  const text = toJson(base);
  const key = Object.keys(base)[0];
  return fc.oneof(
    fc.oneof(fc.integer(), fc.double({ noNaN: true, noDefaultInfinity: true }), fc.string(), fc.boolean(), fc.constant(null), fc.array(fc.jsonValue({ maxDepth: 2 }), { maxLength: 5 }))
      .map((v) => ({ kind: "not an object", make: () => JSON.stringify(v), note: typeOf(v) })),
    fc.oneof(
      fc.nat({ max: text.length - 1 }).map((k) => [text.slice(0, k), `cut after ${k} characters`]),
      fc.constantFrom("{", "}", "{,}", "{\"a\":1,}", "{'a':1}", "{\"a\":undefined}", "{\"a\":NaN}", "{\"a\":\"\\x41\"}", "{\"a\":\"\\u12\"}", "{\"a\" 1}", "[1,]", "nul", "tru", "{\"a\":01}", "{\"a\":\"\n\"}")
        .map((t) => [t, t.replace(/\n/g, "\\n")]),
      fc.string({ unit: "binary", maxLength: 40 }).map((s) => [`{${s}`, "{ then junk"]),
      fc.constant(["", "empty"]),
    ).map(([raw, note]) => ({ kind: "not JSON", make: () => raw, note })),
    // 100,000 deep: far past any recursion limit (about 10,000 frames).
    fc.tuple(fc.integer({ min: 1_000, max: 100_000 }), fc.constantFrom("array", "object", "under a field"), fc.constantFrom("1", "\"\\u0000\"", "\"\\udc00\"")).map(([d, how, inner]) => ({
      kind: "deep nesting",
      make: () => (how === "array" ? nest(d, "[", inner, "]") : how === "object" ? nest(d, "{\"a\":", inner, "}") : `{"${key}":${nest(d, "[", inner, "]")}}`),
      note: `${d} deep, ${how}, ${inner} at the bottom`,
    })),
    fc.constantFrom(0xff, 0xc0, 0xed).map((b) => ({ kind: "bad UTF-8", make: () => Buffer.concat([Buffer.from("{"), Buffer.from([b]), Buffer.from(text.slice(1))]), note: `byte 0x${b.toString(16)} after the brace` })),
  );
}

/** Rarely: a body over the 5 MB cap (a valid body padded with one more field). */
const oversize = (base: Record<string, unknown>) =>
  fc.constant({ kind: "over the size cap", make: () => toJson({ ...base, padding: "x".repeat(5 * 1024 * 1024 + 1) }), note: "5 MB + 1 padding" });

function casesFor(route: string, count: number, seed: number): Case[] {
  const base = ROUTES[route].body();
  const arb = fc.oneof({ arbitrary: oneFieldWrong(base), weight: 60 }, { arbitrary: wholeBodyJunk(base), weight: 40 }, { arbitrary: oversize(base), weight: 1 });
  return fc.sample(arb, { seed, numRuns: count }).map((c) => ({ route, ...c }));
}

// ---- sending ------------------------------------------------------------------------------------

async function send(c: Case): Promise<Answer> {
  const r = ROUTES[c.route];
  const cookie = clients[r.as].cookie;
  const res = await fetch(`${APP_URL}${r.path()}`, {
    method: c.route.split(" ")[0],
    redirect: "manual",
    headers: { "content-type": "application/json", ...(cookie ? { cookie } : {}) },
    body: c.make() as string | Uint8Array<ArrayBuffer>,
  });
  return { status: res.status, text: await res.text() };
}

/** What this test's callers wrote to the audit trail (the fingerprint leaves audit_events out: sign-ins write it). */
async function fingerprint() {
  const audit = await testDb("audit_events").where((q) => q.where("build_id", ids.build).orWhereIn("user_id", [ids.owner, ids.reviewer, ids.admin, ids.extra, ids.pw])).count<{ count: string }[]>("* as count");
  return { ...(await snapshot()), audit_events: String(audit[0].count) };
}
const changed = (a: Record<string, string>, b: Record<string, string>) => Object.keys({ ...a, ...b }).filter((k) => a[k] !== b[k]);

function wrong(c: Case, a: Answer): string | null {
  if (a.status < 400 || a.status >= 500) return `HTTP ${a.status}`;
  // Signed out by a request before: every later answer of this caller would be a 401 that tests nothing.
  if (a.status === 401 && ROUTES[c.route].as !== "anon") return "HTTP 401: the caller's session has ended";
  let body: { error?: { code?: unknown; message?: unknown } };
  try { body = JSON.parse(a.text); } catch { return `HTTP ${a.status} with a body that is not JSON: ${a.text.slice(0, 120)}`; }
  if (typeof body.error?.code !== "string" || typeof body.error?.message !== "string") return `HTTP ${a.status} without {error: {code, message}}`;
  return null;
}
const shown = (c: Case) => {
  const raw = c.make();
  const s = typeof raw === "string" ? raw : raw.toString("latin1");
  return s.length > 240 ? `${JSON.stringify(s.slice(0, 200))}… (${s.length} characters)` : JSON.stringify(s);
};

beforeAll(async () => {
  const [owner, reviewer, admin, extra, pw] = await Promise.all(["fuzz-owner", "fuzz-reviewer", "fuzz-admin", "fuzz-extra", "fuzz-password"].map(makeUser));
  await testDb("users").where({ id: admin.id }).update({ is_site_admin: true });
  Object.assign(ids, { owner: owner.id, reviewer: reviewer.id, admin: admin.id, extra: extra.id, pw: pw.id });
  const made = await makeBuild({ owner, reviewer, extra });
  ids.build = made.buildId;
  ids.demo = made.linkageId;
  await addRevision(ids.demo, demoPitchLinkage(), owner.id); // revision 2: the demo run with its findings
  const [empty] = await testDb("linkages").insert({ build_id: ids.build, name: "Empty run", system: "pitch", current_revision: 1 }).returning("id");
  ids.empty = empty.id;
  await testDb("linkage_revisions").insert({ linkage_id: ids.empty, revision: 1, graph: JSON.stringify(emptyGraph("Empty run", "pitch")), author_id: owner.id });
  const [comment] = await testDb("comments").insert({ build_id: ids.build, linkage_id: ids.demo, subject_type: "linkage", subject_id: ids.demo, author_id: owner.id, body: "Fixture comment", revision: 2 }).returning("id");
  ids.comment = comment.id;
  const [entry] = await testDb("log_entries").insert({ build_id: ids.build, date: "2026-11-29", hours: 1.5, title: "Fixture entry", systems: ["pitch"] }).returning("id");
  ids.entry = entry.id;
  const spec = JSON.stringify(rodEnd().spec);
  ids.buildPart = (await testDb("parts").insert({ build_id: ids.build, kind: "rodEnd", part_number: "FZ-B", spec }).returning("id"))[0].id;
  ids.ownPart = (await testDb("parts").insert({ owner_user_id: owner.id, kind: "rodEnd", part_number: "FZ-P", spec }).returning("id"))[0].id;
  ids.file = await fixtureFile(ids.build, owner.id);
  [clients.owner, clients.reviewer, clients.admin, clients.pw] = await Promise.all([owner, reviewer, admin, pw].map((u) => signIn(u.email)));
  clients.anon = anonymous();
});
afterAll(() => testDb.destroy());

describe("fuzzed bodies on every JSON route", () => {
  it("covers every POST, PUT and PATCH route that takes JSON", () => {
    const writes = apiRoutes().filter((r) => /^(POST|PUT|PATCH) /.test(r));
    expect(writes.filter((r) => !ROUTES[r] && !NOT_JSON[r]), "write routes neither fuzzed nor listed as taking no JSON").toEqual([]);
    expect(Object.keys(ROUTES).filter((r) => !writes.includes(r)), "fuzzed routes that no longer exist").toEqual([]);
  });

  it(`answers ${CASES} generated bodies with a 4xx JSON error and changes nothing (seed ${SEED})`, async () => {
    const t0 = performance.now();
    const routes = Object.keys(ROUTES);
    const cases = routes.flatMap((r, i) => casesFor(r, Math.floor(CASES / routes.length) + (i < CASES % routes.length ? 1 : 0), SEED + i));
    // Shuffled the same way every run (by the seed), so a batch mixes routes and kinds.
    const order = cases.map((c, i) => ({ c, k: createHash("sha1").update(`${SEED}:${i}`).digest("hex") })).sort((a, b) => (a.k < b.k ? -1 : 1)).map((x) => x.c);
    const tGen = performance.now() - t0;

    const failures: string[] = [];
    const byKind: Record<string, { n: number; ms: number }> = {};
    const classes: Record<string, number> = {};
    const fail = (i: number, c: Case, why: string) => {
      const k = `${c.kind} → ${why.split(":")[0]}`;
      classes[k] = (classes[k] ?? 0) + 1;
      failures.push(`#${i} ${c.route} [${c.kind}: ${c.note}] → ${why}\n    body ${shown(c)}`);
    };
    let tSnap = 0;
    let replays = 0;
    let before = await fingerprint();
    for (let start = 0; start < order.length; start += BATCH) {
      const batch = order.slice(start, start + BATCH);
      let next = 0;
      await Promise.all(Array.from({ length: CONCURRENCY }, async () => {
        while (next < batch.length) {
          const i = next++;
          const c = batch[i];
          const t1 = performance.now();
          const a = await send(c).catch((e) => ({ status: 0, text: String(e) }));
          const k = (byKind[c.kind] ??= { n: 0, ms: 0 });
          k.n++;
          k.ms += performance.now() - t1;
          const why = wrong(c, a);
          if (why) fail(start + i, c, `${why}: ${a.text.slice(0, 200)}`);
        }
      }));
      const s0 = performance.now();
      const after = await fingerprint();
      tSnap += performance.now() - s0;
      const tables = changed(before, after);
      if (tables.length && ++replays > 1) {
        failures.push(`batch from #${start}: ${tables.join(", ")} changed (not replayed: one batch was)`);
        before = after;
      } else if (tables.length) {
        // Name the request: the batch again, one at a time, the database fingerprinted after each.
        let prev = after;
        let named = false;
        for (const [i, c] of batch.entries()) {
          const a = await send(c);
          const now = await fingerprint();
          const t = changed(prev, now);
          if (t.length) { fail(start + i, c, `answered ${a.status} and changed ${t.join(", ")}`); named = true; }
          prev = now;
        }
        if (!named) failures.push(`batch from #${start}: ${tables.join(", ")} changed, and no request of it changes them when sent again`);
        before = prev;
      }
    }
    const secs = (performance.now() - t0) / 1000;
    console.log(`fuzz: ${order.length} cases on ${routes.length} routes in ${secs.toFixed(1)} s (${(order.length / secs).toFixed(0)} requests/s; generating ${(tGen / 1000).toFixed(1)} s, fingerprints ${(tSnap / 1000).toFixed(1)} s); seed ${SEED}\n  ${Object.entries(byKind).map(([k, v]) => `${k} ${v.n} (${(v.ms / v.n).toFixed(0)} ms each)`).join(", ")}`);
    const summary = Object.entries(classes).sort((x, y) => y[1] - x[1]).map(([k, v]) => `${v} × ${k}`).join("; ");
    expect(failures, `${failures.length} fuzzed requests were answered wrongly (${summary}); reproduce with ${REPRO}\n${failures.slice(0, 25).join("\n")}`).toEqual([]);
  }, 600_000);

  it("takes each route's valid body (so the fuzzed bodies were wrong in the one field)", async () => {
    const refused: string[] = [];
    // The save last: it moves the empty run to revision 2, and the sign-off signs revision 1.
    const last = "PUT /api/builds/[buildId]/linkages/[linkageId]/graph";
    for (const [route, r] of Object.entries(ROUTES).sort(([x], [y]) => Number(x === last) - Number(y === last))) {
      if (r.control === false) continue;
      const body = toJson(r.body());
      const a = await send({ route, kind: "valid", make: () => body, note: "" });
      if (a.status >= 300) refused.push(`${route}: HTTP ${a.status} ${a.text.slice(0, 200)}`);
    }
    expect(refused).toEqual([]);
  });
});

