import { beforeAll, describe, expect, it } from "vitest";
import { applySuggestion } from "@/editor/panels/JointExtras";
import { createEditorStore } from "@/editor/store";
import { demoPitchLinkage } from "@/shared/demo";
import { hardwareSchema } from "@/shared/linkage/schema";
import type { Suggestion } from "@/shared/records/suggest";
import { loadSchema } from "@/editor/store/schema";

// The cards load the graph schema before they show (editor/panels/Inspector.tsx); so do these tests.
beforeAll(() => loadSchema());

const graph = demoPitchLinkage();
const joint = graph.joints.find((j) => j.id === "j-stick-fwd")!;
const part = (spec: Record<string, unknown>): Suggestion => ({
  part: { id: "p1", kind: "rodEnd", partNumber: "LW-TEST-RE4", description: "", spec: spec as never, createdAt: "", updatedAt: "" },
  capacity: 5200,
  margin: 4.4,
  what: "rod end rating",
});

describe("a suggested part in the joint card", () => {
  it("fills the rod end from the part's spec and keeps what the part does not say", () => {
    const hw = applySuggestion(joint.hardware, part({ thread: "1/4-28", hand: "RH", shank: "female", ballBore: 0.25, ratedUltimate: 5200, hasWitnessHole: false }));
    expect(hw.rodEnd).toEqual({ ...joint.hardware.rodEnd, shank: "female", ratedUltimate: 5200, hasWitnessHole: false, partNumber: "LW-TEST-RE4" });
    expect(hardwareSchema.safeParse(hw).success).toBe(true);
    // Everything else on the joint is untouched.
    expect({ ...hw, rodEnd: undefined }).toEqual({ ...joint.hardware, rodEnd: undefined });
  });

  it("applies as one undoable step that resets the card (epoch), and undo restores the old rod end", () => {
    const store = createEditorStore(graph, { revision: 1 });
    const epoch = store.getState().epoch;
    const r = store.getState().updateJointHardware(joint.id, applySuggestion(joint.hardware, part({ thread: "1/4-28", hand: "RH", shank: "male", ballBore: 0.25, ratedUltimate: 5200, hasWitnessHole: true })), { external: true });
    expect(r.ok).toBe(true);
    expect(store.getState().epoch).toBe(epoch + 1);
    expect(store.getState().dirty).toBe(true);
    expect(store.getState().joints.find((j) => j.id === joint.id)!.hardware.rodEnd!.partNumber).toBe("LW-TEST-RE4");
    store.getState().undo();
    expect(store.getState().joints.find((j) => j.id === joint.id)!.hardware.rodEnd).toEqual(joint.hardware.rodEnd);
    expect(store.getState().dirty).toBe(false);
  });
});
