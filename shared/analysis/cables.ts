/**
 * Cables and wheels (domain.md §1 wheel row, §6): each cable's strength against the ultimate tension, the
 * circuit rules (tension only, rigging tension within the designer's range at its temperature), the smallest
 * cable of a primary system, and the wheel's pitch force and roll couple against the table's minimums.
 * Turnbuckle, pulley and fairlead rules are in cable-parts.ts. Every rule names its source.
 */
import { breakingStrength, CABLE_DIAMETER, CABLE_SRC, MIN_PRIMARY_CABLE, TERMINAL_EFFICIENCY, TERMINAL_NAMES, SRC } from "../hardware";
import { wheelCouple } from "../linkage/kinds/controlWheel";
import type { AnalysisSettings, CableResult, Finding } from "./types";
import { type Ctx, nodeLabel } from "./context";
import type { Loads } from "./loads";
import type { CableCtx } from "./cable-circuits";
import { marginOfSafety } from "./allowables";
import { finding, fmt, fmtMargin, nodeSubject, num } from "./format";
import { cablePartFindings } from "./cable-parts";
import { TENSION_KEYS, unenteredOf } from "./unentered";

const SIZE_KEY = ["size"] as const;

/** Systems whose cables are primary controls (14 CFR 23.689(a)(1): aileron, elevator, rudder). */
export const PRIMARY_SYSTEMS = new Set(["pitch", "roll", "yaw"]);
/** Rigging measured this far from the temperature the range is given at: compare with the designer's chart. common practice, no source */
export const RIGGING_TEMPERATURE_SPREAD = 10; // °F
/** Wheel minimums (14 CFR 23.397(b)): pitch 100 lbf; roll 40·D in·lbf. */
export const WHEEL_PITCH_MIN = 100; // 14 CFR 23.397(b)
export const WHEEL_ROLL_MIN_PER_IN = 40; // 14 CFR 23.397(b)
/** Wheel design values (14 CFR 23.397(b)): pitch 200 lbf; roll 50·D in·lbf. */
export const WHEEL_PITCH_DESIGN = 200; // 14 CFR 23.397(b)
export const WHEEL_ROLL_DESIGN_PER_IN = 50; // 14 CFR 23.397(b)

export function cableResults(ctx: Ctx, cc: CableCtx, loads: Loads, s: AnalysisSettings): CableResult[] {
  const out: CableResult[] = [];
  for (let n = 0; n < ctx.nodes.length; n++) {
    const node = ctx.nodes[n];
    if (node.kind !== "cable" && node.kind !== "turnbuckle") continue;
    const ch = cc.chainOf[n] >= 0 ? cc.chains[cc.chainOf[n]] : null;
    const t = loads.pushrodAxial[n];
    const p = cc.pretension[n];
    const req = t * s.ultimateFactor * s.cableFactor;
    const r: CableResult = {
      nodeId: node.id, kind: node.kind, limitTension: t, ultimateRequired: req, pretension: Number.isNaN(p) ? null : p,
      inCircuit: !!ch && ch.circuit >= 0, breakingStrength: null, terminalEfficiency: null, allowable: null, margin: null,
      driven: loads.driven[n] === 1,
    };
    // Starting values of its own, or of a part its tension comes through: not checked (shared/analysis/unentered.ts).
    if (node.kind === "cable" && unenteredOf(node, TENSION_KEYS).length === 0) {
      const mbs = breakingStrength(node.props.size, node.props.construction, node.props.material);
      const eff = Math.min(TERMINAL_EFFICIENCY[node.props.terminalA], TERMINAL_EFFICIENCY[node.props.terminalB]);
      r.terminalEfficiency = eff;
      if (mbs) {
        r.breakingStrength = mbs.lbf;
        r.allowable = mbs.lbf * eff;
        const m = marginOfSafety(r.allowable, req);
        // A circuit without its rigging tension: only a failure at the force alone is certain. A cable no input
        // drives, or one with no tension, has no known load: not checked (null), never the capped margin of a zero load.
        r.margin = !r.driven || !(t > 0) || loads.nodeFrom[n] || (r.inCircuit && r.pretension === null && m >= 0) ? null : m;
      }
    }
    out.push(r);
  }
  return out;
}

