// Ready-to-flash images in the bundle (firmware.md, build contract): every
// target's own Makefile builds them, README lists each with its sha256 and
// the toolchain versions, two builds give identical bytes, rebuilding the
// shipped folder with `make` gives the shipped bytes, and a build that fails
// names the device and the compiler's first message.
// Reference tools: avr-gcc / avr-objcopy (Debian gcc-avr, binutils-avr), GNU make.
import { execFileSync } from "node:child_process";
import { readFileSync } from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";
import {
  buildBundleFiles,
  buildBundleSources,
  FirmwareBuildError,
  sha256Hex,
  textOf,
  zipBundle,
  type BundleFile,
} from "@/lib/bundle";
import { buildTargetImages, firstErrorLine } from "@/lib/firmware/build-images";
import { writeFolder } from "@/tests/tools/files";
import { requireTool } from "@/tests/tools/require-tool";
import { spec } from "./fixtures";

const AVR_SPEC = spec([
  { device: "atmega328p", clockHz: 16e6, periodS: 0.02, highS: 0.0015, mode: "pwm" },
  { device: "attiny85", clockHz: 8e6, periodS: 2e-3, highS: 0.5e-3, mode: "isr", timer: "TIMER0" },
]);

const images = (files: BundleFile[]) => files.filter((f) => f.path.includes("/firmware/"));

describe("bundle images", () => {
  requireTool("avr-gcc", "gcc-avr avr-libc binutils-avr");

  it("two full builds give the same image bytes and the same zip sha256", async () => {
    const a = await buildBundleFiles(AVR_SPEC);
    const b = await buildBundleFiles(AVR_SPEC);
    expect(images(a).map((f) => f.path)).toEqual([
      "atmega328p/firmware/firmware.elf",
      "atmega328p/firmware/firmware.hex",
      "attiny85/firmware/firmware.elf",
      "attiny85/firmware/firmware.hex",
    ]);
    expect(images(b).map((f) => sha256Hex(f.content))).toEqual(images(a).map((f) => sha256Hex(f.content)));
    expect(sha256Hex(await zipBundle(b))).toBe(sha256Hex(await zipBundle(a)));
    for (const f of images(a)) expect(typeof f.content).not.toBe("string");
  });

  it("README lists every file's sha256 including the images, and the avr-gcc version that built them", async () => {
    const files = await buildBundleFiles(AVR_SPEC);
    const readme = textOf(files.find((f) => f.path === "README.md")!);
    for (const f of files.filter((x) => x.path !== "README.md"))
      expect(readme).toContain(`${sha256Hex(f.content)}  ${f.path}`);
    const version = execFileSync("avr-gcc", ["--version"], { encoding: "utf8" }).split("\n")[0].trim();
    expect(readme).toContain(`avr-gcc: ${version}`);
    // the hex starts with an Intel HEX data record (Intel HEX format specification, record type 00)
    const hex = files.find((f) => f.path === "atmega328p/firmware/firmware.hex")!;
    expect(Buffer.from(hex.content).toString("latin1")).toMatch(/^:[0-9A-F]{8}/);
    // and ends with the end-of-file record
    expect(Buffer.from(hex.content).toString("latin1").trimEnd().endsWith(":00000001FF")).toBe(true);
  });

  it("the checklist's first bench step names the image files and their sha256", async () => {
    const files = await buildBundleFiles(AVR_SPEC);
    const list = textOf(files.find((f) => f.path === "attiny85/CHECKLIST.md")!);
    const hex = files.find((f) => f.path === "attiny85/firmware/firmware.hex")!;
    const b1 = list.split("\n").find((l) => l.startsWith("| B1 "))!;
    expect(b1).toContain("SHA-256");
    expect(b1).toContain(`\`firmware/firmware.hex\`: \`${sha256Hex(hex.content)}\``);
  });

  it("make -C <folder> on the shipped sources rebuilds the shipped images byte for byte", async () => {
    const files = await buildBundleFiles({ ...AVR_SPEC, revision: 7 });
    for (const folder of ["atmega328p", "attiny85"]) {
      const dir = writeFolder(files, folder);
      execFileSync("make", ["-s", "-C", dir], { env: { ...process.env, LC_ALL: "C" } });
      for (const name of ["firmware.elf", "firmware.hex"]) {
        const made = readFileSync(path.join(dir, "build", name));
        const shipped = files.find((f) => f.path === `${folder}/firmware/${name}`)!;
        expect(sha256Hex(made), `${folder}/${name}`).toBe(sha256Hex(shipped.content));
      }
    }
  });

  it("a source that does not compile is a FirmwareBuildError naming the device and avr-gcc's first error", async () => {
    const files = buildBundleSources(spec([AVR_SPEC.targets[0]])).map((f) =>
      f.path === "atmega328p/src/main.c" ? { ...f, content: `${textOf(f)}\nint broken = ;\n` } : f,
    );
    const e = await buildTargetImages(files, "atmega328p", "atmega328p").catch((x: unknown) => x);
    expect(e).toBeInstanceOf(FirmwareBuildError);
    const err = e as FirmwareBuildError;
    expect(err.device).toBe("atmega328p");
    expect(err.message).toMatch(
      /^atmega328p \(atmega328p\): the image did not build: .*main\.c:\d+:\d+: error:/,
    );
  });

  it("a Makefile whose default target makes no firmware.hex fails clearly", async () => {
    const files: BundleFile[] = [
      { path: "dev/Makefile", content: "all:\n\t@mkdir -p build && echo made nothing > build/notes.txt\n" },
    ];
    await expect(buildTargetImages(files, "dev", "somechip")).rejects.toThrow(
      "somechip (dev): the image did not build: the build made no firmware.hex",
    );
  });

  it("firstErrorLine picks the compiler's error, not the make noise before it", () => {
    // GCC diagnostic format "file:line:col: error: text" (GCC manual, Diagnostic Message Formatting Options)
    const out =
      "make: Entering directory '/x'\nsrc/main.c:3:5: error: expected expression\nmake: *** [all] Error 1\n";
    expect(firstErrorLine(out)).toBe("src/main.c:3:5: error: expected expression");
  });

  it("firstErrorLine picks gpasm's error (stdout) over make's line (stderr, read first)", () => {
    // gpasm message format "file:line:Error[nnn] text" as gputils 1.5 prints it (seen in this build)
    const out =
      "make: *** [Makefile:12: build/firmware.hex] Error 1\n\nsrc/main.asm:19:Error[101]   ERROR: (TRIM_PERIOD_COUNTS lies outside)\n";
    expect(firstErrorLine(out)).toBe("src/main.asm:19:Error[101]   ERROR: (TRIM_PERIOD_COUNTS lies outside)");
  });

  it("buildBundleFiles refuses an unplannable target before any compiler runs", async () => {
    const bad = spec([{ device: "atmega328p", clockHz: 16e6, periodS: -1, highS: 0.001 }]);
    await expect(buildBundleFiles(bad)).rejects.toMatchObject({ field: "targets.0" });
  });
});
