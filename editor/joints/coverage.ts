/**
 * What the live check covers at a joint, in words for its card, the run list and the canvas — so that "no
 * findings" is never read as "passes" where nothing was checked. A joint is one of:
 *   checked      every check its hardware calls for was made, and none gave a finding;
 *   partly       some checks were made, others wait for inputs (the card's Checks box lists what to enter);
 *   notChecked   nothing at the joint could be checked yet (no bolt, pin, rod end or bearing recorded…);
 *   nothingHere  a joint with nothing of its own to check: a cable over a pulley or through a fairlead, or a
 *                cable's terminal screwed into a turnbuckle's barrel — those parts are checked on their cards
 *                (the same joints the engine asks no bolt of: shared/linkage/contacts.ts);
 *   pending      the live check has not run yet.
 * Pure (no React), so it is unit-tested without a browser.
 */
import { counted } from "@/shared/analysis/finding-title";
import type { JointResult, Report } from "@/shared/analysis/types";
import { ROLES } from "@/shared/linkage/kinds";
import { boltlessContact, guideEnd } from "@/shared/linkage/contacts";
import { indexById, partName } from "@/shared/linkage/names";
import type { Joint, LinkageNode } from "@/shared/linkage/schema";

type Part = Pick<LinkageNode, "id" | "kind" | "label">;

/** What a joint is, from its two parts and ports (not from its hardware). */
export type JointSort =
  /** A cable's run over a pulley or through a fairlead: nothing is bolted at the joint. */
  | { sort: "passThrough"; cable: Part | undefined; guide: Part }
  /** A cable's terminal screwed into a turnbuckle's barrel: no bolt of its own. */
  | { sort: "screwedEnds"; cable: Part; turnbuckle: Part }
  /** A cable's or turnbuckle's terminal on another part: a bolt or clevis pin holds it. */
  | { sort: "terminal"; end: Part }
  | { sort: "other" };

const roleOf = (p: Part | undefined) => (p ? (ROLES as Record<string, string | undefined>)[p.kind] : undefined);

export function jointSort(joint: Pick<Joint, "from" | "to">, parts: readonly Part[]): JointSort {
  const byId = indexById(parts);
  const from = byId.get(joint.from.node), to = byId.get(joint.to.node);
  if (!from || !to) return { sort: "other" };
  const ends = [{ kind: from.kind, port: joint.from.port, part: from }, { kind: to.kind, port: joint.to.port, part: to }] as const;
  // The same joints the engine asks no bolt of (shared/linkage/contacts.ts).
  const contact = boltlessContact(ends[0], ends[1]);
  if (contact === "passThrough") {
    const guide = guideEnd(ends[0], ends[1])!.part;
    const other = guide === from ? to : from;
    return { sort: "passThrough", guide, cable: other.kind === "cable" ? other : undefined };
  }
  if (contact === "screwedEnds") return from.kind === "cable" ? { sort: "screwedEnds", cable: from, turnbuckle: to } : { sort: "screwedEnds", cable: to, turnbuckle: from };
  if (roleOf(from) === "tension") return { sort: "terminal", end: from };
  if (roleOf(to) === "tension") return { sort: "terminal", end: to };
  return { sort: "other" };
}

/** A bolt, clevis pin or rod end is recorded: what the engine checks a joint's strength with. */
function hasFastener(h: Joint["hardware"]): boolean {
  return !!(h.bolt || h.clevisPin || h.rodEnd || h.bearing === "clevisPin");
}

export type CoverageState = "checked" | "partly" | "notChecked" | "nothingHere" | "pending";
export type Coverage = {
  state: CoverageState;
  /** The card's line when the joint has no findings: what is and is not checked here. */
  text: string;
  /** A few words for the run list's row and the canvas's spoken name ("no findings", "not checked"…). */
  short: string;
  /** For a joint with no checks made (notChecked): what to enter to have it checked, for the card's Checks box. */
  todo: string | null;
};

const BOLT_FOR_TERMINAL = "add the bolt or clevis pin and nut holding the terminal to have this joint checked";
const BOLT_OR_BEARING = "add a bolt, rod end or bearing to this joint to have it checked";

function nothingHereText(k: Extract<JointSort, { sort: "passThrough" | "screwedEnds" }>): string {
  if (k.sort === "passThrough") {
    const what = k.guide.kind === "pulley" ? "pulley" : k.guide.kind === "fairlead" ? "fairlead" : "guide";
    const how = what === "pulley" ? "runs over" : what === "fairlead" ? "runs through" : "is guided by";
    return `Nothing to check here: ${k.cable ? partName(k.cable) : "the cable"} ${how} ${partName(k.guide)}, and nothing is bolted at this joint. The cable and the ${what} are checked on their own cards, the ${what}'s bolt at its mounting joint.`;
  }
  return `Nothing to check here: the terminal of ${partName(k.cable)} screws into the barrel of ${partName(k.turnbuckle)}, with no bolt. The terminal, and the turnbuckle's threads and safetying, are checked on those parts' cards (and shown below).`;
}

