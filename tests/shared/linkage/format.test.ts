// The format's constants the editor uses without the schema library agree with the schema (shared/linkage/format.ts).
import { describe, expect, it } from "vitest";
import { defaultHardware, emptyGraph, FORMAT_VERSION, SYSTEMS, TUBE_MATERIALS } from "@/shared/linkage/format";
import { graphSchema, hardwareSchema, systemSchema, tubeMaterialSchema } from "@/shared/linkage/schema";

describe("the linkage format without its schema", () => {
  it("gives a new joint the hardware the schema makes of nothing, in the schema's key order, a new object each time", () => {
    expect(JSON.stringify(defaultHardware())).toBe(JSON.stringify(hardwareSchema.parse({})));
    expect(defaultHardware()).toEqual(hardwareSchema.parse({}));
    const a = defaultHardware();
    a.photos.push("x");
    expect(defaultHardware().photos).toEqual([]);
  });

  it("lists the same systems and tube materials as the schema, and an empty graph passes it unchanged", () => {
    expect(systemSchema.options).toEqual([...SYSTEMS]);
    expect(tubeMaterialSchema.options).toEqual([...TUBE_MATERIALS]);
    const g = emptyGraph("Empty", "yaw");
    expect(g.formatVersion).toBe(FORMAT_VERSION);
    expect(graphSchema.parse(g)).toEqual(g);
  });
});
