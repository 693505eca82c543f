// Every device's generated code, for hardware and interrupt (software
// divider) plans, goes through the device's real toolchain or, where none is
// free, a host syntax check against the datasheet-named stubs.
import { readFileSync, writeFileSync } from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { buildBundleFiles } from "@/lib/bundle";
import { buildAvr } from "@/tests/tools/avr";
import { buildArm, hostSyntaxCheck, syntaxCheckFolder } from "@/tests/tools/c-check";
import { writeFolder } from "@/tests/tools/files";
import { buildPic } from "@/tests/tools/gpsim";
import { FOLDERS, TARGETS, spec } from "./fixtures";

const files = buildBundleFiles(spec());
const folderOf = (device: string) => FOLDERS.filter((f, i) => TARGETS[i].device === device && f.length > 0);

describe("generated C builds with the device toolchains", () => {
  // avr-gcc + avr-libc (Debian gcc-avr, avr-libc): -Werror, the vendor's register names from <avr/io.h>
  it.each([...folderOf("atmega328p"), ...folderOf("attiny85")])("%s builds with avr-gcc", (folder) => {
    const mcu = folder.replace(/-\d+$/, "");
    const b = buildAvr(files, folder, mcu);
    expect(readFileSync(b.elf).length).toBeGreaterThan(0);
  });

  // arm-none-eabi-gcc (Debian gcc-arm-none-eabi), freestanding -nostdlib link with the bundle's own start-up and linker script
  it.each([...folderOf("stm32g031"), ...folderOf("rp2040")])(
    "%s builds and links with arm-none-eabi-gcc",
    (folder) => {
      const { size } = buildArm(files, folder);
      const text = Number(/\n\s*(\d+)/.exec(size)?.[1]);
      expect(text).toBeGreaterThan(64); // more than the vector table: main and the init code were linked
    },
  );

  // gpasm (Debian gputils) with the bundle's own Makefile: the PIC image is assembled from src/main.asm
  it.each(folderOf("pic12f1840"))("%s assembles into build/firmware.hex with gpasm", (folder) => {
    const dir = buildPic(files, folder);
    expect(readFileSync(path.join(dir, "build/firmware.hex"), "utf8")).toMatch(/^:[0-9A-F]+\r?\n/);
  });

  // host gcc -fsyntax-only -std=c11 against stubs naming the datasheet's registers (PIC12F1840 DS40001441, SLAU144/SLAS735)
  it.each([...folderOf("pic12f1840"), ...folderOf("msp430g2553")])(
    "%s passes the syntax check against the device stub",
    (folder) => {
      const r = syntaxCheckFolder(files, folder);
      expect(r.stderr).toBe("");
      expect(r.status).toBe(0);
    },
  );

  it.each([
    ["pic12f1840", "\n  PR2 =", "\n  PR3 ="], // Timer2 period register; the PIC12F1840 has no Timer3
    ["msp430g2553", "\n  TA0CCR1 =", "\n  TA0CCR3 ="], // Timer0_A3 has CCR0..CCR2 only
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
