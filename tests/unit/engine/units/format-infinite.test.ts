import { describe, expect, it } from "vitest";
import { formatEng } from "@/lib/engine/units";

describe("formatEng of values that are not finite", () => {
  it("keeps the sign of an infinity and prints NaN as a dash", () => {
    // IEEE 754-2019 section 6.1: +∞ and −∞ are distinct values.
    expect(formatEng(-Infinity, "s")).toBe("−∞");
    expect(formatEng(Infinity, "s")).toBe("∞");
    expect(formatEng(NaN, "s")).toBe("—");
  });
});
