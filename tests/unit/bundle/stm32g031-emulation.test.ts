// STM32G031 images proven by an instruction-level run: each bundle folder is
// built with its own Makefile (arm-none-eabi-gcc, Debian), the ELF runs from
// the reset vector in python3-unicorn with every peripheral access logged
// (lib/firmware/emulate/harness/stm32g031-emu.py), and the final clock tree and timer
// registers must give the requested period and high time within half a timer
// count (formulas from RM0444: counter clock f_TIM/(PSC+1), update every
// ARR+1 counts, PWM mode 1 high while CNT < CCR1, toggle halves the rate).
// The emulator has no timer counting and no output unit: the output is judged
// from the final registers, interrupt plans by calling the handler from the
// vector table as the NVIC would and reading the pin after each call.
// Each planted fault below must be caught by the same judge.
import { mkdtempSync, readFileSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { buildBundleSources, type BundleTargetRequest } from "@/lib/bundle";
import type { TimerPlan } from "@/lib/engine";
import { buildTargetImages } from "@/lib/firmware/build-images";
import { buildStm32, runStm32, type RunOptions } from "@/tests/tools/stm32g031-emu";
import { DATASHEET_CH1_PIN, DATASHEET_IRQ, judgeStm32 } from "@/tests/tools/stm32g031-judge";
import { spec } from "./fixtures";

// Requests chosen to exercise every clock path: HSISYS (HSIDIV), the PLL from
// HSI16, and the HSE bypass with an external clock on PC14-OSC_IN.
const CASES: (BundleTargetRequest & { name: string; ext?: number })[] = [
  { name: "pwm TIM2 HSI16 16 MHz", device: "stm32g031", clockHz: 16e6, periodS: 0.02, highS: 0.0015 },
  { name: "pwm TIM2 PLL 64 MHz", device: "stm32g031", clockHz: 64e6, periodS: 1e-3, highS: 0.25e-3 },
  {
    name: "pwm TIM3 external clock 8 MHz",
    device: "stm32g031",
    clockHz: 8e6,
    clockSource: "ext-clock",
    periodS: 1e-3,
    highS: 0.3e-3,
    timer: "TIM3",
    ext: 8e6,
  },
  {
    name: "toggle TIM3 HSI16 / 8 = 2 MHz",
    device: "stm32g031",
    clockHz: 2e6,
    periodS: 0.01,
    highS: 0.005,
    mode: "toggle",
    timer: "TIM3",
  },
  { name: "isr TIM2 HSI16 16 MHz", device: "stm32g031", clockHz: 16e6, periodS: 100, highS: 10, mode: "isr" },
  {
    name: "isr TIM3 PLL 48 MHz",
    device: "stm32g031",
    clockHz: 48e6,
    periodS: 0.5,
    highS: 0.2,
    mode: "isr",
    timer: "TIM3",
  },
];

function bundleRequest(c: (typeof CASES)[number]): BundleTargetRequest {
  const r: BundleTargetRequest & { name?: string; ext?: number } = { ...c };
  delete r.name;
  delete r.ext;
  return r;
}

const files = buildBundleSources(spec(CASES.map(bundleRequest)));
const planJson = JSON.parse((files.find((f) => f.path === "plan.json")?.content as string) ?? "{}") as {
  targets: { folder: string; plan: TimerPlan }[];
};

function target(i: number) {
  const t = planJson.targets[i];
  return { folder: t.folder, plan: t.plan, request: CASES[i] };
}

function options(i: number): RunOptions {
  const { plan, request } = target(i);
  const t = plan.timer as "TIM2" | "TIM3";
  const pin = DATASHEET_CH1_PIN[t];
  return {
    ...(request.ext ? { extClockHz: request.ext } : {}),
    ...(plan.mode === "isr"
      ? {
          isrIrq: DATASHEET_IRQ[t],
          isrCalls: 2 * plan.softwareDivider + 1,
          pinPort: pin.port,
          pinBit: pin.bit,
        }
      : {}),
  };
}

describe("STM32G031 images run in the instruction-level emulator", () => {
  it.each(CASES.map((c, i) => [c.name, i] as const))(
    "%s: clock, pins and timer match the request",
    (_n, i) => {
      const { folder, plan, request } = target(i);
      const b = buildStm32(files, folder);
      const run = runStm32(b.elf, options(i));
      expect(judgeStm32(run, plan, request)).toEqual([]);
      expect(run.idle?.kind).toBe("wfi");
    },
  );

  it("the .bin is the flash content from 0x08000000: SP then the reset vector (ARMv6-M vector table)", () => {
    const b = buildStm32(files, target(0).folder);
    const bin = readFileSync(b.bin);
    const sp = bin.readUInt32LE(0);
    const reset = bin.readUInt32LE(4);
    expect(sp).toBe(0x20000000 + 8 * 1024); // top of the 8 KiB SRAM (DS12992 memory map)
    expect(reset & 1).toBe(1); // Thumb bit
    expect(reset & ~1).toBeGreaterThanOrEqual(0x08000000);
    expect(reset & ~1).toBeLessThan(0x08000000 + bin.length);
    expect(runStm32(b.elf).resetVector).toBe(reset); // the harness started where the hardware would
  });

  it("an external-clock image waits for HSERDY when no clock is fed in, and never runs at another rate", () => {
    const i = CASES.findIndex((c) => c.clockSource === "ext-clock");
    const { folder, plan, request } = target(i);
    const run = runStm32(buildStm32(files, folder).elf, {});
    const problems = judgeStm32(run, plan, request);
    expect(problems.join("\n")).toMatch(/HSERDY cannot come: HSEON without an external clock/);
  });
});

describe("the server's image builder (lib/firmware/build-images.ts) on an STM32G031 folder", () => {
  it("makes elf, hex and bin, the same bytes as a second build, and the image runs as planned", async () => {
    const { folder, plan, request } = target(1);
    const a = await buildTargetImages(files, folder, "stm32g031");
    const b = await buildTargetImages(files, folder, "stm32g031");
    expect(a.map((f) => f.path)).toEqual([
      `${folder}/firmware/firmware.bin`,
      `${folder}/firmware/firmware.elf`,
      `${folder}/firmware/firmware.hex`,
    ]);
    a.forEach((f, i) => expect(Buffer.from(f.content).equals(Buffer.from(b[i].content))).toBe(true));
    const elf = path.join(mkdtempSync(path.join(tmpdir(), "cg-stm-")), "firmware.elf");
    writeFileSync(elf, a[1].content);
    expect(judgeStm32(runStm32(elf, options(1)), plan, request)).toEqual([]);
  });
});

describe("planted faults the STM32G031 harness must catch", () => {
  it("a missing timer clock enable (RCC_APBENR1 TIM2EN removed)", () => {
    const { folder, plan, request } = target(1);
    const b = buildStm32(files, folder, (s) => s.replace(/\n\s*RCC_APBENR1 \|= \(1u << 0\);[^\n]*/, ""));
    const problems = judgeStm32(runStm32(b.elf, options(1)), plan, request);
    expect(problems).toContain("TIM2 written before RCC_APBENR1 TIM2EN");
    // the harness drops writes to the unclocked timer, as the hardware would
    expect(problems.some((p) => /^write of TIM2_\w+ before RCC_APBENR1 TIM2EN$/.test(p))).toBe(true);
    expect(problems).toContain("TIM2_ARR is 4294967295, plan.json says 63999");
  });

  it("a wrong alternate function number (AF1 instead of the datasheet's AF2 on PA0)", () => {
    const { folder, plan, request } = target(0);
    const b = buildStm32(files, folder, (s) => s.replace(/\| \(2u << 0\);/, "| (1u << 0);"));
    expect(judgeStm32(runStm32(b.elf, options(0)), plan, request)).toContain(
      "PA0 AFR is AF1, the datasheet's TIM2_CH1 is AF2",
    );
  });

  it("ARR off by one", () => {
    const { folder, plan, request } = target(1);
    const arr = plan.registers.ARR;
    const b = buildStm32(files, folder, (s) => s.replace(`TIM2->ARR = ${arr};`, `TIM2->ARR = ${arr + 1};`));
    const problems = judgeStm32(runStm32(b.elf, options(1)), plan, request);
    expect(problems).toContain(`TIM2_ARR is ${arr + 1}, plan.json says ${arr}`);
    expect(problems.some((p) => /^period .*more than half a count apart/.test(p))).toBe(true);
  });

  it("ARR off by one in an interrupt plan changes the interrupt interval", () => {
    const { folder, plan, request } = target(5);
    const arr = plan.registers.ARR;
    const b = buildStm32(files, folder, (s) => s.replace(`TIM3->ARR = ${arr};`, `TIM3->ARR = ${arr + 1};`));
    const problems = judgeStm32(runStm32(b.elf, options(5)), plan, request);
    expect(problems).toContain(`TIM3_ARR is ${arr + 1}, plan.json says ${arr}`);
    expect(problems.some((p) => /^period /.test(p))).toBe(true);
  });

  it("the wrong interrupt enabled in the NVIC (TIM3's IRQ 16 for a TIM2 plan)", () => {
    const { folder, plan, request } = target(4);
    const b = buildStm32(files, folder, (s) =>
      s.replace("NVIC_ISER = (1u << 15);", "NVIC_ISER = (1u << 16);"),
    );
    expect(judgeStm32(runStm32(b.elf, options(4)), plan, request)).toContain(
      "NVIC IRQ 15 (TIM2) not enabled",
    );
  });

  it("a handler that leaves UIF set", () => {
    const { folder, plan, request } = target(4);
    const b = buildStm32(files, folder, (s) => s.replace(/\n\s*TIM2->SR = 0u; \/\* clear UIF \*\//, ""));
    expect(judgeStm32(runStm32(b.elf, options(4)), plan, request)).toContain("the handler left UIF set");
  });

  it("a wait on HSERDY with a crystal on the 20-pin package (HSEON without HSEBYP)", () => {
    const { folder, plan, request } = target(0);
    const crystal = "RCC_CR |= (1u << 16);\n  while ((RCC_CR & (1u << 17)) == 0u) {\n  }\n";
    const b = buildStm32(files, folder, (s) =>
      s.replace("static void clock_init(void)\n{\n", `static void clock_init(void)\n{\n  ${crystal}`),
    );
    const problems = judgeStm32(runStm32(b.elf, options(0)), plan, request);
    expect(problems).toHaveLength(1);
    expect(problems[0]).toMatch(/did not reach its idle loop/);
    expect(problems[0]).toMatch(/kept reading RCC_CR/);
    expect(problems[0]).toMatch(/HSEBYP, and the TSSOP-20 package has no OSC_OUT/);
  });

  it("too few flash wait states for 64 MHz (FLASH_ACR LATENCY 2 needed, RM0444)", () => {
    const { folder, plan, request } = target(1);
    const b = buildStm32(files, folder, (s) =>
      s
        .replace(/FLASH_ACR = \(FLASH_ACR & ~7u\) \| 2u;/, "FLASH_ACR = (FLASH_ACR & ~7u) | 1u;")
        .replace(/while \(\(FLASH_ACR & 7u\) != 2u\)/, "while ((FLASH_ACR & 7u) != 1u)"),
    );
    expect(judgeStm32(runStm32(b.elf, options(1)), plan, request)).toContain(
      "FLASH_ACR LATENCY 1 is too few wait states for SYSCLK 64000000 Hz (SYSCLK switch)",
    );
  });
});
