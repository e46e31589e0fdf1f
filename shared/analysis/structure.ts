/**
 * Structure of the graph (domain.md §2): a control run should be a tree of pushrods between mounted
 * cranks, driven from an input and ending at a surface. Anything else is a finding, never an exception.
 * Structure mounts are ground: they are left out of the loop check, since every crank pivoting on the
 * airframe closes a "loop" through it (that is how a linkage works, not a fault).
 */
import { PORTS } from "../linkage/schema";
import { KIND_NAMES, type Role } from "../linkage/kinds";
import { endName, portName } from "../linkage/names";
import { SRC } from "../hardware";
import type { Finding } from "./types";
import { type Ctx, jointLabel, jointsAt, nodeLabel, otherNode } from "./context";
import type { Loads } from "./loads";
import { finding, jointSubject, linkageSubject, nodeSubject } from "./format";
import type { CableCtx } from "./cable-circuits";

/** Roles that turn on a pivot (and so need one joined to a mount), and roles that carry the run's load. */
const PIVOTED = new Set<Role | undefined>(["input", "crank"]);
const LOAD_PATH = new Set<Role | undefined>(["link", "crank", "horn", "surface", "tension"]);

function hasHardware(hw: Ctx["joints"][number]["hardware"] | undefined): boolean {
  return !!hw && !!(hw.rodEnd || hw.bolt || hw.nut || hw.bearing || hw.jamNut || hw.washerUnderHead || hw.washerUnderNut);
}

/**
 * Joints that carry no hardware of their own: a terminal screwed into a turnbuckle (two tension members), and a
 * cable lying over a pulley or through a fairlead (the guide's own mounting carries the bolt).
 */
function needsNoHardware(ctx: Ctx, j: number): boolean {
  const f = ctx.jFrom[j], t = ctx.jTo[j];
  const rf = ctx.nodeRole[f], rt = ctx.nodeRole[t];
  if (rf === "tension" && rt === "tension") return true;
  return (rf === "guide" && ctx.joints[j].from.port === "cable") || (rt === "guide" && ctx.joints[j].to.port === "cable");
}

