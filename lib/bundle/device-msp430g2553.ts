// MSP430G2553, Timer0_A3 up mode. MSP430x2xx Family User's Guide (SLAU144)
// Timer_A chapter (MC_1 up mode, ID dividers, TASSEL_1 = ACLK, TASSEL_2 =
// SMCLK, OUTMOD_7 reset/set: high for TACCR1 counts of TACCR0+1), Basic Clock
// Module+ chapter (calibrated DCO, LFXT1S modes, XCAP), and the MSP430G2x53
// datasheet (SLAS735) pin functions: TA0.1 on P1.2 and P1.6, XIN/XOUT on
// P2.6/P2.7, interrupt vectors at 0xFFE0..0xFFFF.
// The code sets up exactly the clock the plan names; any other combination
// is refused here rather than quietly run from a different oscillator.
import { EngineError } from "@/lib/engine/errors";
import { intRange, unsupported, write, type DeviceView, type RegisterWrite } from "./device-view";
import { pinFacts } from "./pins";
import { MSP430_TRIGGER_SLOTS } from "./trigger-msp430g2553";
import type { BundlePlan } from "./types";

const ID: Record<number, string> = { 1: "ID_0", 2: "ID_1", 4: "ID_2", 8: "ID_3" };
const CAL_MHZ = [1, 8, 12, 16];
/** clang interrupt(N) slot of Timer0_A3 TACCR0 CCIFG: vector 0xFFF2 = 0xFFE0 + 2*9 (SLAS735 vector table). */
const TA0_CCR0_SLOT = 9;
const RESET_SLOT = 15;

export type Msp430Clock = "dco-cal" | "lfxt1" | "external";

interface ClockSetup {
  source: Msp430Clock;
  label: string;
  /** Timer_A TASSEL: 1 = ACLK, 2 = SMCLK */
  tassel: 1 | 2;
  mhz?: number;
  bcsctl3?: string;
}

function refuse(plan: BundlePlan, field: "clockSource" | "clockHz", why: string): never {
  throw new EngineError("clock-out-of-range", `msp430g2553: ${why}`, field);
}

/** The clock the code will set up, or an EngineError naming clockSource or clockHz. */
export function msp430ClockSetup(plan: BundlePlan): ClockSetup {
  const source = plan.clockSource ?? "dco-cal";
  const hz = plan.clockHz;
  if (source === "dco-cal") {
    const mhz = hz / 1e6;
    if (!CAL_MHZ.includes(mhz))
      refuse(plan, "clockHz", `the calibrated DCO runs at 1, 8, 12 or 16 MHz only; ${hz} Hz is none of them`);
    return { source, label: `calibrated DCO ${mhz} MHz`, tassel: 2, mhz };
  }
  if (source === "lfxt1") {
    if (hz !== 32768) refuse(plan, "clockHz", `LFXT1 with a watch crystal runs at 32768 Hz, not ${hz} Hz`);
    // LFXT1S_0: 32768 Hz crystal; XCAP_3: 12.5 pF internal load (SLAU144 BCSCTL3)
    return { source, label: "LFXT1 32.768 kHz crystal", tassel: 1, bcsctl3: "LFXT1S_0 | XCAP_3" };
  }
  if (source === "external") {
    // LF mode only: the G2xx3 has no LFXT1 high-frequency mode (SLAS735)
    if (!(hz >= 10e3 && hz <= 50e3))
      refuse(
        plan,
        "clockHz",
        `an external clock into XIN must be 10 kHz to 50 kHz (LFXT1 LF mode); ${hz} Hz is outside`,
      );
    // LFXT1S_3: digital external clock; XCAP_0: no internal load capacitance (SLAU144 BCSCTL3)
    return { source, label: "external digital clock into XIN", tassel: 1, bcsctl3: "LFXT1S_3 | XCAP_0" };
  }
  return refuse(
    plan,
    "clockSource",
    `the bundle has no code for clock source "${source}" (dco-cal, lfxt1, external)`,
  );
}