export function cableFindings(ctx: Ctx, cc: CableCtx, loads: Loads, results: CableResult[], s: AnalysisSettings, out: Finding[]) {
  const primary = PRIMARY_SYSTEMS.has(ctx.graph.system);
  // 14 CFR 23.693 sets the cable-system factor for the joints of a cable system; this check puts it on the cable too
  // (a conservative choice of its own, said so in the words).
  const factors = `limit × ${fmt(s.ultimateFactor, 2)} ultimate factor × ${fmt(s.cableFactor, 2)} cable-system factor, which 14 CFR 23.693 sets for the joints and this check puts on the cable as well`;
  const byId = new Map(results.map((r) => [r.nodeId, r]));
  for (let n = 0; n < ctx.nodes.length; n++) {
    const node = ctx.nodes[n];
    // Only cable-system parts and wheels have findings here; the others cost no subject or name.
    if (ctx.nodeRole[n] !== "tension" && node.kind !== "controlWheel" && node.kind !== "cable") continue;
    const subj = nodeSubject(node.id);
    const name = nodeLabel(node);
    if (ctx.nodeRole[n] === "tension") {
      for (const end of ["a", "b"]) {
        if (ctx.degree[n] > 0 && !(ctx.ports[n]?.[end]?.length))
          out.push(finding("cable-end-open", "caution", subj, `${name} has nothing on its ${end.toUpperCase()} end. A cable or turnbuckle carries load only between two parts; join both ends.`, SRC.structure));
      }
    }
    if (node.kind === "controlWheel") {
      const p = node.props;
      if (ctx.graph.system === "flap" || ctx.graph.system === "trim") continue;
      if (unenteredOf(node, p.axis === "roll" ? ["axis", "diameter"] : ["axis"]).length) continue; // the unentered finding says what to enter
      if (p.axis === "roll") {
        const c = wheelCouple(p, s.pilotForce);
        const min = WHEEL_ROLL_MIN_PER_IN * p.diameter;
        if (c < min)
          out.push(finding("wheel-couple-below-minimum", "hazard", subj,
            `${name}: the roll couple used is ${fmt(c)} in·lbf, below the minimum of 40 × D = ${fmt(min)} in·lbf for a ${fmt(p.diameter)} in wheel. The design couple is ${WHEEL_ROLL_DESIGN_PER_IN} × D = ${fmt(WHEEL_ROLL_DESIGN_PER_IN * p.diameter)} in·lbf; the minimum applies only where the hinge moments are lower.`,
            SRC.pilotForces, [num("roll couple", c, "in·lbf"), num("minimum", min, "in·lbf")]));
      } else {
        const f = p.designForce ?? s.pilotForce.pitchWheel;
        if (f < WHEEL_PITCH_MIN)
          out.push(finding("wheel-force-below-minimum", "hazard", subj,
            `${name}: the pitch force used is ${fmt(f)} lbf, below the minimum of ${WHEEL_PITCH_MIN} lbf at a wheel. The design force is ${WHEEL_PITCH_DESIGN} lbf; the minimum applies only where the hinge moments are lower.`,
            SRC.pilotForces, [num("pitch force", f, "lbf"), num("minimum", WHEEL_PITCH_MIN, "lbf")]));
      }
    }
    if (node.kind !== "cable") continue;
    const p = node.props;
    const d = CABLE_DIAMETER[p.size];
    // Each rule is judged only on values the builder entered (values-unentered names the rest): the size alone
    // for the smallest size allowed, all of its strength values for its strength.
    if (primary && d < MIN_PRIMARY_CABLE && !unenteredOf(node, SIZE_KEY).length)
      out.push(finding("cable-too-small", "hazard", subj,
        `${name} is ${p.size} in: no cable under 1/8 in may be used in the aileron, elevator or rudder controls. Use 1/8 in cable or larger.`,
        CABLE_SRC.smallCable, [num("cable diameter", d, "in"), num("minimum", MIN_PRIMARY_CABLE, "in")]));
    else if (ctx.graph.system === "trim" && d < MIN_PRIMARY_CABLE && !unenteredOf(node, SIZE_KEY).length)
      out.push(finding("trim-cable-small", "advisory", subj,
        `${name} is ${p.size} in, under the 1/8 in of the primary controls. A trim-tab cable may be smaller only where the airplane is safely controllable with the tab in its most adverse position; keep the designer's showing of that with the build records, or use 1/8 in cable.`,
        CABLE_SRC.tabCable, [num("cable diameter", d, "in"), num("primary-control minimum", MIN_PRIMARY_CABLE, "in")]));
    const r = byId.get(node.id)!;
    if (unenteredOf(node, TENSION_KEYS).length) continue;
    if (r.breakingStrength === null)
      out.push(finding("cable-strength-unknown", "caution", subj,
        `${name}: no breaking strength is tabled for ${p.size} in ${p.construction.replace("x", "×")} ${p.material} cable, so its strength is not checked. Use a tabled size or check it against the maker's certified breaking strength.`,
        CABLE_SRC.table73));
    else if (r.margin !== null && r.margin < 0)
      out.push(finding("cable-strength-weak", "hazard", subj,
        `${name} is too weak: it must carry ${fmt(r.ultimateRequired)} lbf ultimate (${fmt(r.limitTension)} lbf limit tension, ${factors}) but its breaking strength of ${fmt(r.breakingStrength)} lbf × ${fmt(r.terminalEfficiency! * 100, 0)} % for the ${TERMINAL_NAMES[worstTerminal(p)]} is ${fmt(r.allowable!)} lbf — margin ${fmtMargin(r.margin)}. Use a larger cable or stronger terminals; change the arms at the input or the surface only as the designer allows, since they set the gearing and the travel.`,
        breakingStrength(p.size, p.construction, p.material)!.source,
        [num("required ultimate", r.ultimateRequired, "lbf"), num("allowable", r.allowable!, "lbf"), num("margin", r.margin, "")]));
    else if (r.inCircuit && r.pretension === null && r.limitTension > 0 && !loads.nodeFrom[n])
      out.push(finding("cable-strength-unchecked", "caution", subj,
        `${name}: not checked — the circuit has no rigging tension recorded, and the pulling cable carries the larger of the force (${fmt(r.limitTension)} lbf) and the rigging tension plus half the force. Enter the rigging tension measured on the circuit.`,
        CABLE_SRC.preloadedCircuit, [num("force alone", r.limitTension, "lbf")]));
  }

  // Circuits and lone cables.
  for (let c = 0; c < cc.chains.length; c++) {
    const ch = cc.chains[c];
    const first = ctx.nodes[ch.nodes[0]];
    if (!ch.returned && ch.ends.length > 0 && ch.nodes.some((n) => loads.driven[n]))
      out.push(finding("cable-pushes", "hazard", nodeSubject(first.id),
        `${nodeLabel(first)} is the only cable between the parts it joins: when the control is moved the other way, or the surface's load reverses, it would have to push, and a cable carries tension only. Add the return cable to close the circuit (or use a pushrod).`,
        CABLE_SRC.tensionOnly));
  }
  for (const circuit of cc.circuits) riggingFindings(ctx, cc, circuit, out);
  cablePartFindings(ctx, loads, s, out);
}

