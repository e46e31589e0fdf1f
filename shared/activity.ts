/**
 * How the activity list words each recorded action (db/audit.ts). Every action the code writes needs a line here:
 * tests/shared/activity.test.ts reads the audit calls in db/, lib/ and app/ and fails on one without words.
 */
export const ACTION_TEXT: Record<string, string> = {
  "build.create": "created the build",
  "build.update": "changed the build details",
  "build.delete": "deleted the build",
  "linkage.create": "added a linkage",
  "linkage.update": "renamed a linkage",
  "linkage.delete": "deleted a linkage",
  "linkage.picture": "kept a picture of a linkage for the log",
  "linkage.signoff": "signed off a linkage revision",
  "member.add": "added a member",
  "member.role": "changed a member's role",
  "member.remove": "removed a member",
  "invitation.create": "sent an invitation",
  "invitation.accept": "joined through an invitation",
  "demo.seed": "set up the demo build",
  "comment.create": "commented on a linkage",
  "comment.reply": "replied to a comment",
  "comment.edit": "edited a comment",
  "comment.resolve": "resolved a review thread",
  "comment.reopen": "reopened a review thread",
  "finding.acknowledge": "acknowledged a finding",
  "finding.unacknowledge": "withdrew an acknowledgement",
  "checklist.tick": "ticked or cleared a checklist item",
  "hardware.state": "changed a hardware item's state",
  "joint.photo": "added a photo to a joint",
  "log.create": "wrote a log entry",
  "log.update": "changed a log entry",
  "log.delete": "deleted a log entry",
  "file.delete": "deleted a file",
  "admin.site-admin": "changed who is a site administrator",
};

const quoted = (v: unknown) => (typeof v === "string" && v.trim() ? `“${v.trim()}”` : null);
const revisionOf = (v: unknown) => (typeof v === "number" && Number.isInteger(v) ? ` (revision ${v})` : "");

/**
 * The words of one event, naming what it was about where the event recorded it (a linkage's or log entry's name,
 * a tick or its clearing). An action without words (an old or unknown one) reads as "did something", never as its code.
 */
export function activityText(action: string, detail: Record<string, unknown> = {}): string {
  const name = quoted(detail.name);
  switch (action) {
    case "linkage.create": if (name) return `added the linkage ${name}`; break;
    case "linkage.delete": if (name) return `deleted the linkage ${name}`; break;
    case "linkage.update": if (name) return `renamed a linkage to ${name}`; if (typeof detail.system === "string") return "moved a linkage to another control system"; break;
    case "linkage.picture": return `kept a picture of a linkage${revisionOf(detail.revision)} for the log`;
    case "linkage.signoff": if (typeof detail.revision === "number") return `signed off revision ${detail.revision} of a linkage`; break;
    case "checklist.tick": if (typeof detail.ticked === "boolean") return detail.ticked ? "ticked a checklist item" : "cleared a checklist tick"; break;
    case "log.create": { const t = quoted(detail.title); if (t) return `wrote the log entry ${t}`; break; }
  }
  return ACTION_TEXT[action] ?? "did something in this build";
}
