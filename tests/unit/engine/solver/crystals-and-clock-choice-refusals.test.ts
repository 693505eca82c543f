// Refusals that do not depend on the crystal or the clock: a request that is
// invalid at every frequency is reported once by suggestCrystals (crystals.ts:
// only unreachable periods and clocks the source cannot run are left out), and
// clockChoiceProblem answers an unknown device on the device field with the
// same first sentence planTarget gives (timer-api.ts: "the same rule planTarget
// applies, for the form and API schemas").
import { describe, expect, it } from "vitest";
import {
  clockChoiceProblem,
  isEngineError,
  planTarget,
  suggestCrystals,
  type PlanRequest,
} from "@/lib/engine";
import { expectEngineError } from "../expect-engine-error";

describe("suggestCrystals: an invalid request", () => {
  it("a high time longer than the period is refused by name, not answered with an empty list", () => {
    // The planner's own refusal of a high time not inside the period (solver/validate.ts).
    const err = expectEngineError(
      () => suggestCrystals({ device: "atmega328p", periodS: 1e-3, highS: 2e-3 }),
      "invalid-high-time",
    );
    expect(err.field).toBe("highS");
    expect(err.message).toMatch(/^High time 0\.002 s must be above zero/);
    // the valid request gets suggestions (ATmega328P crystal oscillator up to 20 MHz, DS40002061, from memory)
    expect(suggestCrystals({ device: "atmega328p", periodS: 1e-3, highS: 0.5e-3 }).length).toBeGreaterThan(0);
  });
});

describe("clockChoiceProblem: an unknown device", () => {
  it("names the device field and says what planTarget says first", () => {
    const choice = { device: "pic16f84a", clockHz: 4e6 };
    let planner: { field?: string; message: string } | null = null;
    try {
      planTarget({ ...choice, periodS: 1e-3, highS: 0.5e-3 } as unknown as PlanRequest);
    } catch (e) {
      if (!isEngineError(e)) throw e;
      planner = { field: e.field, message: e.message };
    }
    expect(planner?.field).toBe("device");
    const problem = clockChoiceProblem(choice);
    expect(problem).toEqual({ field: "device", message: 'Unknown device "pic16f84a".' });
    expect(planner!.message.startsWith(problem!.message)).toBe(true);
  });
});
