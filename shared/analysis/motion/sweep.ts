/**
 * The sweep: each chain's four-bars solved by loop closure over the input's whole travel in small steps,
 * outward from neutral in each direction, always on the branch the chain is assembled in (the follower's
 * end B stays on the same side of the line from the driver's end A to the follower's pivot O4).
 *
 * Per stage and step: A = O2 + a·e^{i(α0+φ2)}; B is where the circle of radius b about A meets the circle of
 * radius c about O4 (loop closure); the transmission angle at each rod end is the angle between the rod and
 * that arm (mechanism-design texts); gearing dφ4/dφ2 = (r2 × u)/(r4 × u) from the rod's rigid length
 * (velocity of A and B along the rod agree); the torque ratio is its inverse (virtual work), found from the
 * effective arms |r × û| (statics) so a test can hold the two against each other.
 * Loads: the design force acts at the grip, square to the grip arm; each rod carries torque / effective arm in
 * the plane, times length / in-plane length along its axis when it leaves the plane.
 */
import type { Chain } from "./chain";

const DEG = 180 / Math.PI;
const TAU = 2 * Math.PI;
/** |sin μ| below this (μ within 0.06° of 0° or 180°) is toggle. */
export const TOGGLE_SIN = 1e-3; // common practice, no source: a numerical tolerance (about 0.06° from toggle)

export type ChainSweep = {
  chain: Chain;
  /** Input deflection at each step, °, forward positive, ascending from −back to +forward. */
  theta: Float64Array;
  /** Index of neutral in theta. */
  neutral: number;
  /** 1 where every stage closed. */
  ok: Uint8Array;
  /** Rotation of each turning part from neutral, ° counter-clockwise, per step. */
  rot: Float64Array[];
  /** Surface (horn) deflection, ° up positive. */
  deflection: Float64Array;
  /** dδ/dθ: surface degrees per input degree. */
  gearing: Float64Array;
  /** Per stage: cosine of the transmission angle at the driver end (A) and follower end (B); mu() gives degrees. */
  cosA: Float64Array[];
  cosB: Float64Array[];
  /** Per stage: signed r × u at each end (for over-centre: a sign change is passing over centre). */
  crossA: Float64Array[];
  crossB: Float64Array[];
  /** Per stage: torque ratio T_follower / T_driver by statics (effective arms). */
  forceRatio: Float64Array[];
  stageGearing: Float64Array[];
  /** Per stage: limit axial load of the rod, lbf. Per turning part: limit pivot load, lbf. */
  rodForce: Float64Array[];
  pivotLoad: Float64Array[];
  /** Limit hinge moment put in at the horn, in·lbf. */
  hingeMoment: Float64Array;
  /** Input deflection of the first step that cannot close, going back and going forward (null: closed to the end). */
  failBack: number | null;
  failForward: number | null;
  /** The stage that would not close there. */
  failStageBack: number;
  failStageForward: number;
};

/** Steps used when none are asked for: about 0.05° of input each, 200 to 2,000. */
export function defaultSteps(travel: number): number {
  return Math.min(2000, Math.max(200, Math.ceil(travel / 0.05)));
}

export function sweepChain(chain: Chain, designForce: number, steps?: number): ChainSweep {
  const total = chain.travelBack + chain.travelForward;
  const n = Math.max(2, Math.floor(steps ?? defaultSteps(total)));
  const nb = chain.travelBack > 0 ? Math.max(1, Math.round((n * chain.travelBack) / total)) : 0;
  const nf = chain.travelForward > 0 ? Math.max(1, n - nb) : 0;
  const S = nb + nf + 1;
  const P = chain.parts.length, K = chain.stages.length;
  const arr = () => new Float64Array(S);
  const per = (m: number) => Array.from({ length: m }, arr);
  const sw: ChainSweep = {
    chain, theta: arr(), neutral: nb, ok: new Uint8Array(S), rot: per(P), deflection: arr(), gearing: arr(),
    cosA: per(K), cosB: per(K), crossA: per(K), crossB: per(K), forceRatio: per(K), stageGearing: per(K),
    rodForce: per(K), pivotLoad: per(P), hingeMoment: arr(), failBack: null, failForward: null, failStageBack: -1, failStageForward: -1,
  };
  for (let k = 0; k < S; k++) sw.theta[k] = k <= nb ? -chain.travelBack + (nb ? (chain.travelBack * k) / nb : 0) : (chain.travelForward * (k - nb)) / nf;
  sw.theta[nb] = 0;
  const phi = new Float64Array(P); // radians, the running rotation (unwrapped from the previous step)
  const torque = chain.gripArm * designForce;
  const solveDir = (from: number, to: number, dir: 1 | -1) => {
    phi.fill(0);
    for (let k = from; dir > 0 ? k <= to : k >= to; k += dir) {
      const bad = solveStep(sw, k, phi, torque);
      if (bad >= 0) {
        if (dir > 0) { sw.failForward = sw.theta[k]; sw.failStageForward = bad; }
        else { sw.failBack = sw.theta[k]; sw.failStageBack = bad; }
        return;
      }
    }
  };
  solveDir(nb, S - 1, 1);
  if (nb > 0) solveDir(nb - 1, 0, -1);
  return sw;
}

