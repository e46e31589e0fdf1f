/** The witness chip on a joint's line reads engagement as the engine does (domain.md §4 rule 2). */
import { describe, expect, it } from "vitest";
import { hardwareChips } from "@/editor/joints/JointEdge";
import { demoPitchLinkage } from "@/shared/demo";
import type { Joint } from "@/shared/linkage/schema";

const rodEndJoint = () => demoPitchLinkage().joints.find((j) => j.hardware.rodEnd)!.hardware;
const witness = (h: Joint["hardware"]) => hardwareChips(h).find((c) => c.key === "witness")!;

describe("the witness chip", () => {
  it("is solid where the witness hole was checked, hollow where only a length is recorded beside a hole", () => {
    const h = rodEndJoint();
    expect(witness({ ...h, engagement: { witnessHoleVerified: true } }).state).toBe("solid");
    expect(witness({ ...h, engagement: { witnessHoleVerified: false, engagedLength: 0.4 } })).toMatchObject({ state: "hollow", title: expect.stringContaining("witness hole not checked") });
  });
  it("on a rod end without a witness hole, a recorded length is the check; a 'checked' hole that is not there counts for nothing", () => {
    const h = { ...rodEndJoint(), rodEnd: { ...rodEndJoint().rodEnd!, hasWitnessHole: false } };
    expect(witness({ ...h, engagement: { witnessHoleVerified: false, engagedLength: 0.4 } })).toMatchObject({ state: "solid", title: expect.stringMatching(/^No witness hole: engaged length 0.4 in/) });
    expect(witness({ ...h, engagement: { witnessHoleVerified: true } })).toMatchObject({ state: "missing", title: "No witness hole and no engaged length recorded" });
  });
});
