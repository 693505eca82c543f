// PIC12F1840 oscillator configuration chosen by the bundle for the plan's
// clock option (lib/bundle/device-pic12f1840.ts picConfig), checked without
// gpasm so the fast mutation set judges it; the assembled configuration words
// are checked in pic12f1840-image.test.ts.
// Source: PIC12(L)F1840 datasheet DS40001441, Register 4-1 CONFIG1 FOSC<2:0>:
// ECL external clock low-power 0..0.5 MHz, ECM medium power 0.5..4 MHz, ECH
// high power 4..32 MHz (from memory). At the shared edges (0.5 and 4 MHz) the
// bundle takes the lower-power mode: its own choice (common practice, no source).
import { describe, expect, it } from "vitest";
import type { BundlePlan } from "@/lib/bundle";
import { picConfig } from "@/lib/bundle/device-pic12f1840";
import { planTarget } from "@/lib/engine";
import { expectEngineError } from "../engine/expect-engine-error";

const base = planTarget({
  device: "pic12f1840",
  clockSource: "hfintosc",
  clockHz: 16e6,
  periodS: 1e-3,
  highS: 0.25e-3,
}) as BundlePlan;
const at = (clockSource: string, clockHz: number) => ({ ...base, clockSource, clockHz }) as BundlePlan;

describe("PIC12F1840 external clock modes by frequency", () => {
  it.each([
    [200e3, "ECL", "ECL: 200 kHz clock into CLKIN"],
    [500e3, "ECL", "ECL: 500 kHz clock into CLKIN"],
    [600e3, "ECM", "ECM: 600 kHz clock into CLKIN"],
    [4e6, "ECM", "ECM: 4 MHz clock into CLKIN"],
    [20e6, "ECH", "ECH: 20 MHz clock into CLKIN"],
  ])("%d Hz into CLKIN: FOSC = %s", (hz, fosc, why) => {
    expect(picConfig(at("external", hz))).toEqual({ fosc, pllen: false, why });
  });
});

describe("PIC12F1840 clock refusals name the option's own frequencies", () => {
  it("the internal oscillator at 3 MHz (no IRCF step) is refused listing the steps, on clockHz", () => {
    const err = expectEngineError(() => picConfig(at("hfintosc", 3e6)), "clock-out-of-range");
    // the IRCF steps of Register 5-1 from HFINTOSC and MFINTOSC, 31.25 kHz to 16 MHz
    expect(err.field).toBe("clockHz");
    expect(err.message).toBe(
      'pic12f1840: clock option "hfintosc" makes only 31.25 kHz, 62.5 kHz, 125 kHz, 250 kHz, 500 kHz, 1 MHz, 2 MHz, 4 MHz, 8 MHz, 16 MHz; not 3000000 Hz',
    );
  });
});
