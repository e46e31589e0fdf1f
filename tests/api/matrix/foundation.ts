import { randomUUID } from "node:crypto";
import { emptyGraph } from "@/shared/linkage/schema";
import { anonymous, confirmToken } from "../../support/http";
import { anyone, edit, manage, read, signedIn, type Ctx, type Row } from "./types";

/** Site-admin routes: no member of a build is a site admin, so every signed-in caller here gets 403 (admins: tests/api/admin.test.ts). */
const adminOnly = { owner: 403, builder: 403, reviewer: 403, viewer: 403, outsider: 403, anon: 401 };

const unique = () => `new-${randomUUID().slice(0, 8)}@tests.linkwright.test`;
const B = (c: Ctx) => `/api/builds/${c.buildId}`;
const L = (c: Ctx) => `${B(c)}/linkages/${c.linkageId}`;

// prettier-ignore
export const rows: Record<string, Row> = {
  "GET /api/auth/[...nextauth]":                        { expect: anyone(200), path: () => "/api/auth/csrf" },
  "POST /api/auth/[...nextauth]":                       { expect: anyone(200), path: () => "/api/auth/_log", body: () => ({}) },
  "GET /api/health":                                    { expect: anyone(200), path: () => "/api/health" },
  "POST /api/sign-up":                                  { expect: anyone(202), path: () => "/api/sign-up", body: () => ({ name: "New Person", email: unique(), password: "long enough password" }) },
  // Whoever opens the link mailed to a new address makes that account (the link is the proof of the address).
  "POST /api/sign-up/confirm":                          { expect: anyone(200), path: () => "/api/sign-up/confirm", send: async (client) => {
    const email = unique();
    await anonymous().request("POST", "/api/sign-up", { name: "New Person", email, password: "long enough password" });
    return client.request("POST", "/api/sign-up/confirm", { token: await confirmToken(email) });
  } },
  "GET /api/me":                                        { expect: signedIn(200), path: () => "/api/me" },
  "PATCH /api/me":                                      { expect: signedIn(200), path: () => "/api/me", body: () => ({ unitSystem: "US" }) },
  // A wrong current password (a right one would end the shared test users' sessions): signed in 400, else 401.
  "POST /api/me/password":                              { expect: { ...signedIn(400), anon: 401 }, path: () => "/api/me/password", body: () => ({ currentPassword: "not the password at all", newPassword: "a long enough new password" }) },
  "POST /api/analyze":                                  { expect: signedIn(200), path: () => "/api/analyze", body: () => ({ graph: emptyGraph() }) },
  "GET /api/admin/users":                              { expect: adminOnly, path: () => "/api/admin/users" },
  "PATCH /api/admin/users/[userId]":                    { expect: adminOnly, path: (c) => `/api/admin/users/${c.extraId}`, body: () => ({ isSiteAdmin: true }) },
  "GET /api/builds":                                    { expect: signedIn(200), path: () => "/api/builds" },
  "POST /api/builds":                                   { expect: signedIn(201), path: () => "/api/builds", body: () => ({ name: "Another build" }) },
  "GET /api/builds/[buildId]":                          { expect: read, path: B },
  "PATCH /api/builds/[buildId]":                        { expect: manage(200), path: B, body: () => ({ name: "Renamed" }) },
  "DELETE /api/builds/[buildId]":                       { expect: manage(200), path: B },
  "GET /api/builds/[buildId]/members":                  { expect: read, path: (c) => `${B(c)}/members` },
  "POST /api/builds/[buildId]/members":                 { expect: manage(201), path: (c) => `${B(c)}/members`, body: () => ({ email: unique(), role: "viewer" }) },
  "PATCH /api/builds/[buildId]/members/[userId]":       { expect: manage(200), path: (c) => `${B(c)}/members/${c.extraId}`, body: () => ({ role: "viewer" }) },
  "DELETE /api/builds/[buildId]/members/[userId]":      { expect: manage(200), path: (c) => `${B(c)}/members/${c.extraId}` },
  "GET /api/builds/[buildId]/invitations":              { expect: manage(200), path: (c) => `${B(c)}/invitations` },
  "POST /api/builds/[buildId]/invitations":             { expect: manage(201), path: (c) => `${B(c)}/invitations`, body: () => ({ email: unique(), role: "reviewer" }) },
  "DELETE /api/builds/[buildId]/invitations/[invitationId]": { expect: manage(200), path: (c) => `${B(c)}/invitations/${c.invitationId}` },
  // Sent to the outsider's address: anyone else signed in is refused (403), the invitation staying open.
  "POST /api/invitations/[token]":                      { expect: { owner: 403, builder: 403, reviewer: 403, viewer: 403, outsider: 200, anon: 401 }, path: (c) => `/api/invitations/${c.token}` },
  "GET /api/builds/[buildId]/linkages":                 { expect: read, path: (c) => `${B(c)}/linkages` },
  "POST /api/builds/[buildId]/linkages":                { expect: edit(201), path: (c) => `${B(c)}/linkages`, body: () => ({ name: "Roll run", system: "roll" }) },
  "GET /api/builds/[buildId]/linkages/[linkageId]":     { expect: read, path: L },
  "PATCH /api/builds/[buildId]/linkages/[linkageId]":   { expect: edit(200), path: L, body: () => ({ name: "Pitch run, renamed" }) },
  "DELETE /api/builds/[buildId]/linkages/[linkageId]":  { expect: edit(200), path: L },
  "GET /api/builds/[buildId]/linkages/[linkageId]/file": { expect: read, path: (c) => `${L(c)}/file` },
  "GET /api/builds/[buildId]/linkages/[linkageId]/graph": { expect: read, path: (c) => `${L(c)}/graph` },
  "PUT /api/builds/[buildId]/linkages/[linkageId]/graph": { expect: edit(200), path: (c) => `${L(c)}/graph`, body: () => ({ baseRevision: 1, graph: emptyGraph("Pitch run", "pitch") }) },
};

