/**
 * Flap, trim and other secondary inputs: the force must come from a stated source — the designer's figure,
 * or the lever rule (shared/hardware/design-loads.ts) for a lever, crank or wheel. The build's default force
 * for other inputs has no published source behind it, so using it is a caution.
 */
import { DESIGN_LOAD_SRC, leverRuleForce } from "../hardware";
import type { AnalysisSettings, Finding } from "./types";
import { type Ctx, nodeLabel } from "./context";
import { finding, fmt, nodeSubject, num } from "./format";
import { unenteredOf } from "./unentered";

const GRIP = ["gripArm"] as const;

export function secondaryInputFindings(ctx: Ctx, s: AnalysisSettings, out: Finding[]) {
  const system = ctx.graph.system;
  if (system !== "flap" && system !== "trim") return;
  for (let n = 0; n < ctx.nodes.length; n++) {
    if (ctx.nodeRole[n] !== "input") continue;
    const node = ctx.nodes[n];
    const p = node.props as { designForce?: number; forceSource?: "designer" | "leverRule"; gripArm?: number };
    if (node.kind === "stick" && p.forceSource === "leverRule" && unenteredOf(node, GRIP).length) {
      // The rule's force rests on the grip arm: a starting value gives no figure to state.
      out.push(finding("secondary-force-lever-rule", "advisory", nodeSubject(node.id),
        `${nodeLabel(node)}: the design force comes from the lever rule, (1 + R)/3 × 50 lbf held between 50 and 150 lbf, where R is the grip arm — still a starting value. Enter the grip arm (or the designer's figure, where the plans give one) for the force.`,
        DESIGN_LOAD_SRC.lever));
    } else if (node.kind === "stick" && p.forceSource === "leverRule" && p.gripArm !== undefined) {
      out.push(finding("secondary-force-lever-rule", "advisory", nodeSubject(node.id),
        `${nodeLabel(node)}: the design force is ${fmt(leverRuleForce(p.gripArm), 0)} lbf by the lever rule, (1 + ${fmt(p.gripArm, 2)})/3 × 50 lbf, held between 50 and 150 lbf. Use the designer's figure instead where the plans give one.`,
        DESIGN_LOAD_SRC.lever, [num("design force", leverRuleForce(p.gripArm), "lbf")]));
    } else if (p.designForce === undefined) {
      out.push(finding("secondary-force-default", "caution", nodeSubject(node.id),
        `${nodeLabel(node)} moves a ${system} control and its force is the build's default of ${fmt(s.pilotForce.other, 0)} lbf, which no published rule gives for it. Enter the designer's figure${node.kind === "stick" ? ", or choose the lever rule for a lever, crank or wheel" : ""}.`,
        DESIGN_LOAD_SRC.lever, [num("force used", s.pilotForce.other, "lbf")]));
    }
  }
}
