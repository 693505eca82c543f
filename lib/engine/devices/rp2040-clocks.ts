// RP2040 system clock sources the generated code really sets up.
// Reference: RP2040 datasheet (Raspberry Pi Ltd), XOSC section (1..15 MHz
// crystal, STARTUP delay in units of 256 crystal periods), PLL section
// (f_out = FREF / REFDIV * FBDIV / (POSTDIV1 * POSTDIV2); FREF / REFDIV at
// least 5 MHz, FBDIV 16..320, VCO 750..1600 MHz, POSTDIV1 and POSTDIV2 1..7)
// and the 133 MHz top clk_sys (electrical characteristics).
//
// Offered: the 12 MHz crystal direct, and PLL_SYS from that crystal at the
// frequencies it makes exactly (REFDIV 1). Not offered: the ring oscillator.
// Its frequency depends on process, voltage and temperature and is not
// stated tightly enough to plan a period from a typed clockHz (the boot ROM
// leaves the chip on it at a few MHz); a plan on it would promise a period
// the board does not make.

/** Crystal on the usual RP2040 boards (Raspberry Pi Pico and most others: 12 MHz). */
export const RP2040_XOSC_HZ = 12_000_000;
/** Top clk_sys (RP2040 datasheet, electrical characteristics). */
export const RP2040_MAX_SYS_HZ = 133_000_000;

/** PLL limits from the datasheet's PLL section. */
export const RP2040_PLL = {
  refMinHz: 5_000_000,
  fbdivMin: 16,
  fbdivMax: 320,
  vcoMinHz: 750_000_000,
  vcoMaxHz: 1_600_000_000,
  postdivMax: 7,
} as const;

export interface PllSetting {
  refdiv: number;
  fbdiv: number;
  postdiv1: number;
  postdiv2: number;
  vcoHz: number;
}

/**
 * Every (FBDIV, POSTDIV1 >= POSTDIV2) with REFDIV 1 that gives an integer
 * output frequency in Hz up to the top clk_sys, in a fixed order: frequency
 * ascending, then the highest VCO first (lower output jitter; common
 * practice, no source), then the larger POSTDIV1.
 */
function enumerate(): PllSetting[] {
  const out: PllSetting[] = [];
  const refdiv = 1;
  const fref = RP2040_XOSC_HZ / refdiv;
  for (let fbdiv = RP2040_PLL.fbdivMin; fbdiv <= RP2040_PLL.fbdivMax; fbdiv++) {
    const vcoHz = fref * fbdiv;
    if (vcoHz < RP2040_PLL.vcoMinHz || vcoHz > RP2040_PLL.vcoMaxHz) continue;
    for (let postdiv1 = 1; postdiv1 <= RP2040_PLL.postdivMax; postdiv1++)
      for (let postdiv2 = 1; postdiv2 <= postdiv1; postdiv2++) {
        const p = postdiv1 * postdiv2;
        if (vcoHz % p !== 0 || vcoHz / p > RP2040_MAX_SYS_HZ) continue;
        out.push({ refdiv, fbdiv, postdiv1, postdiv2, vcoHz });
      }
  }
  const hz = (s: PllSetting) => s.vcoHz / (s.postdiv1 * s.postdiv2);
  return out.sort((a, b) => hz(a) - hz(b) || b.vcoHz - a.vcoHz || b.postdiv1 - a.postdiv1);
}

const SETTINGS = enumerate();
const BY_HZ = new Map<number, PllSetting>();
for (const s of SETTINGS) {
  const hz = s.vcoHz / (s.postdiv1 * s.postdiv2);
  if (!BY_HZ.has(hz)) BY_HZ.set(hz, s);
}

/** clk_sys frequencies PLL_SYS makes exactly from the 12 MHz crystal, ascending. */
export const RP2040_PLL_FREQUENCIES_HZ: readonly number[] = [...BY_HZ.keys()];

/** The PLL_SYS setting for hz, or undefined where the PLL cannot make it exactly. */
export function rp2040PllSetting(hz: number): PllSetting | undefined {
  const s = BY_HZ.get(hz);
  return s ? { ...s } : undefined;
}

/**
 * XOSC STARTUP DELAY for a crystal: 1 ms in units of 256 crystal periods,
 * rounded up (the datasheet's worked example gives 47 for 12 MHz), times 64
 * as margin for slow-starting crystals on custom boards (common practice, no
 * source). Fits the 14-bit DELAY field for every 1..15 MHz crystal.
 */
export function rp2040XoscStartupDelay(crystalHz: number): number {
  return Math.ceil(crystalHz / 1000 / 256) * 64;
}
