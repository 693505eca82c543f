// Independent readers for the RP2040 images, written for the tests from the
// published formats only (no code shared with the bundle's own
// rp2040_image.py): the ELF program headers (System V ABI, ELF32), Intel HEX
// records (Intel, Hexadecimal Object File Format Specification rev. A), UF2
// blocks (the open UF2 specification: 512-byte blocks, magic numbers, flags,
// family id) and the boot ROM's CRC-32 (RP2040 datasheet, bootrom, boot
// stage 2: polynomial 0x04C11DB7, initial 0xFFFFFFFF, no reflection, no final XOR).

/** Bitwise CRC-32, most significant bit first, no table: the check the RP2040 boot ROM makes. */
export function romCrc32(bytes: Uint8Array): number {
  let crc = 0xffffffff;
  for (const b of bytes) {
    crc = (crc ^ (b << 24)) >>> 0;
    for (let i = 0; i < 8; i++) {
      crc = crc & 0x80000000 ? ((crc << 1) ^ 0x04c11db7) >>> 0 : (crc << 1) >>> 0;
    }
  }
  return crc >>> 0;
}

/** Contiguous memory image: start address and bytes. */
export interface MemImage {
  base: number;
  bytes: Uint8Array;
}

function fromSegments(segments: { addr: number; data: Uint8Array }[]): MemImage {
  if (segments.length === 0) throw new Error("no loadable bytes");
  const base = Math.min(...segments.map((s) => s.addr));
  const end = Math.max(...segments.map((s) => s.addr + s.data.length));
  const bytes = new Uint8Array(end - base).fill(0xff);
  for (const s of segments) bytes.set(s.data, s.addr - base);
  return { base, bytes };
}

/** Loadable flash content of an ELF32 little-endian file: PT_LOAD segments by physical (load) address. */
export function elfFlashContent(elf: Uint8Array, flashBase = 0x10000000, flashEnd = 0x11000000): MemImage {
  const v = new DataView(elf.buffer, elf.byteOffset, elf.byteLength);
  if (v.getUint32(0, false) !== 0x7f454c46) throw new Error("not an ELF file");
  if (elf[4] !== 1 || elf[5] !== 1) throw new Error("not ELF32 little-endian");
  const phoff = v.getUint32(28, true);
  const phentsize = v.getUint16(42, true);
  const phnum = v.getUint16(44, true);
  const segments: { addr: number; data: Uint8Array }[] = [];
  for (let i = 0; i < phnum; i++) {
    const o = phoff + i * phentsize;
    const type = v.getUint32(o, true);
    const offset = v.getUint32(o + 4, true);
    const paddr = v.getUint32(o + 12, true);
    const filesz = v.getUint32(o + 16, true);
    if (type !== 1 || filesz === 0) continue; // PT_LOAD with file bytes
    if (paddr < flashBase || paddr >= flashEnd) continue;
    segments.push({ addr: paddr, data: elf.subarray(offset, offset + filesz) });
  }
  return fromSegments(segments);
}

/** Intel HEX: data (00), end (01), extended linear address (04) and start address (05) records, checksums checked. */
export function hexContent(text: string): MemImage {
  const segments: { addr: number; data: Uint8Array }[] = [];
  let upper = 0;
  let ended = false;
  for (const [n, raw] of text.split(/\r?\n/).entries()) {
    const line = raw.trim();
    if (line === "") continue;
    if (ended) throw new Error(`hex line ${n + 1}: data after the end record`);
    if (!line.startsWith(":")) throw new Error(`hex line ${n + 1}: no start code`);
    const rec = Uint8Array.from(
      line
        .slice(1)
        .match(/../g)!
        .map((h) => parseInt(h, 16)),
    );
    const sum = rec.reduce((a, b) => (a + b) & 0xff, 0);
    if (sum !== 0) throw new Error(`hex line ${n + 1}: checksum`);
    const len = rec[0];
    const addr = (rec[1] << 8) | rec[2];
    const type = rec[3];
    const data = rec.subarray(4, 4 + len);
    if (type === 0) segments.push({ addr: (upper + addr) >>> 0, data });
    else if (type === 1) ended = true;
    else if (type === 4) upper = ((data[0] << 8) | data[1]) * 0x10000;
    else if (type !== 5) throw new Error(`hex line ${n + 1}: record type ${type}`);
  }
  if (!ended) throw new Error("hex: no end record");
  return fromSegments(segments);
}

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
