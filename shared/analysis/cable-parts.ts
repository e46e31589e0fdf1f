/**
 * Rules of the parts a cable runs through (domain.md §6), each with its source: turnbuckles (threads showing,
 * safetied, cannot bind over the travel, made for the cable), pulleys (groove for the cable, close guards,
 * large enough for the cable, within their rating), fairleads (3° at most), and guides mounted on structure.
 */
import { CABLE_DIAMETER, CABLE_SIZES, CABLE_SRC, MAX_FAIRLEAD_TURN, MAX_TURNBUCKLE_THREADS, minPulleyDiameter, SRC } from "../hardware";
import type { LinkageNode } from "../linkage/schema";
import type { AnalysisSettings, Finding } from "./types";
import { type Ctx, nodeLabel, otherNode } from "./context";
import type { Loads } from "./loads";
import { marginOfSafety } from "./allowables";
import { finding, fmt, fmtMargin, nodeSubject, num } from "./format";
import { unenteredOf } from "./unentered";

const SIZE_KEY = ["size"] as const, CONSTRUCTION_KEY = ["construction"] as const, GROOVE_KEY = ["grooveFor"] as const;
const DIAMETER_KEY = ["diameter"] as const, WRAP_KEY = ["wrapAngle"] as const;

type CableNode = Extract<LinkageNode, { kind: "cable" }>;
const MOVING = new Set(["input", "crank", "horn"]);

/** The cables joined to a part (on any port). */
function cablesAt(ctx: Ctx, n: number): CableNode[] {
  const out: CableNode[] = [];
  const m = ctx.ports[n];
  if (!m) return out;
  for (const port in m) for (const k of m[port]) {
    const o = otherNode(ctx, k, n);
    const node = o >= 0 ? ctx.nodes[o] : undefined;
    if (node?.kind === "cable") out.push(node);
  }
  return out;
}

export function cablePartFindings(ctx: Ctx, loads: Loads, s: AnalysisSettings, out: Finding[]) {
  for (let n = 0; n < ctx.nodes.length; n++) {
    const node = ctx.nodes[n];
    if (node.kind === "turnbuckle") turnbuckleFindings(ctx, n, node, out);
    else if (node.kind === "pulley" || node.kind === "fairlead") {
      guideMounted(ctx, n, out);
      if (node.kind === "fairlead") fairleadFindings(node, out);
      else pulleyFindings(ctx, n, node, loads, s, out);
    }
  }
}

function turnbuckleFindings(ctx: Ctx, n: number, node: Extract<LinkageNode, { kind: "turnbuckle" }>, out: Finding[]) {
  const p = node.props;
  const subj = nodeSubject(node.id);
  const name = nodeLabel(node);
  const shown = [p.threadsShowingA, p.threadsShowingB];
  if (shown.some((v) => v === undefined))
    out.push(finding("turnbuckle-threads-unrecorded", "caution", subj,
      `${name}: not checked — record how many threads of each terminal show outside the barrel (${MAX_TURNBUCKLE_THREADS} at most at either end).`, CABLE_SRC.turnbuckleThreads));
  const worst = Math.max(...shown.filter((v): v is number => v !== undefined), 0);
  if (worst > MAX_TURNBUCKLE_THREADS)
    out.push(finding("turnbuckle-threads-showing", "hazard", subj,
      `${name} has ${worst} threads showing outside the barrel; no more than ${MAX_TURNBUCKLE_THREADS} may show at either end, or too little thread is engaged to hold the load. Use a longer cable or screw both ends in equally.`,
      CABLE_SRC.turnbuckleThreads, [num("threads showing", worst, ""), num("most allowed", MAX_TURNBUCKLE_THREADS, "")]));
  if (p.locking === undefined)
    out.push(finding("turnbuckle-locking-unrecorded", "caution", subj, `${name}: record how it is safetied — locking clips or safety wire.`, CABLE_SRC.turnbuckleSafety));
  else if (p.locking === "none")
    out.push(finding("turnbuckle-not-safetied", "hazard", subj,
      `${name} is not safetied: a turnbuckle left unlocked can unwind under vibration and lose the circuit's tension. Safety it with locking clips or safety wire per its method.`, CABLE_SRC.turnbuckleSafety));
  // 14 CFR 23.689(e): a turnbuckle on a part with angular motion must not bind over the travel.
  let onMoving = false;
  const m = ctx.ports[n];
  if (m) for (const port in m) for (const k of m[port]) {
    const o = otherNode(ctx, k, n);
    if (o >= 0 && MOVING.has(ctx.nodeRole[o] ?? "")) onMoving = true;
  }
  if (p.travelCheck === "binds")
    out.push(finding("turnbuckle-binds", "hazard", subj,
      `${name} binds over the travel: a turnbuckle joined to a moving part must line up with its cable at every position. Attach it through a fork or eye that lets it align, or move it away from the moving part.`, CABLE_SRC.turnbuckleBind));
  else if (p.travelCheck === undefined && onMoving)
    out.push(finding("turnbuckle-binding-unchecked", "caution", subj,
      `${name} is joined to a part that swings: not checked whether it can bind. Move the control to both ends of its travel and record that the turnbuckle lines up with the cable and cannot bind.`, CABLE_SRC.turnbuckleBind));
  for (const c of cablesAt(ctx, n)) {
    if (unenteredOf(node, SIZE_KEY).length || unenteredOf(c, SIZE_KEY).length) continue; // starting values: values-unentered
    if (CABLE_SIZES.indexOf(p.size) < CABLE_SIZES.indexOf(c.props.size)) {
      out.push(finding("turnbuckle-undersized", "hazard", subj,
        `${name} is made for ${p.size} in cable but joins ${nodeLabel(c)}, a ${c.props.size} in cable: it will not develop the cable's strength. Use a turnbuckle made for ${c.props.size} in cable.`,
        { kind: "commonPractice", text: "a turnbuckle is sized to develop the strength of its cable" }));
      break;
    }
  }
}

