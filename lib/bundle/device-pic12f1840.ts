// PIC12F1840, Timer2 + CCP1 PWM or Timer2 interrupts. PIC12(L)F1840
// datasheet (Microchip DS40001441): oscillator module (FOSC in CONFIG1,
// OSCCON SPLLEN/IRCF/SCS, OSCSTAT ready bits), configuration words
// (Register 4-1 CONFIG1, 4-2 CONFIG2), Timer2 (T2CON T2CKPS 1/4/16/64, PR2),
// CCP1 PWM (period = (PR2+1)*4*Tosc*prescale, pulse = CCPR1L:DC1B*Tosc*prescale)
// and its "Setup for PWM operation" steps, APFCON CCP1SEL (RA2 or RA5),
// PIR1/PIE1 TMR2IF/TMR2IE.
//
// One ordered list of steps (register writes and ready-bit waits, each with
// its bank) feeds both src/main.asm (built with gpasm into the image) and
// src/main.c (for users of the vendor's C compiler), so the two cannot drift.
import { EngineError } from "@/lib/engine/errors";
import { findDevice } from "@/lib/engine/devices";
import { intRange, unsupported, write, type DeviceView, type RegisterWrite } from "./device-view";
import { pinFacts } from "./pins";
import type { BundlePlan } from "./types";

const T2CKPS: Record<number, number> = { 1: 0, 4: 1, 16: 2, 64: 3 };

/** OSCSTAT bits (DS40001441 Register 5-2): T1OSCR 7, PLLR 6, OSTS 5, HFIOFR 4, HFIOFL 3, MFIOFR 2, LFIOFR 1, HFIOFS 0. */
export const OSCSTAT_BITS = { PLLR: 6, HFIOFR: 4, MFIOFR: 2, LFIOFR: 1 } as const;
type ReadyBit = keyof typeof OSCSTAT_BITS;

export interface PicOsc {
  osccon: number;
  text: string;
  /** OSCSTAT bits to wait for before the timer starts. */
  ready: ReadyBit[];
}

/**
 * OSCCON for the internal oscillator with FOSC = INTOSC and SCS = 00
 * (DS40001441 Register 5-1: SPLLEN 7, IRCF<3:0> 6..3, SCS<1:0> 1..0).
 * 125 kHz to 16 MHz come from HFINTOSC (16 MHz, postscaled; 125-500 kHz
 * also exist from MFINTOSC, HF is used for them), 62.5 and 31.25 kHz from
 * MFINTOSC (500 kHz), 31 kHz from LFINTOSC. null: no such IRCF step.
 */
export function picOsccon(clockHz: number): PicOsc | null {
  const table: [number, number, string, ReadyBit[]][] = [
    [32e6, 0b1_1110_0_00, "SPLLEN = 1, IRCF = 1110: 8 MHz HFINTOSC x 4 PLL", ["HFIOFR", "PLLR"]],
    [16e6, 0b0_1111_0_00, "IRCF = 1111: 16 MHz HFINTOSC", ["HFIOFR"]],
    [8e6, 0b0_1110_0_00, "IRCF = 1110: 8 MHz HFINTOSC", ["HFIOFR"]],
    [4e6, 0b0_1101_0_00, "IRCF = 1101: 4 MHz HFINTOSC", ["HFIOFR"]],
    [2e6, 0b0_1100_0_00, "IRCF = 1100: 2 MHz HFINTOSC", ["HFIOFR"]],
    [1e6, 0b0_1011_0_00, "IRCF = 1011: 1 MHz HFINTOSC", ["HFIOFR"]],
    [500e3, 0b0_1010_0_00, "IRCF = 1010: 500 kHz HFINTOSC", ["HFIOFR"]],
    [250e3, 0b0_1001_0_00, "IRCF = 1001: 250 kHz HFINTOSC", ["HFIOFR"]],
    [125e3, 0b0_1000_0_00, "IRCF = 1000: 125 kHz HFINTOSC", ["HFIOFR"]],
    [62.5e3, 0b0_0100_0_00, "IRCF = 0100: 62.5 kHz MFINTOSC", ["MFIOFR"]],
    [31.25e3, 0b0_0010_0_00, "IRCF = 0010: 31.25 kHz MFINTOSC", ["MFIOFR"]],
    [31e3, 0b0_0000_0_00, "IRCF = 0000: 31 kHz LFINTOSC", ["LFIOFR"]],
  ];
  const hit = table.find(([hz]) => hz === clockHz);
  return hit ? { osccon: hit[1], text: hit[2], ready: hit[3] } : null;
}

