// The bundle's own AVR images run in simavr (Debian libsimavr 1.6, harness
// lib/firmware/emulate/harness/simavr/pin-trace.c): the shipped firmware/firmware.hex, no
// simulator code linked in. The traced pin's period and high time match the
// REQUESTED values within half a timer count plus one CPU cycle (simavr steps
// whole cycles), firmware.md "Timing of an image". Timer modes: ATmega328P
// datasheet DS40002061 (Timer/Counter1 fast PWM mode 14, CTC mode 4) and
// ATtiny25/45/85 datasheet (Timer/Counter0 fast PWM mode 7, CTC mode 2);
// simavr 1.6 drives no ATtiny85 Timer1 outputs, so the ATtiny85 runs Timer0.
// Planted faults (kept as negative cases): TOP off by one, and the output
// driver never enabled (DDR bit left 0: the datasheets' compare output unit
// sections say OCnx reaches the pin only with its DDR bit set).
import { describe, expect, it } from "vitest";
import {
  buildBundleFiles,
  textOf,
  type BundleFile,
  type BundlePlan,
  type BundleTargetRequest,
} from "@/lib/bundle";
import { buildTargetImages } from "@/lib/firmware/build-images";
import { planTarget } from "@/lib/engine";
import { runAvrImage, timingProblems, type PinRun } from "@/tests/tools/simavr";
import { spec } from "./fixtures";

interface Case {
  request: BundleTargetRequest & { clockSource?: string };
  minPeriods: number;
}

async function bundleFor(c: Case) {
  const plan = planTarget(c.request) as BundlePlan;
  const files = await buildBundleFiles(spec([c.request]));
  return { plan, files };
}

function run(c: Case, plan: BundlePlan, files: BundleFile[]): PinRun {
  const port = plan.pin.port.charAt(1);
  const bit = Number(plan.pin.port.slice(2));
  const cycles = (c.minPeriods + 2.5) * c.request.periodS * c.request.clockHz;
  return runAvrImage(files, c.request.device, c.request.device, c.request.clockHz, port, bit, cycles);
}

function expected(c: Case, plan: BundlePlan) {
  return {
    periodS: c.request.periodS,
    highS: c.request.highS,
    countS: plan.divider / plan.clockHz,
    stepS: 1 / plan.clockHz,
    // interrupt plans: the handler's set and clear paths may differ by a few cycles (firmware.md allows 256)
    extraHighS: plan.mode === "isr" ? 16 / plan.clockHz : 0,
    minPeriods: c.minPeriods,
  };
}

/** The same bundle with one source line changed, rebuilt by its own Makefile. */
async function mutated(files: BundleFile[], folder: string, device: string, edit: (src: string) => string) {
  const changed = files
    .filter((f) => !f.path.includes("/firmware/"))
    .map((f) => {
      if (f.path !== `${folder}/src/main.c`) return f;
      const after = edit(textOf(f));
      if (after === textOf(f)) throw new Error("the planted fault changed nothing");
      return { ...f, content: after };
    });
  return [...changed, ...(await buildTargetImages(changed, folder, device))];
}

const PWM_328P: Case = {
  request: {
    device: "atmega328p",
    clockHz: 16e6,
    periodS: 0.02,
    highS: 0.0015,
    mode: "pwm",
    clockSource: "crystal",
  },
  minPeriods: 6,
};
const ISR_328P: Case = {
  request: {
    device: "atmega328p",
    clockHz: 16e6,
    periodS: 0.05,
    highS: 0.01,
    mode: "isr",
    clockSource: "crystal",
  },
  minPeriods: 4,
};
const PWM_T85: Case = {
  request: {
    device: "attiny85",
    clockHz: 8e6,
    periodS: 2e-3,
    highS: 0.5e-3,
    mode: "pwm",
    timer: "TIMER0",
    clockSource: "rc8m",
  },
  minPeriods: 8,
};
const ISR_T85: Case = {
  request: {
    device: "attiny85",
    clockHz: 8e6,
    periodS: 10e-3,
    highS: 2.5e-3,
    mode: "isr",
    timer: "TIMER0",
    clockSource: "rc8m",
  },
  minPeriods: 6,
};

describe("AVR images in simavr", () => {
  for (const [name, c] of [
    ["ATmega328P Timer1 fast PWM mode 14: 20 ms period, 1.5 ms high", PWM_328P],
    ["ATmega328P Timer1 interrupt plan with a software divider: 50 ms, 10 ms high", ISR_328P],
    ["ATtiny85 Timer0 fast PWM (TOP = OCR0A) on OC0B: 2 ms, 0.5 ms high", PWM_T85],
    ["ATtiny85 Timer0 interrupt plan: 10 ms, 2.5 ms high", ISR_T85],
  ] as const) {
    it(name, async () => {
      const { plan, files } = await bundleFor(c);
      expect(plan.mode).toBe(c.request.mode);
      if (c.request.timer) expect(plan.timer).toBe(c.request.timer);
      expect(timingProblems(run(c, plan, files), expected(c, plan))).toEqual([]);
    });
  }

  it("planted fault: Timer1 TOP (ICR1) one count too high is caught", async () => {
    const { plan, files } = await bundleFor(PWM_328P);
    const top = plan.registers.ICR1;
    const bad = await mutated(files, "atmega328p", "atmega328p", (s) =>
      s.replace(`ICR1 = ${top};`, `ICR1 = ${top + 1};`),
    );
    const problems = timingProblems(run(PWM_328P, plan, bad), expected(PWM_328P, plan));
    expect(problems.some((p) => p.startsWith("period"))).toBe(true);
  });

  it("planted fault: ATtiny85 Timer0 TOP (OCR0A) one count too low is caught", async () => {
    const { plan, files } = await bundleFor(PWM_T85);
    const top = plan.registers.OCR0A;
    const bad = await mutated(files, "attiny85", "attiny85", (s) =>
      s.replace(`OCR0A = ${top};`, `OCR0A = ${top - 1};`),
    );
    const problems = timingProblems(run(PWM_T85, plan, bad), expected(PWM_T85, plan));
    expect(problems.some((p) => p.startsWith("period"))).toBe(true);
  });

  it("planted fault: the output driver never enabled (no DDR write) is caught", async () => {
    const { plan, files } = await bundleFor(PWM_328P);
    const bad = await mutated(files, "atmega328p", "atmega328p", (s) =>
      s.replace(/^\s*DDRB \|= \(1 << DDB1\);$/m, ""),
    );
    const problems = timingProblems(run(PWM_328P, plan, bad), expected(PWM_328P, plan));
    expect(problems.some((p) => p.startsWith("only 0 full periods"))).toBe(true);
  });
});
