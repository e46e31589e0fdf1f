/** Authorization rows and malformed-input cases of the build-records routes (issue 6). */
import { randomUUID } from "node:crypto";
import { demoPitchLinkage } from "@/shared/demo";
import { testDb } from "../../support/db";
import { fixtureFile, putTestObject, testImage, upload, uploadRaw } from "../../support/upload";
import type { Client } from "../../support/http";
import { anyone, edit, comment, read, signedIn, type BadInput, type Ctx, type Row } from "./types";
import { PDFDocument } from "pdf-lib";

/** A PDF with a record fingerprint in its keywords that names no sign-off: checked, and answered "no match". */
async function unknownRecord() {
  const d = await PDFDocument.create();
  d.addPage();
  d.setKeywords([`linkwright-record-fingerprint:${"0".repeat(64)}`]);
  return Buffer.from(await d.save());
}

const B = (c: Ctx) => `/api/builds/${c.buildId}`;
const L = (c: Ctx) => `${B(c)}/linkages/${c.linkageId}`;
const J = (c: Ctx, joint = "j-stick-fwd") => `${L(c)}/joints/${joint}`;

/** The linkage's revision 1 becomes the demo pitch run, so joints exist. */
async function demoGraph(c: Ctx) {
  await testDb("linkage_revisions").where({ linkage_id: c.linkageId, revision: 1 }).update({ graph: JSON.stringify(demoPitchLinkage()) });
  return {};
}
const rodEnd = (pn = `RE-${randomUUID().slice(0, 6)}`) => ({ kind: "rodEnd", partNumber: pn, description: "test", spec: { thread: "1/4-28", hand: "RH", ballBore: 0.25, ratedUltimate: 4200 } }); // invented rating, no source
const CSV = () => `kind,partNumber,thread,hand,ballBore,ratedUltimate\nrodEnd,CSV-${randomUUID().slice(0, 6)},1/4-28,RH,0.25,4200\n`; // invented rating, no source
const entry = () => ({ date: "2026-11-30", hours: 2.5, title: "Fitted the aft pushrod", text: "", systems: ["pitch"] });

/** Personal-library rows: each user acts on a part of their own (found through /api/me). */
async function personalParts(c: Ctx) {
  const x: Record<string, string> = {};
  for (const u of Object.values(c.users)) {
    const [p] = await testDb("parts").insert({ owner_user_id: u.id, kind: "rodEnd", part_number: `P-${randomUUID().slice(0, 6)}`, spec: JSON.stringify(rodEnd().spec) }).returning("id");
    x[u.id] = p.id;
  }
  return x;
}
async function asOwnPart(client: Client, c: Ctx, method: string, body?: unknown) {
  const me = await client.request("GET", "/api/me");
  const id = me.status === 200 ? c.x[me.body.user?.id ?? me.body.id] ?? randomUUID() : randomUUID();
  return client.request(method, `/api/parts/${id}`, body);
}