/** Solve step k in place; returns -1, or the index of the stage that cannot close. */
function solveStep(sw: ChainSweep, k: number, phi: Float64Array, torque: number): number {
  const ch = sw.chain;
  phi[0] = (ch.inputSign * sw.theta[k]) / DEG;
  let T = torque, g = 1;
  // Direction of the driver's arm: the input's from its angle, a crank's from the follower end of the stage before.
  let dc = 0, ds = 0;
  let prevK = 0, prevUx = 0, prevUy = 0, prevUz = 0; // force of the previous rod on the crank, along its û
  let pivotPrev = 0;
  sw.pivotLoad[0][k] = 0;
  for (let s = 0; s < ch.stages.length; s++) {
    const st = ch.stages[s];
    if (s === 0) { dc = Math.cos(st.alpha0 + phi[0]); ds = Math.sin(st.alpha0 + phi[0]); }
    const r2x = st.a * dc, r2y = st.a * ds;
    const ax = st.o2x + r2x, ay = st.o2y + r2y;
    const ex0 = st.o4x - ax, ey0 = st.o4y - ay;
    const D = Math.sqrt(ex0 * ex0 + ey0 * ey0);
    const along = (st.b * st.b - st.c * st.c + D * D) / (2 * D);
    const h2 = st.b * st.b - along * along;
    if (!(D > 0) || h2 < -1e-9 * st.b * st.b) return s;
    const h = Math.sqrt(Math.max(0, h2));
    const ex = ex0 / D, ey = ey0 / D;
    const bx = ax + along * ex - st.branch * h * ey;
    const by = ay + along * ey + st.branch * h * ex;
    const r4x = bx - st.o4x, r4y = by - st.o4y;
    // Unwrap the follower's rotation next to its value at the step before.
    const raw = Math.atan2(r4y, r4x) - st.beta0;
    const prev = phi[st.follower];
    phi[st.follower] = raw - TAU * Math.round((raw - prev) / TAU);
    const ux = bx - ax, uy = by - ay; // |u| = b
    const cA = r2x * uy - r2y * ux, cB = r4x * uy - r4y * ux;
    sw.crossA[s][k] = cA;
    sw.crossB[s][k] = cB;
    sw.cosA[s][k] = clamp((r2x * ux + r2y * uy) / (st.a * st.b));
    sw.cosB[s][k] = clamp((r4x * ux + r4y * uy) / (st.c * st.b));
    // The next stage's driver arm turns with this follower, at a fixed angle from this arm.
    const fc = r4x / st.c, fs = r4y / st.c;
    dc = fc * st.nextCos - fs * st.nextSin;
    ds = fs * st.nextCos + fc * st.nextSin;
    const gs = cA / cB;
    sw.stageGearing[s][k] = gs;
    g *= gs;
    // Statics: rod force in the plane = T / effective arm at A; follower torque = that × effective arm at B.
    const effA = Math.max(Math.abs(cA) / st.b, 1e-12 * st.a);
    const effB = Math.abs(cB) / st.b;
    sw.forceRatio[s][k] = effB / effA;
    const fPlane = T / effA;
    sw.rodForce[s][k] = (fPlane * st.length) / st.b;
    // Pivot of the driver (a crank, not the input): the rod arriving (previous stage) and this rod leaving.
    const kThis = -(T * st.b) / cA; // signed force of this rod on the driver, along û (in-plane component / b·b)
    const uxn = ux / st.b, uyn = uy / st.b, uzn = st.dz / st.b;
    if (s === 0) {
      pivotPrev = torque / ch.gripArm + sw.rodForce[0][k]; // the input: grip force + rod force (arms taken opposite)
      sw.pivotLoad[0][k] = pivotPrev;
    } else {
      const fx = prevK * prevUx + kThis * uxn, fy = prevK * prevUy + kThis * uyn, fz = prevK * prevUz + kThis * uzn;
      sw.pivotLoad[st.driver][k] = Math.sqrt(fx * fx + fy * fy + fz * fz);
    }
    T = fPlane * effB;
    prevK = (T * st.b) / cB;
    prevUx = uxn; prevUy = uyn; prevUz = uzn;
  }
  for (let p = 0; p < phi.length; p++) sw.rot[p][k] = phi[p] * DEG;
  const last = ch.parts.length - 1;
  sw.pivotLoad[last][k] = ch.stages.length ? sw.rodForce[ch.stages.length - 1][k] : 0;
  sw.deflection[k] = ch.upSign * phi[last] * DEG;
  sw.gearing[k] = ch.upSign * ch.inputSign * g;
  sw.hingeMoment[k] = T;
  sw.ok[k] = 1;
  return -1;
}

/** Transmission angle, °, from its cosine. */
export function mu(cos: number): number {
  return Math.acos(cos) * DEG;
}

function clamp(x: number): number {
  return x > 1 ? 1 : x < -1 ? -1 : x;
}
