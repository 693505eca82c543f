// RP2040 PWM slice. RP2040 datasheet: PWM chapter (CSR, DIV 8.4 fixed point,
// CC, TOP; slice = (gpio >> 1) & 7, channel = gpio & 1; PH_CORRECT counts up
// and down), clocks (XOSC, PLL_SYS: f = fref/REFDIV*FBDIV/(POSTDIV1*POSTDIV2)),
// IO_BANK0 FUNCSEL (4 = PWM, 5 = SIO), RESETS. Clock facts live in the
// engine (lib/engine/devices/rp2040-clocks.ts) so plans and code agree.
import { RP2040_XOSC_HZ, rp2040PllSetting, rp2040XoscStartupDelay } from "@/lib/engine/devices/rp2040-clocks";
import { EngineError } from "@/lib/engine/errors";
import { intRange, unsupported, write, type DeviceView, type RegisterWrite } from "./device-view";
import { pinFacts } from "./pins";
import type { BundlePlan } from "./types";

export interface RpClock {
  kind: "xosc" | "pll";
  refdiv?: number;
  fbdiv?: number;
  postdiv1?: number;
  postdiv2?: number;
  vcoHz?: number;
}

/**
 * The clock set-up main.c makes for clockHz: the 12 MHz crystal direct, or
 * PLL_SYS from it. The engine refuses other frequencies before a plan exists
 * (lib/engine/devices/rp2040-clocks.ts); this is the last guard.
 */
export function rpClock(plan: BundlePlan): RpClock {
  if (plan.clockSource === "xosc" || (plan.clockSource !== "xosc-pll" && plan.clockHz === RP2040_XOSC_HZ)) {
    if (plan.clockHz !== RP2040_XOSC_HZ)
      throw new EngineError(
        "clock-out-of-range",
        `rp2040: the crystal runs at ${RP2040_XOSC_HZ} Hz, not ${plan.clockHz} Hz`,
        "clockHz",
      );
    return { kind: "xosc" };
  }
  const s = rp2040PllSetting(plan.clockHz);
  if (!s)
    throw new EngineError(
      "clock-out-of-range",
      `rp2040: PLL_SYS cannot make ${plan.clockHz} Hz from the 12 MHz crystal`,
      "clockHz",
    );
  return { kind: "pll", ...s };
}

/** How a technician puts the image on the chip (RP2040 datasheet, bootrom USB drive; openocd's rp2040 target). */
export const RP2040_FLASHING: string[] = [
  "USB: hold BOOTSEL (QSPI_SS to GND) while plugging in or pressing RUN; the RPI-RP2 drive appears; copy firmware/firmware.uf2 onto it; the chip restarts into the new image.",
  'SWD: connect SWCLK, SWD (SWDIO) and GND to a CMSIS-DAP probe; with the Debian package openocd: openocd -f interface/cmsis-dap.cfg -f target/rp2040.cfg -c "adapter speed 5000" -c "program firmware/firmware.elf verify reset exit"',
];

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
    extra: {
      gpio,
      slice,
      channel,
      isr,
      phCorrect,
      divInt,
      divFrac,
      clock: rpClock(plan),
      xoscStartup: rp2040XoscStartupDelay(RP2040_XOSC_HZ),
      xoscStartupMs: Math.round((rp2040XoscStartupDelay(RP2040_XOSC_HZ) * 256 * 1000) / RP2040_XOSC_HZ),
    },
    flashing: RP2040_FLASHING,
  };
}