/**
 * The coverage of one joint. `result` is the joint's entry in the report (undefined when the joint is not in
 * it); `reportReady` is false until the live check has run once.
 */
export function jointCoverage(joint: Pick<Joint, "from" | "to" | "hardware">, parts: readonly Part[], result: JointResult | undefined, reportReady: boolean): Coverage {
  if (!reportReady) return { state: "pending", text: "Not checked yet: the live check has not run.", short: "not checked yet", todo: null };
  if (!result) return { state: "notChecked", text: "Not checked: this joint is left out of the live check (see its findings).", short: "not checked", todo: null };
  const checks = result.checks ?? [];
  const made = checks.filter((c) => c.status === "computed").length;
  const open = checks.length - made;
  if (made > 0 && open === 0)
    return { state: "checked", text: `No findings here from the live check: ${counted(made, "check", "checks")} made at this joint, listed under Checks.`, short: "no findings", todo: null };
  if (made > 0)
    return { state: "partly", text: `Partly checked: no findings from the ${counted(made, "check", "checks")} made; ${counted(open, "check is", "checks are")} not made yet — what to enter is under Checks.`, short: "partly checked", todo: null };
  if (open > 0)
    return { state: "notChecked", text: "Not checked yet: no check at this joint could be made. What to enter is under Checks.", short: "not checked", todo: null };
  // No check at all: either the joint has nothing of its own to check, or it lacks what holds it.
  const k = jointSort(joint, parts);
  if ((k.sort === "passThrough" || k.sort === "screwedEnds") && !hasFastener(joint.hardware))
    return { state: "nothingHere", text: nothingHereText(k), short: "nothing to check", todo: null };
  const todo = k.sort === "terminal" ? BOLT_FOR_TERMINAL : BOLT_OR_BEARING;
  return { state: "notChecked", text: "Not checked yet: nothing at this joint could be checked. What to enter is under Checks.", short: "not checked", todo };
}

/** A report's joint results by joint id, built once per report. */
const byReport = new WeakMap<Report, Map<string, JointResult>>();
export function jointResult(report: Report | null, jointId: string): JointResult | undefined {
  if (!report) return undefined;
  let m = byReport.get(report);
  if (!m) {
    m = new Map(report.joints.map((j) => [j.jointId, j]));
    byReport.set(report, m);
  }
  return m.get(jointId);
}

const BEARING_WORDS: Record<string, string> = { rodEnd: "rod end", ballBearing: "ball bearing", plainBushing: "plain bushing", clevisPin: "clevis pin" };

/** The run list's second line of a joint: what holds it, or what it is when nothing is bolted there. */
export function jointHardwareLine(joint: Pick<Joint, "from" | "to" | "hardware">, parts: readonly Part[]): string {
  const h = joint.hardware;
  if (h.rodEnd) return h.bolt ? `rod end on a bolt ${h.bolt.size === "custom" ? "" : h.bolt.size}`.trim() : "rod end";
  if (h.clevisPin) return "clevis pin";
  if (h.bolt) return `bolt ${h.bolt.size === "custom" ? "(custom)" : h.bolt.size}${h.bearing && BEARING_WORDS[h.bearing] && h.bearing !== "rodEnd" ? `, ${BEARING_WORDS[h.bearing]}` : ""}`;
  const k = jointSort(joint, parts);
  if (k.sort === "passThrough")
    return k.guide.kind === "pulley" ? "cable over the pulley — nothing bolted here" : k.guide.kind === "fairlead" ? "cable through the fairlead — nothing bolted here" : "cable guided here — nothing bolted here";
  if (k.sort === "screwedEnds")
    return "terminal screwed into the turnbuckle — no bolt";
  if (h.bearing && BEARING_WORDS[h.bearing]) return `${BEARING_WORDS[h.bearing]}, no bolt or pin recorded yet`;
  return k.sort === "terminal" ? "no bolt or clevis pin recorded yet" : "no hardware recorded yet";
}

/** The canvas badge's words for a joint with no hardware chips: what it is, or that its hardware is missing. */
export function emptyJointChip(joint: Pick<Joint, "from" | "to">, parts: readonly Part[]): { text: string; title: string; quiet: boolean } {
  const k = jointSort(joint, parts);
  if (k.sort === "passThrough") {
    const pulley = k.guide.kind === "pulley";
    return { text: pulley ? "over pulley" : k.guide.kind === "fairlead" ? "in fairlead" : "guided", quiet: true, title: `The cable ${pulley ? "runs over" : "runs through"} ${partName(k.guide)}: nothing is bolted here, nothing to check at this joint` };
  }
  if (k.sort === "screwedEnds") return { text: "screwed in", quiet: true, title: "A terminal screwed into a turnbuckle's barrel: no bolt, nothing to check at this joint (the parts are checked on their cards)" };
  if (k.sort === "terminal") return { text: "no bolt", quiet: false, title: "No bolt or clevis pin recorded holding the terminal yet: not checked" };
  return { text: "no hardware", quiet: false, title: "No hardware recorded for this joint yet: not checked" };
}
