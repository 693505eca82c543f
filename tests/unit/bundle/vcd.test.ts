// The VCD reader against hand-written traces in the IEEE 1364-2005 section 18
// format and the simavr habits noted in verification (start at x, repeated
// values 10 ns apart).
import { describe, expect, it } from "vitest";
import { measure, parseVcd } from "@/lib/firmware/emulate/harness/vcd";

const trace = `$timescale 10ns $end
$scope module logic $end
$var wire 1 ! PB1 $end
$var wire 8 " PORTB $end
$upscope $end
$enddefinitions $end
#0
x!
#100
1!
#101
1!
#250
0!
#1100
1!
#1250
0!
#2100
1!
#2101
1!
#2250
0!
`;

describe("VCD reader", () => {
  it("turns value changes into edges, dropping x and repeats", () => {
    const edges = parseVcd(trace, "PB1");
    // the x -> 1 start at 1 us is not an edge; the falling edge at 2.5 us is
    expect(edges.map((e) => [Math.round(e.t * 1e9), e.level])).toEqual([
      [2500, 0],
      [11000, 1],
      [12500, 0],
      [21000, 1],
      [22500, 0],
    ]);
  });

  it("measures periods between rising edges and high times", () => {
    const m = measure(parseVcd(trace, "PB1"));
    expect(m.periods.map((p) => Math.round(p * 1e9))).toEqual([10000]);
    expect(m.highs.map((h) => Math.round(h * 1e9))).toEqual([1500, 1500]);
  });

  it("names the signals it has when asked for a missing one", () => {
    expect(() => parseVcd(trace, "PB2")).toThrow(/has PB1, PORTB/);
    expect(() => parseVcd(trace, "PORTB")).toThrow(/8 bits/);
  });
});