function guideMounted(ctx: Ctx, n: number, out: Finding[]) {
  const node = ctx.nodes[n];
  const m = ctx.ports[n];
  if (!m || ctx.degree[n] === 0) return;
  let mounted = false;
  for (const port in m) if (port !== "cable") for (const k of m[port]) {
    const o = otherNode(ctx, k, n);
    if (o >= 0 && ctx.nodeRole[o] === "mount") mounted = true;
  }
  if (!mounted)
    out.push(finding("guide-unmounted", "caution", nodeSubject(node.id),
      `${nodeLabel(node)} is not joined to a structure mount, so nothing carries the load the cable puts on it. Join it to the structure it is fixed to.`, SRC.structure));
  for (const k of m.cable ?? []) {
    const o = otherNode(ctx, k, n);
    const port = ctx.jFrom[k] === n ? ctx.joints[k].to.port : ctx.joints[k].from.port;
    if (o >= 0 && ctx.nodes[o].kind === "cable" && port !== "run")
      out.push(finding("guide-on-cable-end", "caution", nodeSubject(node.id),
        `${nodeLabel(node)} is joined to an end of ${nodeLabel(ctx.nodes[o])}. A pulley or fairlead guides a cable along its length: join it to the cable's run, and the cable's ends to the parts it pulls.`, SRC.structure));
  }
}

function fairleadFindings(node: Extract<LinkageNode, { kind: "fairlead" }>, out: Finding[]) {
  const t = node.props.turnAngle;
  const subj = nodeSubject(node.id);
  if (t === undefined)
    out.push(finding("fairlead-turn-unrecorded", "caution", subj, `${nodeLabel(node)}: not checked — record the angle the cable turns through it (${MAX_FAIRLEAD_TURN}° at most).`, CABLE_SRC.fairlead));
  else if (Math.abs(t) > MAX_FAIRLEAD_TURN)
    out.push(finding("fairlead-turn", "hazard", subj,
      `${nodeLabel(node)} turns the cable ${fmt(Math.abs(t), 1)}°; a fairlead may change a cable's direction by ${MAX_FAIRLEAD_TURN}° at most, or the cable wears through it. Line the fairlead up with the cable, or use a pulley for the turn.`,
      CABLE_SRC.fairlead, [num("turn", Math.abs(t), "°"), num("most allowed", MAX_FAIRLEAD_TURN, "°")]));
}