/** FOSC<2:0> mode names of CONFIG1 (the assembler's and the C compiler's spelling). */
export type PicFosc = "LP" | "XT" | "HS" | "ECL" | "ECM" | "ECH" | "INTOSC";

export interface PicConfig {
  fosc: PicFosc;
  pllen: boolean;
  /** Why this oscillator mode, one line. */
  why: string;
}

function fmtHz(hz: number): string {
  return hz >= 1e6 ? `${hz / 1e6} MHz` : `${hz / 1e3} kHz`;
}

function refuse(plan: BundlePlan, message: string): never {
  throw new EngineError("clock-out-of-range", `${plan.device}: ${message}`, "clockHz");
}

/** Configuration word oscillator fields for the plan's clock option (DS40001441 Register 4-1 FOSC, 4-2 PLLEN). */
export function picConfig(plan: BundlePlan): PicConfig {
  const id = plan.clockSource ?? "crystal";
  const option = findDevice("pic12f1840")?.clocks.find((c) => c.id === id);
  if (!option) refuse(plan, `unknown clock option "${id}"`);
  const f = plan.clockHz;
  if (option.frequenciesHz && !option.frequenciesHz.includes(f))
    refuse(
      plan,
      `clock option "${id}" makes only ${option.frequenciesHz.map(fmtHz).join(", ")}; not ${f} Hz`,
    );
  if (option.minHz !== undefined && option.maxHz !== undefined && (f < option.minHz || f > option.maxHz))
    refuse(
      plan,
      `clock option "${id}" runs from ${fmtHz(option.minHz)} to ${fmtHz(option.maxHz)}; not ${f} Hz`,
    );
  switch (id) {
    case "crystal":
      // LP for watch crystals, XT up to 4 MHz, HS above (oscillator module, crystal modes).
      // The 100 kHz LP/XT boundary: common practice, no source.
      if (f <= 100e3)
        return { fosc: "LP", pllen: false, why: `LP: ${fmtHz(f)} low-power crystal on OSC1/OSC2` };
      if (f <= 4e6) return { fosc: "XT", pllen: false, why: `XT: ${fmtHz(f)} crystal on OSC1/OSC2` };
      return { fosc: "HS", pllen: false, why: `HS: ${fmtHz(f)} crystal on OSC1/OSC2` };
    case "crystal-pll":
      return { fosc: "HS", pllen: true, why: `HS with PLLEN: ${fmtHz(f / 4)} crystal x 4 PLL` };
    case "external":
      // ECL 0-0.5 MHz, ECM 0.5-4 MHz, ECH 4-32 MHz (CONFIG1 FOSC table).
      if (f <= 500e3) return { fosc: "ECL", pllen: false, why: `ECL: ${fmtHz(f)} clock into CLKIN` };
      if (f <= 4e6) return { fosc: "ECM", pllen: false, why: `ECM: ${fmtHz(f)} clock into CLKIN` };
      return { fosc: "ECH", pllen: false, why: `ECH: ${fmtHz(f)} clock into CLKIN` };
    default:
      // Internal: SPLLEN in OSCCON switches the PLL, which works only with PLLEN = 0.
      return { fosc: "INTOSC", pllen: false, why: `INTOSC: internal oscillator, RA4 and RA5 free` };
  }
}

/** One start-up step: a register write or a wait for a flag, in the bank the register lives in. */
export interface PicStep {
  /** Register whose bank BANKSEL selects before the step. */
  bankOf: string;
  write: RegisterWrite | null;
  /** Wait until reg<bit> reads 1 (ready flag or TMR2IF). */
  wait: { reg: string; bit: string; why: string } | null;
  /** Clear one bit, read-modify-write (bcf), e.g. PIR1 TMR2IF. */
  clear: { reg: string; bit: string; why: string } | null;
}

