/**
 * What the live check covers at a part, in words for its card, the run list and the canvas's spoken name — the
 * part's side of editor/joints/coverage.ts, so that a part with no findings reads "no findings" only where a
 * check of the part itself was made. A part is one of:
 *   checked      the check computed something of the part itself and found nothing: a pushrod's margins
 *                (report.pushrods), a cable's strength margin (report.cables), a driven surface's hinge moment
 *                (report.surfaces), a turnbuckle's, pulley's or fairlead's rules judged from its records;
 *   atJoints     nothing of the part itself is checked, but checks were made at its joints (a bellcrank's bolt
 *                and holes, a structure mount's bracket…);
 *   toEnter      some of its values are still the starting values it was placed with: the check uses none of them;
 *   notChecked   nothing of the part, nor at its joints, could be checked;
 *   pending      the live check has not run yet.
 * Pure (no React), so it is unit-tested without a browser.
 */
import { counted } from "@/shared/analysis/finding-title";
import type { Report } from "@/shared/analysis/types";
import type { Joint, LinkageNode } from "@/shared/linkage/schema";

type Part = Pick<LinkageNode, "id" | "kind"> & { unentered?: readonly string[] };
type JointEnds = Pick<Joint, "id" | "from" | "to">;

export type PartCoverageState = "checked" | "atJoints" | "toEnter" | "notChecked" | "pending";
export type PartCoverage = {
  state: PartCoverageState;
  /** The card's line when the part has no findings. */
  text: string;
  /** A few words for the run list's row and the canvas's spoken name. */
  short: string;
};

const SHORT: Record<PartCoverageState, string> = {
  checked: "no findings",
  atJoints: "checked at its joints",
  toEnter: "values to enter",
  notChecked: "not checked",
  pending: "not checked yet",
};
const cov = (state: PartCoverageState, text: string): PartCoverage => ({ state, text, short: SHORT[state] });

/** What the check found for each part in one report, indexed once per report and joints list. */
type Index = {
  pushrods: Map<string, Report["pushrods"][number]>;
  cables: Map<string, Report["cables"][number]>;
  surfaces: Map<string, Report["surfaces"][number]>;
  /** Per part: how many checks were computed at the joints that touch it. */
  jointChecks: Map<string, number>;
  /** Parts joined to a cable whose size is entered (a pulley's rules are judged against it). */
  onCable: Set<string>;
};
const indexes = new WeakMap<Report, WeakMap<readonly JointEnds[], Index>>();

function indexOf(report: Report, joints: readonly JointEnds[], parts: readonly Part[]): Index {
  let byJoints = indexes.get(report);
  if (!byJoints) indexes.set(report, (byJoints = new WeakMap()));
  let ix = byJoints.get(joints);
  if (ix) return ix;
  const made = new Map(report.joints.map((j) => [j.jointId, (j.checks ?? []).filter((c) => c.status === "computed").length]));
  // A cable whose size is still a starting value: the pulley's groove and size are not judged against it.
  const sizedCable = new Set(parts.filter((p) => p.kind === "cable" && !p.unentered?.includes("size")).map((p) => p.id));
  const jointChecks = new Map<string, number>();
  const onCable = new Set<string>();
  for (const j of joints) {
    const n = made.get(j.id) ?? 0;
    for (const id of [j.from.node, j.to.node]) if (n) jointChecks.set(id, (jointChecks.get(id) ?? 0) + n);
    if (sizedCable.has(j.from.node)) onCable.add(j.to.node);
    if (sizedCable.has(j.to.node)) onCable.add(j.from.node);
  }
  ix = {
    pushrods: new Map(report.pushrods.map((r) => [r.nodeId, r])),
    cables: new Map((report.cables ?? []).map((r) => [r.nodeId, r])),
    surfaces: new Map((report.surfaces ?? []).map((r) => [r.nodeId, r])),
    jointChecks,
    onCable,
  };
  // Only cache against the joints list the parts belong to (parts change with it in the store).
  byJoints.set(joints, ix);
  return ix;
}

/** The part's own check, when the engine made one: the card's words for it, else null. */
function ownCheck(part: Part, ix: Index): string | null | { notChecked: string } {
  switch (part.kind) {
    case "pushrod": {
      const r = ix.pushrods.get(part.id);
      if (!r) return null;
      if (r.marginCompression !== null && r.marginTension !== null) return "its margins in compression and in tension were computed";
      return { notChecked: r.todo ? `its margins are not computed — ${r.todo.replace(/\.$/, "")}.` : "its margins are not computed." };
    }
    case "cable": {
      const r = ix.cables.get(part.id);
      if (!r) return null;
      if (r.margin !== null) return "its strength margin was computed";
      return { notChecked: r.driven ? "its strength margin is not computed (its size has no table row, or its circuit has no rigging tension recorded)." : "no input drives it, so its strength margin is not computed." };
    }
    case "controlSurface": {
      const r = ix.surfaces.get(part.id);
      if (!r) return null;
      return r.driven ? "the hinge moment the control run puts in was computed" : { notChecked: "no input drives it, so no hinge moment was computed." };
    }
    // Rules judged from the part's records (shared/analysis/cable-parts.ts): a record not made is itself a finding.
    case "turnbuckle":
      return "its threads showing, safetying, size and binding were judged from what is recorded";
    case "fairlead":
      return "the turn of the cable through it was judged";
    case "pulley":
      return ix.onCable.has(part.id) ? "its guards, groove and size were judged against its cable" : null;
    default:
      return null;
  }
}

/**
 * The coverage of one part with no findings of its own (a part with findings shows them instead).
 * `joints` is the linkage's joints (the ones touching the part are read), `parts` its parts.
 */
export function partCoverage(part: Part, joints: readonly JointEnds[], parts: readonly Part[], report: Report | null): PartCoverage {
  if (!report) return cov("pending", "Not checked yet: the live check has not run.");
  const ix = indexOf(report, joints, parts);
  const own = ownCheck(part, ix);
  if (typeof own === "string") return cov("checked", `No findings here from the live check: ${own}.`);
  const enter = part.unentered?.length ?? 0;
  if (enter > 0)
    return cov("toEnter", `Not checked yet: ${counted(enter, "value is", "values are")} still the starting ${enter === 1 ? "value" : "values"} (below).`);
  const atJoints = ix.jointChecks.get(part.id) ?? 0;
  if (atJoints > 0) {
    const rest = own ? `${own.notChecked.charAt(0).toUpperCase()}${own.notChecked.slice(1)}` : "The live check makes no check of this part itself.";
    return cov("atJoints", `Checked at its joints only: ${counted(atJoints, "check was", "checks were")} made there (see the joint cards). ${rest}`);
  }
  if (own) return cov("notChecked", `Not checked: ${own.notChecked}`);
  return cov("notChecked", "Not checked: the live check makes no check of this part itself, and none could be made at its joints yet.");
}