function pulleyFindings(ctx: Ctx, n: number, node: Extract<LinkageNode, { kind: "pulley" }>, loads: Loads, s: AnalysisSettings, out: Finding[]) {
  const p = node.props;
  const subj = nodeSubject(node.id);
  const name = nodeLabel(node);
  const cables = cablesAt(ctx, n);
  if (p.guards === "missing")
    out.push(finding("pulley-guards-missing", "hazard", subj, `${name} has no guard pins: a slack or jerked cable can leave the groove and jam. Fit closely fitted guards.`, CABLE_SRC.pulleyFit));
  else if (p.guards === undefined)
    out.push(finding("pulley-guards-unrecorded", "caution", subj, `${name}: not checked — record whether its guard pins are fitted.`, CABLE_SRC.pulleyFit));
  for (const c of cables.slice(0, 1)) {
    // Each rule is judged only on values entered (values-unentered says what to enter): the groove and the guard
    // need the cable's size, the pulley's diameter the size and construction too.
    if (unenteredOf(c, SIZE_KEY).length) break;
    const d = CABLE_DIAMETER[c.props.size];
    if (p.grooveFor === undefined)
      out.push(finding("pulley-groove-unrecorded", "caution", subj, `${name}: not checked — record the cable size its groove is made for (it carries ${c.props.size} in cable).`, CABLE_SRC.pulleyFit));
    else if (p.grooveFor !== c.props.size && !unenteredOf(node, GROOVE_KEY).length)
      out.push(finding("pulley-groove-mismatch", "hazard", subj,
        `${name} has a groove for ${p.grooveFor} in cable but carries ${nodeLabel(c)}, ${c.props.size} in. A pulley must correspond to its cable; use the pulley made for ${c.props.size} in.`, CABLE_SRC.pulleyFit));
    if (p.guards === "fitted" && p.guardGap !== undefined && p.guardGap >= d)
      out.push(finding("pulley-guard-gap", "hazard", subj,
        `${name}: its guard stands ${fmt(p.guardGap, 3)} in from the flange, as wide as the ${fmt(d, 3)} in cable or wider, so the cable can slip past it. Close the guard up.`,
        CABLE_SRC.guardGap, [num("guard gap", p.guardGap, "in"), num("cable diameter", d, "in")]));
    if (unenteredOf(c, CONSTRUCTION_KEY).length) break;
    const min = minPulleyDiameter(c.props.size, c.props.construction);
    if (!min)
      out.push(finding("nonflexible-over-pulley", "hazard", subj,
        `${nodeLabel(c)} is 1×19 nonflexible strand, which is not made to run over pulleys; over ${name} it fatigues and breaks. Use 7×19 flexible cable here.`, CABLE_SRC.nonflexible));
    else if (p.diameter < min.inches - 1e-9 && !unenteredOf(node, DIAMETER_KEY).length)
      out.push(finding("pulley-too-small", "caution", subj,
        `${name} is ${fmt(p.diameter)} in across; for ${c.props.size} in ${c.props.construction.replace("x", "×")} cable the pulley should be at least ${fmt(min.inches)} in, or the cable fatigues where it bends. Use a larger pulley.`,
        min.source, [num("pulley diameter", p.diameter, "in"), num("minimum", min.inches, "in")]));
  }
  // Its load: the largest resultant put on it by a cable (recorded on its cable joints), limit.
  let r = 0, from = unenteredOf(node, WRAP_KEY).length ? n + 1 : 0;
  for (const k of ctx.ports[n]?.cable ?? []) { r = Math.max(r, loads.jointRadial[k]); from ||= loads.jointFrom[k]; }
  if (from) return; // its load rests on starting values: the unentered finding says which
  if (r > 0 && p.ratedLoad !== undefined) {
    const req = r * s.ultimateFactor * s.cableFactor;
    const ms = marginOfSafety(p.ratedLoad, req);
    if (ms < 0)
      out.push(finding("pulley-overloaded", "hazard", subj,
        `${name} is rated ${fmt(p.ratedLoad)} lbf but must carry ${fmt(req)} lbf ultimate (${fmt(r)} lbf limit from the cable turned ${fmt(p.wrapAngle, 0)}°, limit × ${fmt(s.ultimateFactor, 2)} × ${fmt(s.cableFactor, 2)} cable-system factor) — margin ${fmtMargin(ms)}. Use a stronger pulley or a smaller wrap.`,
        CABLE_SRC.cableFactor, [num("required ultimate", req, "lbf"), num("rating", p.ratedLoad, "lbf"), num("margin", ms, "")]));
  } else if (r > 0 && p.ratedLoad === undefined) {
    out.push(finding("pulley-rating-missing", "caution", subj,
      `${name}: its load is not checked — it carries ${fmt(r)} lbf limit; enter the maker's rated load.`, CABLE_SRC.pulleyLoad, [num("limit load", r, "lbf")]));
  }
}
