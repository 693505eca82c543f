// Measured times are bounded by what the devices can make (issue 15 point 8:
// 5e-324 s was stored). The bounds are the engine's own: the test checks them
// against the planner itself, so they can be neither too tight (a plannable
// period refused) nor too loose (an unplannable one let through). Each end is
// probed just inside (some device and mode plans it) and just outside (every
// device, clock source and mode refuses it).
import { describe, expect, it, vi } from "vitest";
import {
  clockChoiceProblem,
  listDevices,
  LONGEST_PERIOD_S,
  planTarget,
  SHORTEST_PERIOD_S,
  SHORTEST_TIME_S,
} from "@/lib/engine";
import { stageSchema } from "@/lib/validation/stage";
import { highOutOfBounds, measurementProblems, periodOutOfBounds } from "@/lib/validation/measurement";

vi.mock("@/db/client", () => ({ db: {} }));

const MODES = ["pwm", "toggle", "isr"] as const;

/** Every (device, clock source, mode) that may run at `which` clock of its device. */
function choices(which: "min" | "max") {
  return listDevices().flatMap((d) => {
    const clockHz = which === "min" ? d.minClockHz : d.maxClockHz;
    return d.clocks
      .filter((c) => !clockChoiceProblem({ device: d.id, clockSource: c.id, clockHz }))
      .flatMap((c) => MODES.map((mode) => ({ device: d.id, clockSource: c.id, clockHz, mode })));
  });
}

function plans(req: Parameters<typeof planTarget>[0]): boolean {
  return achieved(req) !== null;
}

/** The period the plan makes, or null when the planner refuses. */
function achieved(req: Parameters<typeof planTarget>[0]): number | null {
  try {
    return planTarget(req).periodS;
  } catch {
    return null;
  }
}

describe("the bounds follow from the planner", () => {
  it("the longest period is planned just inside and refused by every device just outside", () => {
    const slow = choices("min");
    expect(slow.length).toBeGreaterThan(0);
    const inside = LONGEST_PERIOD_S * 0.999;
    expect(slow.some((c) => plans({ ...c, periodS: inside, highS: inside * 0.4 }))).toBe(true);
    const outside = LONGEST_PERIOD_S * 1.001;
    for (const c of slow)
      expect(plans({ ...c, periodS: outside, highS: outside * 0.4 }), JSON.stringify(c)).toBe(false);
  });

  it("the shortest period is planned at the fastest clock and no device makes a shorter one", () => {
    const fast = choices("max");
    expect(fast.some((c) => plans({ ...c, periodS: SHORTEST_PERIOD_S, highS: SHORTEST_PERIOD_S / 2 }))).toBe(
      true,
    );
    // Below the bound the planner either refuses or offers its nearest period,
    // which is never shorter than the bound: a reading there cannot be matched.
    for (const f of [0.99, 0.75, 0.5]) {
      const outside = SHORTEST_PERIOD_S * f;
      for (const c of fast) {
        const made = achieved({ ...c, periodS: outside, highS: outside / 2 });
        if (made !== null) expect(made, JSON.stringify(c)).toBeGreaterThanOrEqual(SHORTEST_PERIOD_S);
      }
    }
  });

  it("the shortest time is one cycle of the fastest clock of any device", () => {
    const fastest = Math.max(...listDevices().map((d) => d.maxClockHz));
    expect(SHORTEST_TIME_S).toBe(1 / fastest);
    expect(SHORTEST_PERIOD_S).toBeGreaterThanOrEqual(2 * SHORTEST_TIME_S);
  });
});

describe("measurements outside the bounds are refused with the bounds stated", () => {
  it("refuses 5e-324 s and periods past the longest count, accepts ordinary readings", () => {
    expect(periodOutOfBounds(5e-324)).toMatch(/outside what any target device can make: from 15 ns/);
    expect(periodOutOfBounds(LONGEST_PERIOD_S * 2)).toMatch(/outside/);
    expect(highOutOfBounds(5e-324)).toMatch(/from 7\.52 ns/);
    expect(periodOutOfBounds(0.01)).toBeNull();
    expect(highOutOfBounds(0.002)).toBeNull();
    expect(measurementProblems({ periodS: 0.01, highS: 0.02 })).toEqual({
      highS: "High time 20 ms must be shorter than the period 10 ms.",
    });
  });

  it("a measured stage is refused on its field", () => {
    const tiny = stageSchema.safeParse({ kind: "measured", periodS: 1e-300, highS: 5e-324 });
    expect(tiny.success).toBe(false);
    expect(tiny.error?.issues.map((i) => i.path.join(".")).sort()).toEqual(["highS", "periodS"]);
    const huge = stageSchema.safeParse({ kind: "measured", periodS: 1e12, highS: 1 });
    expect(huge.error?.issues.map((i) => i.path.join("."))).toEqual(["periodS"]);
    expect(stageSchema.safeParse({ kind: "measured", periodS: "10m", highS: "2m" }).success).toBe(true);
  });

  it("a field check is refused on its field", async () => {
    const { fieldCheckSchema } = await import("@/lib/field/record-check");
    const base = { revisionId: 1, signedOffBy: "A. Tester" };
    const r = fieldCheckSchema.safeParse({ ...base, measuredPeriodS: 5e-324, measuredHighS: 1e-3 });
    expect(r.error?.issues.map((i) => i.path.join("."))).toEqual(["measuredPeriodS"]);
    expect(fieldCheckSchema.safeParse({ ...base, measuredPeriodS: 0.01, measuredHighS: 0.002 }).success).toBe(
      true,
    );
  });
});
