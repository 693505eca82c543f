// Every clock-select / divider code of every timer of every device, checked
// against tables typed here from the vendors' documents (not from
// lib/engine/devices or lib/bundle). Both the solver's `registers` and the
// bundle's register writes (what the generated C stores) are decoded with
// these tables and must give back the plan's divider.
//
// To make the solver pick a given divider d, the request asks for
// d * maxCounts * modeFactor clock cycles: a smaller divider cannot reach it
// and a larger one reaches it with fewer counts, which the ordering of
// engine.md section 3 ("ties -> most counts per period") ranks lower.
import { describe, expect, it } from "vitest";
import type { BundlePlan } from "@/lib/bundle";
import { DEVICES as BUNDLE_DEVICES } from "@/lib/bundle/devices";
import { planTarget, type PlanRequest } from "@/lib/engine";
import { DEVICES } from "@/lib/engine/devices";

// ATmega328P datasheet (Microchip DS40002061), 8-bit Timer/Counter0, register
// description TCCR0B, "Clock Select Bit Description" table: CS02:0 = 001 clk/1,
// 010 clk/8, 011 clk/64, 100 clk/256, 101 clk/1024 (110/111 = external T0 pin).
// Timer/Counter1 (TCCR1B CS12:0) has the same table. The ATtiny25/45/85
// datasheet gives the same CS02:0 table for its Timer/Counter0 (TCCR0B).
const AVR_CS_T0_T1: Record<number, number> = { 1: 0b001, 8: 0b010, 64: 0b011, 256: 0b100, 1024: 0b101 };
// ATmega328P datasheet DS40002061, 8-bit Timer/Counter2 with asynchronous
// operation, register description TCCR2B, "Clock Select Bit Description":
// CS22:0 = 001 /1, 010 /8, 011 /32, 100 /64, 101 /128, 110 /256, 111 /1024.
const AVR_CS_T2: Record<number, number> = {
  1: 0b001,
  8: 0b010,
  32: 0b011,
  64: 0b100,
  128: 0b101,
  256: 0b110,
  1024: 0b111,
};
// ATtiny25/45/85 datasheet, 8-bit Timer/Counter1, TCCR1 register description,
// "Timer/Counter1 Prescale Select" table: CS13:10 = 0001 CK, 0010 CK/2,
// 0011 CK/4, 0100 CK/8 ... 1110 CK/8192, 1111 CK/16384 (0000 = stopped).
// Written out row by row, not as a formula.
const TINY_CS1: Record<number, number> = {
  1: 0b0001,
  2: 0b0010,
  4: 0b0011,
  8: 0b0100,
  16: 0b0101,
  32: 0b0110,
  64: 0b0111,
  128: 0b1000,
  256: 0b1001,
  512: 0b1010,
  1024: 0b1011,
  2048: 0b1100,
  4096: 0b1101,
  8192: 0b1110,
  16384: 0b1111,
};
// PIC12F1840 datasheet (Microchip DS40001441), Timer2 module, T2CON register:
// T2CKPS<1:0> (bits 1:0) = 00 prescaler 1, 01 = 4, 10 = 16, 11 = 64; Timer2
// counts Fosc/4, so the plan's divider in clock cycles is 4 x prescale.
const PIC_T2CKPS: Record<number, number> = { 1: 0b00, 4: 0b01, 16: 0b10, 64: 0b11 };
// MSP430x2xx Family User's Guide (TI SLAU144), Timer_A, TACTL register:
// ID bits 7-6 = 00 /1, 01 /2, 10 /4, 11 /8.
const MSP_ID: Record<number, number> = { 1: 0b00, 2: 0b01, 4: 0b10, 8: 0b11 };

// Decoders: bit positions from the same register descriptions.
const invert = (t: Record<number, number>) => new Map(Object.entries(t).map(([d, c]) => [c, Number(d)]));
const avr = (table: Record<number, number>) => (v: number) => invert(table).get(v & 0b111);
const tiny1 = (v: number) => invert(TINY_CS1).get(v & 0b1111); // TCCR1 CS13:10 = bits 3..0
const pic = (v: number) => {
  const p = invert(PIC_T2CKPS).get(v & 0b11);
  return p === undefined ? undefined : 4 * p;
};
const msp = (v: number) => invert(MSP_ID).get((v >> 6) & 0b11); // TACTL ID = bits 7..6

