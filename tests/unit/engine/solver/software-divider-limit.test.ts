// The exhaustive interrupt reference at the software divider's own limit: the
// firmware's interrupt counter is 32 bits (isr.ts MAX_SOFTWARE_DIVIDER), so
// 2^32 - 1 interrupts per period is still a legal plan (engine.md section 3:
// every legal configuration is tried, least absolute period error wins).
import { describe, expect, it } from "vitest";
import { DEVICES } from "@/lib/engine/devices";
import { bruteForceBestIsr, minIsrIntervalCycles } from "@/lib/engine/solver";
import { MAX_SOFTWARE_DIVIDER } from "@/lib/engine/solver/isr";

describe("interrupt reference at the 32-bit software divider limit", () => {
  it("takes 2^32 - 1 interrupts of the longest ATtiny85 Timer1 interval when that is exact", () => {
    const device = DEVICES.find((d) => d.id === "attiny85")!;
    const t = device.timers.find((x) => x.name === "TIMER1")!;
    // ATtiny25/45/85 datasheet, Timer1 prescaler CS13:10 up to CK/16384; 8-bit
    // counter (256 counts): the longest interval is 16384 * 256 = 2^22 cycles.
    const longest = t.isrDividers[t.isrDividers.length - 1] * t.counts.isr!.max;
    expect(longest).toBe(2 ** 22);
    const hz = 2 ** 20; // a power of two keeps periodS * clockHz exact
    const periodS = (longest * MAX_SOFTWARE_DIVIDER) / hz;
    const best = bruteForceBestIsr(t, hz, periodS, periodS / 2, minIsrIntervalCycles(device))!;
    // d * n <= 2^22 forces s >= 2^32 - 1: the only exact plan is the limit itself.
    expect(best.periodErrorCycles).toBe(0);
    expect(best.softwareDivider).toBe(2 ** 32 - 1);
    expect(best.intervalCycles).toBe(2 ** 22);
  });
});
