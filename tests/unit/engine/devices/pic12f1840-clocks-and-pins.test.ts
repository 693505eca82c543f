// PIC12F1840 clock options and PDIP-8 service pins, checked against the
// PIC12(L)F1840 datasheet (Microchip DS40001441): OSCCON IRCF table
// (Register 5-1; the list recalled from it, from memory) and the 8-pin
// PDIP/SOIC pin diagram (Figure 1: VDD 1, RA5/OSC1/CLKIN 2, RA4/OSC2/CLKOUT 3,
// RA3/MCLR/VPP 4, RA2/CCP1 5, RA1/ICSPCLK 6, RA0/ICSPDAT 7, VSS 8).
import { describe, expect, it } from "vitest";
import { listDevices } from "@/lib/engine";

const pic = listDevices().find((d) => d.id === "pic12f1840")!;
const clock = (id: string) => pic.clocks.find((c) => c.id === id)!;

describe("PIC12F1840 clock options", () => {
  it("the internal oscillator offers exactly the IRCF steps", () => {
    expect(clock("hfintosc").frequenciesHz).toEqual([
      31.25e3, 62.5e3, 125e3, 250e3, 500e3, 1e6, 2e6, 4e6, 8e6, 16e6,
    ]);
    expect(clock("hfintosc-pll").frequenciesHz).toEqual([32e6]); // 8 MHz x 4 PLL
    expect(clock("lfintosc").frequenciesHz).toEqual([31e3]); // LFINTOSC
  });

  it("crystal options need the OSC1/OSC2 pins of the package", () => {
    const names = (pic.packages ?? []).map((p) => p.name);
    for (const id of ["crystal", "crystal-pll"]) {
      expect(clock(id).packages).toEqual(["PDIP-8"]);
      for (const p of clock(id).packages ?? []) expect(names).toContain(p);
    }
    // HS crystal up to 20 MHz; the PLL takes a 4-8 MHz crystal (oscillator module, from memory).
    expect([clock("crystal").minHz, clock("crystal").maxHz]).toEqual([32e3, 20e6]);
    expect([clock("crystal-pll").minHz, clock("crystal-pll").maxHz]).toEqual([16e6, 32e6]);
  });
});

describe("PIC12F1840 PDIP-8 service pins (datasheet pin diagram)", () => {
  const pins = pic.packages?.find((p) => p.name === "PDIP-8")?.servicePins ?? [];
  const bySignal = (s: string) => pins.find((p) => p.signal === s);

  it.each([
    ["VDD", "supply", undefined, [1]],
    ["VSS", "ground", undefined, [8]],
    ["MCLR/VPP", "reset", "RA3", [4]],
    ["ICSPDAT", "programming", "RA0", [7]],
    ["ICSPCLK", "programming", "RA1", [6]],
    ["OSC1/CLKIN", "crystal", "RA5", [2]],
    ["OSC2/CLKOUT", "crystal", "RA4", [3]],
  ] as const)("%s: %s, %s, pin %j", (signal, role, port, packagePins) => {
    const p = bySignal(signal);
    expect(p).toBeDefined();
    expect(p).toMatchObject({ role, packagePins });
    expect(p?.port).toBe(port);
  });

  it("MCLR notes its pull-up; no two service pins share a package pin, and none is the CCP1 output (pin 5)", () => {
    expect(bySignal("MCLR/VPP")?.notes).toMatch(/pull-up/);
    const all = pins.flatMap((p) => p.packagePins);
    expect(new Set(all).size).toBe(all.length);
    expect(all).not.toContain(5);
    expect(all.sort()).toEqual([1, 2, 3, 4, 6, 7, 8]);
  });
});
