/**
 * Retention and installation rules, domain.md §4 rules 1–10, plus nut locking (14 CFR 23.607, which
 * domain.md does not list but a careful engineer checks). Each rule reads only the joint card and, for
 * thread engagement and handedness, the pushrod on the joint. Unrecorded facts that a rule needs give a
 * caution or advisory asking for them; recorded facts that break a rule give the rule's finding.
 */
import { AN_BOLTS_BY_SIZE, MIN_BOLT_DIAMETER, SRC as SRC_, THREADS_BY_NAME, TORQUE_BY_THREAD, TUBE_MATERIALS_BY_NAME } from "../hardware";
import type { Joint } from "../linkage/schema";
import type { Finding, JointRole } from "./types";
import { movingRole, turnsOnBolt } from "./joints/factors";
import { MIN_PREVAILING_TORQUE, PREVAILING_SRC } from "../hardware/plates";
import { type Ctx, jointLabel, jointsAt, nodeLabel, pushrodNodeOf } from "./context";
import { boltDiameter } from "./allowables";
import { finding, fmt, jointSubject, nodeSubject, num } from "./format";
import { MATERIAL_KEY, unenteredOf } from "./unentered";

// Module-level aliases: read the tables once, not through re-export getters on every joint.
const BOLTS = AN_BOLTS_BY_SIZE, THREADS = THREADS_BY_NAME, TORQUE = TORQUE_BY_THREAD, TUBES = TUBE_MATERIALS_BY_NAME, SRC = SRC_;
const MIN_D = MIN_BOLT_DIAMETER, MIN_DRAG = MIN_PREVAILING_TORQUE;
/** No aluminium bolt under 1/4 in. // AC 43.13-1B 7-41 */
const ALU_MIN_D = 0.25;

function torqueNumbers(v: number, min: number, max: number, drag?: number) {
  // Where the range already holds the nut's measured drag, its figures say so (they are no longer the table's own).
  const w = drag ? " with drag" : "";
  return [num("applied torque", v, "in·lbf"), num(`table minimum${w}`, min, "in·lbf"), num(`table maximum${w}`, max, "in·lbf")];
}

/** Tolerance on grip vs stack, in: a measurement tolerance of 1/64 in. // common practice, no source */
export const GRIP_TOLERANCE = 1 / 64;

/** Engagement multiple of the thread diameter: 1×D in steel, 2×D in aluminium (rule 2). // common practice, no source (domain.md §4 rule 2) */
export function engagementMultiple(family: "steel" | "aluminium"): number {
  return family === "steel" ? 1 : 2;
}

export function boltSubjectToRotation(hw: Joint["hardware"], role: JointRole = "other"): boolean {
  return turnsOnBolt(hw, role);
}

