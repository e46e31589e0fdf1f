/** The names of the files the editor makes (editor/download.ts): a kept picture names its build once. */
import { describe, expect, it } from "vitest";
import { pictureFileName } from "@/editor/download";

describe("pictureFileName", () => {
  it("names the build once when the linkage's name already starts with it", () => {
    expect(pictureFileName("Larkspur LX-2", "Larkspur LX-2 pitch", 1)).toBe("Larkspur-LX-2-pitch-r1.png");
    expect(pictureFileName("Larkspur LX-2", "larkspur lx-2 pitch", 3)).toBe("larkspur-lx-2-pitch-r3.png");
    expect(pictureFileName("Larkspur LX-2", "Larkspur LX-2", 2)).toBe("Larkspur-LX-2-r2.png");
  });
  it("puts the build before a linkage named on its own", () => {
    expect(pictureFileName("Larkspur LX-2", "Yaw — pedals to rudder", 1)).toBe("Larkspur-LX-2-Yaw-pedals-to-rudder-r1.png");
    // A linkage whose name only begins with the same letters is not taken for the build's.
    expect(pictureFileName("Lark", "Larkspur pitch", 1)).toBe("Lark-Larkspur-pitch-r1.png");
  });
});
