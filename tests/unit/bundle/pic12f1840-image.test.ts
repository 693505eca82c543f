// The PIC12F1840 bundle's image: `make -C pic12f1840` assembles src/main.asm
// with gpasm (Debian gputils) into build/firmware.hex; the configuration
// words read back from the hex (word addresses 0x8007/0x8008) are checked
// field by field against the datasheet's bit tables (PIC12(L)F1840,
// DS40001441, Register 4-1 CONFIG1 and 4-2 CONFIG2, decoded independently
// in lib/firmware/emulate/harness/pic12f1840-tables.ts), the OSCCON value against Register
// 5-1, bank selection against the data memory map, and the start-up order
// against the CCP chapter's "Setup for PWM operation" steps.
import { readFileSync } from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { buildBundleSources, type BundleTargetRequest } from "@/lib/bundle";
import { isEngineError, listDevices, planTarget, type PlanRequest } from "@/lib/engine";
import { buildPic, configWords } from "@/tests/tools/gpsim";
import { decodeConfig1, decodeConfig2, IRCF_HZ, REGISTER_BANK } from "@/tests/tools/pic12f1840-tables";
import { mustRun } from "@/tests/tools/require-tool";
import { spec } from "./fixtures";

type Req = BundleTargetRequest & { clockSource: string };
const req = (clockSource: string, clockHz: number, over: Partial<Req> = {}): Req => ({
  device: "pic12f1840",
  clockSource,
  clockHz,
  periodS: 1e-3,
  highS: 0.25e-3,
  ...over,
});

const filesOf = (r: Req) => buildBundleSources(spec([r]));
const asmOf = (r: Req) => String(filesOf(r).find((f) => f.path === "pic12f1840/src/main.asm")?.content);
const cOf = (r: Req) => String(filesOf(r).find((f) => f.path === "pic12f1840/src/main.c")?.content);

function built(r: Req): { dir: string; config1: number; config2: number } {
  const dir = buildPic(filesOf(r), "pic12f1840");
  const { config1, config2 } = configWords(path.join(dir, "build/firmware.hex"));
  return { dir, config1, config2 };
}

describe("PIC12F1840 image build (gpasm)", () => {
  it("make builds build/firmware.hex without a warning or an error, and no ELF", () => {
    const dir = buildPic(filesOf(req("hfintosc", 16e6)), "pic12f1840");
    // Rebuild verbosely to see gpasm's own messages.
    const r = mustRun("make", ["-B", "-C", dir], dir);
    expect(`${r.stdout}${r.stderr}`).not.toMatch(/Warning|Error|Message/);
    expect(readFileSync(path.join(dir, "build/firmware.hex"), "utf8")).toMatch(/^:020000040000FA\r?\n/);
    expect(() => readFileSync(path.join(dir, "build/firmware.elf"))).toThrow();
  });

  it("two builds of the same bundle give identical bytes", () => {
    const files = filesOf(req("crystal", 8e6, { mode: "isr", periodS: 1, highS: 0.4 }));
    const a = readFileSync(path.join(buildPic(files, "pic12f1840"), "build/firmware.hex"));
    const b = readFileSync(path.join(buildPic(files, "pic12f1840"), "build/firmware.hex"));
    expect(a.equals(b)).toBe(true);
  });

  // CONFIG1 FOSC<2:0>: 000 LP, 001 XT, 010 HS, 100 INTOSC, 101 ECL, 110 ECM, 111 ECH; CONFIG2 PLLEN bit 8.
  it.each([
    ["hfintosc", 16e6, "INTOSC", false],
    ["hfintosc-pll", 32e6, "INTOSC", false], // the PLL comes from SPLLEN in OSCCON, which needs PLLEN = 0
    ["lfintosc", 31e3, "INTOSC", false],
    ["crystal", 16e6, "HS", false],
    ["crystal", 4e6, "XT", false],
    ["crystal", 32768, "LP", false],
    ["crystal-pll", 32e6, "HS", true],
    ["external", 20e6, "ECH", false],
    ["external", 2e6, "ECM", false],
    ["external", 200e3, "ECL", false],
  ] as const)("%s at %d Hz: FOSC = %s, PLLEN = %s in the hex", (source, hz, fosc, pllen) => {
    const r = req(source, hz, { periodS: hz < 1e6 ? 0.1 : 1e-3, highS: hz < 1e6 ? 0.025 : 0.25e-3 });
    const { config1, config2 } = built(r);
    const c1 = decodeConfig1(config1);
    const c2 = decodeConfig2(config2);
    expect(c1.fosc).toBe(fosc);
    expect(c2.pllen).toBe(pllen);
    // The rest of the fixed choices: watchdog off, power-up timer on, MCLR is reset,
    // no code protection, brown-out reset on at the high trip point, no CLKOUT,
    // no two-speed start-up, no fail-safe monitor, high-voltage programming only.
    expect(c1).toMatchObject({
      wdte: 0,
      powerUpTimer: true,
      mclrIsReset: true,
      codeProtect: false,
      dataProtect: false,
      boren: 3,
      clkout: false,
      ieso: false,
      fcmen: false,
    });
    expect(c2).toMatchObject({ wrt: 3, stvren: true, borHigh: true, lvp: false });
  });
});

