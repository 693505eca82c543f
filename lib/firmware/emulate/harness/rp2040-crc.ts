// The RP2040 boot ROM's check of boot stage 2 (RP2040 datasheet, bootrom, boot
// stage 2): CRC-32 with polynomial 0x04C11DB7, initial 0xFFFFFFFF, no
// reflection, no final XOR, over the first 252 bytes of flash.

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