const read202 = { ...read, owner: 202, builder: 202, reviewer: 202, viewer: 202 };
/** An export job of the build's owner, finished (with a stored CSV) or failed. */
const exportJob = (status: "done" | "failed") => async (c: Ctx) => {
  const key = `builds/${c.buildId}/exports/fixture-${randomUUID()}.csv`;
  if (status === "done") await putTestObject(key, Buffer.from("kind,quantity\r\n"), "text/csv");
  const [j] = await testDb("export_jobs").insert({
    build_id: c.buildId, user_id: c.users.owner.id, kind: "hardware-csv", params: "{}", label: "Hardware list CSV", status,
    ...(status === "done" ? { result_key: key, result_name: "hardware.csv", result_type: "text/csv", result_size: 15, progress: 1 } : { error: "fixture failure" }),
  }).returning("id");
  return { job: j.id as string };
};
// prettier-ignore
export const rows: Record<string, Row> = {
  "GET /api/builds/[buildId]/files":                      { expect: read, path: (c) => `${B(c)}/files` },
  "POST /api/builds/[buildId]/files":                     { expect: edit(201), path: (c) => `${B(c)}/files`, send: async (cl, c) => upload(cl, `${B(c)}/files`, { bytes: await testImage("jpeg", 40, 30), name: "witness.jpg" }) },
  "GET /api/builds/[buildId]/files/[fileId]":             { expect: read, path: (c) => `${B(c)}/files/${c.x.file}`, prepare: async (c) => ({ file: await fixtureFile(c.buildId, null) }) },
  "DELETE /api/builds/[buildId]/files/[fileId]":          { expect: edit(200), path: (c) => `${B(c)}/files/${c.x.file}`, prepare: async (c) => ({ file: await fixtureFile(c.buildId, null) }) },
  "GET /api/builds/[buildId]/linkages/[linkageId]/joints/[jointId]/photos": { expect: read, path: (c) => `${J(c)}/photos`, prepare: demoGraph },
  "POST /api/builds/[buildId]/linkages/[linkageId]/joints/[jointId]/photos": { expect: edit(201), path: (c) => `${J(c)}/photos`, prepare: demoGraph, send: async (cl, c) => upload(cl, `${J(c)}/photos`, { bytes: await testImage("png", 40, 30), name: "jam-nut.png" }) },
  "DELETE /api/builds/[buildId]/linkages/[linkageId]/joints/[jointId]/photos/[fileId]": {
    expect: edit(200), path: (c) => `${J(c)}/photos/${c.x.file}`,
    prepare: async (c) => { await demoGraph(c); const file = await fixtureFile(c.buildId, null); await testDb("joint_photos").insert({ linkage_id: c.linkageId, joint_id: "j-stick-fwd", file_id: file }); return { file }; },
  },
  "GET /api/builds/[buildId]/linkages/[linkageId]/joints/[jointId]/suggestions": { expect: read, path: (c) => `${J(c)}/suggestions`, prepare: demoGraph },
  "GET /api/builds/[buildId]/linkages/[linkageId]/revisions/[revision]/picture": {
    expect: read, path: (c) => `${L(c)}/revisions/1/picture`,
    prepare: async (c) => { const file = await fixtureFile(c.buildId, null, { kind: "linkage-picture" }); await testDb("revision_pictures").insert({ linkage_id: c.linkageId, revision: 1, file_id: file }); return {}; },
  },
  "POST /api/builds/[buildId]/linkages/[linkageId]/revisions/[revision]/picture": { expect: edit(201), path: (c) => `${L(c)}/revisions/1/picture`, send: async (cl, c) => uploadRaw(cl, `${L(c)}/revisions/1/picture`, await testImage("png", 80, 60), "image/png") },
  "GET /api/builds/[buildId]/log":                        { expect: read, path: (c) => `${B(c)}/log?system=pitch&from=2026-01-01` },
  "POST /api/builds/[buildId]/log":                       { expect: edit(201), path: (c) => `${B(c)}/log`, body: entry },
  "GET /api/builds/[buildId]/log/[entryId]":              { expect: read, path: (c) => `${B(c)}/log/${c.x.entry}`, prepare: logEntry },
  "PATCH /api/builds/[buildId]/log/[entryId]":            { expect: edit(200), path: (c) => `${B(c)}/log/${c.x.entry}`, prepare: logEntry, body: () => ({ hours: 3 }) },
  "DELETE /api/builds/[buildId]/log/[entryId]":           { expect: edit(200), path: (c) => `${B(c)}/log/${c.x.entry}`, prepare: logEntry },
  "GET /api/builds/[buildId]/activity":                   { expect: read, path: (c) => `${B(c)}/activity?limit=5` },
  "GET /api/builds/[buildId]/log/estimate":               { expect: read, path: (c) => `${B(c)}/log/estimate?from=2026-01-01&to=2026-12-31`, prepare: logEntry },
  "POST /api/builds/[buildId]/exports":                   { expect: read202, path: (c) => `${B(c)}/exports`, prepare: logEntry, body: () => ({ kind: "log-pdf", params: { from: "2026-01-01" } }) },
  "GET /api/builds/[buildId]/exports/[jobId]":            { expect: read, path: (c) => `${B(c)}/exports/${c.x.job}`, prepare: exportJob("done") },
  "POST /api/builds/[buildId]/exports/[jobId]/retry":     { expect: read202, path: (c) => `${B(c)}/exports/${c.x.job}/retry`, prepare: exportJob("failed") },
  "GET /api/builds/[buildId]/exports/[jobId]/download":   { expect: read, path: (c) => `${B(c)}/exports/${c.x.job}/download`, prepare: exportJob("done") },
  "POST /api/verify":                                     { expect: anyone(200), path: () => "/api/verify", body: () => ({ fingerprint: "0".repeat(64) }) },
  "POST /api/verify/file":                                { expect: anyone(200), path: () => "/api/verify/file", send: async (cl) => upload(cl, "/api/verify/file", { bytes: await unknownRecord(), name: "record.pdf", type: "application/pdf" }) },
  "GET /api/parts":                                       { expect: signedIn(200), path: () => "/api/parts" },
  "POST /api/parts":                                      { expect: signedIn(201), path: () => "/api/parts", body: () => rodEnd() },
  "PUT /api/parts/[partId]":                              { expect: signedIn(200), path: () => "", prepare: personalParts, send: (cl, c) => asOwnPart(cl, c, "PUT", rodEnd()) },
  "DELETE /api/parts/[partId]":                           { expect: signedIn(200), path: () => "", prepare: personalParts, send: (cl, c) => asOwnPart(cl, c, "DELETE") },
  "POST /api/parts/import":                               { expect: signedIn(201), path: () => "/api/parts/import", body: () => ({ csv: CSV() }) },
  "GET /api/parts/export":                                { expect: signedIn(200), path: () => "/api/parts/export" },
  "GET /api/builds/[buildId]/parts":                      { expect: read, path: (c) => `${B(c)}/parts` },
  "POST /api/builds/[buildId]/parts":                     { expect: edit(201), path: (c) => `${B(c)}/parts`, body: () => rodEnd() },
  "PUT /api/builds/[buildId]/parts/[partId]":             { expect: edit(200), path: (c) => `${B(c)}/parts/${c.x.part}`, prepare: buildPart, body: () => rodEnd() },
  "DELETE /api/builds/[buildId]/parts/[partId]":          { expect: edit(200), path: (c) => `${B(c)}/parts/${c.x.part}`, prepare: buildPart },
  "POST /api/builds/[buildId]/parts/import":              { expect: edit(201), path: (c) => `${B(c)}/parts/import`, body: () => ({ csv: CSV() }) },
  "GET /api/builds/[buildId]/parts/export":               { expect: read, path: (c) => `${B(c)}/parts/export` },
  "GET /api/builds/[buildId]/hardware":                   { expect: read, path: (c) => `${B(c)}/hardware`, prepare: demoGraph },
  "PUT /api/builds/[buildId]/hardware":                   { expect: edit(200), path: (c) => `${B(c)}/hardware`, prepare: demoGraph, body: () => ({ key: "jamNut|1/4-28|RH", state: "ordered" }) },
  "GET /api/builds/[buildId]/linkages/[linkageId]/checklist": { expect: read, path: (c) => `${L(c)}/checklist`, prepare: demoGraph },
  "PUT /api/builds/[buildId]/linkages/[linkageId]/checklist": { expect: comment(200), path: (c) => `${L(c)}/checklist`, prepare: demoGraph, body: () => ({ revision: 1, jointId: "j-stick-fwd", code: "jam-nut", ticked: true, note: "marked" }) },
};

