// MSP430G2553, Timer0_A3 up mode. MSP430x2xx Family User's Guide (SLAU144)
// Timer_A chapter (MC_1 up mode, ID dividers, OUTMOD_7 reset/set: high for
// TACCR1 counts of TACCR0+1), Basic Clock Module+ (calibrated DCO), and the
// MSP430G2553 datasheet (SLAS735) pin functions: TA0.1 on P1.2 and P1.6.
import { EngineError } from "@/lib/engine/errors";
import { intRange, unsupported, write, type DeviceView, type RegisterWrite } from "./device-view";
import { pinFacts } from "./pins";
import type { BundlePlan } from "./types";

const ID: Record<number, string> = { 1: "ID_0", 2: "ID_1", 4: "ID_2", 8: "ID_3" };
const CAL_MHZ = [1, 8, 12, 16];

export function msp430g2553View(plan: BundlePlan): DeviceView {
  const t = plan.timer.toUpperCase().replace(/[^A-Z0-9]/g, "");
  if (t !== "TIMER0A3" && t !== "TIMER0A" && t !== "TA0") unsupported(plan, `timer ${plan.timer}`);
  const idName = ID[plan.divider] ?? unsupported(plan, `input divider ${plan.divider}`);
  const m = /^P([12])\.([0-7])$/.exec(plan.pin.port) ?? unsupported(plan, `pin ${plan.pin.port}`);
  const port = Number(m[1]);
  const bit = Number(m[2]);
  const mhz = plan.clockHz / 1e6;
  const watch = plan.clockHz === 32768;
  if (!watch && !CAL_MHZ.includes(mhz)) {
    throw new EngineError(
      "clock-out-of-range",
      `msp430g2553: ${plan.clockHz} Hz is neither a calibrated DCO frequency (1, 8, 12, 16 MHz) nor a 32.768 kHz crystal`,
    );
  }
  const ccr0 = intRange(plan, "TA0CCR0", plan.periodCounts - 1, 1, 65535);
  const writes: RegisterWrite[] = [
    write("TA0CCR0", ccr0, String(ccr0), `TACCR0 = periodCounts - 1; period = ID*(TACCR0+1)/f`),
  ];
  const isr = plan.mode === "isr";
  if (plan.mode === "pwm") {
    if (!(port === 1 && (bit === 2 || bit === 6))) unsupported(plan, `TA0.1 on ${plan.pin.port}`);
    const ccr1 = intRange(plan, "TA0CCR1", plan.highCounts, 0, ccr0 + 1);
    writes.push(
      write("TA0CCR1", ccr1, String(ccr1), `high = TACCR1 counts = ${ccr1}*ID/f`),
      write("TA0CCTL1", 0xe0, "OUTMOD_7", "reset/set: set at TACCR0, reset at TACCR1"),
    );
  } else if (plan.mode === "toggle") {
    if (!(port === 1 && (bit === 2 || bit === 6))) unsupported(plan, `TA0.1 on ${plan.pin.port}`);
    writes.push(
      write("TA0CCR1", ccr0, String(ccr0), "toggle at TACCR0 each period; output period = 2*ID*(TACCR0+1)/f"),
      write("TA0CCTL1", 0x80, "OUTMOD_4", "toggle"),
    );
  } else {
    writes.push(write("TA0CCTL0", 0x10, "CCIE", "TACCR0 interrupt on"));
  }
  const tassel = watch ? "TASSEL_1" : "TASSEL_2";
  const ctl = (watch ? 0x100 : 0x200) | ([1, 2, 4, 8].indexOf(plan.divider) << 6) | 0x10;
  writes.push(
    write(
      "TA0CTL",
      ctl,
      `${tassel} | ${idName} | MC_1`,
      `${watch ? "ACLK" : "SMCLK"}, divide by ${plan.divider}, up mode; starts the timer`,
    ),
  );
  return { writes, pin: pinFacts(plan), extra: { isr, port, bit, mhz, watch } };
}
