// The cable system in the records: checklist items per cable, turnbuckle, pulley and fairlead; hardware-list lines.
import { describe, expect, it } from "vitest";
import { checklistFor } from "@/shared/records/checklist";
import { hardwareList } from "@/shared/records/hardware";
import { analyze } from "@/shared/analysis";
import { demoPitchLinkage } from "@/shared/demo";
import { rudderCircuit } from "../analysis/cable-fixtures";

describe("checklist of a cable circuit", () => {
  const g = rudderCircuit();
  const items = checklistFor(g, analyze(g));
  const of = (id: string) => items.filter((i) => i.jointId === id && i.subject === "part").map((i) => i.code);

  it("asks for the tensiometer reading and temperature, the terminals and the wear of each cable", () => {
    for (const c of ["cableL", "cableR"]) expect(of(c)).toEqual(["cable-tension", "cable-terminals", "cable-wear"]);
    const tension = items.find((i) => i.jointId === "cableL" && i.code === "cable-tension")!;
    expect(tension.text).toContain("25 to 35 lbf at 70 °F"); // the fixture's invented designer range
    expect(tension.text).toMatch(/tensiometer.*temperature/);
    expect(items.find((i) => i.jointId === "cableL" && i.code === "cable-wear")!.text).toMatch(/pulley and fairlead/);
  });

  it("quotes the reading on the cable's card beside the item, or says there is none", () => {
    const text = (id: string) => items.find((i) => i.jointId === id && i.code === "cable-tension")!.text;
    expect(text("cableL")).toContain("On the cable's card: 30 lbf at 70 °F."); // the fixture's invented rigging record
    expect(text("cableR")).toContain("No reading on this cable's card.");
  });

  it("asks each turnbuckle to be safetied with at most three threads showing (AC 43.13-1B), and free over the travel (23.689(e))", () => {
    expect(of("tbL")).toEqual(["turnbuckle-safety", "turnbuckle-free"]);
    const s = items.find((i) => i.jointId === "tbL" && i.code === "turnbuckle-safety")!;
    expect(s.text).toContain("no more than 3 threads");
    expect(s.text).toContain("locking clip"); // the fixture's turnbuckle is clipped
    expect(s.source.text).toContain("AC 43.13-1B");
    expect(items.find((i) => i.jointId === "tbL" && i.code === "turnbuckle-free")!.source.text).toContain("23.689(e)");
  });

  it("checks the pulley's guards (23.689(b)) and the fairlead's turn (23.689(c))", () => {
    expect(of("pulley")).toEqual(["pulley-guards"]);
    expect(of("fairlead")).toEqual(["fairlead-turn"]);
    expect(items.find((i) => i.code === "fairlead-turn")!.text).toContain("3°");
  });

  it("lists the parts after the joints and before the whole-linkage items, each part once as a group", () => {
    const order = items.map((i) => i.subject);
    expect(order.indexOf("part")).toBeGreaterThan(order.lastIndexOf("joint"));
    expect(order.lastIndexOf("part")).toBeLessThan(order.indexOf("linkage"));
    expect(new Set(items.map((i) => `${i.jointId}|${i.code}`)).size).toBe(items.length); // keys stay unique
  });

  it("adds nothing to a pushrod run", () => {
    expect(checklistFor(demoPitchLinkage()).some((i) => i.subject === "part")).toBe(false);
  });
});

describe("hardware list of a cable circuit", () => {
  const lines = hardwareList([{ id: "l1", name: "Rudder", graph: rudderCircuit() }]);
  const kind = (k: string) => lines.filter((l) => l.kind === k);

  it("lists both cables as one line of two, and four swaged terminals named once per cable", () => {
    expect(kind("cable").reduce((a, l) => a + l.quantity, 0)).toBe(2);
    const term = kind("cableTerminal");
    expect(term).toHaveLength(1);
    expect(term[0]).toMatchObject({ description: "Swaged terminal for 1/8 in cable", quantity: 4 });
    expect(term[0].usedIn.map((u) => u.jointId)).toEqual(["cableL", "cableR"]);
  });

  it("lists the turnbuckles, the pulley and the fairlead, after the joint hardware", () => {
    expect(kind("turnbuckle")).toEqual([expect.objectContaining({ description: "Turnbuckle for 1/8 in cable, with two locking clips", quantity: 2 })]);
    expect(kind("pulley")).toEqual([expect.objectContaining({ description: "Pulley 3 in, ball bearing, groove for 1/8 in cable", quantity: 1 })]);
    expect(kind("fairlead")[0].quantity).toBe(1);
    const firstCable = lines.findIndex((l) => l.kind === "cable");
    expect(lines.slice(firstCable).every((l) => ["cable", "cableTerminal", "turnbuckle", "pulley", "fairlead"].includes(l.kind))).toBe(true);
  });
});
