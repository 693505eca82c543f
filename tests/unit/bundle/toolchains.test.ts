// Every device's generated code, for hardware and interrupt (software
// divider) plans, goes through the device's real toolchain or, where none is
// free, a host syntax check against the datasheet-named stubs. The MSP430
// folders build with their own Makefile (Debian clang + lld against the
// msp430mcu headers, firmware.md build contract).
import { readFileSync, writeFileSync } from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { buildBundleSources } from "@/lib/bundle";
import { buildAvr } from "@/tests/tools/avr";
import { buildArm, hostSyntaxCheck, syntaxCheckFolder } from "@/tests/tools/c-check";
import { writeFolder } from "@/tests/tools/files";
import { buildMsp430 } from "@/tests/tools/msp430-build";
import { buildStm32 } from "@/tests/tools/stm32g031-emu";
import { buildRp2040 } from "@/tests/unit/firmware/rp2040-build";
import { elfFlashContent } from "@/tests/unit/firmware/rp2040-image-readers";
import { buildPic } from "@/tests/tools/gpsim";
import { FOLDERS, TARGETS, spec } from "./fixtures";

const files = buildBundleSources(spec());
const folderOf = (device: string) => FOLDERS.filter((f, i) => TARGETS[i].device === device && f.length > 0);

describe("generated C builds with the device toolchains", () => {
  // avr-gcc + avr-libc (Debian gcc-avr, avr-libc): -Werror, the vendor's register names from <avr/io.h>
  it.each([...folderOf("atmega328p"), ...folderOf("attiny85")])("%s builds with avr-gcc", (folder) => {
    const mcu = folder.replace(/-\d+$/, "");
    const b = buildAvr(files, folder, mcu);
    expect(readFileSync(b.elf).length).toBeGreaterThan(0);
  });

  // STM32G031: the bundle's own Makefile (firmware.md build contract) makes build/firmware.elf, .hex and .bin;
  // two builds give the same bytes. Intel HEX records: Intel Hexadecimal Object File Format Specification.
  it.each(folderOf("stm32g031"))(
    "%s builds with make into build/ and twice gives the same bytes",
    (folder) => {
      const a = buildStm32(files, folder);
      const b = buildStm32(files, folder);
      for (const k of ["elf", "bin", "hex"] as const) {
        expect(readFileSync(a[k]).length).toBeGreaterThan(64);
        expect(readFileSync(a[k]).equals(readFileSync(b[k]))).toBe(true);
      }
      const hex = readFileSync(a.hex, "utf8");
      expect(hex).toMatch(/^:020000040800F2/); // extended linear address 0x0800: flash at 0x08000000
      expect(hex.trimEnd().endsWith(":00000001FF")).toBe(true);
    },
  );

  // arm-none-eabi-gcc (Debian gcc-arm-none-eabi), freestanding -nostdlib link with the bundle's own start-up and linker script
  it.each([...folderOf("stm32g031")])("%s builds and links with arm-none-eabi-gcc", (folder) => {
    const { size } = buildArm(files, folder);
    const text = Number(/\n\s*(\d+)/.exec(size)?.[1]);
    expect(text).toBeGreaterThan(64); // more than the vector table: main and the init code were linked
  });

  // RP2040: the bundle's own Makefile (firmware.md build contract) with arm-none-eabi-gcc and python3;
  // the image must carry stage 2 (256 bytes), the vector table (192) and main's code beyond them.
  it.each([...folderOf("rp2040")])("%s builds with make into build/firmware.elf, .hex and .uf2", (folder) => {
    const imgs = buildRp2040(files, folder);
    const flash = elfFlashContent(imgs.elf);
    expect(flash.base).toBe(0x10000000);
    expect(flash.bytes.length).toBeGreaterThan(256 + 192 + 64);
    expect(imgs.hex.startsWith(":")).toBe(true);
    expect(imgs.uf2.length % 512).toBe(0);
  });

  // clang --target=msp430 -Werror with msp430mcu's msp430g2553.h (register names as in SLAU144/SLAS735), ld.lld, llvm-objcopy
  it.each(folderOf("msp430g2553"))(
    "%s builds with clang + lld into build/firmware.elf and .hex",
    (folder) => {
      const b = buildMsp430(files, folder);
      expect(b.make.stderr).toBe("");
      expect(b.make.status).toBe(0);
      expect(readFileSync(b.hex, "utf8")).toMatch(/^:10C00000/); // first record at the start of flash, 0xC000 (SLAS735 memory map)
    },
  );

  it("a register the MSP430G2553 header lacks fails the clang build", () => {
    // Timer0_A3 has TACCR0..TACCR2 only (SLAS735), so msp430g2553.h declares no TA0CCR3
    const b = buildMsp430(files, "msp430g2553", {
      file: "src/main.c",
      from: "\n  TA0CCR1 =",
      to: "\n  TA0CCR3 =",
    });
    expect(b.make.status).not.toBe(0);
    expect(b.make.stderr).toContain("TA0CCR3");
  });

  // gpasm (Debian gputils) with the bundle's own Makefile: the PIC image is assembled from src/main.asm
  it.each(folderOf("pic12f1840"))("%s assembles into build/firmware.hex with gpasm", (folder) => {
    const dir = buildPic(files, folder);
    expect(readFileSync(path.join(dir, "build/firmware.hex"), "utf8")).toMatch(/^:[0-9A-F]+\r?\n/);
  });

  // host gcc -fsyntax-only -std=c11 against stubs naming the datasheet's registers (PIC12F1840 DS40001441)
  it.each([...folderOf("pic12f1840")])("%s passes the syntax check against the device stub", (folder) => {
    const r = syntaxCheckFolder(files, folder);
    expect(r.stderr).toBe("");
    expect(r.status).toBe(0);
  });

  it.each([
    ["pic12f1840", "\n  PR2 =", "\n  PR3 ="], // Timer2 period register; the PIC12F1840 has no Timer3
  ])("a register the %s datasheet lacks fails the check", (folder, good, bad) => {
    const dir = writeFolder(files, folder);
    const main = path.join(dir, "src/main.c");
    const text = readFileSync(main, "utf8");
    expect(text).toContain(good);
    writeFileSync(main, text.replace(good, bad));
    const r = hostSyntaxCheck(dir);
    expect(r.status).not.toBe(0);
    expect(r.stderr).toContain(bad.replace(" =", "").trim());
  });
});
