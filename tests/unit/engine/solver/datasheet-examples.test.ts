import { describe, expect, it } from "vitest";
import { planTarget } from "@/lib/engine";

const near = (a: number, b: number, rel = 1e-12) =>
  expect(Math.abs(a - b)).toBeLessThanOrEqual(rel * Math.abs(b));

describe("ATmega328P Timer1 (ATmega328P datasheet DS40002061)", () => {
  it("a 1 kHz compare rate at 16 MHz: prescaler 1, OCR1A = 15999 (not 64 x 250: most counts wins)", () => {
    // CTC (mode 4) toggle output: f_OC1A = f_clk / (2 N (1 + OCR1A)) (datasheet CTC frequency
    // formula) = 500 Hz for a compare every 1 ms. Both N = 1, OCR1A = 15999 and N = 64,
    // OCR1A = 249 make it exactly; engine.md section 3 breaks the tie by most counts per period.
    const p = planTarget({
      device: "atmega328p",
      clockHz: 16e6,
      periodS: 2e-3,
      highS: 1e-3,
      mode: "toggle",
      timer: "TIMER1",
    });
    expect(p.periodErrorPpm).toBe(0);
    near(p.periodS, (2 * p.divider * (1 + p.registers.OCR1A)) / 16e6);
    // most counts per period wins: prescaler 1 with OCR1A = 15999 beats 64 x 250
    expect([p.divider, p.registers.OCR1A]).toEqual([1, 15999]);
    const interval = (p.divider * p.periodCounts) / p.clockHz;
    expect(interval).toBe(1e-3);
  });

  it("8-bit Timer0 reaches 1 kHz compare rate only as prescaler 64, OCR0A = 249", () => {
    // 16 MHz / (64 * (1 + 249)) = 1000 compare matches per second (datasheet CTC formula, f_OC0A = 500 Hz).
    const p = planTarget({
      device: "atmega328p",
      clockHz: 16e6,
      periodS: 2e-3,
      highS: 1e-3,
      mode: "toggle",
      timer: "TIMER0",
    });
    expect([p.divider, p.registers.OCR0A]).toEqual([64, 249]);
    expect(p.registers.TCCR0B & 7).toBe(3); // CS01 | CS00: clk/64
    expect(p.registers.TCCR0A).toBe(0x42); // COM0A0 | WGM01
    expect(p.pin.port).toBe("PD6");
  });

  it("isr plan at 1 kHz interrupt rate uses the CTC compare with OCIE1A", () => {
    // 2 ms period, 1 ms high: one compare interrupt every 1 ms (1 kHz), two per period;
    // interval = N (1 + OCR1A) / f_clk (datasheet CTC mode: the counter clears at OCR1A).
    const p = planTarget({
      device: "atmega328p",
      clockHz: 16e6,
      periodS: 2e-3,
      highS: 1e-3,
      mode: "isr",
      timer: "TIMER1",
    });
    expect(p.mode).toBe("isr");
    expect(p.periodErrorPpm).toBe(0);
    expect(p.highErrorPpm).toBe(0);
    expect(p.registers.TIMSK1).toBe(0x02); // OCIE1A is bit 1 of TIMSK1
    expect(p.registers.TCCR1B & 0x18).toBe(0x08); // WGM12 only: CTC mode 4
    near(p.interruptIntervalS!, (p.divider * (1 + p.registers.OCR1A)) / 16e6);
    expect(p.interruptIntervalS).toBe(1e-3);
    expect(p.softwareDivider).toBe(2);
    expect(p.interruptIntervalCycles! >= 500).toBe(true);
  });

  it("fast PWM mode 14: f = f_clk / (N (1 + TOP)), high for OCR1A + 1 counts", () => {
    // 16 MHz / (8 * (1 + 39999)) = 50 Hz (datasheet fast PWM frequency formula); 1.5 ms high.
    const p = planTarget({
      device: "atmega328p",
      clockHz: 16e6,
      periodS: 20e-3,
      highS: 1.5e-3,
      mode: "pwm",
      timer: "TIMER1",
    });
    expect(p.registers.TCCR1A).toBe(0x82); // COM1A1 (bit 7) | WGM11 (bit 1)
    expect(p.registers.TCCR1B & 0x18).toBe(0x18); // WGM13 | WGM12
    near(1 / p.periodS, 16e6 / (p.divider * (1 + p.registers.ICR1)));
    near(p.highS, (p.divider * (p.registers.OCR1A + 1)) / 16e6);
    expect(p.periodErrorPpm).toBe(0);
    expect([p.divider, p.registers.ICR1]).toEqual([8, 39999]);
    expect(p.registers.TCCR1B & 7).toBe(2); // CS11: clk/8
  });
});