export function msp430g2553View(plan: BundlePlan): DeviceView {
  const t = plan.timer.toUpperCase().replace(/[^A-Z0-9]/g, "");
  if (t !== "TIMER0A3" && t !== "TIMER0A" && t !== "TA0") unsupported(plan, `timer ${plan.timer}`);
  const idName = ID[plan.divider] ?? unsupported(plan, `input divider ${plan.divider}`);
  const m = /^P([12])\.([0-7])$/.exec(plan.pin.port) ?? unsupported(plan, `pin ${plan.pin.port}`);
  const port = Number(m[1]);
  const bit = Number(m[2]);
  const clock = msp430ClockSetup(plan);
  const isr = plan.mode === "isr";
  if (clock.tassel === 1 && port === 2 && (bit === 6 || bit === 7))
    unsupported(plan, `${plan.pin.port} as output while it carries XIN/XOUT`);
  const ccr0 = intRange(plan, "TA0CCR0", plan.periodCounts - 1, 1, 65535);
  const writes: RegisterWrite[] = [
    write("TA0CCR0", ccr0, String(ccr0), `TACCR0 = periodCounts - 1; period = ID*(TACCR0+1)/f`),
  ];
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
      write(
        "TA0CCR1",
        ccr0,
        String(ccr0),
        "toggle at TACCR1 = TACCR0 each period; output period = 2*ID*(TACCR0+1)/f",
      ),
      write("TA0CCTL1", 0x80, "OUTMOD_4", "toggle"),
    );
  } else {
    writes.push(write("TA0CCTL0", 0x10, "CCIE", "TACCR0 interrupt on"));
  }
  const tassel = `TASSEL_${clock.tassel}`;
  const ctl = (clock.tassel << 8) | ([1, 2, 4, 8].indexOf(plan.divider) << 6) | 0x10;
  writes.push(
    write(
      "TA0CTL",
      ctl,
      `${tassel} | ${idName} | MC_1`,
      `${clock.tassel === 1 ? "ACLK" : "SMCLK"}, divide by ${plan.divider}, up mode; starts the timer`,
    ),
  );
  // Triggered firmware fills PORT1, TIMER0_A1 and TIMER0_A0 (lib/bundle/trigger-msp430g2553.ts).
  const triggered = plan.start !== undefined && plan.start !== "free";
  const used: number[] = triggered
    ? [...MSP430_TRIGGER_SLOTS, RESET_SLOT]
    : isr
      ? [TA0_CCR0_SLOT, RESET_SLOT]
      : [RESET_SLOT];
  const unusedVectors = Array.from({ length: 16 }, (_, i) => i).filter((i) => !used.includes(i));
  return {
    writes,
    pin: pinFacts(plan),
    extra: {
      isr,
      port,
      bit,
      mhz: clock.mhz ?? 0,
      dco: clock.source === "dco-cal",
      lfxt1: clock.source !== "dco-cal",
      bcsctl3: clock.bcsctl3 ?? "",
      clockSource: clock.source,
      clockLabel: clock.label,
      sleepBits: isr ? "LPM0_bits | GIE" : "LPM0_bits",
      unusedVectors,
    },
    flashing: [
      "Spy-Bi-Wire: connect the debugger's TEST to TEST/SBWTCK (package pin 17), its RST to RST/NMI/SBWTDIO (pin 16), and its VCC and GND to DVCC (pin 1) and DVSS (pin 20).",
      'LaunchPad debugger of the rf2500 kind (Debian package mspdebug): mspdebug rf2500 "prog firmware/firmware.elf"',
      "Or from the source folder: make flash (builds, then runs the same mspdebug command; MSPDEBUG_DRIVER=... picks another driver).",
      "A newer eZ-FET debugger needs mspdebug's tilib driver and TI's MSP430 library, which Debian does not package.",
    ],
  };
}
