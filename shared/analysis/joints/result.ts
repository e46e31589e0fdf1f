/**
 * A joint's result: its loads, every check (computed or not checked), the governing check and the to-do.
 * The older fields (rod-end and bolt margins) are kept and read from the checks.
 */
import type { AnalysisSettings, JointCheck, JointResult } from "../types";
import type { Ctx } from "../context";
import type { Loads } from "../loads";
import { boltDiameter } from "../allowables";
import { jointChecks } from "./checks";
import { selectSpecialFactor, type FactorOptions } from "./factors";

// Module-level aliases: read imports once, not through re-export getters on every joint.
const checksOf = jointChecks, factorOf = selectSpecialFactor, boltDia = boltDiameter;

export function jointResult(ctx: Ctx, j: number, loads: Loads, settings: AnalysisSettings, loadTodo: string | null, opts: FactorOptions = {}): JointResult {
  const jt = ctx.joints[j];
  const hw = jt.hardware;
  const role = ctx.roles[j];
  const radialLimit = loads.jointRadial[j];
  const factor = factorOf(hw, role, settings, opts);
  const checks = checksOf({ ctx, j, role, limit: loadTodo ? null : radialLimit, loadTodo, settings, special: factor }, boltDia);
  let rodEnd: JointCheck | undefined, shear: JointCheck | undefined, governing: JointResult["governing"] = null;
  const todo: string[] = [];
  for (const c of checks) {
    if (c.id === "rodEndRating") rodEnd = c;
    else if (c.id === "boltShear" || c.id === "pinShear") shear = c;
    if (c.status === "computed" && c.margin !== null && (governing === null || c.margin < governing.margin)) governing = { check: c.id, label: c.label, margin: c.margin };
    if (c.todo !== null) {
      if (c.todo.indexOf("; ") < 0) { if (!todo.includes(c.todo)) todo.push(c.todo); }
      else for (const t of c.todo.split("; ")) if (!todo.includes(t)) todo.push(t);
    }
  }
  if (loadTodo && checks.length === 0) todo.push(loadTodo);
  const rodEndFactor = rodEnd?.factor ?? settings.fittingFactor;
  return {
    jointId: jt.id,
    loadKnown: loadTodo === null,
    radialLimit,
    radialUltimate: radialLimit * settings.ultimateFactor * rodEndFactor,
    rodEndRating: hw?.rodEnd?.ratedUltimate ?? null,
    rodEndMargin: rodEnd?.status === "computed" ? rodEnd.margin : null,
    boltShearAllowable: shear?.allowable ?? null,
    boltMargin: shear?.status === "computed" ? shear.margin : null,
    role,
    specialFactor: factor.value,
    factor,
    checks,
    governing,
    todo,
  };
}