function worstTerminal(p: { terminalA: keyof typeof TERMINAL_EFFICIENCY; terminalB: keyof typeof TERMINAL_EFFICIENCY }) {
  return TERMINAL_EFFICIENCY[p.terminalA] <= TERMINAL_EFFICIENCY[p.terminalB] ? p.terminalA : p.terminalB;
}

/** Rigging tension of a closed circuit: recorded, with its temperature, within the designer's range. */
function riggingFindings(ctx: Ctx, cc: CableCtx, circuit: number[], out: Finding[]) {
  const cables = circuit.flatMap((c) => cc.chains[c].nodes).map((n) => ctx.nodes[n]).flatMap((n) => (n.kind === "cable" ? [n] : []));
  if (!cables.length) return;
  const ranged = cables.find((n) => n.props.tensionMin !== undefined || n.props.tensionMax !== undefined);
  let measured = cables[0];
  for (const n of cables) if ((n.props.riggingTension ?? -1) > (measured.props.riggingTension ?? -1)) measured = n;
  const subj = nodeSubject((ranged ?? measured).id);
  const circuitName = `The circuit of ${cables.map(nodeLabel).slice(0, 2).join(" and ")}`;
  const t = measured.props.riggingTension;
  if (!ranged) {
    out.push(finding("rigging-range-missing", "caution", subj,
      `${circuitName}: rigging tension not checked — no designer's range is recorded. Enter the low and high tension from the plans and the temperature they are given at.`, CABLE_SRC.rigging));
  }
  if (t === undefined) {
    out.push(finding("rigging-tension-missing", "caution", subj,
      `${circuitName}: no rigging tension is recorded. Measure it with a tensiometer, convert the reading with its chart, and record it with the temperature.`, CABLE_SRC.rigging));
    return;
  }
  const temp = measured.props.riggingTemperature;
  if (temp === undefined)
    out.push(finding("rigging-temperature-missing", "caution", nodeSubject(measured.id),
      `${circuitName}: the rigging tension of ${fmt(t)} lbf has no temperature recorded. Cable tension changes with the airframe's temperature; record the temperature it was measured at.`, CABLE_SRC.rigging));
  if (!ranged) return;
  const { tensionMin: lo, tensionMax: hi, rangeTemperature: rt } = ranged.props;
  const nums = [num("rigging tension", t, "lbf"), ...(lo !== undefined ? [num("range low", lo, "lbf")] : []), ...(hi !== undefined ? [num("range high", hi, "lbf")] : [])];
  if (lo !== undefined && t < lo)
    out.push(finding("rigging-tension-low", "hazard", nodeSubject(measured.id),
      `${circuitName} is rigged at ${fmt(t)} lbf, below the designer's ${fmt(lo)} lbf${rt !== undefined ? ` (at ${fmt(rt, 0)} °F)` : ""}. A slack circuit gives lost motion and lets a cable leave its pulleys; re-rig it with the turnbuckles.`, CABLE_SRC.rigging, nums));
  else if (hi !== undefined && t > hi)
    out.push(finding("rigging-tension-high", "caution", nodeSubject(measured.id),
      `${circuitName} is rigged at ${fmt(t)} lbf, above the designer's ${fmt(hi)} lbf${rt !== undefined ? ` (at ${fmt(rt, 0)} °F)` : ""}. Too much tension adds friction and wears pulleys and cables; re-rig it with the turnbuckles.`, CABLE_SRC.rigging, nums));
  if (temp !== undefined && rt !== undefined && Math.abs(temp - rt) > RIGGING_TEMPERATURE_SPREAD)
    out.push(finding("rigging-temperature-differs", "advisory", nodeSubject(measured.id),
      `${circuitName} was measured at ${fmt(temp, 0)} °F but the range is given at ${fmt(rt, 0)} °F. Compare the reading with the designer's tension-temperature chart for ${fmt(temp, 0)} °F, not with the range alone.`,
      { kind: "commonPractice", text: "rigging tension read against the designer's chart at the measured temperature" }, [num("measured at", temp, "°F"), num("range at", rt, "°F")]));
}
