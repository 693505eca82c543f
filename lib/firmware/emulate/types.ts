// What an emulator run of one built target image reports, and what the
// product stores per target in a revision. Every device wrapper
// (lib/firmware/emulate/<device>.ts) takes an EmulationInput and answers an
// EmulationResult; index.ts picks the wrapper by device id. A wrapper never
// fakes a result: a missing tool or a plan kind it cannot drive answers
// "not-emulated" with a plain reason.
import type { BundleFile } from "@/lib/bundle/types";
import type { InputEdge } from "@/lib/engine/plan-types";

/** Triggered and zero-cross plans: the input the emulator drives and the pulse it must see. */
export interface TriggerDrive {
  /** Input pin as the datasheet names it, e.g. "PD2". */
  input: string;
  edge: InputEdge;
  /** Planned delay from the input edge to the pulse (the plan's counted delay), seconds. */
  delayS: number;
  /** Planned pulse width, seconds. */
  widthS: number;
  /** Stated worst-case input edge to timer start (interrupt response + handler), seconds. */
  latencyS: number;
  /** One timer count, seconds (the prescaler's phase). */
  countS: number;
  /** The pulse is the pin going low. */
  activeLow: boolean;
}

export type EmulationVerdict = "agrees" | "differs" | "not-emulated";

export interface EmulationInput {
  /** Device id as in the engine's device table, e.g. "atmega328p". */
  device: string;
  /** Bundle folder of the target, e.g. "atmega328p" or "attiny85-2". */
  folder: string;
  /** Every file of the target folder, images under <folder>/firmware/ included. */
  files: BundleFile[];
  /** The planned output the image must produce, in seconds. */
  planned: {
    periodS: number;
    highS: number;
    /** Output pin as the datasheet names it, e.g. "PB1" or "GP15". */
    pin: string;
  };
  /** Plan kind as the bundle names it ("periodic", "triggered", "zero-cross", ...). */
  kind: string;
  /** Acceptance half-width for period and high time, in seconds (e.g. one timer count plus latency). */
  toleranceS: { period: number; high: number };
  /** The plan's CPU clock, for emulators that count cycles (simavr); a wrapper that needs it and gets none answers not-emulated. */
  clockHz?: number;
  /** Wall-clock cap for the emulator run. */
  timeoutMs?: number;
  /** Kinds "triggered" and "zero-cross" only: the input to drive. */
  trigger?: TriggerDrive;
}

export interface EmulationResult {
  verdict: EmulationVerdict;
  /** Plain sentence for people: what agreed, what differed by how much, or why nothing ran. */
  reason: string;
  /** Emulator and version as it printed itself, e.g. "simavr 1.6". */
  tool?: string;
  /** Measured from the pin's edges (absent when nothing ran). */
  periodS?: number;
  highS?: number;
  /** The pin's first edges: time from reset in seconds and the level after the edge. */
  edges?: { t: number; level: 0 | 1 }[];
  /** Emulated time covered, in seconds. */
  emulatedS?: number;
  /** Triggered and zero-cross runs: mean measured delay from the input edge and pulse width (highS repeats the width). */
  delayS?: number;
  widthS?: number;
  /** Triggered and zero-cross runs: the input as driven (its first changes) and the time between selected edges. */
  trigger?: {
    input: string;
    edge: InputEdge;
    spacingS: number;
    inputEdges: { t: number; level: 0 | 1 }[];
  };
}

export type DeviceEmulator = (input: EmulationInput) => Promise<EmulationResult>;
