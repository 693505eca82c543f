// Issue 18 point 2: one rule decides whether a device/clock-source/frequency
// combination can be built, in the browser (the form schema) and on the
// server (planTarget during generation). Facts: RP2040 datasheet 2.18 (PLL:
// FOUTPOSTDIV = FREF / REFDIV * FBDIV / (POSTDIV1 * POSTDIV2), VCO 750..1600
// MHz, from a 12 MHz crystal), RM0444 6.4 (STM32G0 timers clocked from
// SYSCLK; HSI16 / HSIDIV down to 125 kHz, so 32.768 kHz is no SYSCLK option).
import { describe, expect, it } from "vitest";
import { clockChoiceProblem, isEngineError, listDevices, parseEng, planTarget } from "@/lib/engine";
import { buildRefusal } from "@/lib/bundle/buildable";
import { planOne } from "@/lib/revisions/plan-targets";
import { defaultTarget, targetSchema } from "@/lib/validation/target";
import { plainMessage } from "@/lib/validation/plain-message";

function engineRefusal(r: { device: string; clockSource: string; clockHz: number }) {
  try {
    planTarget({ ...r, device: r.device as "rp2040", periodS: 1e-3, highS: 2.5e-4 });
  } catch (e) {
    if (isEngineError(e)) return { field: e.field, message: e.message };
    throw e;
  }
  return null;
}

const CASES = [
  { device: "rp2040", clockSource: "xosc-pll", clockHz: 16e6 },
  { device: "rp2040", clockSource: "xosc", clockHz: 16e6 },
  { device: "stm32g031", clockSource: "hsi16", clockHz: 32768 },
  { device: "stm32g031", clockSource: "hsi16", clockHz: 7e6 },
  { device: "msp430g2553", clockSource: "dco-cal", clockHz: 4e6 },
];

describe("one clock rule for the form and generation", () => {
  for (const c of CASES) {
    it(`${c.device} ${c.clockSource} at ${c.clockHz} Hz: the form says what the planner says`, () => {
      const engine = engineRefusal(c);
      expect(engine).not.toBeNull();
      const r = targetSchema.safeParse({
        ...defaultTarget(c.device),
        clockSource: c.clockSource,
        clockHz: String(c.clockHz),
      });
      expect(r.success).toBe(false);
      const issue = r.error!.issues.find((i) => i.path.join(".") === engine!.field);
      // The form prints the same refusal in the user's words (plainMessage).
      expect(issue?.message).toBe(plainMessage(engine!.message));
      expect(clockChoiceProblem(c)).toEqual(engine);
    });
  }

  it("every device's default new target is accepted by both", () => {
    for (const id of ["atmega328p", "attiny85", "stm32g031", "rp2040", "pic12f1840", "msp430g2553"]) {
      const t = defaultTarget(id);
      expect(targetSchema.safeParse(t).success).toBe(true);
      expect(
        engineRefusal({ device: id, clockSource: t.clockSource, clockHz: parseEng(String(t.clockHz), "Hz") }),
      ).toBeNull();
    }
  });

  it("every device has triggered firmware, so live plans take a triggered start; an unknown device is refused naming start", () => {
    const analysis = { periodS: 10e-3, highS: 1e-3, oscillates: true, kind: "measured" } as never;
    const row = planOne(
      analysis,
      {
        device: "msp430g2553",
        clockSource: "dco-cal",
        clockHz: 8e6,
        mode: null,
        timer: null,
        clockAccuracyPpm: null,
        requiredTolerancePct: null,
        activeLow: false,
        trigger: { start: "trigger" },
        gateDrive: null,
      } as never,
      0,
    );
    expect(row.ok ? null : row).toBeNull();
    for (const d of listDevices())
      for (const start of ["trigger", "zero-cross", "free"])
        expect(buildRefusal({ device: d.id, start }), `${d.id} ${start}`).toBeNull();
    // The rule still refuses where no firmware exists (a device id outside the table).
    expect(buildRefusal({ device: "attiny13", start: "trigger" })?.field).toBe("start");
    expect(buildRefusal({ device: "attiny13", start: "free" })).toBeNull();
  });
});
