// Triggered plans (engine.md section 6) on all six devices: zero crossings at
// 50 Hz and 60 Hz over the firing-angle range and trigger one-shots. Each plan
// must put the pulse within one timer count of the requested delay (plus the
// stated input latency) and the pulse width within one count, and its
// registers, decoded here with the datasheet's bit definitions (independently
// of the engine's encoders), must count exactly those counts.
//
// Triggered firmware is not generated this round, so no emulator runs the
// input path yet: the checks are the timer registers, the counts formula and
// the datasheet latency figures (named per device below).
import { describe, expect, it } from "vitest";
import { planTarget, type PlanRequest, type TimerPlan } from "@/lib/engine";
import { expectEngineError } from "../expect-engine-error";

/** Clock per device, one its datasheet allows on the default package. */
const CLOCK: Record<string, number> = {
  atmega328p: 16e6,
  attiny85: 8e6,
  stm32g031: 64e6,
  rp2040: 125e6,
  // Timer2 (8-bit, at most Fosc/4/64) reaches a 10 ms delay only from a slow clock.
  pic12f1840: 4e6,
  msp430g2553: 16e6,
};

/** Timer divider and top decoded from the plan's registers, per datasheet. */
function decode(p: TimerPlan): { divider: number; counts: number } {
  const r = p.registers;
  switch (`${p.device}/${p.timer}`) {
    // ATmega328P datasheet, Timer/Counter1 TCCR1B CS12:0 (Clock Select Bit Description): 1..5 = 1, 8, 64, 256, 1024; CTC TOP = OCR1A
    case "atmega328p/TIMER1":
      return { divider: [0, 1, 8, 64, 256, 1024][r.TCCR1B & 7], counts: r.OCR1A + 1 };
    // ATtiny25/45/85 datasheet, Timer/Counter0 TCCR0B CS02:0: 1..5 = 1, 8, 64, 256, 1024; CTC TOP = OCR0A
    case "attiny85/TIMER0":
      return { divider: [0, 1, 8, 64, 256, 1024][r.TCCR0B & 7], counts: r.OCR0A + 1 };
    // ATtiny25/45/85 datasheet, Timer/Counter1 TCCR1 CS13:0: n -> 2^(n-1); CTC1 clears on OCR1C
    case "attiny85/TIMER1":
      return { divider: 2 ** ((r.TCCR1 & 15) - 1), counts: r.OCR1C + 1 };
    // RM0444, TIMx_PSC: counter clock = f / (PSC + 1); period ARR + 1
    case "stm32g031/TIM2":
    case "stm32g031/TIM3":
      return { divider: r.PSC + 1, counts: r.ARR + 1 };
    // PIC12F1840 datasheet, Timer2: clocked at Fosc/4, T2CKPS 0..3 = 1, 4, 16, 64; period PR2 + 1
    case "pic12f1840/TIMER2":
      return { divider: 4 * [1, 4, 16, 64][r.T2CON & 3], counts: r.PR2 + 1 };
    // MSP430x2xx family user's guide, Timer_A TACTL ID bits 7:6 = 1, 2, 4, 8; up mode to TACCR0
    case "msp430g2553/TIMER0_A3":
      return { divider: [1, 2, 4, 8][(r.TACTL >> 6) & 3], counts: r.TACCR0 + 1 };
    default:
      // RP2040 datasheet, PWM CHx_DIV: DIV_INT in bits 11:4, DIV_FRAC 3:0; wrap at TOP + 1
      if (p.device === "rp2040") {
        const slice = p.timer.replace("PWM", "");
        const div = r[`CH${slice}_DIV`] ?? r.DIV;
        const top = r[`CH${slice}_TOP`] ?? r.TOP;
        return { divider: (div >> 4) + (div & 15) / 16, counts: top + 1 };
      }
      throw new Error(`no decoder for ${p.device}/${p.timer}`);
  }
}

