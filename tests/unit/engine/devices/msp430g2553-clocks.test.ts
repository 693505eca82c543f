// MSP430G2553 clock choices: only what the bundle's code sets up, refused by
// field otherwise. Sources: MSP430G2x53 datasheet SLAS735 (calibration data
// for 1, 8, 12 and 16 MHz at 0x10F8..0x10FF; LFXT1 in LF mode only, XIN/XOUT
// on P2.6/P2.7; 20-pin N package pin designation) and MSP430x2xx Family
// User's Guide SLAU144 (Timer_A TASSEL: 1 = ACLK, 2 = SMCLK).
import { describe, expect, it } from "vitest";
import { buildBundleSources, type BundleTargetRequest } from "@/lib/bundle";
import { DEVICES } from "@/lib/bundle/devices";
import { isEngineError, listDevices, planTarget, type PlanRequest } from "@/lib/engine";
import { targetSchema } from "@/lib/validation/target";
import { spec } from "../../bundle/fixtures";

const msp = listDevices().find((d) => d.id === "msp430g2553")!;

function refusal(run: () => unknown): { code: string; field?: string; message: string } {
  try {
    run();
  } catch (e) {
    if (isEngineError(e)) return { code: e.code, field: e.field, message: e.message };
    throw e;
  }
  throw new Error("accepted, expected a refusal");
}

const req = (over: Partial<PlanRequest>): PlanRequest => ({
  device: "msp430g2553",
  clockHz: 1e6,
  periodS: 0.02,
  highS: 0.0015,
  ...over,
});

describe("MSP430G2553 clock options", () => {
  it("listDevices offers the calibrated DCO steps, the watch crystal and a 10..50 kHz XIN clock, nothing else", () => {
    expect(msp.clocks.map((c) => c.id)).toEqual(["dco-cal", "lfxt1", "external"]);
    const [dco, xt, ext] = msp.clocks;
    expect(dco.frequenciesHz).toEqual([1e6, 8e6, 12e6, 16e6]); // CALBC1_1MHZ/8/12/16 (SLAS735)
    expect(xt).toMatchObject({ hz: 32768, kind: "crystal" });
    expect(ext).toMatchObject({ minHz: 10e3, maxHz: 50e3, kind: "external" }); // LF digital input (SLAS735, from memory)
    expect(dco.accuracySource).toMatch(/SLAS735/);
  });

  it.each([
    ["a DCO frequency without calibration data", { clockHz: 4e6 }, "clockHz"],
    ["the watch crystal at another frequency", { clockSource: "lfxt1", clockHz: 1e6 }, "clockHz"],
    ["an external clock beyond the LF mode", { clockSource: "external", clockHz: 16e6 }, "clockHz"],
    ["an external clock below the LF mode", { clockSource: "external", clockHz: 5e3 }, "clockHz"],
    ["the VLO, for which the bundle has no code", { clockSource: "vlo", clockHz: 12e3 }, "clockSource"],
  ])("the engine refuses %s, naming the field", (_n, over, field) => {
    const r = refusal(() => planTarget(req(over)));
    expect(r.field).toBe(field);
    expect(r.message).toMatch(/MSP430G2553/);
  });

  it.each([
    ["dco-cal", 16e6, 2],
    ["lfxt1", 32768, 1],
    ["external", 32768, 1],
  ] as const)("%s at %d Hz: plan TACTL selects TASSEL_%d", (clockSource, clockHz, tassel) => {
    const p = planTarget(req({ clockSource, clockHz, periodS: 0.5, highS: 0.125 }));
    expect((p.registers.TACTL >> 8) & 3).toBe(tassel);
    expect(p.clockSource).toBe(clockSource);
  });

  it("the form schema refuses an uncalibrated DCO frequency on clockHz and accepts a calibrated one", () => {
    const base = { device: "msp430g2553", clockSource: "dco-cal", mode: "pwm", requiredTolerancePct: "1" };
    const bad = targetSchema.safeParse({ ...base, clockHz: "4M" });
    expect(bad.success).toBe(false);
    expect(bad.error?.issues.map((i) => i.path.join("."))).toContain("clockHz");
    expect(targetSchema.safeParse({ ...base, clockHz: "8M" }).success).toBe(true);
  });

  it("the bundle refuses a clock it has no code for before writing any file", () => {
    // a hand-built plan that skipped the engine's checks still cannot become an image on the DCO
    const plan = { ...planTarget(req({})), clockSource: "external", clockHz: 8e6 };
    expect(refusal(() => DEVICES.msp430g2553.view(plan)).field).toBe("clockHz");
    const t: BundleTargetRequest = {
      device: "msp430g2553",
      clockHz: 8e6,
      periodS: 1e-3,
      highS: 5e-4,
      clockSource: "external",
    };
    const r = refusal(() => buildBundleSources(spec([t])));
    expect(r.code).toBe("clock-out-of-range");
  });

  it("every timer register the firmware writes is in plan.json with the same value, and no other", () => {
    // SLAU144 names TACTL/TACCRx/TACCTLx; the G2553 header spells them TA0CTL/TA0CCRx/TA0CCTLx
    for (const [clockSource, clockHz] of [
      ["dco-cal", 1e6],
      ["lfxt1", 32768],
      ["external", 20e3],
    ] as const) {
      for (const mode of ["pwm", "toggle", "isr"] as const) {
        const p = planTarget(req({ clockSource, clockHz, mode, periodS: 0.25, highS: 0.05 }));
        const writes = DEVICES.msp430g2553.view(p).writes.filter((w) => w.reg.startsWith("TA0"));
        const fromFirmware = Object.fromEntries(writes.map((w) => [w.reg.replace("TA0", "TA"), w.value]));
        expect([clockSource, mode, fromFirmware]).toEqual([clockSource, mode, p.registers]);
      }
    }
  });
});

describe("MSP430G2553 PDIP-20 service pins (SLAS735 pin designation, N package)", () => {
  const pkg = msp.packages?.[0];
  it.each([
    ["DVCC", 1],
    ["DVSS", 20],
    ["RST/NMI/SBWTDIO", 16],
    ["TEST/SBWTCK", 17],
    ["XIN", 19],
    ["XOUT", 18],
  ])("%s is package pin %d", (signal, n) => {
    expect(pkg?.name).toBe("PDIP-20");
    expect(pkg?.servicePins.find((s) => s.signal === signal)?.packagePins).toEqual([n]);
  });
  it("XIN/XOUT are P2.6/P2.7 and the timer output P1.2 is pin 4", () => {
    expect(pkg?.servicePins.find((s) => s.signal === "XIN")?.port).toBe("P2.6");
    expect(pkg?.servicePins.find((s) => s.signal === "XOUT")?.port).toBe("P2.7");
    expect(planTarget(req({})).pin).toMatchObject({ port: "P1.2", packagePin: 4, package: "PDIP-20" });
  });
});