describe("PIC12F1840 clocks are the ones the plan assumes", () => {
  const internal = listDevices()
    .find((d) => d.id === "pic12f1840")!
    .clocks.filter((c) => c.kind === "internal" || c.id === "hfintosc-pll");

  it("every offered internal frequency is written as OSCCON IRCF giving that frequency, with FOSC = INTOSC", () => {
    let checked = 0;
    for (const option of internal) {
      for (const hz of option.frequenciesHz ?? []) {
        const asm = asmOf(req(option.id, hz, { mode: "isr", periodS: 20, highS: 5 }));
        expect(asm).toContain("_FOSC_INTOSC");
        expect(asm).not.toMatch(/_FOSC_(HS|XT|LP)/);
        const m = /movlw\s+(0x[0-9A-F]+)\n\s+movwf\s+OSCCON/.exec(asm);
        expect(m, `${option.id} ${hz} Hz writes OSCCON`).not.toBeNull();
        const osccon = Number(m![1]);
        const ircf = (osccon >> 3) & 15;
        const spllen = (osccon & 0x80) !== 0;
        // Register 5-1: SPLLEN with IRCF = 1110 (8 MHz) gives 32 MHz; SCS = 00 (clock from FOSC).
        expect(spllen ? (ircf === 14 ? 32e6 : NaN) : IRCF_HZ[ircf]).toBe(hz);
        expect(osccon & 3).toBe(0);
        checked++;
      }
    }
    expect(checked).toBe(12); // 31 kHz LF, 31.25 kHz to 16 MHz (10 steps), 32 MHz PLL
  });

  it("the image waits for the ready bit of the oscillator it selects before Timer2 starts", () => {
    const bitsOf = (asm: string) => [...asm.matchAll(/btfss\s+OSCSTAT, (\w+)/g)].map((m) => m[1]);
    // OSCSTAT (Register 5-2): HFIOFR for HFINTOSC, MFIOFR for MFINTOSC, LFIOFR for LFINTOSC, PLLR for the PLL.
    expect(bitsOf(asmOf(req("hfintosc", 4e6)))).toEqual(["HFIOFR"]);
    expect(bitsOf(asmOf(req("hfintosc", 62.5e3, { mode: "isr", periodS: 20, highS: 5 })))).toEqual([
      "MFIOFR",
    ]);
    expect(bitsOf(asmOf(req("lfintosc", 31e3, { mode: "isr", periodS: 20, highS: 5 })))).toEqual(["LFIOFR"]);
    expect(bitsOf(asmOf(req("hfintosc-pll", 32e6)))).toEqual(["HFIOFR", "PLLR"]);
    expect(bitsOf(asmOf(req("crystal-pll", 32e6)))).toEqual(["PLLR"]);
    expect(bitsOf(asmOf(req("crystal", 8e6)))).toEqual([]);
    const asm = asmOf(req("hfintosc", 4e6));
    expect(asm.indexOf("OSCSTAT, HFIOFR")).toBeLessThan(asm.indexOf("movwf   T2CON"));
  });

  it("a crystal plan writes no OSCCON (SCS = 00 takes the FOSC choice) and never HS/XT without a crystal option", () => {
    expect(asmOf(req("crystal", 16e6))).not.toContain("movwf   OSCCON");
    for (const source of ["hfintosc", "lfintosc", "hfintosc-pll", "external"]) {
      const hz = source === "lfintosc" ? 31e3 : source === "hfintosc-pll" ? 32e6 : 16e6;
      const asm = asmOf(req(source, hz, { mode: "isr", periodS: 20, highS: 5 }));
      expect(asm).not.toMatch(/_FOSC_(HS|XT|LP)/);
    }
  });
});

/** SFR accesses whose selected bank is not the register's bank; labels other code jumps to forget the bank. */
function bankCheck(asm: string): { wrong: string[]; checked: number } {
  let bank: number | "all" | undefined;
  const wrong: string[] = [];
  let checked = 0;
  for (const line of asm.split("\n")) {
    const code = line.replace(/;.*/, "").trim();
    const sel = /^banksel\s+(\w+)/.exec(code);
    if (sel) {
      bank = REGISTER_BANK[sel[1]];
      continue;
    }
    if (/^\w+:$/.test(code) && !code.startsWith("wait_")) bank = undefined;
    const acc = /^(movwf|movf|bcf|bsf|btfss|btfsc|clrf)\s+([A-Z][A-Z0-9]+)\b/.exec(code);
    if (!acc || acc[2] === "STATUS" || acc[2] === "INTCON") continue;
    if (REGISTER_BANK[acc[2]] === undefined || REGISTER_BANK[acc[2]] !== bank) wrong.push(acc[2]);
    checked++;
  }
  return { wrong, checked };
}