export function structureFindings(ctx: Ctx, loads: Loads, out: Finding[], cc?: CableCtx) {
  const { nodes, joints } = ctx;
  const linkageId = ctx.graph.name || "linkage";

  // Joints: ends that do not resolve (only in graphs that skipped the schema), ports, hardware.
  for (let j = 0; j < joints.length; j++) {
    const jt = joints[j];
    const f = ctx.jFrom[j], t = ctx.jTo[j];
    if (f < 0 || t < 0) {
      out.push(finding("joint-end-missing", "caution", jointSubject(jt.id), f < 0 && t < 0
        ? "A joint between two parts that are not in the drawing is left out of the check."
        : `A joint from ${f < 0 ? endName(nodes[t], jt.to.port) : endName(nodes[f], jt.from.port)} to a part that is not in the drawing is left out of the check.`, SRC.structure));
      continue;
    }
    if (f === t) {
      out.push(finding("joint-to-itself", "caution", jointSubject(jt.id), `The joint ${jointLabel(ctx, j)} joins a part to itself; it is left out of the check.`, SRC.structure));
      continue;
    }
    checkPort(ctx, j, nodes[f], jt.from.port, out);
    checkPort(ctx, j, nodes[t], jt.to.port, out);
    if (!hasHardware(jt.hardware) && !needsNoHardware(ctx, j)) {
      // A cable's or turnbuckle's terminal is held by a bolt or clevis pin and its nut; it has no rod end.
      const terminal = ctx.nodeRole[f] === "tension" || ctx.nodeRole[t] === "tension";
      out.push(finding("joint-hardware-missing", "caution", jointSubject(jt.id),
        `The joint ${jointLabel(ctx, j)} has no hardware recorded (${terminal ? "no bolt or clevis pin and nut holding the terminal" : "no bolt, nut, rod end or bearing"}), so nothing about it can be checked. Fill in its joint card.`, SRC.structure));
    }
  }

  let inputCount = 0;
  for (let n = 0; n < nodes.length; n++) {
    const node = nodes[n];
    const role = ctx.nodeRole[n];
    if (role === "input") inputCount++;
    if (ctx.degree[n] === 0) {
      out.push(finding("part-unconnected", "caution", nodeSubject(node.id), `${nodeLabel(node)} is not joined to anything. Connect it or remove it.`, SRC.structure));
      continue;
    }
    if (role === "link") {
      for (const end of ["a", "b"]) {
        if (jointsAt(ctx, n, end).length === 0)
          out.push(finding("pushrod-end-open", "caution", nodeSubject(node.id),
            `Pushrod ${nodeLabel(node)} has nothing on its ${portName(node.kind, end)} end. A pushrod carries load only between two joints; connect both ends.`, SRC.structure));
      }
    }
    if (PIVOTED.has(role)) {
      let mounted = false;
      for (const k of jointsAt(ctx, n, "pivot")) {
        const far = otherNode(ctx, k, n);
        if (far >= 0 && ctx.nodeRole[far] === "mount") { mounted = true; break; }
      }
      if (!mounted)
        out.push(finding("pivot-unmounted", "caution", nodeSubject(node.id),
          `${nodeLabel(node)} has no pivot joint to a structure mount, so nothing reacts its pivot load. Join its pivot to the structure it turns on.`, SRC.structure));
    }
  }

  if (nodes.length > 0 && inputCount === 0)
    out.push(finding("no-input", "caution", linkageSubject(linkageId),
      `The drawing has no stick, wheel or pedal, so no load can be put into it and no loads are computed. Add the input the pilot moves.`, SRC.structure));

  for (const inp of loads.inputs) {
    if (!inp.reachesSurface) {
      const node = nodes[inp.node];
      out.push(finding("input-reaches-no-surface", "caution", nodeSubject(node.id),
        `Following the run from ${nodeLabel(node)} never reaches a control surface, so the run is incomplete or broken and the loads past the break are not known. Connect the run through to its surface.`, SRC.structure));
    }
  }

  if (inputCount > 0) {
    for (let n = 0; n < nodes.length; n++) {
      const node = nodes[n];
      if (!loads.driven[n] && ctx.degree[n] > 0 && LOAD_PATH.has(ctx.nodeRole[n]))
        out.push(finding("part-not-driven", "advisory", nodeSubject(node.id),
          `No input drives ${nodeLabel(node)}, so its loads are not known and its margins and those of its joints are not checked. Connect it to the run or check the joints leading to it.`, SRC.structure));
    }
  }

  // Loops: union-find over the parts that are not ground. A joint closing a cycle is reported.
  const parent = new Int32Array(nodes.length);
  for (let i = 0; i < parent.length; i++) parent[i] = i;
  const find = (x: number) => {
    while (parent[x] !== x) { parent[x] = parent[parent[x]]; x = parent[x]; }
    return x;
  };
  for (let j = 0; j < joints.length; j++) {
    const f = ctx.jFrom[j], t = ctx.jTo[j];
    if (f < 0 || t < 0 || f === t) continue;
    if (ctx.nodeRole[f] === "mount" || ctx.nodeRole[t] === "mount") continue;
    if (cc && cc.skipLoop[j]) continue; // cable runs: taken below as whole chains
    union(f, t, j);
  }
  // A cable chain between two parts already joined by pushrods and cranks closes a loop; chains meeting
  // other chains form a closed circuit, which is how cables work, not a loop.
  if (cc) for (const [x, y, j] of cc.chainLinks) if (find(x) === find(y)) loopFinding(j);

  function union(f: number, t: number, j: number) {
    const a = find(f), b = find(t);
    if (a === b) loopFinding(j);
    else parent[a] = b;
  }
  function loopFinding(j: number) {
    out.push(finding("linkage-loop", "caution", jointSubject(joints[j].id),
      `The joint ${jointLabel(ctx, j)} closes a loop in the run. Loads in a closed loop share out by stiffness, which this check does not model: each path is taken to carry the full force, and the result should be checked by hand.`, SRC.structure));
  }
}

function checkPort(ctx: Ctx, j: number, node: Ctx["nodes"][number], port: string, out: Finding[]) {
  const ports = PORTS[node.kind];
  if (ports && !ports.includes(port))
    out.push(finding("joint-port-unknown", "caution", jointSubject(ctx.joints[j].id), `The joint ${jointLabel(ctx, j)} attaches to "${port}" of ${nodeLabel(node)}, which a ${KIND_NAMES[node.kind].toLowerCase()} does not have; that end carries no load in the check.`, SRC.structure));
}
