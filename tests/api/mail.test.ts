/**
 * E-mail through the real local SMTP sink (scripts/services.mjs writes each message it receives as JSON
 * into .data/mail-sink-test/): invitations, comments and replies to followers, sign-offs and stale
 * sign-offs to the owner, with the right recipients and links, user text escaped in the HTML.
 */
import { randomUUID } from "node:crypto";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { makeBuild, makeUser, testDb, TEST_PASSWORD } from "../support/db";
import { anonymous, signIn, signUp, type Client } from "../support/http";
import { APP_URL } from "../support/env";
import { mailTo, sinkMessages } from "../support/review";
import { demoPitchLinkage, DEMO_WRONG_JOINT } from "@/shared/demo";
import type { LinkageGraph } from "@/shared/linkage/schema";

type Who = "owner" | "builder" | "reviewer" | "viewer";
const c = {} as Record<Who, Client>;
const u = {} as Record<Who, { id: string; email: string; name: string }>;
let buildId: string;
let linkageId: string;
const L = () => `/api/builds/${buildId}/linkages/${linkageId}`;
const WRONG = { type: "joint", id: DEMO_WRONG_JOINT } as const;
const BUILD_NAME = `Larkspur <b>"test"</b> & co ${randomUUID().slice(0, 4)}`;

async function save(graph: LinkageGraph) {
  const cur = await c.owner.request("GET", `${L()}/graph`);
  const r = await c.builder.request("PUT", `${L()}/graph`, { baseRevision: cur.body.revision, graph });
  expect(r.status).toBe(200);
}
const pause = (ms: number) => new Promise((r) => setTimeout(r, ms));

beforeAll(async () => {
  for (const w of ["owner", "builder", "reviewer", "viewer"] as Who[]) {
    u[w] = await makeUser(w);
    c[w] = await signIn(u[w].email);
  }
  ({ buildId, linkageId } = await makeBuild({ owner: u.owner, builder: u.builder, reviewer: u.reviewer, viewer: u.viewer }));
  await testDb("builds").where({ id: buildId }).update({ name: BUILD_NAME });
  await save(demoPitchLinkage());
});
afterAll(() => testDb.destroy());

describe("invitation e-mail", () => {
  it("goes to the invitee with a single-use link that signs them into the build with the invited role", async () => {
    const email = `invitee-${randomUUID().slice(0, 8)}@tests.linkwright.test`;
    const r = await c.owner.request("POST", `/api/builds/${buildId}/members`, { email, role: "reviewer" });
    expect(r.status).toBe(201);
    expect(r.body.mailed).toBe(true);
    const [m] = await mailTo(email);
    expect(m, "no invitation in the sink").toBeTruthy();
    expect(m.to).toEqual([email]);
    expect(m.subject).toContain(BUILD_NAME);
    const link = m.text!.match(/https?:\/\/\S+\/invite\/[A-Za-z0-9_-]+/)?.[0];
    expect(link).toBe(r.body.link);
    expect(link!.startsWith(`${APP_URL}/invite/`)).toBe(true);
    expect(m.html).toContain(`href="${link}"`);
    expect(m.html).not.toContain("<b>");
    expect(m.html).toContain("&lt;b&gt;&quot;test&quot;&lt;/b&gt; &amp; co");
    expect(m.text).toMatch(/as reviewer/);

    // The invitee opens the link: the page offers sign-in; they sign up, sign in and accept.
    const token = link!.split("/invite/")[1];
    const page = await anonymous().request("GET", `/invite/${token}`);
    expect(page.status).toBe(200);
    await signUp({ name: "Invited Person", email, password: TEST_PASSWORD, next: `/invite/${token}` });
    const invitee = await signIn(email);
    expect((await invitee.request("GET", `/api/builds/${buildId}`)).status).toBe(404);
    const accept = await invitee.request("POST", `/api/invitations/${token}`);
    expect(accept.status).toBe(200);
    expect(accept.body).toEqual({ buildId, role: "reviewer" });
    const b = await invitee.request("GET", `/api/builds/${buildId}`);
    expect(b.status).toBe(200);
    expect(b.body.role).toBe("reviewer");
    // Once only: neither the invitee again nor anyone else can use it.
    expect((await invitee.request("POST", `/api/invitations/${token}`)).status).toBe(410);
    const other = await makeUser("latecomer");
    expect((await (await signIn(other.email)).request("POST", `/api/invitations/${token}`)).status).toBe(410);
    expect((await testDb("memberships").where({ build_id: buildId, user_id: other.id })).length).toBe(0);
  });

  it("is also sent from the invitations route", async () => {
    const email = `invitee-${randomUUID().slice(0, 8)}@tests.linkwright.test`;
    const r = await c.owner.request("POST", `/api/builds/${buildId}/invitations`, { email, role: "viewer" });
    expect(r.status).toBe(201);
    const [m] = await mailTo(email);
    expect(m.text).toContain(r.body.link);
    expect(m.text).toMatch(/as viewer/);
  });
});

