// STM32G031 clock tree: how SYSCLK reaches a requested frequency from a
// clock option. One solver for the engine (which refuses what it cannot
// reach) and the bundle (which writes exactly these fields), so the plan and
// the firmware cannot disagree.
// References: RM0444 reference manual, RCC chapter (RCC_CR HSIDIV, HSEON,
// HSEBYP; RCC_PLLCFGR PLLM/PLLN/PLLR with the VCO input 2.66-16 MHz, VCO
// output 64-344 MHz (from memory) and PLLRCLK at most 64 MHz; RCC_CFGR SW),
// FLASH chapter (FLASH_ACR LATENCY: 0 wait states to 24 MHz, 1 to 48 MHz,
// 2 to 64 MHz in voltage range 1, the reset range).

export const HSI16_HZ = 16e6;
/** HSE bypass: external clock into PC14-OSC_IN, 1 to 48 MHz (STM32G031 datasheet, HSE user clock; from memory). */
export const EXT_CLOCK_MIN_HZ = 1e6;
export const EXT_CLOCK_MAX_HZ = 48e6;

export type Stm32ClockPath =
  /** SYSCLK = HSISYS = HSI16 / 2^HSIDIV */
  | { kind: "hsisys"; hsidiv: number }
  /** SYSCLK = PLLRCLK = HSI16 / M * N / R */
  | { kind: "pll"; pllM: number; pllN: number; pllR: number; vcoHz: number }
  /** SYSCLK = HSE in bypass mode (external clock on PC14-OSC_IN) */
  | { kind: "hse-bypass" };

export type Stm32ClockTree = Stm32ClockPath & {
  source: string;
  sysclkHz: number;
  /** Frequency of the source before any divider or PLL. */
  inputHz: number;
  /** FLASH_ACR LATENCY wait states for this SYSCLK. */
  flashLatency: 0 | 1 | 2;
};

export function flashLatency(sysclkHz: number): 0 | 1 | 2 {
  return sysclkHz <= 24e6 ? 0 : sysclkHz <= 48e6 ? 1 : 2;
}

/** Every legal PLL setting from HSI16 whose output is a whole number of Hz, in search order. */
function pllSettings(): { m: number; n: number; r: number; vco: number; out: number }[] {
  const out: { m: number; n: number; r: number; vco: number; out: number }[] = [];
  for (let m = 1; m <= 8; m++) {
    const fin = HSI16_HZ / m;
    if (fin < 2.66e6 || fin > 16e6) continue;
    for (let n = 8; n <= 86; n++) {
      const vco = fin * n;
      if (vco < 64e6 || vco > 344e6) continue;
      for (let r = 2; r <= 8; r++) {
        const f = vco / r;
        if (f <= 64e6 && Number.isInteger(f)) out.push({ m, n, r, vco, out: f });
      }
    }
  }
  return out;
}

const PLL = pllSettings();

/** SYSCLK frequencies HSI16 can make, directly (HSIDIV) or through the PLL, ascending. */
export const HSI16_FREQUENCIES_HZ: readonly number[] = [
  ...new Set([...[0, 1, 2, 3, 4, 5, 6, 7].map((k) => HSI16_HZ / 2 ** k), ...PLL.map((p) => p.out)]),
].sort((a, b) => a - b);

/**
 * The clock tree for `clockHz` from clock option `source`, or null when the
 * part cannot make it. HSIDIV is preferred over the PLL (fewer parts running).
 */
export function stm32ClockTree(source: string, clockHz: number): Stm32ClockTree | null {
  const latency = flashLatency(clockHz);
  if (source === "hsi16") {
    for (let k = 0; k <= 7; k++) {
      if (HSI16_HZ / 2 ** k === clockHz)
        return {
          kind: "hsisys",
          hsidiv: k,
          source,
          sysclkHz: clockHz,
          inputHz: HSI16_HZ,
          flashLatency: latency,
        };
    }
    const p = PLL.find((s) => s.out === clockHz);
    if (p)
      return {
        kind: "pll",
        pllM: p.m,
        pllN: p.n,
        pllR: p.r,
        vcoHz: p.vco,
        source,
        sysclkHz: clockHz,
        inputHz: HSI16_HZ,
        flashLatency: latency,
      };
    return null;
  }
  if (source === "ext-clock") {
    if (clockHz >= EXT_CLOCK_MIN_HZ && clockHz <= EXT_CLOCK_MAX_HZ)
      return { kind: "hse-bypass", source, sysclkHz: clockHz, inputHz: clockHz, flashLatency: latency };
    return null;
  }
  return null;
}
