// PIC12F1840, Timer2 + CCP1 PWM. PIC12(L)F1840 datasheet (Microchip
// DS40001441): Timer2 (T2CON T2CKPS 1/4/16/64, PR2), CCP1 PWM (period =
// (PR2+1)*4*Tosc*prescale, pulse = CCPR1L:DC1B*Tosc*prescale), OSCCON IRCF
// table, APFCON CCP1SEL (RA2 or RA5), PIR1/PIE1 TMR2IF/TMR2IE.
import { EngineError } from "@/lib/engine/errors";
import { intRange, unsupported, write, type DeviceView, type RegisterWrite } from "./device-view";
import { pinFacts } from "./pins";
import type { BundlePlan } from "./types";

const T2CKPS: Record<number, number> = { 1: 0, 4: 1, 16: 2, 64: 3 };

/** OSCCON for the internal oscillator (SCS = 00 with FOSC = INTOSC); null = external crystal. */
export function picOsccon(clockHz: number): { osccon: number; text: string } | null {
  const table: [number, number, string][] = [
    [32e6, 0xf0, "SPLLEN = 1, IRCF = 1110: 8 MHz x 4 PLL"],
    [16e6, 0x78, "IRCF = 1111: 16 MHz HF"],
    [8e6, 0x70, "IRCF = 1110: 8 MHz HF"],
    [4e6, 0x68, "IRCF = 1101: 4 MHz HF"],
    [2e6, 0x60, "IRCF = 1100: 2 MHz HF"],
    [1e6, 0x58, "IRCF = 1011: 1 MHz HF"],
    [500e3, 0x38, "IRCF = 0111: 500 kHz MF"],
  ];
  const hit = table.find(([hz]) => hz === clockHz);
  return hit ? { osccon: hit[1], text: hit[2] } : null;
}

export function pic12f1840View(plan: BundlePlan): DeviceView {
  if (plan.timer.toUpperCase() !== "TIMER2") unsupported(plan, `timer ${plan.timer}`);
  const prescale = plan.divider / 4;
  const ckps =
    T2CKPS[prescale] ??
    unsupported(plan, `Timer2 prescale ${prescale} (divider ${plan.divider} = 4 x prescale)`);
  const m = /^RA([0-5])$/.exec(plan.pin.port) ?? unsupported(plan, `pin ${plan.pin.port}`);
  const bit = Number(m[1]);
  const pr2 = intRange(plan, "PR2", plan.periodCounts - 1, 0, 255);
  const writes: RegisterWrite[] = [
    write("PR2", pr2, String(pr2), `PR2 = periodCounts - 1; period = (PR2+1)*4*Tosc*prescale`),
  ];
  const isr = plan.mode === "isr";
  if (plan.mode === "pwm") {
    if (bit !== 2 && bit !== 5) unsupported(plan, `CCP1 on ${plan.pin.port}`);
    const duty10 = intRange(plan, "CCPR1L:DC1B", Math.round(plan.highCounts * 4), 0, 1023);
    if (Math.abs(duty10 - plan.highCounts * 4) > 1e-9)
      unsupported(plan, `high counts ${plan.highCounts} (quarter counts only)`);
    writes.push(
      write(
        "APFCON",
        bit === 5 ? 1 : 0,
        bit === 5 ? "0x01" : "0x00",
        `CCP1SEL = ${bit === 5 ? 1 : 0}: CCP1 on RA${bit}`,
      ),
      write(
        "CCPR1L",
        duty10 >> 2,
        String(duty10 >> 2),
        `CCPR1L:DC1B = ${duty10} (highCounts*4); pulse = ${duty10}*Tosc*prescale`,
      ),
      write(
        "CCP1CON",
        ((duty10 & 3) << 4) | 0x0c,
        `0x${(((duty10 & 3) << 4) | 0x0c).toString(16).toUpperCase()}`,
        `DC1B = ${duty10 & 3}, CCP1M = 1100 (PWM, active high)`,
      ),
    );
  } else if (plan.mode === "toggle") {
    throw new EngineError(
      "invalid-request",
      "pic12f1840: Timer2 has no compare toggle output; use pwm or isr",
    );
  }
  writes.push(
    write(
      "T2CON",
      0x04 | ckps,
      `0x${(0x04 | ckps).toString(16).toUpperCase().padStart(2, "0")}`,
      `TMR2ON = 1, T2CKPS = ${ckps} (prescale 1:${prescale}), postscale 1:1`,
    ),
  );
  return {
    writes,
    pin: pinFacts(plan),
    extra: {
      isr,
      bit,
      osc: (plan.clockSource ?? "crystal").startsWith("hfintosc") ? picOsccon(plan.clockHz) : null,
      crystalPll: plan.clockSource === "crystal-pll",
      crystalHs: plan.clockHz > 4e6,
    },
  };
}
