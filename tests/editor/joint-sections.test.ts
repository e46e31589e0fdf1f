// The joint card's sections follow the joint: the holes named after their parts, no rod end at a cable's terminal.
import { describe, expect, it } from "vitest";
import { jointCardSections } from "@/editor/panels/specs";
import { cableEnds } from "@/editor/panels/CableEndFields";
import { demoPitchLinkage } from "@/shared/demo";
import { rudderCircuit } from "../shared/analysis/cable-fixtures";

const titles = (s: { title: string }[]) => s.map((x) => x.title);

describe("joint card sections", () => {
  it("names the holes after the joint's two parts on a pushrod run, with the rod-end sections", () => {
    const g = demoPitchLinkage();
    const j = g.joints.find((x) => x.id === "j-fwd-bellcrank")!;
    const t = titles(jointCardSections(j, g.nodes));
    expect(t).toContain("Rod-end bearing");
    expect(t).toContain("Jam nut & thread engagement");
    expect(t).toContain("Hole in Forward pushrod");
    expect(t).toContain("Hole in Bellcrank under the seat");
    expect(t.some((x) => /first part|second part/.test(x))).toBe(false);
  });

  it("puts the designer's hinge load first on a surface's hinge, and on no other joint", () => {
    const g = demoPitchLinkage();
    const hinge = jointCardSections(g.joints.find((x) => x.id === "j-elevator-hinge")!, g.nodes);
    expect(hinge[0].title).toBe("Hinge load");
    expect(hinge[0].fields.map((f) => f.path)).toEqual(["hingeLoad"]);
    for (const id of ["j-fwd-bellcrank", "j-bellcrank-pivot", "j-horn-elevator"])
      expect(titles(jointCardSections(g.joints.find((x) => x.id === id)!, g.nodes))).not.toContain("Hinge load");
  });

  it("leaves the rod end and jam nut off at a cable's or turnbuckle's terminal", () => {
    const g = rudderCircuit();
    const j = g.joints.find((x) => [x.from.node, x.to.node].some((n) => n === "tbL" || n === "cableL"))!;
    const t = titles(jointCardSections(j, g.nodes));
    expect(t).not.toContain("Rod-end bearing");
    expect(t).not.toContain("Jam nut & thread engagement");
    expect(t).toContain("Bolt");
    expect(t).toContain("Nut");
  });

  it("keeps a rod end someone recorded at a cable's terminal, so nothing they entered is hidden", () => {
    const g = rudderCircuit();
    const j = g.joints.find((x) => [x.from.node, x.to.node].includes("tbL"))!;
    const withRodEnd = { ...j, hardware: { ...j.hardware, rodEnd: { shank: "male" as const, thread: "1/4-28" as const, hand: "RH" as const, ballBore: 0.25 } } };
    expect(titles(jointCardSections(withRodEnd as typeof j, g.nodes))).toContain("Rod-end bearing");
  });
});

describe("cable ends on a joint's card", () => {
  const g = rudderCircuit();
  const endsOf = (id: string) => {
    const j = g.joints.find((x) => x.id === id)!;
    const n = (k: string) => g.nodes.find((x) => x.id === k);
    return cableEnds([n(j.from.node), j.from.port, n(j.to.node), j.to.port]).map((e) => `${e.node.id}:${e.port}`);
  };
  it("names the cable's end and the turnbuckle's end a joint holds", () => {
    expect(endsOf("tbLa")).toEqual(["cableL:b", "tbL:a"]); // cable B ↔ turnbuckle A
    expect(endsOf("hornL")).toEqual(["tbL:b"]); // turnbuckle B ↔ horn
    expect(endsOf("pedL")).toEqual(["cableL:a"]);
  });
  it("has none where a pulley guides the cable's run, or on a pushrod run", () => {
    expect(endsOf("overP")).toEqual([]);
    expect(endsOf("pivL")).toEqual([]);
    expect(cableEnds([])).toEqual([]);
  });
});
