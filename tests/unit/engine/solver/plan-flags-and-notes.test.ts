// The plan's phase-correct flag and its notes on plans the datasheets' formulas give exactly.
// ATmega328P DS40002061, 16-bit Timer/Counter1: CTC (mode 4) toggles OC1A at
// f = fclk / (2 N (1 + OCR1A)); fast PWM with TOP = ICR1 (mode 14) runs at f = fclk / (N (1 + TOP)).
// RP2040 datasheet, PWM: with CSR.PH_CORRECT the period is 2 (TOP + 1) DIV / fsys.
import { describe, expect, it } from "vitest";
import { planTarget, type PlanRequest } from "@/lib/engine";

const plan = (r: PlanRequest) => planTarget(r);

describe("phase-correct flag", () => {
  it("a compare toggle halves the frequency but is not phase-correct counting", () => {
    const p = plan({ device: "atmega328p", clockHz: 16e6, periodS: 1e-3, highS: 0.5e-3, mode: "toggle" });
    // 16 MHz / (2 x 1 x 8000) = 1 kHz
    expect([p.registers.OCR1A, p.prescale]).toEqual([7999, 1]);
    expect(p.phaseCorrect).toBe(false);
  });

  it("an MSP430 compare toggle is not phase-correct either", () => {
    // MSP430x2xx family user's guide, Timer_A up mode with OUTMOD 4 (toggle): period 2 (TACCR0 + 1)
    const p = plan({ device: "msp430g2553", clockHz: 1e6, periodS: 1e-3, highS: 0.5e-3, mode: "toggle" });
    expect(p.registers.TACCR0).toBe(499);
    expect(p.phaseCorrect).toBe(false);
  });

  it("fast PWM is not phase-correct; the RP2040's up-down count is", () => {
    const fast = plan({ device: "atmega328p", clockHz: 16e6, periodS: 1e-3, highS: 0.25e-3, mode: "pwm" });
    expect([fast.registers.ICR1, fast.registers.OCR1A]).toEqual([15999, 3999]);
    expect(fast.phaseCorrect).toBe(false);
    const rp = plan({ device: "rp2040", clockHz: 125e6, periodS: 1e-3, highS: 0.25e-3, mode: "pwm" });
    // 2 x 62500 x 1 / 125 MHz = 1 ms; CSR = EN | PH_CORRECT
    expect([rp.registers.TOP, rp.registers.DIV, rp.registers.CSR]).toEqual([62499, 16, 0x03]);
    expect(rp.phaseCorrect).toBe(true);
  });
});

describe("plan notes", () => {
  it("an exact hardware PWM plan with full resolution carries no notes", () => {
    // 16 000 counts, 4000 high: period and high time exact, 16 000 high-time steps.
    const p = plan({ device: "atmega328p", clockHz: 16e6, periodS: 1e-3, highS: 0.25e-3, mode: "pwm" });
    expect([p.periodErrorPpm, p.highErrorPpm]).toEqual([0, 0]);
    expect(p.notes).toEqual([]);
  });

  it("the RP2040's phase-correct plan names the doubled count and nothing else", () => {
    const p = plan({ device: "rp2040", clockHz: 125e6, periodS: 1e-3, highS: 0.25e-3, mode: "pwm" });
    expect(p.notes).toEqual(["Phase-correct (up-down) counting doubles the period per count."]);
  });
});
