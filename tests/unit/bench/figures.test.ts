// Verdicts and the printed table of the benchmark.
import { describe, expect, it } from "vitest";
import { figure, formatTable, formatValue, meets, skipped } from "@/scripts/bench/figures";

describe("verdicts", () => {
  it("applies each comparison at its boundary", () => {
    expect(meets(19.99, { op: "<", value: 20 })).toBe(true);
    expect(meets(20, { op: "<", value: 20 })).toBe(false);
    expect(meets(20, { op: "<=", value: 20 })).toBe(true);
    expect(meets(299.9, { op: ">=", value: 300 })).toBe(false);
    expect(meets(300, { op: ">=", value: 300 })).toBe(true);
    expect(meets(0, { op: "=", value: 0 })).toBe(true);
    expect(meets(1, { op: "=", value: 0 })).toBe(false);
  });

  it("gives PASS, MISS, INFO and SKIP", () => {
    expect(figure("a", 12, "ms", { op: "<", value: 20 }).status).toBe("PASS");
    expect(figure("a", 25, "ms", { op: "<", value: 20 }).status).toBe("MISS");
    expect(figure("a", NaN, "ms", { op: "<", value: 20 }).status).toBe("MISS");
    expect(figure("a", 25, "ms").status).toBe("INFO");
    expect(skipped("a", "skipped: route missing").status).toBe("SKIP");
  });
});

describe("table", () => {
  it("formats values to about four significant digits with the unit", () => {
    expect(formatValue(5.77123, "ms")).toBe("5.771 ms");
    expect(formatValue(85.2712, "ms")).toBe("85.27 ms");
    expect(formatValue(1183.61, "ms")).toBe("1183.6 ms");
    expect(formatValue(100, "%")).toBe("100 %");
    expect(formatValue(0.01234, "ms")).toBe("0.0123 ms");
    expect(formatValue(1, "")).toBe("1");
    expect(formatValue(null, "ms")).toBe("-");
  });

  it("prints a header, a rule and one aligned line per figure", () => {
    const text = formatTable([
      figure("engine: analyzeStage", 5.771, "ms", { op: "<", value: 20 }, "median of 21"),
      figure("api: plan req/s", 1234, "req/s", { op: ">=", value: 300 }),
      skipped("api: GET bundle", "skipped: route missing"),
    ]);
    const lines = text.split("\n");
    expect(lines).toHaveLength(5);
    expect(lines[0].split(/\s{2,}/)).toEqual(["figure", "value", "target", "status", "note"]);
    expect(lines[1]).toMatch(/^-+( {2}-+){4}$/);
    expect(lines[2].split(/\s{2,}/)).toEqual([
      "engine: analyzeStage",
      "5.771 ms",
      "< 20 ms",
      "PASS",
      "median of 21",
    ]);
    expect(lines[3].split(/\s{2,}/)).toEqual(["api: plan req/s", "1234 req/s", ">= 300 req/s", "PASS"]);
    expect(lines[4].split(/\s{2,}/)).toEqual(["api: GET bundle", "-", "SKIP", "skipped: route missing"]);
    // values right-aligned: every value cell ends in the same column
    const end = (l: string, v: string) => l.indexOf(v) + v.length;
    expect(end(lines[2], "5.771 ms")).toBe(end(lines[3], "1234 req/s"));
  });
});