export const step = (s: Partial<PicStep> & { bankOf: string }): PicStep => ({
  write: null,
  wait: null,
  clear: null,
  ...s,
});

function bytes32(plan: BundlePlan, name: string, v: number): string[] {
  const n = intRange(plan, name, v, 0, 0xffffffff);
  return [0, 8, 16, 24].map((sh) => hex2(Math.floor(n / 2 ** sh) & 0xff));
}

export const hex2 = (v: number) => `0x${v.toString(16).toUpperCase().padStart(2, "0")}`;

/** Oscillator start-up steps: OSCCON and its ready bits (internal), or the PLL lock wait (crystal with PLLEN). */
export function picOscSteps(config: PicConfig, osc: PicOsc | null): PicStep[] {
  const steps: PicStep[] = [];
  const put = (w: RegisterWrite) => steps.push(step({ bankOf: w.reg, write: w }));
  if (osc) {
    put(write("OSCCON", osc.osccon, hex2(osc.osccon), `${osc.text}, SCS = 00 (clock from FOSC = INTOSC)`));
    for (const r of osc.ready)
      steps.push(
        step({ bankOf: "OSCSTAT", wait: { reg: "OSCSTAT", bit: r, why: `${r}: oscillator ready` } }),
      );
  } else if (config.pllen) {
    steps.push(
      step({ bankOf: "OSCSTAT", wait: { reg: "OSCSTAT", bit: "PLLR", why: "PLLR: 4x PLL locked" } }),
    );
  }
  return steps;
}

