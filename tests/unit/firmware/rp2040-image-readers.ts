// Independent readers for the RP2040 images, written for the tests from the
// published formats only (no code shared with the bundle's own
// rp2040_image.py): the ELF program headers (System V ABI, ELF32), Intel HEX
// records (Intel, Hexadecimal Object File Format Specification rev. A), UF2
// blocks (the open UF2 specification: 512-byte blocks, magic numbers, flags,
// family id) and the boot ROM's CRC-32 (RP2040 datasheet, bootrom, boot
// stage 2: polynomial 0x04C11DB7, initial 0xFFFFFFFF, no reflection, no final XOR).

// The ROM check itself lives with the emulator harness (the product runs it too).
export { romCrc32 } from "@/lib/firmware/emulate/harness/rp2040-crc";
// The ELF and Intel HEX readers and the segment joiner live with the emulator
// harness, which loads images in the product as well.
import { fromSegments, type MemImage } from "@/lib/firmware/emulate/harness/image-readers";
export { elfFlashContent, hexContent, type MemImage } from "@/lib/firmware/emulate/harness/image-readers";

export interface Uf2Block {
  flags: number;
  targetAddr: number;
  payloadSize: number;
  blockNo: number;
  numBlocks: number;
  familyId: number;
  payload: Uint8Array;
}

/** Every 512-byte UF2 block, each checked on its own; throws naming the block and field that is wrong. */
export function parseUf2(file: Uint8Array): Uf2Block[] {
  if (file.length === 0 || file.length % 512 !== 0)
    throw new Error(`UF2 length ${file.length} is not a multiple of 512`);
  const v = new DataView(file.buffer, file.byteOffset, file.byteLength);
  const blocks: Uf2Block[] = [];
  for (let o = 0; o < file.length; o += 512) {
    const n = o / 512;
    const u = (k: number) => v.getUint32(o + k, true);
    if (u(0) !== 0x0a324655) throw new Error(`UF2 block ${n}: first start magic`);
    if (u(4) !== 0x9e5d5157) throw new Error(`UF2 block ${n}: second start magic`);
    if (u(508) !== 0x0ab16f30) throw new Error(`UF2 block ${n}: end magic`);
    const payloadSize = u(16);
    if (payloadSize > 476) throw new Error(`UF2 block ${n}: payload size ${payloadSize}`);
    blocks.push({
      flags: u(8),
      targetAddr: u(12),
      payloadSize,
      blockNo: u(20),
      numBlocks: u(24),
      familyId: u(28),
      payload: file.subarray(o + 32, o + 32 + payloadSize),
    });
  }
  return blocks;
}

/** Flash content written by a UF2 file (blocks in any order, no overlaps allowed). */
export function uf2Content(blocks: Uf2Block[]): MemImage {
  const seen = new Set<number>();
  for (const b of blocks) {
    if (seen.has(b.targetAddr)) throw new Error(`UF2: address 0x${b.targetAddr.toString(16)} written twice`);
    seen.add(b.targetAddr);
  }
  return fromSegments(blocks.map((b) => ({ addr: b.targetAddr, data: b.payload })));
}
