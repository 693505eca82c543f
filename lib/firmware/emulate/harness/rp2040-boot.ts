// Runs a built RP2040 flash image in rp2040js (npm package) from the
// state the boot ROM hands over, and records one GPIO's edges.
//
// rp2040js has no boot ROM image here, so the harness does the ROM's part
// itself, as the RP2040 datasheet (bootrom, boot sequence and boot stage 2)
// describes it: check the CRC-32 of the first 252 bytes of flash against the
// word at 252 and refuse to run on a mismatch (the real chip drops to USB
// boot); copy the 256 bytes to SRAM at 0x20041f00; enter there in Thumb
// state with SP = 0x20042000, VTOR still 0 (the ROM's vectors).
//
// rp2040js 1.4.1 lets every block run out of reset. The ROM leaves all
// blocks but IO_QSPI and PADS_QSPI in reset (RP2040 datasheet, RESETS), and
// a block held in reset ignores writes, so the harness models RESETS: RESET
// starts with those bits set, RESET_DONE reads as its complement, and writes
// to IO_BANK0, PADS_BANK0, PLL_SYS and PWM are dropped while their bit is set.
// A missing release therefore shows as a pin that never moves.
import { GPIOPinState, RP2040 } from "rp2040js";
import { romCrc32 } from "./rp2040-crc";

/** RESETS bit numbers (RP2040 datasheet, RESETS register list). */
export const RESET_BITS = {
  IO_BANK0: 5,
  IO_QSPI: 6,
  PADS_BANK0: 8,
  PADS_QSPI: 9,
  PLL_SYS: 12,
  PWM: 14,
} as const;
const ALL_BLOCKS = 0x1ffffff; // 25 blocks, bits 0..24
const ROM_LEAVES_IN_RESET = ALL_BLOCKS & ~((1 << RESET_BITS.IO_QSPI) | (1 << RESET_BITS.PADS_QSPI));

/** Peripheral page (address >>> 14 << 2, as rp2040js indexes them) -> RESETS bit. */
const GATED: Record<number, number> = {
  0x40014: RESET_BITS.IO_BANK0,
  0x4001c: RESET_BITS.PADS_BANK0,
  0x40028: RESET_BITS.PLL_SYS,
  0x40050: RESET_BITS.PWM,
};

export class BootRefused extends Error {}

export interface Edge {
  /** simulated time in ns since the hand-over */
  ns: number;
  high: boolean;
}

export interface RunOutcome {
  rp: RP2040;
  edges: Edge[];
  /** clk_sys at the end of the run (rp2040js derives it from XOSC, PLL_SYS and CLOCKS) */
  clkSysHz: number;
  /** writes dropped because the block was still in reset, by peripheral page */
  droppedWrites: Record<string, number>;
  instructions: number;
  /** true when maxWallMs ended the run */
  timedOut: boolean;
}

interface PeripheralLike {
  readUint32(offset: number): number;
  writeUint32(offset: number, value: number): void;
}

function modelResets(rp: RP2040, dropped: Record<string, number>): void {
  const resets = rp.peripherals[0x4000c] as unknown as PeripheralLike & { reset: number };
  resets.reset = ROM_LEAVES_IN_RESET;
  const read = resets.readUint32.bind(resets);
  resets.readUint32 = (offset: number) => (offset === 0x8 ? ~resets.reset & ALL_BLOCKS : read(offset));
  for (const [page, bit] of Object.entries(GATED)) {
    const p = rp.peripherals[Number(page)] as unknown as PeripheralLike;
    const write = p.writeUint32.bind(p);
    p.writeUint32 = (offset: number, value: number) => {
      if (resets.reset & (1 << bit)) {
        const key = `0x${Number(page).toString(16)}`;
        dropped[key] = (dropped[key] ?? 0) + 1;
        return;
      }
      write(offset, value);
    };
  }
}

/**
 * Boots the image as the ROM would and runs until `edgesWanted` edges on
 * `gpio` were seen or `maxNs` of simulated time passed.
 * Throws BootRefused where the ROM would not run stage 2.
 */
export function bootAndRun(
  flash: Uint8Array,
  opts: {
    gpio: number;
    edgesWanted: number;
    maxNs: number;
    maxInstructions?: number;
    /** wall-clock cap in ms (the product's budget); the run stops and says timedOut */
    maxWallMs?: number;
    /** called before the first instruction (e.g. to set ADC input values) */
    setup?: (rp: RP2040) => void;
  },
): RunOutcome {
  if (flash.length < 256) throw new BootRefused("flash image shorter than the 256-byte stage-2 block");
  const stored = new DataView(flash.buffer, flash.byteOffset, 256).getUint32(252, true);
  const computed = romCrc32(flash.subarray(0, 252));
  if (stored !== computed)
    throw new BootRefused(
      `stage-2 CRC mismatch: stored 0x${stored.toString(16)}, computed 0x${computed.toString(16)}; the ROM would not run it`,
    );
  const rp = new RP2040();
  rp.logger = { debug() {}, info() {}, warn() {}, error() {} } as unknown as RP2040["logger"];
  rp.flash.set(flash);
  rp.sram.set(flash.subarray(0, 256), 0x41f00);
  const dropped: Record<string, number> = {};
  modelResets(rp, dropped);
  rp.core.SP = 0x20042000;
  rp.core.PC = 0x20041f00;
  opts.setup?.(rp);

  const edges: Edge[] = [];
  rp.gpio[opts.gpio].addListener((state) => {
    const high = state === GPIOPinState.High; // an undriven (input) pin counts as low
    if (edges.length === 0 || edges[edges.length - 1].high !== high) edges.push({ ns: clock.nanos, high });
  });
  const clock = rp.clock as unknown as { nanos: number; tick(ns: number): void; nanosToNextAlarm: number };
  const maxInstructions = opts.maxInstructions ?? 50_000_000;
  let instructions = 0;
  const deadline = opts.maxWallMs === undefined ? Infinity : Date.now() + opts.maxWallMs;
  let timedOut = false;
  while (edges.length < opts.edgesWanted && clock.nanos < opts.maxNs && instructions < maxInstructions) {
    if ((instructions & 0xffff) === 0 && Date.now() > deadline) {
      timedOut = true;
      break;
    }
    if (rp.core.waiting) {
      const dt = clock.nanosToNextAlarm;
      if (dt <= 0) break; // asleep with nothing scheduled: nothing more will happen
      clock.tick(dt);
      rp.core.executeInstruction(); // takes the pending interrupt, if any
    } else {
      const cycles = rp.core.executeInstruction();
      clock.tick((cycles * 1e9) / rp.clkSys);
    }
    instructions++;
  }
  return { rp, edges, clkSysHz: rp.clkSys, droppedWrites: dropped, instructions, timedOut };
}

export interface Measured {
  periodsNs: number[];
  highsNs: number[];
}

/** Rising-to-rising periods and rising-to-falling high times, skipping the first `skip` full periods. */
export function measure(edges: Edge[], skip = 1): Measured {
  const rises = edges.filter((e) => e.high).map((e) => e.ns);
  const periodsNs: number[] = [];
  const highsNs: number[] = [];
  for (let i = skip; i + 1 < rises.length; i++) {
    periodsNs.push(rises[i + 1] - rises[i]);
    const fall = edges.find((e) => !e.high && e.ns > rises[i]);
    if (fall && fall.ns < rises[i + 1]) highsNs.push(fall.ns - rises[i]);
  }
  return { periodsNs, highsNs };
}
