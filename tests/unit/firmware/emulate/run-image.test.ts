// The image the stored emulation names (runImageOf, read by the build) must be
// the image each wrapper actually looks for. Each wrapper is handed a target
// folder without any image; its refusal names the file it wanted, and that
// must be the table's entry. A table line pointing at firmware.hex for a
// wrapper that runs firmware.elf (the drift this guards) fails here.
// Own check of our code, no outside source.
import { describe, expect, it } from "vitest";
import { DEVICE_EMULATORS, emulateTarget, runImageOf } from "@/lib/firmware/emulate";

const PINS: Record<string, string> = {
  atmega328p: "PB1",
  attiny85: "PB1",
  rp2040: "GP15",
  stm32g031: "PA6",
  msp430g2553: "P1.2",
  pic12f1840: "RA2",
};

describe("the image each emulator runs", () => {
  for (const device of Object.keys(DEVICE_EMULATORS)) {
    it(`${device}: the wrapper asks for the table's image`, async () => {
      const image = runImageOf(device);
      expect(image).toMatch(/^firmware\/firmware\.(hex|elf)$/);
      const result = await emulateTarget({
        device,
        folder: "t1",
        files: [{ path: "t1/src/main.c", content: "int main(void){}" }],
        planned: { periodS: 1e-3, highS: 5e-4, pin: PINS[device] },
        kind: "periodic",
        toleranceS: { period: 1e-6, high: 1e-6 },
        clockHz: 16_000_000,
      });
      expect(result.verdict).toBe("not-emulated");
      expect(result.reason).toContain(`t1/${image}`);
    });
  }
  it("answers null for a device without an emulator", () => {
    expect(runImageOf("z80")).toBeNull();
  });
});