/** The rule of engine.md section 6, read from the plan's own numbers. */
function violations(p: TimerPlan, req: PlanRequest): string[] {
  const out: string[] = [];
  const count = p.divider / p.clockHz;
  const pulse = req.highS;
  const delay = req.delayS ?? 0;
  // The pulse starts between delayS and delayS + latencyS after the input edge.
  const earliest = p.delayS!;
  const latest = p.delayS! + p.latencyS!;
  if (Math.abs(earliest - delay) > count + 1e-15) out.push(`delay ${earliest} vs ${delay}`);
  if (latest - delay > count + p.latencyS! + 1e-15) out.push(`late ${latest} vs ${delay}`);
  if (Math.abs(p.highS - pulse) > count + 1e-15) out.push(`pulse ${p.highS} vs ${pulse}`);
  if (Math.abs(p.delayCounts! * count - p.delayS!) > 1e-15) out.push("delayS is not delayCounts counts");
  const hw = decode(p);
  if (hw.divider !== p.divider) out.push(`registers divide by ${hw.divider}, plan says ${p.divider}`);
  if (hw.counts !== p.delayCounts! + p.highCounts) out.push(`registers count ${hw.counts}`);
  return out;
}

const DEVICES = Object.keys(CLOCK);

describe.each(DEVICES)("%s: zero-cross and trigger plans within one count plus latency", (device) => {
  for (const mainsHz of [50, 60]) {
    it(`zero crossings at ${mainsHz} Hz, firing angles 5..175 deg, 100 us gate pulse`, () => {
      const half = 1 / (2 * mainsHz);
      for (const deg of [5, 30, 60, 90, 120, 150, 175]) {
        const req: PlanRequest = {
          device,
          clockHz: CLOCK[device],
          start: "zero-cross",
          periodS: half,
          delayS: ((deg / 180) * half * 0.98) as number,
          highS: 100e-6,
        };
        const p = planTarget(req);
        expect(p.start).toBe("zero-cross");
        expect(p.edge).toBe("both"); // one edge per crossing: both half cycles
        expect(violations(p, req), `${deg} deg`).toEqual([]);
      }
    });
  }

  it("a trigger one-shot (falling edge, ignore while running) and a restartable one", () => {
    const req: PlanRequest = { device, clockHz: CLOCK[device], start: "trigger", periodS: 0.1, highS: 2e-3 };
    const p = planTarget(req);
    expect(p.edge).toBe("falling");
    expect(p.retrigger).toBe("ignore");
    expect(violations(p, req)).toEqual([]);
    const q = planTarget({ ...req, delayS: 1e-3, edge: "rising", retrigger: "restart" });
    expect(q.retrigger).toBe("restart");
    expect(q.notes.join(" ")).toMatch(/starts the delay again/);
    expect(violations(q, { ...req, delayS: 1e-3 })).toEqual([]);
  });

  it("the input pin is another pin than the output and names its conditioning", () => {
    const p = planTarget({
      device,
      clockHz: CLOCK[device],
      start: "zero-cross",
      periodS: 0.01,
      delayS: 5e-3,
      highS: 1e-4,
    });
    expect(p.input!.port).not.toBe(p.pin.port);
    expect(p.input!.packagePin).not.toBe(p.pin.packagePin);
    expect(p.inputConditioning).toMatch(/isolated zero-cross detector/);
  });

  // Planted fault, kept as a negative case: two counts too late must be caught.
  it("the rule check catches a plan two counts off", () => {
    const req: PlanRequest = {
      device,
      clockHz: CLOCK[device],
      start: "zero-cross",
      periodS: 0.01,
      delayS: 5e-3,
      highS: 1e-4,
    };
    const p = planTarget(req);
    const bad = {
      ...p,
      delayCounts: p.delayCounts! + 2,
      delayS: ((p.delayCounts! + 2) * p.divider) / p.clockHz,
    };
    expect(violations(bad, req).length).toBeGreaterThan(0);
  });
});