describe("comment e-mail", () => {
  it("goes to the followers (the owner, the commenters) but not to the author, with the text escaped and links kept", async () => {
    const before = sinkMessages().length;
    const body = "Washer looks small <script>alert(1)</script>\nsee https://example.test/a?b=1&c=2 for the table";
    const r = await c.builder.request("POST", `${L()}/comments`, { subject: WRONG, body });
    expect(r.status).toBe(201);
    const [m] = await mailTo(u.owner.email);
    expect(m.subject).toMatch(/^Comment on the joint Aft pushrod B ↔ Elevator horn, attach — /);
    expect(m.text).toContain("> Washer looks small <script>alert(1)</script>");
    expect(m.text).toContain(`${APP_URL}/builds/${buildId}/linkages/${linkageId}?focus=joint:${DEMO_WRONG_JOINT}`);
    expect(m.html).not.toContain("<script>");
    expect(m.html).toContain("&lt;script&gt;alert(1)&lt;/script&gt;");
    expect(m.html).toContain('<a href="https://example.test/a?b=1&amp;c=2" rel="noopener noreferrer nofollow">');
    await pause(300);
    const fresh = sinkMessages().slice(before);
    expect(fresh.flatMap((x) => x.to).sort()).toEqual([u.owner.email]); // not the author, not the reviewer (not following yet)

    // The reviewer replies: now the builder (a commenter) and the owner hear of it.
    const before2 = sinkMessages().length;
    const reply = await c.reviewer.request("POST", `${L()}/comments`, { subject: WRONG, body: "Agreed; fit a larger washer.", parentId: r.body.comment.id });
    expect(reply.status).toBe(201);
    await mailTo(u.builder.email);
    await pause(300);
    const got = sinkMessages().slice(before2);
    expect(got.flatMap((x) => x.to).sort()).toEqual([u.builder.email, u.owner.email].sort());
    expect(got[0].subject).toMatch(/^Reply on/);
  });

  it("honours each person's setting: none, or only @mentions", async () => {
    expect((await c.owner.request("PATCH", "/api/me/notifications", { notify: "none" })).body).toEqual({ notify: "none" });
    expect((await c.builder.request("PATCH", "/api/me/notifications", { notify: "mentions_signoffs" })).status).toBe(200);
    expect((await c.builder.request("GET", "/api/me/notifications")).body.notify).toBe("mentions_signoffs");
    const before = sinkMessages().length;
    await c.reviewer.request("POST", `${L()}/comments`, { subject: WRONG, body: "No mention here." });
    await pause(800);
    expect(sinkMessages().slice(before)).toEqual([]);
    const first = u.builder.name.split(" ")[0];
    await c.reviewer.request("POST", `${L()}/comments`, { subject: WRONG, body: `@${first} please check the torque.` });
    const got = await mailTo(u.builder.email, { min: 1 });
    expect(got.some((m) => m.text!.includes("please check the torque"))).toBe(true);
    await pause(300);
    expect(sinkMessages().slice(before).flatMap((m) => m.to)).toEqual([u.builder.email]);
    await c.owner.request("PATCH", "/api/me/notifications", { notify: "all" });
    await c.builder.request("PATCH", "/api/me/notifications", { notify: "all" });
  });
});

describe("sign-off e-mail", () => {
  it("tells the owner of a sign-off, and once when a later revision makes it stale", async () => {
    for (const code of ["jam-nut-missing", "retaining-washer-small"])
      expect((await c.reviewer.request("POST", `${L()}/acknowledgements`, { code, subject: WRONG, reason: "Accepted for the test." })).status).toBe(201);
    const s = await c.reviewer.request("POST", `${L()}/signoffs`, { revision: 2, statement: "Checked <all> joints & stops." });
    expect(s.status).toBe(201);
    const signed = (await mailTo(u.owner.email, { min: 1, ms: 5000 })).filter((m) => m.subject?.startsWith("Signed off"));
    expect(signed).toHaveLength(1);
    expect(signed[0].subject).toContain("revision 2");
    expect(signed[0].text).toContain(`${APP_URL}/builds/${buildId}/linkages/${linkageId}`);
    expect(signed[0].html).toContain("Checked &lt;all&gt; joints &amp; stops.");
    expect(signed[0].to).toEqual([u.owner.email]);

    const g = demoPitchLinkage();
    g.joints.find((j) => j.id === "j-stick-fwd")!.hardware.torque = 66;
    await save(g);
    const stale = async () => (await mailTo(u.owner.email, { min: 1 })).filter((m) => m.subject?.startsWith("Sign-off stale"));
    for (let i = 0; i < 30 && (await stale()).length === 0; i++) await pause(100);
    const one = await stale();
    expect(one).toHaveLength(1);
    expect(one[0].subject).toContain("revision 3");
    expect(one[0].text).toMatch(/revision 2 \(signed by Test reviewer\)/);
    g.joints.find((j) => j.id === "j-stick-fwd")!.hardware.torque = 67;
    await save(g);
    await pause(800);
    expect(await stale()).toHaveLength(1);
  });
});