export function pic12f1840View(plan: BundlePlan): DeviceView {
  if (plan.timer.toUpperCase() !== "TIMER2") unsupported(plan, `timer ${plan.timer}`);
  const prescale = plan.divider / 4;
  const ckps =
    T2CKPS[prescale] ??
    unsupported(plan, `Timer2 prescale ${prescale} (divider ${plan.divider} = 4 x prescale)`);
  const m = /^RA([0-5])$/.exec(plan.pin.port) ?? unsupported(plan, `pin ${plan.pin.port}`);
  const bit = Number(m[1]);
  if (plan.mode === "toggle")
    throw new EngineError(
      "invalid-request",
      "pic12f1840: Timer2 has no compare toggle output; use pwm or isr",
    );
  const isr = plan.mode === "isr";
  if (!isr && bit !== 2 && bit !== 5) unsupported(plan, `CCP1 on ${plan.pin.port}`);
  const config = picConfig(plan);
  const osc = config.fosc === "INTOSC" ? picOsccon(plan.clockHz) : null;
  if (config.fosc === "INTOSC" && !osc)
    refuse(plan, `the internal oscillator has no IRCF step at ${plan.clockHz} Hz`);
  if (isr && bit === 3) unsupported(plan, "RA3 as an output (input only)");
  // A crystal or an external clock occupies RA5 (and RA4 for a crystal).
  const crystal = config.fosc === "LP" || config.fosc === "XT" || config.fosc === "HS";
  if (config.fosc !== "INTOSC" && bit === 5) unsupported(plan, "RA5 as output while it carries OSC1/CLKIN");
  if (crystal && bit === 4) unsupported(plan, "RA4 as output while it carries OSC2");

  const pr2 = intRange(plan, "PR2", plan.periodCounts - 1, 0, 255);
  const mask = 1 << bit;
  const steps: PicStep[] = picOscSteps(config, osc);
  const put = (w: RegisterWrite) => steps.push(step({ bankOf: w.reg, write: w }));
  put(write("ANSELA", 0, "0x00", "all of PORTA digital"));
  put(write("LATA", 0, "0x00", "output latch low before the driver is on"));
  if (isr) {
    put(write("TRISA", 0x3f & ~mask, hex2(0x3f & ~mask), `${plan.pin.port} output (GPIO), the rest inputs`));
  } else {
    // Setup for PWM operation, step 1: CCP1 pin driver off while the module is set up.
    put(write("TRISA", 0x3f, "0x3F", `PWM setup 1: ${plan.pin.port} driver off (TRISA${bit} = 1)`));
    put(
      write(
        "APFCON",
        bit === 5 ? 1 : 0,
        bit === 5 ? "0x01" : "0x00",
        `CCP1SEL = ${bit === 5 ? 1 : 0}: CCP1 on RA${bit}`,
      ),
    );
  }
  put(write("PR2", pr2, String(pr2), `PR2 = periodCounts - 1; period = (PR2+1)*4*Tosc*prescale`));
  if (!isr) {
    const duty10 = intRange(plan, "CCPR1L:DC1B", Math.round(plan.highCounts * 4), 0, 1023);
    if (Math.abs(duty10 - plan.highCounts * 4) > 1e-9)
      unsupported(plan, `high counts ${plan.highCounts} (quarter counts only)`);
    const ccp1con = ((duty10 & 3) << 4) | 0x0c;
    put(
      write(
        "CCP1CON",
        ccp1con,
        hex2(ccp1con),
        `PWM setup 3: DC1B = ${duty10 & 3}, CCP1M = 1100 (PWM, active high)`,
      ),
    );
    put(
      write(
        "CCPR1L",
        duty10 >> 2,
        String(duty10 >> 2),
        `PWM setup 4: CCPR1L:DC1B = ${duty10} (highCounts*4); pulse = ${duty10}*Tosc*prescale`,
      ),
    );
  }
  steps.push(
    step({
      bankOf: "PIR1",
      clear: { reg: "PIR1", bit: "TMR2IF", why: "PWM setup 5: clear TMR2IF before Timer2 starts" },
    }),
  );
  const t2con = 0x04 | ckps;
  put(
    write(
      "T2CON",
      t2con,
      hex2(t2con),
      `TMR2ON = 1, T2CKPS = ${ckps} (prescale 1:${prescale}), postscale 1:1`,
    ),
  );
  if (isr) {
    put(write("PIE1", 0x02, "0x02", "TMR2IE = 1"));
    put(write("INTCON", 0xc0, "0xC0", "GIE = 1, PEIE = 1"));
  } else {
    // PWM setup 6: the first full period starts after a Timer2 overflow; only then the driver goes on.
    steps.push(
      step({
        bankOf: "PIR1",
        wait: { reg: "PIR1", bit: "TMR2IF", why: "PWM setup 6: Timer2 has overflowed once" },
      }),
    );
    put(
      write(
        "TRISA",
        0x3f & ~mask,
        hex2(0x3f & ~mask),
        `PWM setup 6: ${plan.pin.port} driver on (TRISA${bit} = 0)`,
      ),
    );
  }

  return {
    writes: steps.flatMap((s) => (s.write ? [s.write] : [])),
    pin: pinFacts(plan),
    extra: {
      isr,
      bit,
      mask: hex2(mask),
      steps,
      config,
      osc,
      crystal,
      // Interrupt plans: software divider and high count as little-endian bytes for the assembler.
      soft: isr ? bytes32(plan, "softwareDivider", plan.softwareDivider) : null,
      high: isr ? bytes32(plan, "highCounts", plan.highCounts) : null,
      firstLevel: isr && plan.highCounts > 0 ? hex2(mask) : "0x00",
    },
    flashing: [
      "Image: pic12f1840/firmware/firmware.hex (Intel HEX, program memory and the two configuration words at 0x8007/0x8008).",
      "Connect an ICSP programmer to the 6-pin header: 1 MCLR/VPP (pin 4), 2 VDD (pin 1), 3 VSS (pin 8), 4 ICSPDAT (RA0, pin 7), 5 ICSPCLK (RA1, pin 6), 6 not connected.",
      "Program and verify the whole device (program memory and configuration words) with the programmer's own software; high-voltage programming (LVP = OFF).",
      "After programming, disconnect the programmer or make sure it releases MCLR, so the pull-up lets the chip run.",
    ],
  };
}
