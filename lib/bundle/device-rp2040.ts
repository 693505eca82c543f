// RP2040 PWM slice. RP2040 datasheet: PWM chapter (CSR, DIV 8.4 fixed point,
// CC, TOP; slice = (gpio >> 1) & 7, channel = gpio & 1; PH_CORRECT counts up
// and down), clocks (XOSC, PLL_SYS: f = fref/REFDIV*FBDIV/(POSTDIV1*POSTDIV2)),
// IO_BANK0 FUNCSEL (4 = PWM, 5 = SIO), RESETS.
import { EngineError } from "@/lib/engine/errors";
import { intRange, unsupported, write, type DeviceView, type RegisterWrite } from "./device-view";
import { pinFacts } from "./pins";
import type { BundlePlan } from "./types";

/** Crystal on the usual RP2040 boards (Raspberry Pi Pico: 12 MHz). */
export const XOSC_HZ = 12e6;

export interface RpClock {
  kind: "xosc" | "pll";
  fbdiv?: number;
  postdiv1?: number;
  postdiv2?: number;
  vcoHz?: number;
}

/** PLL_SYS settings for clockHz from the 12 MHz crystal, REFDIV = 1, VCO 750..1600 MHz (datasheet PLL section, from memory). */
export function rpClock(clockHz: number): RpClock {
  if (clockHz === XOSC_HZ) return { kind: "xosc" };
  for (let fbdiv = 16; fbdiv <= 320; fbdiv++) {
    const vco = XOSC_HZ * fbdiv;
    if (vco < 750e6 || vco > 1600e6) continue;
    for (let p1 = 7; p1 >= 1; p1--)
      for (let p2 = p1; p2 >= 1; p2--)
        if (vco / (p1 * p2) === clockHz)
          return { kind: "pll", fbdiv, postdiv1: p1, postdiv2: p2, vcoHz: vco };
  }
  throw new EngineError(
    "clock-out-of-range",
    `rp2040: ${clockHz} Hz is not reachable from the 12 MHz crystal with PLL_SYS`,
  );
}

export function rp2040View(plan: BundlePlan): DeviceView {
  const m = /^GPIO(\d{1,2})$/i.exec(plan.pin.port) ?? unsupported(plan, `pin ${plan.pin.port}`);
  const gpio = intRange(plan, "GPIO", plan.pin.gpio ?? Number(m[1]), 0, 29);
  const slice = (gpio >> 1) & 7;
  const channel = gpio & 1;
  const div16 = Math.round(plan.divider * 16);
  if (Math.abs(div16 - plan.divider * 16) > 1e-9)
    unsupported(plan, `divider ${plan.divider} (not a multiple of 1/16)`);
  const divInt = intRange(plan, "DIV_INT", Math.floor(div16 / 16), 1, 255);
  const divFrac = div16 % 16;
  const phCorrect = plan.modeFactor === 2 && plan.mode !== "isr" ? 1 : 0;
  const top = intRange(plan, "TOP", plan.periodCounts - 1, 0, 65535);
  const isr = plan.mode === "isr";
  const writes: RegisterWrite[] = [
    write(
      "DIV",
      (divInt << 4) | divFrac,
      `(${divInt}u << 4) | ${divFrac}u`,
      `DIV_INT.DIV_FRAC = ${divInt} + ${divFrac}/16 = ${plan.divider}`,
    ),
    write("TOP", top, String(top), `TOP = periodCounts - 1; period = (TOP+1)*(PH_CORRECT+1)*DIV/f_sys`),
  ];
  if (plan.mode === "pwm") {
    const cc = intRange(plan, "CC", plan.highCounts, 0, top + 1);
    writes.push(
      write(
        "CC",
        channel ? cc << 16 : cc,
        channel ? `${cc}u << 16` : `${cc}u`,
        `channel ${channel ? "B" : "A"}: high while counter < CC; ${cc} counts`,
      ),
    );
  } else if (plan.mode === "toggle") {
    unsupported(plan, "toggle mode (the PWM slice has no compare toggle)");
  } else {
    writes.push(write("INTE", 1 << slice, `1u << ${slice}`, `wrap interrupt of slice ${slice} on`));
  }
  writes.push(
    write(
      "CSR",
      1 | (phCorrect << 1),
      phCorrect ? "(1u << 1) | 1u" : "1u",
      `EN = 1, PH_CORRECT = ${phCorrect}`,
    ),
  );
  return {
    writes,
    pin: pinFacts(plan),
    extra: { gpio, slice, channel, isr, phCorrect, divInt, divFrac, clock: rpClock(plan.clockHz) },
  };
}