describe("STM32G031 TIM3 (RM0444 update event rate f_TIM / ((PSC+1)(ARR+1)))", () => {
  it("64 MHz, 1 kHz PWM with 25 % duty in PWM mode 1", () => {
    const p = planTarget({
      device: "stm32g031",
      clockHz: 64e6,
      periodS: 1e-3,
      highS: 0.25e-3,
      timer: "TIM3",
    });
    near(1 / p.periodS, 64e6 / ((p.registers.PSC + 1) * (p.registers.ARR + 1)));
    expect(p.periodErrorPpm).toBe(0);
    // PWM mode 1 upcounting: active while CNT < CCR1
    near(p.highS, ((p.registers.PSC + 1) * p.registers.CCR1) / 64e6);
    expect((p.registers.CCMR1 >> 4) & 7).toBe(0b110);
    expect([p.registers.PSC, p.registers.ARR]).toEqual([0, 63999]);
  });

  it("TIM3 16-bit needs the prescaler for 10 Hz at 64 MHz", () => {
    const p = planTarget({ device: "stm32g031", clockHz: 64e6, periodS: 0.1, highS: 0.05, timer: "TIM3" });
    expect(p.registers.ARR).toBeLessThanOrEqual(65535);
    expect((p.registers.PSC + 1) * (p.registers.ARR + 1)).toBe(6.4e6);
    // most counts: ARR + 1 = 64000, PSC + 1 = 100
    expect(p.registers.ARR + 1).toBe(64000);
  });
});

describe("RP2040 PWM (RP2040 datasheet, PWM chapter: period = (TOP+1)(PH_CORRECT+1)(DIV_INT + DIV_FRAC/16) / f_sys)", () => {
  it("period follows the datasheet formula with a fractional divider", () => {
    const p = planTarget({ device: "rp2040", clockHz: 125e6, periodS: 1.23457e-3, highS: 0.3e-3 });
    const div = p.divInt! + p.divFrac! / 16;
    const ph = (p.registers.CSR >> 1) & 1;
    near(p.periodS, ((p.registers.TOP + 1) * (ph + 1) * div) / 125e6);
    expect(p.registers.DIV).toBe((p.divInt! << 4) | p.divFrac!);
    expect(p.divFrac).not.toBe(0);
    expect(p.jitterS).toBe(1 / 125e6);
    expect(Math.abs(p.periodErrorPpm)).toBeLessThan(1);
  });

  it("phase-correct mode doubles the period: 0.5 s at 125 MHz needs it", () => {
    // Edge-aligned reach is 255.9375 * 65536 / 125 MHz = 0.134 s; phase-correct doubles it.
    const p = planTarget({ device: "rp2040", clockHz: 125e6, periodS: 0.25, highS: 0.1 });
    expect(p.phaseCorrect).toBe(true);
    expect(p.registers.CSR).toBe(0x03); // EN | PH_CORRECT
    near(p.periodS, ((p.registers.TOP + 1) * 2 * p.divider) / 125e6);
    near(p.highS, (2 * p.divider * p.registers.CC) / 125e6);
    expect(p.periodErrorPpm).toBe(0);
  });
});

describe("PIC12F1840 Timer2 + CCP1 PWM (PIC12F1840 datasheet: period (PR2+1)*4*Tosc*prescale, pulse = DC*Tosc*prescale)", () => {
  it("32 MHz, 1 kHz, 30 % duty", () => {
    const p = planTarget({ device: "pic12f1840", clockHz: 32e6, periodS: 1e-3, highS: 0.3e-3 });
    const prescale = [1, 4, 16, 64][p.registers.T2CON & 3];
    const tosc = 1 / 32e6;
    near(p.periodS, (p.registers.PR2 + 1) * 4 * tosc * prescale);
    const dc = (p.registers.CCPR1L << 2) | ((p.registers.CCP1CON >> 4) & 3);
    near(p.highS, dc * tosc * prescale);
    expect(p.registers.CCP1CON & 0x0f).toBe(0x0c); // CCP1M = 11xx: PWM
    expect(p.periodErrorPpm).toBe(0);
    expect(p.highErrorPpm).toBe(0);
    // 10-bit duty: 4 * (PR2 + 1) steps per period
    expect(p.resolutionBits).toBeCloseTo(Math.log2(4 * (p.registers.PR2 + 1)), 12);
  });
});

describe("MSP430G2553 Timer_A up mode (SLAU144: period TACCR0 + 1 counts; OUTMOD_7 high for TACCR1 counts)", () => {
  it("1 MHz calibrated DCO, 50 Hz, 1.5 ms", () => {
    const p = planTarget({ device: "msp430g2553", clockHz: 1e6, periodS: 20e-3, highS: 1.5e-3 });
    const id = 1 << ((p.registers.TACTL >> 6) & 3);
    near(p.periodS, (id * (p.registers.TACCR0 + 1)) / 1e6);
    near(p.highS, (id * p.registers.TACCR1) / 1e6);
    expect(p.registers.TACCTL1).toBe(0x00e0); // OUTMOD_7
    expect((p.registers.TACTL >> 4) & 3).toBe(1); // MC_1 up mode
    expect((p.registers.TACTL >> 8) & 3).toBe(2); // TASSEL_2 SMCLK
    expect([id, p.registers.TACCR0, p.registers.TACCR1]).toEqual([1, 19999, 1500]);
  });
});