export function retentionFindings(ctx: Ctx, out: Finding[]) {
  const { joints, nodes } = ctx;
  for (let j = 0; j < joints.length; j++) {
    const jt = joints[j];
    const hw = jt.hardware;
    if (!hw) continue;
    const re = hw.rodEnd;

    if (re) {
      // Rule 1: jam nut fitted and tightened.
      if (!hw.jamNut || !hw.jamNut.fitted) {
        out.push(finding("jam-nut-missing", "hazard", jointSubject(jt.id),
          `The threaded rod end at joint ${jointLabel(ctx, j)} has no jam nut. Without a jam nut tightened against the fitting, the reversing push-pull load works on the threads alone and the rod end can turn and unscrew. Fit a jam nut and tighten it.`,
          SRC.jamNut));
      } else if (!hw.jamNut.tightened) {
        out.push(finding("jam-nut-loose", "hazard", jointSubject(jt.id),
          `The jam nut at joint ${jointLabel(ctx, j)} is fitted but not recorded as tightened. A loose jam nut does not lock the rod end; tighten it against the fitting (and torque-stripe it).`,
          SRC.jamNut));
      }

      // Rule 2: thread engagement.
      const th = THREADS[re.thread];
      if (th) {
        let family: "steel" | "aluminium" | null = null;
        // The pushrod the rod end screws into; the words for its thread are made only for a finding (internalThread).
        let pn: Ctx["nodes"][number] | null = null;
        // A female rod end's own internal thread: its body's material (an aluminium or unrecorded body takes the longer rule).
        if (re.shank === "female") family = re.bodyMaterial === undefined || re.bodyMaterial === "aluminium" ? "aluminium" : "steel";
        else {
          const p = pushrodNodeOf(ctx, j);
          pn = p >= 0 ? nodes[p] : null;
          // A starting-value material is no material: the longer (aluminium) rule applies until it is entered.
          if (pn && pn.kind === "pushrod" && !unenteredOf(pn, MATERIAL_KEY).length) family = TUBES[pn.props.material]?.family ?? null;
          if (!family) family = "aluminium";
        }
        const k = engagementMultiple(family);
        const required = k * th.majorDiameter;
        const eng = hw.engagement;
        const len = eng?.engagedLength;
        const hasHole = re.hasWitnessHole !== false;
        const verified = hasHole && eng?.witnessHoleVerified === true;
        // domain.md §4 rule 2: where the rod end has a witness hole, the wire check is the check; a recorded length
        // judges engagement only where there is no hole. k×D is a rule of thumb for that length (common practice).
        const thumb = `${k}×D of the ${re.thread} thread in ${internalThread(re, pn)}, a rule of thumb; more where the designer's drawing says so`;
        if (!verified) {
          if (len !== undefined && len < required) {
            out.push(finding("thread-engagement-short", "hazard", jointSubject(jt.id),
              `The rod end at joint ${jointLabel(ctx, j)} is screwed in only ${fmt(len, 3)} in; it needs at least ${fmt(required, 3)} in (${thumb}). Screw it in further and re-adjust the other end.`,
              SRC.engagement, [num("engaged length", len, "in"), num("required", required, "in")]));
          } else if (hasHole) {
            out.push(finding("thread-engagement-unverified", "caution", jointSubject(jt.id),
              len === undefined
                ? `The thread engagement at joint ${jointLabel(ctx, j)} is not verified: check that a wire will not pass through the rod end's witness hole, and record it on the joint's card.`
                : `Not checked: the rod end at joint ${jointLabel(ctx, j)} has a witness hole, and the check is that a wire will not pass through it; the recorded ${fmt(len, 3)} in of engaged length does not stand in for that. Check the hole with a wire and record it on the joint's card.`,
              SRC.engagement, len === undefined ? [] : [num("engaged length", len, "in"), num("rule of thumb", required, "in")]));
          } else if (len === undefined) {
            out.push(finding("thread-engagement-unverified", "caution", jointSubject(jt.id),
              `The rod end at joint ${jointLabel(ctx, j)} has no witness hole and no engaged length recorded. Measure and record it: at least ${fmt(required, 3)} in (${thumb}).`,
              SRC.engagement, [num("required", required, "in")]));
          }
        }
      }

      // Rule 3a: the bolt clamps the ball; it must not turn in it.
      if (hw.fit === "freeToRotate") {
        out.push(finding("bolt-turns-in-ball", "hazard", jointSubject(jt.id),
          `The bolt at joint ${jointLabel(ctx, j)} is set loose so it turns in the rod-end ball. Clamp the ball's inner race tight between the fitting and washers so the bearing does the moving; a bolt turning in the ball wears the bore and can loosen the nut.`,
          SRC.boltClamped));
      } else if (hw.fit === undefined && hw.bolt) {
        out.push(finding("bolt-fit-unrecorded", "caution", jointSubject(jt.id),
          `Not checked whether the bolt at joint ${jointLabel(ctx, j)} turns in the rod-end ball: its fit is not recorded. Record "clamped on the race" once the ball's inner race is clamped tight between the fitting and washers, so the bearing does the moving; a bolt turning in the ball wears the bore and can loosen the nut.`,
          SRC.boltClamped));
      }

      // Rule 4: retaining washer on a single-shear rod end.
      if (hw.shear === "single" && hw.freeSide === undefined) {
        // Which side is free is not recorded: a washer larger than the bore on both sides holds the eye either way;
        // otherwise the side decides, so it is asked for (never taken as the head).
        const bore = re.housingBore ?? re.ballDiameter;
        const ws = [hw.washerUnderHead, hw.washerUnderNut].filter((w): w is NonNullable<typeof w> => !!w);
        if (!ws.length) {
          out.push(finding("retaining-washer-missing", "hazard", jointSubject(jt.id),
            `The rod end at joint ${jointLabel(ctx, j)} is in single shear with no washer under the bolt head or the nut. If the ball comes out of its housing nothing holds the eye on the bolt: fit a washer whose outside diameter is larger than the housing bore${bore ? ` (over ${fmt(bore, 3)} in)` : ""} on the rod end's free side.`,
            SRC.retainingWasher, bore ? [num("housing bore", bore, "in")] : []));
        } else if (bore === undefined) {
          out.push(finding("retaining-washer-unverifiable", "caution", jointSubject(jt.id),
            `The rod end at joint ${jointLabel(ctx, j)} is in single shear, but neither its housing bore nor its ball diameter is recorded, so its retaining washer cannot be checked. Record the housing bore, and which side of the rod end is free (head or nut).`,
            SRC.retainingWasher));
        } else if (!(ws.length === 2 && ws.every((w) => w.outsideDiameter > bore))) {
          out.push(finding("retaining-washer-side-unrecorded", "caution", jointSubject(jt.id),
            `Not checked: the rod end at joint ${jointLabel(ctx, j)} is in single shear, and which side of it is free (against the ball, not the member) is not recorded. The retaining washer must be on that side and larger than the ${fmt(bore, 3)} in ${re.housingBore !== undefined ? "housing bore" : "ball (no housing bore recorded)"}; the washer under the head is ${hw.washerUnderHead ? `${fmt(hw.washerUnderHead.outsideDiameter, 3)} in` : "not fitted"}, under the nut ${hw.washerUnderNut ? `${fmt(hw.washerUnderNut.outsideDiameter, 3)} in` : "not fitted"}. Record the free side on the joint's card.`,
            SRC.retainingWasher, [num("housing bore", bore, "in")]));
        }
      } else if (hw.shear === "single") {
        const bore = re.housingBore ?? re.ballDiameter;
        const nutSide = hw.freeSide === "nut";
        const w = nutSide ? hw.washerUnderNut : hw.washerUnderHead;
        const under = nutSide ? "under the nut" : "under the bolt head";
        if (!w) {
          out.push(finding("retaining-washer-missing", "hazard", jointSubject(jt.id),
            `The rod end at joint ${jointLabel(ctx, j)} is in single shear with no retaining washer on its free side (${under}). If the ball comes out of its housing nothing holds the eye on the bolt: fit a washer whose outside diameter is larger than the housing bore${bore ? ` (over ${fmt(bore, 3)} in)` : ""}.`,
            SRC.retainingWasher, bore ? [num("housing bore", bore, "in")] : []));
        } else if (bore === undefined) {
          out.push(finding("retaining-washer-unverifiable", "caution", jointSubject(jt.id),
            `The rod end at joint ${jointLabel(ctx, j)} is in single shear, but neither its housing bore nor its ball diameter is recorded, so the ${fmt(w.outsideDiameter, 3)} in retaining washer cannot be checked. Record the housing bore.`,
            SRC.retainingWasher, [num("washer outside diameter", w.outsideDiameter, "in")]));
        } else if (!(w.outsideDiameter > bore)) {
          out.push(finding("retaining-washer-small", "hazard", jointSubject(jt.id),
            `The washer ${under} at joint ${jointLabel(ctx, j)} is ${fmt(w.outsideDiameter, 3)} in across, no larger than the ${fmt(bore, 3)} in ${re.housingBore !== undefined ? "housing bore" : "ball (no housing bore recorded)"} of the rod end. If the ball falls out the eye slides off over it. Fit a larger-diameter washer.`,
            SRC.retainingWasher, [num("washer outside diameter", w.outsideDiameter, "in"), num("housing bore", bore, "in")]));
        }
      }

      // Rule 10: misalignment rating.
      if (re.ratedMisalignment === undefined) {
        out.push(finding("misalignment-rating-unknown", "caution", jointSubject(jt.id),
          `The rod end at joint ${jointLabel(ctx, j)} has no rated misalignment on its card. Record the maker's rating and check at full travel, both ways, that the ball does not reach it (typical ratings ±6° to ±14°). The drawing is planar, so the check cannot measure this for you.`,
          SRC.misalignment));
      }
    }

    // Rule 3b: no self-locking nut where a part turns on the bolt (AC 43.13-1B 7-64a).
    const nut = hw.nut;
    const role = ctx.roles[j];
    const rotating = turnsOnBolt(hw, role);
    if (nut && (nut.type === "selfLockingMetal" || nut.type === "selfLockingInsert") && rotating) {
      const known = hw.fit === "freeToRotate" || hw.bearing !== undefined;
      const why = hw.fit === "freeToRotate" ? "the bolt is set free to rotate"
        : hw.bearing === "clevisPin" ? "the part turns on a clevis pin"
        : hw.bearing === "plainBushing" ? "the part turns on a plain bushing on the bolt"
        : hw.bearing === "none" ? "the part turns directly on the bolt (no bearing)"
        : "nothing records what the part turns on, so it is taken to turn on the bolt";
      out.push(finding("self-locking-nut-on-turning-bolt", known ? "hazard" : "caution", jointSubject(jt.id),
        `A self-locking nut is used at joint ${jointLabel(ctx, j)}, where ${why}. A part turning on the bolt can work a self-locking nut loose. Use a castellated nut with a new cotter pin (snugged so the part still turns freely, not torqued to the table), or a nut locked by safety wire; do not clamp a bushing pivot tight to stop it turning, which binds the control.${known ? "" : " If it turns on a ball bearing or rod end whose inner race the bolt clamps, record that under \"Turns on\"."}`,
        SRC.selfLockingRotation));
    }

    // Rule 7: castellated nut with a new cotter pin.
    if (nut?.type === "castellatedCotter") {
      if (nut.cotterPinNew === false) {
        out.push(finding("cotter-pin-reused", "hazard", jointSubject(jt.id),
          `The cotter pin at joint ${jointLabel(ctx, j)} is not new. A cotter pin is bent once and never reused; fit a new one.`, SRC.cotter));
      } else if (nut.cotterPinNew === undefined) {
        out.push(finding("cotter-pin-unrecorded", "caution", jointSubject(jt.id),
          `The castellated nut at joint ${jointLabel(ctx, j)} does not record a new cotter pin. Fit a new cotter pin (never reuse one) and tick it on the joint card.`, SRC.cotter));
      }
    }

    // Rule 4 (domain.md §4): no lock washers in a control run.
    if (hw.lockWasher === true)
      out.push(finding("lock-washer-in-run", "hazard", jointSubject(jt.id),
        `Joint ${jointLabel(ctx, j)} has a split or tooth lock washer in its stack. Lock washers are not used where a fastener's failure could endanger the aircraft, on primary or secondary structure: remove it, fit a plain washer, and lock the nut by a self-locking nut, a castellated nut with a new cotter pin, or safety wire.`,
        SRC.lockWashers));

    const bolt = hw.bolt;
    if (!bolt) continue;
    const d = boltDiameter(bolt);

    // Nut present and locked (14 CFR 23.607, beyond the ten rules).
    if (!nut) {
      out.push(finding("nut-missing", "caution", jointSubject(jt.id),
        `The bolt at joint ${jointLabel(ctx, j)} has no nut recorded. Record the nut and how it is locked.`, SRC.nutLocking));
    } else if (nut.type === "none") {
      out.push(finding("nut-missing", "hazard", jointSubject(jt.id),
        `The bolt at joint ${jointLabel(ctx, j)} has no nut: nothing holds it in the joint. Fit a locked nut.`, SRC.nutLocking));
    } else if (nut.type === "plain") {
      out.push(finding("nut-not-locked", "hazard", jointSubject(jt.id),
        `The plain nut at joint ${jointLabel(ctx, j)} has no locking device. In a control run every nut must be locked: use a self-locking nut where the bolt is clamped, or a castellated nut with a cotter pin, or safety wire.`,
        SRC.nutLocking));
    }

    // Rule 8: no bolt under 10-32.
    if (d !== null && d < MIN_D - 1e-9) {
      out.push(finding("bolt-too-small", "hazard", jointSubject(jt.id),
        `The bolt at joint ${jointLabel(ctx, j)} is ${fmt(d, 3)} in in diameter; nothing smaller than a 10-32 (AN3, 0.190 in) belongs in a control run. Use an AN3 or larger.`,
        SRC.minBolt, [num("bolt diameter", d, "in"), num("minimum", MIN_D, "in")]));
    }

    // Aluminium bolts: none under 1/4 in (AC 43.13-1B 7-41 says primary structure; a control run of any system is
    // held to it here, as the primary-structure test is the structure's, not the control's), and none where the
    // joint is taken apart again and again (AC 43.13-1B 7-41, from memory): a rod end or a moving joint.
    if (bolt.material === "aluminium" && d !== null && d < ALU_MIN_D - 1e-9) {
      out.push(finding("aluminium-bolt-small", "hazard", jointSubject(jt.id),
        `The aluminium bolt at joint ${jointLabel(ctx, j)} is ${fmt(d, 3)} in in diameter; aluminium bolts under 1/4 in do not belong in a control run. Use a steel bolt.`,
        SRC.minBolt, [num("bolt diameter", d, "in"), num("minimum", ALU_MIN_D, "in")]));
    } else if (bolt.material === "aluminium" && (re || movingRole(role))) {
      out.push(finding("aluminium-bolt-moving-joint", "advisory", jointSubject(jt.id),
        `The bolt at joint ${jointLabel(ctx, j)} is aluminium, at a joint that is ${re ? "disconnected for rigging" : "moving"}. Aluminium bolts and nuts are not used where they are taken out again and again for maintenance and inspection; use a steel bolt unless the designer calls for aluminium here.`,
        SRC.minBolt));
    }

    const hasNut = nut && nut.type !== "none";
    // Rule 5: thread protrusion, grip vs stack.
    if (hasNut) {
      if (bolt.threadsProtruding === undefined) {
        out.push(finding("bolt-protrusion-unrecorded", "advisory", jointSubject(jt.id),
          `Record how many threads of the bolt at joint ${jointLabel(ctx, j)} show past the nut: at least one full thread must.`, SRC.protrusion));
      } else if (bolt.threadsProtruding < 1) {
        out.push(finding("bolt-thread-short", "hazard", jointSubject(jt.id),
          `The bolt at joint ${jointLabel(ctx, j)} does not show a full thread past the nut (${fmt(bolt.threadsProtruding, 1)}), so the nut's locking does not fully engage. Use the next longer bolt.`,
          SRC.protrusion, [num("threads protruding", bolt.threadsProtruding, "threads"), num("minimum", 1, "threads")]));
      }
    }
    if (bolt.grip !== undefined && bolt.stack !== undefined) {
      const underNut = hw.washerUnderNut?.thickness ?? 0;
      if (bolt.grip > bolt.stack + GRIP_TOLERANCE) {
        out.push(finding("bolt-grip-long", "caution", jointSubject(jt.id),
          `The grip of the bolt at joint ${jointLabel(ctx, j)} (${fmt(bolt.grip, 3)} in) is longer than the stack it clamps (${fmt(bolt.stack, 3)} in): the nut can run out of thread and stop on the shank before it clamps. Use a shorter grip or add a washer under the nut.`,
          SRC.grip, [num("grip", bolt.grip, "in"), num("stack", bolt.stack, "in")]));
      } else if (bolt.grip < bolt.stack - underNut - GRIP_TOLERANCE) {
        out.push(finding("bolt-threads-in-bearing", "caution", jointSubject(jt.id),
          `The grip of the bolt at joint ${jointLabel(ctx, j)} (${fmt(bolt.grip, 3)} in) is shorter than the stack it clamps (${fmt(bolt.stack, 3)} in${underNut ? `, less ${fmt(underNut, 3)} in of washer under the nut` : ""}), so threads bear in the joint. Use the next longer grip.`,
          SRC.grip, [num("grip", bolt.grip, "in"), num("stack", bolt.stack, "in")]));
      }
    }

    // Rule 6: torque within AC 43.13-1B table 7-1.
    if (hasNut && bolt.size !== "custom") {
      const row = BOLTS[bolt.size];
      if (nut.type === "castellatedCotter" && rotating) {
        // A castellated nut on a bolt that turns is snugged to line up the cotter, not torqued to the table.
      } else if (row) {
        const trow = TORQUE[row.thread];
        if (trow) {
          // Pattern unrecorded: the two ranges differ (a thin nut takes about 60 %), so only a torque over both
          // ceilings is judged; anything else asks for the pattern.
          const pattern = nut.pattern;
          const range = pattern === "shear" ? trow.shear : trow.tension;
          const source = trow.source;
          const tq = hw.torque;
          const selfLocking = nut.type === "selfLockingMetal" || nut.type === "selfLockingInsert";
          const drag = selfLocking ? nut.dragTorque : 0;
          const ceiling = pattern === "shear" ? trow.ceiling.shear : trow.ceiling.tension;
          const pat = pattern ?? "tension";
          const lo = range.min + (drag ?? 0), hi = range.max + (drag ?? 0);
          // The applied torque includes the nut's drag, so its ceiling does too (the table's figures are without it).
          const top = ceiling + (drag ?? 0);
          const plusDrag = selfLocking ? (drag === undefined ? " plus the nut's drag torque" : ` plus the measured ${fmt(drag, 1)} in·lbf drag`) : "";
          if (pattern === undefined) {
            const both = `${fmt(trow.tension.min, 0)}–${fmt(trow.tension.max, 0)} in·lbf for a ${row.thread} tension nut, ${fmt(trow.shear.min, 0)}–${fmt(trow.shear.max, 0)} in·lbf for a shear (thin) nut${plusDrag}`;
            const topEither = Math.max(trow.ceiling.tension, trow.ceiling.shear) + (drag ?? 0);
            if (tq !== undefined && tq > topEither)
              out.push(finding("torque-over-maximum", "hazard", jointSubject(jt.id),
                `The nut at joint ${jointLabel(ctx, j)} is torqued to ${fmt(tq, 0)} in·lbf, above the ${fmt(topEither, 0)} in·lbf maximum allowable for a ${row.thread} nut of either pattern${drag ? ` (with the measured ${fmt(drag, 1)} in·lbf drag)` : ""}. The bolt may have yielded: replace the bolt and the nut, and torque the new ones within the table (${both}).`,
                SRC.torqueCeiling, [num("applied torque", tq, "in·lbf"), num("maximum allowable", topEither, "in·lbf")]));
            else
              out.push(finding("nut-pattern-unrecorded", tq === undefined ? "advisory" : "caution", jointSubject(jt.id),
                tq === undefined
                  ? `Record the torque applied at joint ${jointLabel(ctx, j)} and whether its nut is a tension or a shear (thin) nut: ${both}.`
                  : `Not checked: the nut at joint ${jointLabel(ctx, j)} is torqued to ${fmt(tq, 0)} in·lbf, but whether it is a tension or a shear (thin) nut is not recorded, and the ranges differ: ${both}. Record the nut's pattern on the joint's card.`,
                source, tq === undefined ? [] : [num("applied torque", tq, "in·lbf")]));
          } else if (tq === undefined) {
            out.push(finding("torque-unrecorded", "advisory", jointSubject(jt.id),
              `Record the torque applied at joint ${jointLabel(ctx, j)}: ${fmt(range.min, 0)}–${fmt(range.max, 0)} in·lbf for a ${row.thread} ${pat} nut${plusDrag}.`, source));
          } else if (tq > top) {
            out.push(finding("torque-over-maximum", "hazard", jointSubject(jt.id),
              `The nut at joint ${jointLabel(ctx, j)} is torqued to ${fmt(tq, 0)} in·lbf, above the ${fmt(top, 0)} in·lbf maximum allowable for a ${row.thread} ${pat} nut${drag ? ` (${fmt(ceiling, 0)} in·lbf plus the measured ${fmt(drag, 1)} in·lbf drag)` : ""}. The bolt may have yielded: replace the bolt and the nut, and torque the new ones within ${fmt(range.min, 0)}–${fmt(range.max, 0)} in·lbf${plusDrag}.`,
              SRC.torqueCeiling, [...torqueNumbers(tq, range.min, range.max), num("maximum allowable", top, "in·lbf")]));
          } else if (tq < lo) {
            out.push(finding("torque-low", "caution", jointSubject(jt.id),
              `The nut at joint ${jointLabel(ctx, j)} is torqued to ${fmt(tq, 0)} in·lbf, below the ${fmt(range.min, 0)}–${fmt(range.max, 0)} in·lbf of table 7-1 for a ${row.thread} ${pat} nut${plusDrag}. Re-torque it.`, source, torqueNumbers(tq, lo, hi, drag)));
          } else if (tq > hi) {
            if (selfLocking && drag === undefined)
              out.push(finding("torque-check-drag", "caution", jointSubject(jt.id),
                `Not checked: the nut at joint ${jointLabel(ctx, j)} is torqued to ${fmt(tq, 0)} in·lbf, above the table's ${fmt(range.max, 0)} in·lbf for a ${row.thread} ${pat} nut, and its drag torque is not recorded. Measure the nut's drag torque and record it: the torque is within the table only if it is no more than ${fmt(range.max, 0)} in·lbf plus the drag.`, source, torqueNumbers(tq, range.min, range.max)));
            else if (nut.type === "castellatedCotter")
              // AC 43.13-1B 7-40f: start lining up the cotter-pin hole at the range's minimum (plus drag), do not exceed
              // its maximum (plus drag); if the hole and a castellation do not line up, change the washer or the nut.
              out.push(finding("torque-high", "caution", jointSubject(jt.id),
                `The castellated nut at joint ${jointLabel(ctx, j)} is torqued to ${fmt(tq, 0)} in·lbf, above the ${fmt(range.min, 0)}–${fmt(range.max, 0)} in·lbf of table 7-1 for a ${row.thread} ${pat} nut${plusDrag}, though within the ${fmt(top, 0)} in·lbf maximum allowable. Do not go past the range to line up the cotter-pin slot (AC 43.13-1B 7-40f): back the nut off, change the washer or the nut, and torque it again, starting at the range's minimum.`, SRC.castleAlign, [...torqueNumbers(tq, lo, hi, drag), num("maximum allowable", top, "in·lbf")]));
            else
              out.push(finding("torque-high", "caution", jointSubject(jt.id),
                `The nut at joint ${jointLabel(ctx, j)} is torqued to ${fmt(tq, 0)} in·lbf, above the ${fmt(range.min, 0)}–${fmt(range.max, 0)} in·lbf of table 7-1 for a ${row.thread} ${pat} nut${plusDrag}, though within the ${fmt(top, 0)} in·lbf maximum allowable. Back the nut off and torque it again within the range.`, source, [...torqueNumbers(tq, lo, hi, drag), num("maximum allowable", top, "in·lbf")]));
          } else if (selfLocking && drag === undefined) {
            // Within the bare table range, but the range is the table's plus the nut's drag: a torque here may be low.
            out.push(finding("torque-drag-unrecorded", "advisory", jointSubject(jt.id),
              `Not checked against the nut's drag: the self-locking nut at joint ${jointLabel(ctx, j)} is torqued to ${fmt(tq, 0)} in·lbf, and the range is ${fmt(range.min, 0)}–${fmt(range.max, 0)} in·lbf for a ${row.thread} ${pat} nut plus its drag torque, which is not recorded. Measure the drag (the torque to turn the nut before it seats) and record it on the joint's card.`, source, torqueNumbers(tq, range.min, range.max)));
          }
          // A re-used self-locking nut whose drag has fallen below the minimum breakaway torque no longer locks: a
          // hazard, as a plain nut without a locking device is (nut-not-locked), now that the minimums are read from
          // published tables (PREVAILING_SRC), not recalled.
          const minDrag = MIN_DRAG[row.thread];
          if (selfLocking && drag !== undefined && minDrag !== undefined && drag < minDrag) {
            out.push(finding("nut-drag-low", "hazard", jointSubject(jt.id),
              `The self-locking nut at joint ${jointLabel(ctx, j)}${nut.reused ? ", re-used," : ""} has a drag torque of ${fmt(drag, 1)} in·lbf, below the ${fmt(minDrag, 1)} in·lbf minimum for a ${row.thread} nut: its locking feature is worn. Replace the nut.`,
              PREVAILING_SRC, [num("drag torque", drag, "in·lbf"), num("minimum", minDrag, "in·lbf")]));
          }
        }
      }
    }
  }

  // Rule 9: one RH and one LH end per pushrod (advisory).
  for (let n = 0; n < nodes.length; n++) {
    const node = nodes[n];
    if (node.kind !== "pushrod") continue;
    const ha = handAt(ctx, n, "a"), hb = handAt(ctx, n, "b");
    if (ha && hb && ha === hb) {
      out.push(finding("pushrod-ends-same-hand", "advisory", nodeSubject(node.id),
        `Both rod ends of pushrod ${nodeLabel(node)} are ${ha}-threaded, so its length can only be adjusted by disconnecting an end. With one RH and one LH end, turning the tube changes the length (2 × pitch per turn) in place.`,
        SRC.handedEnds));
    }
  }
}

/** The internal thread a rod end screws into, in words: its own (female), the pushrod's, or unknown (taken as aluminium). */
function internalThread(re: NonNullable<Joint["hardware"]["rodEnd"]>, pn: Ctx["nodes"][number] | null): string {
  if (re.shank === "female")
    return re.bodyMaterial === undefined ? "the rod end's own internal thread (body material not recorded: taken as aluminium, the longer rule)"
      : re.bodyMaterial === "aluminium" ? "the rod end's own aluminium internal thread" : "the rod end's own steel internal thread";
  if (pn && pn.kind === "pushrod" && !unenteredOf(pn, MATERIAL_KEY).length && TUBES[pn.props.material]?.family) return `the ${pn.props.material} pushrod's internal thread`;
  return "an internal thread of unknown material (taken as aluminium, the longer rule)";
}

function handAt(ctx: Ctx, n: number, port: string): "RH" | "LH" | null {
  for (const j of jointsAt(ctx, n, port)) {
    const re = ctx.joints[j].hardware?.rodEnd;
    if (re) return re.hand ?? null; // unrecorded: not taken as RH
  }
  return null;
}