describe("PIC12F1840 start-up code", () => {
  it("follows the datasheet's Setup for PWM operation order; driver on only after TMR2IF", () => {
    const asm = asmOf(req("hfintosc", 16e6));
    const at = (re: RegExp) => {
      const m = re.exec(asm);
      expect(m, String(re)).not.toBeNull();
      return m!.index;
    };
    const trisOff = at(/movlw\s+0x3F\n\s+movwf\s+TRISA/); // 1. TRISA2 = 1
    const pr2 = at(/movwf\s+PR2/); // 2. PR2
    const ccp1con = at(/movwf\s+CCP1CON/); // 3. CCP1CON PWM mode
    const ccpr1l = at(/movwf\s+CCPR1L/); // 4. duty
    const clearIf = at(/bcf\s+PIR1, TMR2IF/); // 5. clear TMR2IF ...
    const t2con = at(/movwf\s+T2CON/); // ... prescale and TMR2ON
    const waitIf = at(/btfss\s+PIR1, TMR2IF/); // 6. wait for the overflow ...
    const trisOn = at(/movlw\s+0x3B\n\s+movwf\s+TRISA/); // ... then TRISA2 = 0
    const order = [trisOff, pr2, ccp1con, ccpr1l, clearIf, t2con, waitIf, trisOn];
    expect([...order].sort((a, b) => a - b)).toEqual(order);
  });

  it("every register access is preceded by a BANKSEL of a register in the same bank (data memory map)", () => {
    for (const r of [
      req("hfintosc", 16e6),
      req("hfintosc", 16e6, { mode: "isr", periodS: 10e-3, highS: 2.5e-3 }),
    ]) {
      const { wrong, checked } = bankCheck(asmOf(r));
      expect(wrong).toEqual([]);
      expect(checked).toBeGreaterThan(10);
    }
  });

  it("planted fault: a missing BANKSEL is caught by the bank check", () => {
    const asm = asmOf(req("hfintosc", 16e6)).replace(/\n\s+banksel CCP1CON\n/, "\n");
    expect(bankCheck(asm).wrong).toEqual(["CCP1CON"]);
  });

  it("main.asm and main.c make the same register writes in the same order", () => {
    for (const r of [
      req("hfintosc", 16e6),
      req("crystal-pll", 32e6),
      req("hfintosc", 500e3, { mode: "isr", periodS: 1, highS: 0.25 }),
    ]) {
      const asm = [...asmOf(r).matchAll(/^start:[\s\S]*/gm)][0][0];
      const fromAsm = [...asm.matchAll(/movlw\s+(\S+)\n\s+movwf\s+([A-Z][A-Z0-9]+)\b/g)].map(
        (m) => `${m[2]}=${Number(m[1])}`,
      );
      const fromC = [...cOf(r).matchAll(/^\s+([A-Z][A-Z0-9]+) = (0x[0-9A-F]+|\d+);/gm)].map(
        (m) => `${m[1]}=${Number(m[2])}`,
      );
      expect(fromAsm.length).toBeGreaterThan(5);
      expect(fromAsm).toEqual(fromC);
    }
  });
});

describe("PIC12F1840 bad clock input is refused naming clockHz", () => {
  const engineField = (r: PlanRequest) => {
    try {
      planTarget(r);
    } catch (e) {
      return isEngineError(e) ? e.field : "not an EngineError";
    }
    return "accepted";
  };

  it("an internal frequency that is not an IRCF step is refused by the engine", () => {
    for (const hz of [3e6, 12e6, 20e6, 100e3, 31.5e3]) {
      expect(engineField({ ...req("hfintosc", hz), clockSource: "hfintosc" })).toBe("clockHz");
    }
    expect(engineField({ ...req("hfintosc-pll", 16e6), clockSource: "hfintosc-pll" })).toBe("clockHz");
    expect(engineField({ ...req("hfintosc", 4e6), clockSource: "hfintosc" })).toBe("accepted");
  });

  it("a crystal outside 32 kHz-20 MHz is refused before any file is made", () => {
    let err: unknown;
    try {
      filesOf(req("crystal", 25e6));
    } catch (e) {
      err = e;
    }
    expect(isEngineError(err)).toBe(true);
    expect((err as Error).message).toMatch(/crystal.*32 kHz to 20 MHz/);
  });
});
