// Cautions in the README and every checklist (lib/bundle/safety.ts): each flag
// of the retrofit brings its own lines and only those (product requirement:
// mains-powered boards get the isolation and lock-out lines, thyristor gate
// drives the gate isolation lines).
import { describe, expect, it } from "vitest";
import { cautionLines } from "@/lib/bundle/safety";

const THYRISTOR = "The output fires a thyristor gate.";
const MAINS = "The board is mains-powered.";

describe("caution lines per retrofit flag", () => {
  it("mains-powered only: the mains lines, no thyristor lines", () => {
    const lines = cautionLines({ name: "x", mainsPowered: true, drivesThyristor: false });
    expect(lines.some((l) => l.startsWith(MAINS))).toBe(true);
    expect(lines.some((l) => l.startsWith(THYRISTOR))).toBe(false);
    expect(lines.some((l) => l.includes("thyristor's datasheet"))).toBe(false);
  });

  it("thyristor only: the thyristor lines, no mains lines", () => {
    const lines = cautionLines({ name: "x", drivesThyristor: true });
    expect(lines.some((l) => l.startsWith(THYRISTOR))).toBe(true);
    expect(lines.some((l) => l.startsWith(MAINS))).toBe(false);
  });

  it("neither flag: no cautions", () => {
    expect(cautionLines({ name: "x" })).toEqual([]);
  });
});