interface Case {
  device: PlanRequest["device"];
  timer: string;
  clockHz: number;
  /** Clock option the bundle has code for at clockHz (PIC12F1840: 32 MHz only through the 4x PLL). */
  clockSource?: string;
  /** datasheet counter length: 8-bit 256, 16-bit 65536 counts */
  maxCounts: number;
  modes: { mode: "pwm" | "toggle"; factor: number }[];
  dividers: number[];
  /** solver register key, bundle write name (same register) */
  reg: string;
  bundleReg: string;
  decode: (value: number) => number | undefined;
}

const avrModes = [
  { mode: "pwm" as const, factor: 1 },
  { mode: "toggle" as const, factor: 2 }, // CTC toggle: one output period = 2 compare matches
];

const CASES: Case[] = [
  ...(["TIMER0", "TIMER1", "TIMER2"] as const).map((timer) => {
    const table = timer === "TIMER2" ? AVR_CS_T2 : AVR_CS_T0_T1;
    const reg = `TCCR${timer.slice(-1)}B`;
    return {
      device: "atmega328p",
      timer,
      clockHz: 16e6,
      maxCounts: timer === "TIMER1" ? 65536 : 256,
      modes: avrModes,
      dividers: Object.keys(table).map(Number),
      reg,
      bundleReg: reg,
      decode: avr(table),
    };
  }),
  {
    device: "attiny85",
    timer: "TIMER0",
    clockHz: 8e6,
    maxCounts: 256,
    modes: avrModes,
    dividers: Object.keys(AVR_CS_T0_T1).map(Number),
    reg: "TCCR0B",
    bundleReg: "TCCR0B",
    decode: avr(AVR_CS_T0_T1),
  },
  {
    device: "attiny85",
    timer: "TIMER1",
    clockHz: 8e6,
    maxCounts: 256, // OCR1C is 8 bits
    modes: avrModes,
    dividers: Object.keys(TINY_CS1).map(Number),
    reg: "TCCR1",
    bundleReg: "TCCR1",
    decode: tiny1,
  },
  {
    device: "pic12f1840",
    timer: "TIMER2",
    clockHz: 32e6,
    clockSource: "crystal-pll",
    maxCounts: 256, // PR2 is 8 bits
    modes: [{ mode: "pwm", factor: 1 }],
    dividers: Object.keys(PIC_T2CKPS).map((p) => 4 * Number(p)),
    reg: "T2CON",
    bundleReg: "T2CON",
    decode: pic,
  },
  {
    device: "msp430g2553",
    timer: "TIMER0_A3",
    clockHz: 16e6,
    maxCounts: 65536,
    modes: avrModes, // up mode OUTMOD_7 (pwm) and OUTMOD_4 toggle (2 periods per output period)
    dividers: Object.keys(MSP_ID).map(Number),
    reg: "TACTL",
    bundleReg: "TA0CTL",
    decode: msp,
  },
];

function writes(plan: BundlePlan): Map<string, number> {
  return new Map(BUNDLE_DEVICES[plan.device].view(plan).writes.map((w) => [w.reg, w.value]));
}

describe("clock-select codes against the datasheet tables", () => {
  for (const c of CASES)
    for (const { mode, factor } of c.modes)
      it(`${c.device} ${c.timer} ${mode}: every divider (${c.dividers.join(", ")})`, () => {
        for (const d of c.dividers) {
          const periodS = (d * c.maxCounts * factor) / c.clockHz;
          const req: PlanRequest = {
            device: c.device,
            clockHz: c.clockHz,
            periodS,
            highS: periodS / 2,
            mode,
            timer: c.timer,
            ...(c.clockSource ? { clockSource: c.clockSource } : {}),
          };
          const plan = planTarget(req) as BundlePlan;
          expect([d, plan.mode, plan.timer, plan.divider, plan.periodCounts]).toEqual([
            d,
            mode,
            c.timer,
            d,
            c.maxCounts,
          ]);
          expect([d, c.decode(plan.registers[c.reg])]).toEqual([d, d]);
          const w = writes(plan);
          expect(w.has(c.bundleReg), `${c.bundleReg} written`).toBe(true);
          expect([d, c.decode(w.get(c.bundleReg)!)]).toEqual([d, d]);
        }
      });

  it("the tables decode each code to one divider (a typo in a table shows here)", () => {
    for (const t of [AVR_CS_T0_T1, AVR_CS_T2, TINY_CS1, PIC_T2CKPS, MSP_ID])
      expect(invert(t).size).toBe(Object.keys(t).length);
  });
});

