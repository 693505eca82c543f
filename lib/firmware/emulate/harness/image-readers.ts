// Readers for built images from the published formats only (no code shared
// with the bundle's own rp2040_image.py): ELF32 program headers (System V ABI)
// and Intel HEX records (Intel, Hexadecimal Object File Format Specification
// rev. A). The RP2040 emulator wrapper loads flash with them; the image tests
// use them to check the bundle's images.

/** Contiguous memory image: start address and bytes. */
export interface MemImage {
  base: number;
  bytes: Uint8Array;
}

export function fromSegments(segments: { addr: number; data: Uint8Array }[]): MemImage {
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
