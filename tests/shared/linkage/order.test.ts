/**
 * The run in load-path order (shared/linkage/order.ts), as the list view and the phone read it.
 */
import { describe, expect, it } from "vitest";
import { demoPitchLinkage, generateLinkage } from "@/shared/demo";
import { partName } from "@/shared/linkage/names";
import { runOrder } from "@/shared/linkage/order";

describe("runOrder", () => {
  it("starts at the stick and reads the demo run down to the elevator, each joint between its two parts", () => {
    const g = demoPitchLinkage();
    const order = runOrder(g);
    const parts = order.filter((i) => i.type === "node").map((i) => partName(g.nodes.find((n) => n.id === i.id)));
    expect(parts[0]).toMatch(/stick/i);
    // every part and every joint exactly once
    expect(order.filter((i) => i.type === "node").map((i) => i.id).sort()).toEqual(g.nodes.map((n) => n.id).sort());
    expect(order.filter((i) => i.type === "joint").map((i) => i.id).sort()).toEqual(g.joints.map((j) => j.id).sort());
    // the horn comes after the aft pushrod, and the elevator after the horn (along the path, not drawing order)
    const at = (re: RegExp) => parts.findIndex((p) => re.test(p));
    expect(at(/aft pushrod/i)).toBeGreaterThan(0);
    expect(at(/horn/i)).toBeGreaterThan(at(/aft pushrod/i));
    expect(at(/^elevator$/i)).toBeGreaterThan(at(/horn/i));
    // each part after the first is read right after a joint that touches it; each joint after one of its parts
    const pos = new Map(order.map((x, i) => [`${x.type}:${x.id}`, i]));
    order.forEach((it, i) => {
      if (it.type === "node" && i > 0) {
        const prev = order[i - 1];
        expect(prev.type).toBe("joint");
        const j = g.joints.find((x) => x.id === prev.id)!;
        expect([j.from.node, j.to.node]).toContain(it.id);
      }
      if (it.type === "joint") {
        const j = g.joints.find((x) => x.id === it.id)!;
        expect(Math.min(pos.get(`node:${j.from.node}`)!, pos.get(`node:${j.to.node}`)!)).toBeLessThan(i);
      }
    });
    // a branch's end (the stick's mount and its stop) is read next to the stick, before the run goes on
    expect(at(/stop/i)).toBeLessThan(at(/forward pushrod/i));
    expect(at(/stick mount/i)).toBeLessThan(at(/forward pushrod/i));
  });

  it("lists parts no input reaches, and a part with no joints, after the run", () => {
    const g = demoPitchLinkage();
    const lone = { ...g.nodes[g.nodes.length - 1], id: "lone", label: "Spare horn" };
    const order = runOrder({ nodes: [lone, ...g.nodes], joints: g.joints });
    expect(order[0].id).not.toBe("lone"); // drawn first, but not an input
    expect(order.filter((i) => i.id === "lone")).toHaveLength(1);
  });

  it("stays linear on a long chain (no recursion: 20,000 parts in one path)", () => {
    const g = generateLinkage(20_000);
    const order = runOrder(g);
    expect(order.length).toBe(g.nodes.length + g.joints.length);
  });
});
