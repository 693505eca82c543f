// The names and numbers the MSP430G2553 entry shows a reviewer and a
// technician, typed here from the documents, not from the device file:
// - MSP430G2x53 datasheet (TI SLAS735), terminal functions of the 20-pin N
//   (PDIP) package: 1 DVCC, 4 P1.2/TA0.1, 16 RST/NMI/SBWTDIO, 17 TEST/SBWTCK,
//   18 XOUT/P2.7, 19 XIN/P2.6, 20 DVSS; supply 1.8 to 3.6 V; calibration
//   data CALBC1_1MHZ/8MHZ/12MHZ/16MHZ; the timer is named Timer0_A3.
// - MSP430x2xx Family User's Guide (TI SLAU144), Timer_A: TACTL ID bits
//   00 /1, 01 /2, 10 /4, 11 /8; OUTMOD_7 reset/set; OUTMOD_4 toggle; CCIE bit 4.
// - Spy-Bi-Wire reset pin: 47 kΩ pull-up and at most 2.2 nF (TI SLAU278,
//   MSP430 hardware tools guide, from memory).
import { describe, expect, it } from "vitest";
import { listDevices, planTarget } from "@/lib/engine";

const msp = listDevices().find((d) => d.id === "msp430g2553")!;

describe("MSP430G2553 names against SLAS735 / SLAU144", () => {
  it("device, family, core, reference documents and toolchain", () => {
    expect(msp.name).toBe("MSP430G2553");
    expect(msp.family).toMatch(/^MSP430\b/);
    expect(msp.family).toMatch(/Value Line/);
    expect(msp.core).toBe("msp430");
    expect(msp.reference).toMatch(/SLAU144/);
    expect(msp.reference).toMatch(/SLAS735/);
    expect(msp.toolchain).toEqual({
      compiler: expect.stringMatching(/msp430/),
      target: "-mmcu=msp430g2553",
      header: "msp430.h", // TI's device header name, as avr-libc's avr/io.h
    });
    // the G2553 runs to 16 MHz (SLAS735, recommended operating conditions)
    expect(msp.maxClockHz).toBe(16e6);
    expect(msp.minClockHz).toBe(10e3);
  });

  it("PDIP-20 service pins carry the SLAS735 terminal names and numbers", () => {
    const pkg = msp.packages![0];
    expect(pkg.name).toBe("PDIP-20");
    const rows = pkg.servicePins.map((p) => [p.signal, p.role, p.packagePins, p.port ?? null]);
    expect(rows).toEqual([
      ["DVCC", "supply", [1], null],
      ["DVSS", "ground", [20], null],
      ["RST/NMI/SBWTDIO", "reset", [16], null],
      ["TEST/SBWTCK", "programming", [17], null],
      ["XIN", "crystal", [19], "P2.6"],
      ["XOUT", "crystal", [18], "P2.7"],
    ]);
    const notes = Object.fromEntries(pkg.servicePins.map((p) => [p.signal, p.notes]));
    expect(notes.DVCC).toMatch(/1\.8 V to 3\.6 V/);
    expect(notes.DVCC).toMatch(/100 nF/);
    expect(notes.DVSS).toMatch(/ground/);
    expect(notes["RST/NMI/SBWTDIO"]).toMatch(/47 kΩ/);
    expect(notes["RST/NMI/SBWTDIO"]).toMatch(/2\.2 nF/);
    expect(notes["RST/NMI/SBWTDIO"]).toMatch(/SBWTDIO/);
    expect(notes["TEST/SBWTCK"]).toMatch(/SBWTCK/);
    expect(notes.XIN).toMatch(/32\.768 kHz/);
    expect(notes.XOUT).toMatch(/XIN/);
  });

  it("clock option labels name the calibrated steps and the XIN/XOUT pins", () => {
    const [dco, xt, ext] = msp.clocks;
    expect(dco.label).toMatch(/DCO/);
    expect(dco.label).toMatch(/1, 8, 12 or 16 MHz/);
    expect(dco.accuracyPpm).toBe(30000); // +-3 % (SLAS735 calibrated DCO tolerance, from memory)
    expect(xt.label).toMatch(/LFXT1/);
    expect(xt.label).toMatch(/32\.768 kHz/);
    expect(xt.label).toMatch(/P2\.6\/P2\.7/);
    expect(xt.accuracySource).toMatch(/common practice, no source/);
    expect(ext.label).toMatch(/XIN \(P2\.6\)/);
    expect(ext.label).toMatch(/10 to 50 kHz/);
    expect(ext.accuracySource).toMatch(/common practice, no source/);
  });

  it("the timer is Timer0_A3 with the /1 /2 /4 /8 input divider, output TA0.1 on P1.2 = pin 4", () => {
    const [t] = msp.timers;
    expect(msp.timers).toHaveLength(1);
    expect(t.name).toBe("TIMER0_A3");
    expect(t.bits).toBe(16);
    expect(t.dividers).toEqual([1, 2, 4, 8]);
    expect(t.maxCounts).toBe(65536);
    expect(t.modes).toEqual(["pwm", "toggle", "isr"]);
    const [out, gpio] = t.pins;
    expect(out).toMatchObject({
      port: "P1.2",
      packagePin: 4,
      package: "PDIP-20",
      function: "TA0.1",
      sel: 1,
      sel2: 0,
    });
    expect(out).toMatchObject({ portName: "1", bit: 2 });
    expect(gpio).toMatchObject({ port: "P1.2", function: "GPIO", sel: 0, sel2: 0 });
  });

  it.each([
    [1, 0],
    [2, 1],
    [4, 2],
    [8, 3],
  ])("TACTL ID for /%d is %d (SLAU144 Timer_A, TACTL bits 7-6), in pwm, toggle and isr plans", (div, id) => {
    // 1 MHz DCO: div * 50000 clock cycles per timer period fit 16 bits only from divider div
    // up, and the most counts win (engine.md section 3), so the plan must use exactly div.
    // Toggle and the interrupt plan run the timer twice per output period.
    for (const mode of ["pwm", "toggle", "isr"] as const) {
      const periodS = mode === "pwm" ? div * 0.05 : 2 * div * 0.05;
      const p = planTarget({
        device: "msp430g2553",
        clockHz: 1e6,
        periodS,
        highS: periodS / 2,
        mode,
        timer: "TIMER0_A3",
      });
      expect([p.mode, p.divider, p.registers.TACCR0]).toEqual([mode, div, 49999]);
      expect((p.registers.TACTL >> 6) & 3, `${mode} /${div}`).toBe(id);
      expect((p.registers.TACTL >> 4) & 3).toBe(1); // MC_1: up mode
      expect((p.registers.TACTL >> 8) & 3).toBe(2); // TASSEL_2: SMCLK
      expect(p.registers.TACTL & ~0x3f0).toBe(0); // nothing else set
      if (mode === "pwm") expect(p.registers.TACCTL1).toBe(7 << 5); // OUTMOD_7
      if (mode === "toggle") {
        expect(p.registers.TACCTL1).toBe(4 << 5); // OUTMOD_4
        expect(p.registers.TACCR1).toBe(p.registers.TACCR0);
      }
      if (mode === "isr") expect(p.registers.TACCTL0).toBe(1 << 4); // CCIE
    }
  });
});
