import "server-only";
/**
 * The review e-mails, in our own words, each as plain text and as HTML. Every piece of text a person
 * typed (names, comments, statements, build names) is escaped before it goes into the HTML, and only
 * http(s) addresses become links.
 */
import { sendMail } from "./mail";
import { appUrl } from "./urls";
import { ROLE_LABEL, type Role } from "@/shared/roles";
import type { Recipient } from "@/db/users";
import type { Subject } from "@/shared/analysis/types";

export function escapeHtml(s: string) {
  return s.replace(/&/g, "&amp;").replace(/</g, "&lt;").replace(/>/g, "&gt;").replace(/"/g, "&quot;").replace(/'/g, "&#39;");
}

const URL_RE = /\bhttps?:\/\/[^\s<>"']+[^\s<>"'.,;:!?)\]]/g;

/** Escaped text with line breaks kept and plain http(s) addresses made into links. */
export function textToHtml(s: string) {
  let out = "";
  let last = 0;
  for (const m of s.matchAll(URL_RE)) {
    out += escapeHtml(s.slice(last, m.index));
    const url = m[0];
    out += `<a href="${escapeHtml(url)}" rel="noopener noreferrer nofollow">${escapeHtml(url)}</a>`;
    last = (m.index ?? 0) + url.length;
  }
  out += escapeHtml(s.slice(last));
  return out.replace(/\r?\n/g, "<br>\n");
}

type Body = { heading: string; lines: string[]; quote?: string; action: { label: string; url: string }; footer?: string };

function render(b: Body) {
  const text = [
    b.heading,
    "",
    ...b.lines,
    ...(b.quote !== undefined ? ["", ...b.quote.split(/\r?\n/).map((l) => `> ${l}`)] : []),
    "",
    `${b.action.label}: ${b.action.url}`,
    "",
    "—",
    b.footer ?? "Sent by Linkwright. You can change which review e-mails you get from the review panel of any linkage.",
  ].join("\n");
  const html = `<!doctype html><html><body style="font-family:system-ui,sans-serif;font-size:14px;color:#1d2733;max-width:560px">
<h2 style="font-size:16px">${escapeHtml(b.heading)}</h2>
${b.lines.map((l) => `<p>${escapeHtml(l)}</p>`).join("\n")}
${b.quote !== undefined ? `<blockquote style="border-left:3px solid #c8d0da;margin:0;padding:4px 12px;color:#333">${textToHtml(b.quote)}</blockquote>` : ""}
<p><a href="${escapeHtml(b.action.url)}" style="display:inline-block;background:#1d2733;color:#fff;padding:6px 12px;border-radius:4px;text-decoration:none">${escapeHtml(b.action.label)}</a></p>
<p style="font-size:12px;color:#667">${escapeHtml(b.action.url)}</p>
<hr style="border:none;border-top:1px solid #dde"><p style="font-size:12px;color:#667">${escapeHtml(b.footer ?? "Sent by Linkwright. You can change which review e-mails you get from the review panel of any linkage.")}</p>
</body></html>`;
  return { text, html };
}

export const linkageUrl = (buildId: string, linkageId: string, subject?: Subject) =>
  `${appUrl()}/builds/${buildId}/linkages/${linkageId}${subject && subject.type !== "linkage" ? `?focus=${subject.type}:${encodeURIComponent(subject.id)}` : ""}`;

// ---- invitation ------------------------------------------------------------------------------

export async function sendInvitationMail(i: { to: string; buildName: string; role: Role; inviterName: string; link: string; expiresAt: string }) {
  const body = render({
    heading: `You're invited to the build "${i.buildName}"`,
    lines: [
      `${i.inviterName} has asked you to join "${i.buildName}" on Linkwright as ${ROLE_LABEL[i.role].toLowerCase()}.`,
      `The link below works once and closes on ${i.expiresAt.slice(0, 10)}. Sign in (or create an account with this e-mail address) after opening it.`,
    ],
    action: { label: "Open the invitation", url: i.link },
    footer: "Sent by Linkwright because a build owner entered this address. If you did not expect it, you can ignore this message.",
  });
  return sendMail({ to: i.to, subject: `Invitation to "${i.buildName}" on Linkwright`, ...body });
}

// ---- accounts --------------------------------------------------------------------------------
// Sent to whatever address was typed on the sign-up page, so they carry no text the requester typed.

/** The link that makes the account (a new address). */
export async function sendSignUpConfirmMail(i: { to: string; link: string; hours: number }) {
  const body = render({
    heading: "Finish creating your Linkwright account",
    lines: [
      "Someone, we hope you, asked to create a Linkwright account with this e-mail address.",
      `To finish, open the link below within ${i.hours} hours. It works once; then sign in with the e-mail and password you chose.`,
    ],
    action: { label: "Finish creating my account", url: i.link },
    footer: "Sent by Linkwright because this address was entered on its sign-up page. If that was not you, ignore this message: no account is made without the link.",
  });
  return sendMail({ to: i.to, subject: "Finish creating your Linkwright account", ...body });
}

/** The address already has an account: how to get in instead. */
export async function sendAlreadyRegisteredMail(i: { to: string; signInLink: string }) {
  const body = render({
    heading: "You already have a Linkwright account",
    lines: [
      "Someone, we hope you, asked to create a Linkwright account with this e-mail address, which already has one. No second account was made and nothing was changed.",
      "Sign in with this address and your password instead. Once signed in, you can change your password under Your account (your name at the top of every page).",
    ],
    action: { label: "Sign in", url: i.signInLink },
    footer: "Sent by Linkwright because this address was entered on its sign-up page. If that was not you, you can ignore this message.",
  });
  return sendMail({ to: i.to, subject: "You already have a Linkwright account", ...body });
}

// ---- comments --------------------------------------------------------------------------------

/** Does the text @mention this person (by first name, full name or the part of the address before @)? */
export function mentions(body: string, r: { name: string; email: string }) {
  const b = body.toLowerCase();
  const tags = [r.name.trim().split(/\s+/)[0], r.name.trim().replace(/\s+/g, ""), r.email.split("@")[0]].filter((t) => t && t.length >= 2);
  return tags.some((t) => new RegExp(`(^|[^\\w@])@${t.toLowerCase().replace(/[.*+?^${}()|[\]\\]/g, "\\$&")}(?![\\w])`).test(b));
}

export async function notifyComment(c: {
  audience: Recipient[];
  authorId: string;
  authorName: string;
  buildId: string;
  buildName: string;
  linkageId: string;
  linkageName: string;
  subject: Subject;
  subjectLabel: string;
  body: string;
  isReply: boolean;
}) {
  const url = linkageUrl(c.buildId, c.linkageId, c.subject);
  const sent: string[] = [];
  for (const r of c.audience) {
    if (r.id === c.authorId) continue;
    if (r.notify === "none") continue;
    if (r.notify === "mentions_signoffs" && !mentions(c.body, r)) continue;
    const body = render({
      heading: c.isReply ? `${c.authorName} replied on ${c.subjectLabel}` : `${c.authorName} commented on ${c.subjectLabel}`,
      lines: [`Linkage "${c.linkageName}" in the build "${c.buildName}".`],
      quote: c.body,
      action: { label: "Open the thread", url },
    });
    const subject = `${c.isReply ? "Reply" : "Comment"} on ${c.subjectLabel} — ${c.linkageName}`;
    if (await sendMail({ to: r.email, subject, ...body })) sent.push(r.email);
  }
  return sent;
}

// ---- sign-offs -------------------------------------------------------------------------------

export async function notifySignoff(s: { owners: Recipient[]; reviewerId: string; reviewerName: string; buildId: string; buildName: string; linkageId: string; linkageName: string; revision: number; statement: string }) {
  for (const r of s.owners) {
    if (r.notify === "none" || r.id === s.reviewerId) continue;
    const body = render({
      heading: `${s.reviewerName} signed off revision ${s.revision} of "${s.linkageName}"`,
      lines: [`Build "${s.buildName}". The sign-off covers revision ${s.revision} exactly; any later change to the linkage will mark it stale.`, "Statement:"],
      quote: s.statement,
      action: { label: "Open the linkage", url: linkageUrl(s.buildId, s.linkageId) },
    });
    await sendMail({ to: r.email, subject: `Signed off: ${s.linkageName}, revision ${s.revision}`, ...body });
  }
}

export async function notifyStale(s: { owners: Recipient[]; editorId: string; editorName: string; buildId: string; buildName: string; linkageId: string; linkageName: string; signed: { revision: number; reviewerName: string }[]; newRevision: number }) {
  for (const r of s.owners) {
    if (r.notify === "none") continue;
    const list = s.signed.map((x) => `revision ${x.revision} (signed by ${x.reviewerName})`).join(", ");
    const body = render({
      heading: `The sign-off of "${s.linkageName}" is now stale`,
      lines: [
        `${s.editorName} saved revision ${s.newRevision} of "${s.linkageName}" in the build "${s.buildName}".`,
        `The sign-off of ${list} no longer covers the linkage as it stands. A reviewer needs to sign the new revision.`,
      ],
      action: { label: "Open the linkage", url: linkageUrl(s.buildId, s.linkageId) },
    });
    await sendMail({ to: r.email, subject: `Sign-off stale: ${s.linkageName} changed to revision ${s.newRevision}`, ...body });
  }
}