// STM32G0x1 reference manual RM0444, general-purpose timers TIM2/TIM3,
// TIMx_PSC: "The counter clock frequency CK_CNT is equal to fCK_PSC / (PSC[15:0] + 1)",
// so PSC = N - 1 for N = 1..65536. All 65536 values cannot be forced one by
// one in a unit test; the sample covers both ends, powers of two and primes.
describe("STM32G031 PSC = N - 1 (RM0444, TIMx_PSC)", () => {
  const sample = [1, 2, 3, 7, 8, 100, 127, 1000, 4093, 32768, 65535, 65536];
  for (const timer of ["TIM3", "TIM2"] as const)
    it(`${timer}: sampled prescalers`, () => {
      const clockHz = 16e6;
      // TIM3 is 16-bit (ARR+1 up to 65536); TIM2 is 32-bit, so a 16-bit count
      // would be reached with a smaller divider: ask for odd periods instead.
      for (const n of sample) {
        const counts = timer === "TIM3" ? 65536 : 3;
        const periodS = (n * counts) / clockHz;
        const plan = planTarget({
          device: "stm32g031",
          clockHz,
          periodS,
          highS: periodS / 2,
          mode: "pwm",
          timer,
        }) as BundlePlan;
        expect(Math.abs(plan.periodErrorPpm)).toBeLessThan(1e-6);
        // whatever (PSC, ARR) pair is exact, PSC decodes to the plan's divider
        expect([n, plan.registers.PSC + 1]).toEqual([n, plan.divider]);
        expect([n, writes(plan).get("PSC")! + 1]).toEqual([n, plan.divider]);
        if (timer === "TIM3") expect([n, plan.divider]).toEqual([n, n]);
      }
    });
});

// RP2040 datasheet, PWM chapter, CHx_DIV register: INT bits 11:4, FRAC bits
// 3:0; the slice counts at f_sys / (INT + FRAC/16), INT 1..255 (0 means 256).
describe("RP2040 DIV INT.FRAC (RP2040 datasheet, PWM, CHx_DIV)", () => {
  const decode = (v: number) => ((v >> 4) & 0xff) + (v & 0xf) / 16;
  it("integer and fractional dividers decode to the plan's divider", () => {
    const clockHz = 125e6;
    // The solver prefers an integer divider when one is as exact (a
    // fractional one jitters by a clock, engine.md section 2), so periods of
    // a prime number of clock cycles above 65536 are used to reach the
    // fractional ones: no integer divider times a count equals them.
    const cycles = [
      65536, 131072, 8_000_000, 16_711_680, 70_001, 1_000_003, 3_999_971, 12_345_679, 16_000_057,
    ];
    const seen: number[] = [];
    for (const k of cycles) {
      const periodS = k / clockHz;
      const plan = planTarget({
        device: "rp2040",
        clockHz,
        periodS,
        highS: periodS / 2,
        mode: "pwm",
      }) as BundlePlan;
      expect([k, decode(plan.registers.DIV)]).toEqual([k, plan.divider]);
      const div = [...writes(plan).entries()].find(([reg]) => /DIV$/.test(reg));
      expect(div, "a DIV register write").toBeDefined();
      expect([k, decode(div![1])]).toEqual([k, plan.divider]);
      seen.push(plan.divider);
    }
    expect(seen.filter((d) => !Number.isInteger(d)).length).toBeGreaterThanOrEqual(3);
    expect(seen.filter((d) => Number.isInteger(d) && d > 1).length).toBeGreaterThanOrEqual(2);
  });

  it("the slice takes every INT 1..255 with every FRAC 0..15, up to 255 + 15/16", () => {
    const typed: number[] = [];
    for (let int = 1; int <= 255; int++) for (let frac = 0; frac <= 15; frac++) typed.push(int + frac / 16);
    const slice = DEVICES.find((d) => d.id === "rp2040")!.timers.find((t) => t.name === "PWM0")!;
    expect(slice.dividers.length).toBe(typed.length);
    expect([...slice.dividers]).toEqual(typed);
    // The longest phase-correct period, 2 x 65536 x 255.9375 clocks, has one
    // exact setting: TOP 65535 with DIV 0xFFF.
    const periodS = (2 * 65536 * 255.9375) / 125e6;
    const plan = planTarget({
      device: "rp2040",
      clockHz: 125e6,
      periodS,
      highS: periodS / 2,
      mode: "pwm",
    }) as BundlePlan;
    expect([plan.registers.DIV, plan.registers.TOP, plan.registers.CSR]).toEqual([0xfff, 65535, 0x03]);
    expect(decode(plan.registers.DIV)).toBe(255.9375);
    expect(plan.periodErrorPpm).toBe(0);
  });
});
