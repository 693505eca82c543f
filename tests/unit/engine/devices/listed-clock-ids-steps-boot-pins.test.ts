// Facts a request or a pin map takes from listDevices(): the clock option ids
// a request names (engine.md section 4: clockSource is an option id from
// listDevices), the RP2040's fractional divider steps and the STM32G031's
// bootloader serial pins.
import { describe, expect, it } from "vitest";
import { listDevices, planTarget } from "@/lib/engine";

const device = (id: string) => listDevices().find((d) => d.id === id)!;

describe("clock option ids", () => {
  it("are non-empty and distinct on every device (engine.md section 4)", () => {
    for (const d of listDevices()) {
      const ids = d.clocks.map((c) => c.id);
      for (const id of ids) expect(id.trim(), d.id).not.toBe("");
      expect(new Set(ids).size, d.id).toBe(ids.length);
    }
  });

  it("ATmega328P external clock plans when a request names it", () => {
    // ATmega328P datasheet (DS40002061), System Clock and Clock Options:
    // external clock on XTAL1/CLKI, 0-20 MHz
    const ext = device("atmega328p").clocks.find((c) => c.id === "external")!;
    expect(ext.label).toBe("External clock 0-20 MHz");
    const plan = planTarget({
      device: "atmega328p",
      clockHz: 12e6,
      periodS: 1e-3,
      highS: 5e-4,
      clockSource: "external",
    });
    // Timer1 fast PWM: N * (1 + TOP) / f = 1 ms at 12 MHz is exact
    expect(plan.periodErrorPpm).toBe(0);
  });
});

describe("RP2040 PWM divider", () => {
  it("is listed as a range in sixteenths (RP2040 datasheet, PWM chapter: DIV_INT + DIV_FRAC/16)", () => {
    for (const t of device("rp2040").timers)
      expect(t.dividers, t.name).toMatchObject({ min: 1, step: 1 / 16 });
  });
});

describe("STM32G031 bootloader serial pins", () => {
  it("name USART2_TX on PA2 (pin 9) and USART2_RX on PA3 (pin 10) of the TSSOP-20", () => {
    // AN2606 (STM32 system memory boot mode), STM32G03x: USART2 on PA2/PA3;
    // STM32G031x4/x6/x8 datasheet TSSOP20 pinout: PA2 = 9, PA3 = 10 (both from memory)
    const p = device("stm32g031").packages!.find((x) => x.name === "TSSOP-20")!;
    const boot = p.servicePins.filter((s) => s.role === "boot").map((s) => [s.signal, s.port, s.packagePins]);
    expect(boot).toEqual([
      ["USART2_TX", "PA2", [9]],
      ["USART2_RX", "PA3", [10]],
    ]);
  });
});