async function logEntry(c: Ctx) {
  const [e] = await testDb("log_entries").insert({ build_id: c.buildId, date: "2026-11-29", hours: 1.5, title: "Fixture entry", systems: ["pitch"] }).returning("id");
  return { entry: e.id as string };
}
async function buildPart(c: Ctx) {
  const [p] = await testDb("parts").insert({ build_id: c.buildId, kind: "rodEnd", part_number: `BP-${randomUUID().slice(0, 6)}`, spec: JSON.stringify(rodEnd().spec) }).returning("id");
  return { part: p.id as string };
}

const someId = "00000000-0000-4000-8000-000000000000";
// prettier-ignore
export const badInput: BadInput = {
  "POST /api/builds/[buildId]/files": { path: (c) => `${B(c)}/files`, bodies: [[{}, "file"]] },
  "POST /api/builds/[buildId]/linkages/[linkageId]/joints/[jointId]/photos": { path: (c) => `${J(c, "j1")}/photos`, bodies: [[{ fileId: "not-a-uuid" }, "fileId"], [{}, "fileId"]] },
  "POST /api/builds/[buildId]/linkages/[linkageId]/revisions/[revision]/picture": { path: (c) => `${L(c)}/revisions/1/picture`, bodies: [[{ png: "base64…" }, "file"]] },
  "POST /api/builds/[buildId]/log": { path: (c) => `${B(c)}/log`, bodies: [[{ ...entry(), date: "2026-02-30" }, "date"], [{ ...entry(), hours: -1 }, "hours"], [{ ...entry(), title: "" }, "title"], [{ ...entry(), systems: ["wings"] }, "systems.0"]] },
  "PATCH /api/builds/[buildId]/log/[entryId]": { path: (c) => `${B(c)}/log/${someId}`, bodies: [[{ hours: "two" }, "hours"], [{ date: "yesterday" }, "date"]] },
  "POST /api/parts": { path: () => "/api/parts", bodies: [[{ ...rodEnd(), spec: { thread: "M6", hand: "RH", ballBore: 0.25, ratedUltimate: 4200 } }, "spec.thread"], [{ ...rodEnd(), kind: "sprocket" }, "kind"]] },
  "PUT /api/parts/[partId]": { path: () => `/api/parts/${someId}`, bodies: [[{ ...rodEnd(), spec: { thread: "1/4-28", ballBore: -1, ratedUltimate: 4200 } }, "spec.ballBore"]] },
  "POST /api/parts/import": { path: () => "/api/parts/import", bodies: [[{ csv: 5 }, "csv"], [{ csv: "a", skipBadRows: "yes" }, "skipBadRows"]] },
  "POST /api/builds/[buildId]/parts": { path: (c) => `${B(c)}/parts`, bodies: [[{ ...rodEnd(), partNumber: "" }, "partNumber"], [{ ...rodEnd(), spec: { thread: "1/4-28", ballBore: 0.25 } }, "spec.ratedUltimate"]] },
  "PUT /api/builds/[buildId]/parts/[partId]": { path: (c) => `${B(c)}/parts/${someId}`, bodies: [[{ ...rodEnd(), spec: "strong" }, "spec"]] },
  "POST /api/builds/[buildId]/parts/import": { path: (c) => `${B(c)}/parts/import`, bodies: [[{}, "csv"]] },
  "PUT /api/builds/[buildId]/hardware": { path: (c) => `${B(c)}/hardware`, bodies: [[{ key: "x", state: "lost" }, "state"], [{ state: "ordered" }, "key"]] },
  "POST /api/builds/[buildId]/exports": { path: (c) => `${B(c)}/exports`, bodies: [[{ kind: "zip" }, "kind"], [{ kind: "log-pdf", params: { from: "soon" } }, "params.from"], [{ kind: "checklist-pdf", params: {} }, "params.linkageId"], [{ kind: "checklist-pdf", params: { linkageId: someId } }, "params.linkageId"], [{ kind: "hardware-csv", params: { extra: 1 } }, "params"], [{ kind: "revision-record", params: { linkageId: someId } }, "params.revision"], [{ kind: "revision-record", params: { revision: 1 } }, "params.linkageId"]] },
  "POST /api/verify": { path: () => "/api/verify", bodies: [[{ fingerprint: "abc" }, "fingerprint"], [{}, "fingerprint"], [{ fingerprint: 42 }, "fingerprint"], [{ fingerprint: "0".repeat(64), extra: 1 }, "_"]] },
  "PUT /api/builds/[buildId]/linkages/[linkageId]/checklist": { path: (c) => `${L(c)}/checklist`, bodies: [[{ revision: 1, code: "polish", ticked: true }, "code"], [{ revision: 1, code: "jam-nut" }, "ticked"]] },
};
