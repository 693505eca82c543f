// The RP2040 image files the bundle's Makefile makes, read back with the
// tests' own readers (./rp2040-image-readers.ts), which share no code with
// the bundle's rp2040_image.py.
// Sources: RP2040 datasheet, bootrom / boot stage 2 (256-byte block at the
// start of flash, CRC-32 over its first 252 bytes stored in the last 4,
// polynomial 0x04C11DB7, initial 0xFFFFFFFF, no reflection, no final XOR;
// vector table after it at 0x10000100) and the open UF2 specification
// (512-byte blocks, start magics 0x0A324655 and 0x9E5D5157, end magic
// 0x0AB16F30, flag 0x00002000 = family id present; RP2040 family id
// 0xe48bff56 as firmware.md states).
import { createHash } from "node:crypto";
import { describe, expect, it } from "vitest";
import { buildBundleSources, type BundleFile } from "@/lib/bundle";
import { spec } from "@/tests/unit/bundle/fixtures";
import { buildRp2040 } from "./rp2040-build";
import { elfFlashContent, hexContent, parseUf2, romCrc32, uf2Content } from "./rp2040-image-readers";

const REQ = { device: "rp2040", clockHz: 125e6, periodS: 0.02, highS: 0.0015 } as const;
const files = buildBundleSources(spec([REQ])) as BundleFile[];
const imgs = buildRp2040(files, "rp2040");
const flash = elfFlashContent(imgs.elf);
const u32 = (b: Uint8Array, o: number) =>
  new DataView(b.buffer, b.byteOffset, b.byteLength).getUint32(o, true);

describe("RP2040 boot stage 2 block", () => {
  it("the test's CRC is CRC-32/MPEG-2: check value 0x0376E6E7 for the ASCII digits 123456789 (catalogue of parametrised CRC algorithms, from memory)", () => {
    expect(romCrc32(new TextEncoder().encode("123456789"))).toBe(0x0376e6e7);
  });

  it("starts the flash at 0x10000000 and ends with the CRC-32 the ROM checks", () => {
    expect(flash.base).toBe(0x10000000);
    expect(u32(flash.bytes, 252)).toBe(romCrc32(flash.bytes.subarray(0, 252)));
  });

  it("is followed by the vector table at 0x10000100: SP = top of SRAM, reset vector a Thumb address in flash", () => {
    expect(u32(flash.bytes, 0x100)).toBe(0x20042000); // 264 KiB SRAM from 0x20000000 (RP2040 datasheet, address map)
    const reset = u32(flash.bytes, 0x104);
    expect(reset & 1).toBe(1); // Armv6-M: vector entries have bit 0 set (Thumb)
    expect(reset).toBeGreaterThan(0x10000100);
    expect(reset).toBeLessThan(0x10000000 + flash.bytes.length);
  });

  it("a planted one-bit error in the block no longer matches (the check can fail)", () => {
    const bad = new Uint8Array(flash.bytes.subarray(0, 256));
    bad[100] ^= 0x04;
    expect(u32(bad, 252)).not.toBe(romCrc32(bad.subarray(0, 252)));
  });
});

describe("RP2040 image files agree", () => {
  it("firmware.hex holds exactly the ELF's flash content", () => {
    const hex = hexContent(imgs.hex);
    expect(hex.base).toBe(flash.base);
    expect(Buffer.from(hex.bytes).equals(Buffer.from(flash.bytes))).toBe(true);
  });

  it("every UF2 block is well formed, numbered and addressed from 0x10000000 in 256-byte steps", () => {
    const blocks = parseUf2(imgs.uf2);
    expect(blocks.length).toBe(Math.ceil(flash.bytes.length / 256));
    blocks.forEach((b, n) => {
      expect(b.flags).toBe(0x00002000);
      expect(b.familyId).toBe(0xe48bff56);
      expect(b.payloadSize).toBe(256);
      expect(b.targetAddr).toBe(0x10000000 + 256 * n);
      expect(b.blockNo).toBe(n);
      expect(b.numBlocks).toBe(blocks.length);
    });
  });

  it("the UF2 blocks reassemble the ELF's flash content exactly (zero fill only past its end in the last block)", () => {
    const u = uf2Content(parseUf2(imgs.uf2));
    expect(u.base).toBe(flash.base);
    expect(Buffer.from(u.bytes.subarray(0, flash.bytes.length)).equals(Buffer.from(flash.bytes))).toBe(true);
    expect(u.bytes.length - flash.bytes.length).toBeLessThan(256);
    expect(u.bytes.subarray(flash.bytes.length).every((b) => b === 0)).toBe(true);
  });

  it("the UF2 reader refuses a block with a damaged magic (planted fault)", () => {
    const bad = new Uint8Array(imgs.uf2);
    bad[512 + 508] ^= 0xff; // end magic of block 1
    expect(() => parseUf2(bad)).toThrow(/block 1: end magic/);
  });

  it("two builds of the same bundle give byte-identical images (firmware.md)", () => {
    const again = buildRp2040(buildBundleSources(spec([REQ])) as BundleFile[], "rp2040");
    const sha = (b: Uint8Array | string) => createHash("sha256").update(b).digest("hex");
    expect(sha(again.elf)).toBe(sha(imgs.elf));
    expect(sha(again.hex)).toBe(sha(imgs.hex));
    expect(sha(again.uf2)).toBe(sha(imgs.uf2));
  });
});

describe("RP2040 build refuses a stage 2 that cannot be sealed", () => {
  it("stage 2 over 252 bytes stops make with a message naming the limit", () => {
    expect(() =>
      buildRp2040(files, "rp2040", [
        { file: "src/boot2.S", from: "    .ltorg", to: "    .ltorg\n    .space 200" },
      ]),
    ).toThrow(/at most 252 fit before the CRC/);
  });
});
