// The PIC12F1840 start-up text for the internal oscillator: for every IRCF
// step the bundle offers, main.asm and main.c write OSCCON with the IRCF code
// of that frequency, say so in the comment beside the write, and wait for the
// ready bit of the oscillator block that makes it. Checked in the generated
// text (no gpasm run), so the fast mutation set judges it; the assembled
// image is checked in pic12f1840-image.test.ts and pic12f1840-gpsim.test.ts.
// Source: PIC12(L)F1840 datasheet DS40001441, Register 5-1 OSCCON (SPLLEN 7,
// IRCF<3:0> 6..3, SCS<1:0> 1..0) and Register 5-2 OSCSTAT (HFIOFR, MFIOFR,
// LFIOFR). The IRCF codes below are typed from memory of Register 5-1; they
// agree with the emulator harness's own decoder (IRCF_HZ in
// lib/firmware/emulate/harness/pic12f1840-tables.ts), written separately.
// Where HFINTOSC and MFINTOSC both make 125..500 kHz, the bundle takes
// HFINTOSC (its own choice, stated in lib/bundle/device-pic12f1840.ts).
import { describe, expect, it } from "vitest";
import { buildBundleSources, type BundleTargetRequest } from "@/lib/bundle";
import { spec } from "./fixtures";

// frequency -> [IRCF<3:0> as written in the register description, oscillator block, its OSCSTAT ready bit]
const IRCF: [number, string, string, string, string][] = [
  [16e6, "1111", "16 MHz", "HFINTOSC", "HFIOFR"],
  [8e6, "1110", "8 MHz", "HFINTOSC", "HFIOFR"],
  [4e6, "1101", "4 MHz", "HFINTOSC", "HFIOFR"],
  [2e6, "1100", "2 MHz", "HFINTOSC", "HFIOFR"],
  [1e6, "1011", "1 MHz", "HFINTOSC", "HFIOFR"],
  [500e3, "1010", "500 kHz", "HFINTOSC", "HFIOFR"],
  [250e3, "1001", "250 kHz", "HFINTOSC", "HFIOFR"],
  [125e3, "1000", "125 kHz", "HFINTOSC", "HFIOFR"],
  [62.5e3, "0100", "62.5 kHz", "MFINTOSC", "MFIOFR"],
  [31.25e3, "0010", "31.25 kHz", "MFINTOSC", "MFIOFR"],
];

type Req = BundleTargetRequest & { clockSource: string };
function sources(clockSource: string, clockHz: number): { asm: string; c: string } {
  // a slow interrupt plan fits Timer2 at every internal frequency
  const r: Req = { device: "pic12f1840", clockSource, clockHz, mode: "isr", periodS: 20, highS: 5 };
  const files = buildBundleSources(spec([r]));
  const text = (p: string) => String(files.find((f) => f.path === p)?.content);
  return { asm: text("pic12f1840/src/main.asm"), c: text("pic12f1840/src/main.c") };
}
const hex2 = (v: number) => `0x${v.toString(16).toUpperCase().padStart(2, "0")}`;

describe("PIC12F1840 internal oscillator start-up text", () => {
  it.each(IRCF)(
    "%d Hz: OSCCON IRCF = %s, comment and ready wait in main.asm and main.c",
    (hz, ircf, label, block, ready) => {
      const { asm, c } = sources("hfintosc", hz);
      // SPLLEN = 0, SCS = 00: OSCCON = IRCF << 3
      const osccon = hex2(parseInt(ircf, 2) << 3);
      const comment = `IRCF = ${ircf}: ${label} ${block}, SCS = 00 (clock from FOSC = INTOSC)`;
      expect(asm).toContain(`; ${comment}\n    banksel OSCCON\n    movlw   ${osccon}\n    movwf   OSCCON\n`);
      expect([...asm.matchAll(/btfss\s+OSCSTAT, (\w+)/g)].map((m) => m[1])).toEqual([ready]);
      expect(c).toContain(`/* ${comment} -> ${osccon} */`);
      expect(c).toContain(`OSCCON = ${osccon};`);
      expect([...c.matchAll(/while \(!OSCSTATbits\.(\w+)\)/g)].map((m) => m[1])).toEqual([ready]);
    },
  );

  it("31 kHz LFINTOSC: IRCF = 0000 and the LFIOFR wait", () => {
    const { asm, c } = sources("lfintosc", 31e3);
    expect(asm).toContain("; IRCF = 0000: 31 kHz LFINTOSC, SCS = 00 (clock from FOSC = INTOSC)");
    expect(c).toContain("OSCCON = 0x00;");
    expect([...c.matchAll(/while \(!OSCSTATbits\.(\w+)\)/g)].map((m) => m[1])).toEqual(["LFIOFR"]);
  });

  it("32 MHz: SPLLEN = 1 with IRCF = 1110 (8 MHz x 4), waiting for HFIOFR then PLLR", () => {
    const { asm, c } = sources("hfintosc-pll", 32e6);
    expect(asm).toContain(
      "; SPLLEN = 1, IRCF = 1110: 8 MHz HFINTOSC x 4 PLL, SCS = 00 (clock from FOSC = INTOSC)",
    );
    expect(c).toContain(`OSCCON = ${hex2(0x80 | (0b1110 << 3))};`);
    expect([...c.matchAll(/while \(!OSCSTATbits\.(\w+)\)/g)].map((m) => m[1])).toEqual(["HFIOFR", "PLLR"]);
  });
});