describe("input pins and interrupt response per datasheet", () => {
  // [port, package pin, least response in clock cycles] from each datasheet:
  const expected: Record<string, [string, number, number]> = {
    // ATmega328P datasheet: pin configuration PDIP-28, PD2 (INT0) = pin 4; Interrupt Response Time, 4 cycles minimum
    atmega328p: ["PD2", 4, 4],
    // ATtiny25/45/85 datasheet: PDIP-8, PB2 (INT0) = pin 7; Interrupt Response Time, 4 cycles minimum
    attiny85: ["PB2", 7, 4],
    // RM0444 EXTI on PA1; TSSOP-20 pin 8 (from memory); Cortex-M0+ TRM: 15-cycle entry
    stm32g031: ["PA1", 8, 15],
    // RP2040 datasheet: QFN-56 GPIO15 = pin 18 (from memory); Cortex-M0+ 15-cycle entry
    rp2040: ["GPIO15", 18, 15],
    // PIC12F1840 datasheet: PDIP-8 RA1 = pin 6, IOC; interrupt latency at least 3 instruction cycles (12 clocks)
    pic12f1840: ["RA1", 6, 12],
    // MSP430G2553 datasheet: PDIP-20 P1.3 = pin 5; family guide: 6 cycles to accept an interrupt
    msp430g2553: ["P1.3", 5, 6],
  };
  it.each(DEVICES)("%s", (device) => {
    const p = planTarget({ device, clockHz: CLOCK[device], start: "trigger", periodS: 0.01, highS: 1e-4 });
    const [port, packagePin, least] = expected[device];
    expect(p.input!.port).toBe(port);
    expect(p.input!.packagePin).toBe(packagePin);
    expect(p.latencyCycles!).toBeGreaterThan(least);
    expect(p.latencyS!).toBeCloseTo(p.latencyCycles! / CLOCK[device], 18);
    expect(p.latencyBasis).toMatch(/cycles/);
  });
});

describe("ATmega328P worked numbers", () => {
  // 16 MHz, 5 ms + 100 us: 16e6 * 5.1e-3 = 81 600 cycles exceeds Timer1's 65 536 at
  // clk/1, so clk/8 (CS12:0 = 010): 10 000 + 200 counts, OCR1A = 10 199, TCCR1B = WGM12 | CS11 = 0x0A.
  it("zero cross at 50 Hz, 90 deg, 100 us", () => {
    const p = planTarget({
      device: "atmega328p",
      clockHz: 16e6,
      start: "zero-cross",
      periodS: 0.01,
      delayS: 5e-3,
      highS: 1e-4,
    });
    expect(p.divider).toBe(8);
    expect(p.delayCounts).toBe(10000);
    expect(p.highCounts).toBe(200);
    expect(p.registers.TCCR1B).toBe(0x0a);
    expect(p.registers.OCR1A).toBe(10199);
  });
});

describe("bad triggered requests name the field and plan nothing", () => {
  const base: PlanRequest = {
    device: "atmega328p",
    clockHz: 16e6,
    start: "zero-cross",
    periodS: 0.01,
    delayS: 5e-3,
    highS: 1e-4,
  };
  it("refusals", () => {
    expectEngineError(() => planTarget({ ...base, start: "later" as never }), "invalid-request", "start");
    expectEngineError(() => planTarget({ ...base, delayS: -1e-3 }), "invalid-request", "delayS");
    expectEngineError(() => planTarget({ ...base, delayS: 9.95e-3 }), "invalid-request", "delayS");
    expectEngineError(() => planTarget({ ...base, edge: "up" as never }), "invalid-request", "edge");
    expectEngineError(() => planTarget({ ...base, retrigger: "restart" }), "invalid-request", "retrigger");
    expectEngineError(
      () => planTarget({ ...base, start: "free", delayS: 1e-3 }),
      "invalid-request",
      "delayS",
    );
    // 8-bit Timer2 of the PIC at 32 MHz counts at most 256 * 256 / 32e6 = 2 ms.
    const e = expectEngineError(
      () => planTarget({ ...base, device: "pic12f1840", clockHz: 32e6 }),
      "unreachable-period",
      "delayS",
    );
    expect(e.message).toMatch(/use a clock of .* Hz or less/);
  });
  it("free-running plans carry no trigger fields", () => {
    const p = planTarget({ device: "atmega328p", clockHz: 16e6, periodS: 1e-3, highS: 2.5e-4 });
    expect(p.start).toBeUndefined();
    expect(p.input).toBeUndefined();
  });
});
