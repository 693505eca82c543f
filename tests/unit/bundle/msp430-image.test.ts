// The MSP430G2553 image as flashed: vector table, hex against ELF, no runtime
// library, two builds byte-identical. Addresses: MSP430G2x53 datasheet SLAS735
// (flash 0xC000..0xFFFF; interrupt vector table: Timer0_A3 TACCR0 CCIFG at
// 0xFFF2, reset at 0xFFFE). Intel hex record layout: Intel's hexadecimal
// object file format specification (record types 00 data, 01 end, 03 start).
import { readFileSync } from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { buildBundleSources } from "@/lib/bundle";
import { buildTargetImages } from "@/lib/firmware/build-images";
import { buildMsp430, symbolAddress } from "@/tests/tools/msp430-build";
import { run } from "@/tests/tools/require-tool";
import { spec } from "./fixtures";

const ISR = { device: "msp430g2553", clockHz: 1e6, periodS: 2, highS: 0.5, mode: "isr" as const };
const PWM = { device: "msp430g2553", clockHz: 16e6, periodS: 0.03, highS: 0.01 };

function parseHex(text: string): Map<number, number> {
  const bytes = new Map<number, number>();
  let base = 0;
  for (const line of text.split(/\r?\n/).filter(Boolean)) {
    expect(line[0]).toBe(":");
    const raw = Buffer.from(line.slice(1), "hex");
    const sum = raw.reduce((a, b) => (a + b) & 0xff, 0);
    expect(sum).toBe(0); // record checksum: two's complement of the byte sum
    const [len, hi, lo, type] = raw;
    const data = raw.subarray(4, 4 + len);
    if (type === 0) data.forEach((b, i) => bytes.set(base + ((hi << 8) | lo) + i, b));
    else if (type === 2) base = ((data[0] << 8) | data[1]) << 4;
    else if (type === 4) base = ((data[0] << 8) | data[1]) << 16;
  }
  return bytes;
}

const word = (m: Map<number, number>, a: number) => (m.get(a) ?? -1) | ((m.get(a + 1) ?? -1) << 8);

describe("MSP430G2553 image", () => {
  it("vectors: reset at 0xFFFE -> reset_entry, TACCR0 at 0xFFF2 -> timing_isr, every other slot -> unexpected_irq", () => {
    const b = buildMsp430(buildBundleSources(spec([ISR])), "msp430g2553");
    expect(b.make.status).toBe(0);
    const hex = parseHex(readFileSync(b.hex, "utf8"));
    expect(word(hex, 0xfffe)).toBe(symbolAddress(b.elf, "reset_entry"));
    expect(word(hex, 0xfff2)).toBe(symbolAddress(b.elf, "timing_isr"));
    const trap = symbolAddress(b.elf, "unexpected_irq");
    for (let a = 0xffe0; a < 0xfffe; a += 2) if (a !== 0xfff2) expect([a, word(hex, a)]).toEqual([a, trap]);
  });

  it("a PWM image leaves the TACCR0 slot on the trap too (no handler, no enabled interrupt)", () => {
    const b = buildMsp430(buildBundleSources(spec([PWM])), "msp430g2553");
    const hex = parseHex(readFileSync(b.hex, "utf8"));
    expect(word(hex, 0xfff2)).toBe(symbolAddress(b.elf, "unexpected_irq"));
  });

  it("the hex holds exactly the ELF's loadable bytes, all inside flash", () => {
    const b = buildMsp430(buildBundleSources(spec([ISR])), "msp430g2553");
    const hex = parseHex(readFileSync(b.hex, "utf8"));
    const bin = path.join(b.dir, "build/check.bin");
    expect(run("llvm-objcopy", ["-O", "binary", b.elf, bin], b.dir).status).toBe(0);
    const flat = readFileSync(bin); // from the lowest load address, 0xC000 here
    const addrs = [...hex.keys()];
    expect(Math.min(...addrs)).toBe(0xc000);
    expect(Math.max(...addrs)).toBe(0xffff);
    for (const [a, v] of hex) expect(flat[a - 0xc000]).toBe(v);
    // sizes of the loadable sections (llvm-size -A): text + data load image + vectors
    const sizes = run("llvm-size", ["-A", b.elf], b.dir).stdout;
    const size = (name: string) => Number(new RegExp(`^\\${name}\\s+(\\d+)`, "m").exec(sizes)?.[1] ?? 0);
    expect(hex.size).toBe(size(".text") + size(".data") + size(".vectors"));
    expect(size(".vectors")).toBe(32);
  });

  it("no runtime library: the objects call nothing but register symbols from periph.x", () => {
    for (const t of [ISR, PWM]) {
      const b = buildMsp430(buildBundleSources(spec([t])), "msp430g2553");
      const undef = run("llvm-nm", ["-u", "build/main.o", "build/startup.o"], b.dir)
        .stdout.split("\n")
        .map((l) => l.trim().replace(/^U /, ""))
        .filter((l) => l && !l.endsWith(":"));
      const others = undef.filter(
        (s) =>
          !/^__[A-Z0-9_]+$/.test(s) &&
          s !== "main" &&
          !s.startsWith("__data") &&
          !s.startsWith("__bss") &&
          s !== "__stack_top",
      );
      expect(others).toEqual([]);
      expect(undef.some((s) => s.startsWith("__mspabi"))).toBe(false);
    }
  });

  it("planted: a run-time division needs a libgcc helper, and the check sees it (the link fails too)", () => {
    const plant = {
      file: "src/main.c",
      from: "\n  /* Sleep in LPM0",
      to: "\n  P1OUT = (uint8_t)(TA0R / P1IN);\n  /* Sleep in LPM0",
    };
    const b = buildMsp430(buildBundleSources(spec([PWM])), "msp430g2553", plant);
    expect(b.make.status).not.toBe(0);
    expect(b.make.stderr).toMatch(/undefined symbol: __mspabi_divu/);
    expect(run("llvm-nm", ["-u", "build/main.o"], b.dir).stdout).toMatch(/__mspabi_divu/);
  });

  it("two builds through the bundle's image builder give identical bytes", async () => {
    const files = buildBundleSources(spec([ISR]));
    const a = await buildTargetImages(files, "msp430g2553", "msp430g2553");
    const b = await buildTargetImages(files, "msp430g2553", "msp430g2553");
    expect(a.map((f) => f.path)).toEqual([
      "msp430g2553/firmware/firmware.elf",
      "msp430g2553/firmware/firmware.hex",
    ]);
    a.forEach((f, i) => expect(Buffer.from(f.content).equals(Buffer.from(b[i].content))).toBe(true));
  });
});
