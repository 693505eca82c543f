// A threshold, UJT or PUT stage with `sync`: the static model (supplyV = the
// clamp voltage) gives the trip point, the load-line checks and the gate
// pulse (the discharge); the firing delay comes from the synchronised charge
// (./sync.ts). One firing counts per half cycle: a real firing card may fire
// again later in the same half cycle, but the thyristor is already on.
import type {
  MainsSync,
  PutStage,
  Stage,
  StageField,
  StageSync,
  ThresholdStage,
  UjtStage,
} from "../stage-types";
import { errorCheck, fmt, invalidStage, running, stopped, warningCheck, type ModelResult } from "./model";
import { modelOf } from "./index";
import { putInput } from "./put";
import { firingDelay, peakCapacitorV, syncFigures, timingRForDelay, type SyncCircuit } from "./sync";
import type { RelaxationInput } from "./threshold";
import { ujtInput } from "./ujt";

export type SyncableStage = ThresholdStage | UjtStage | PutStage;
export const SYNC_KINDS: readonly SyncableStage["kind"][] = ["threshold", "ujt", "put"];

/** Form fields of the sync block (names as in MainsSync, shown as sync.<name>). */
export const SYNC_FIELDS: readonly StageField[] = [
  { name: "mainsHz", label: "Mains frequency", unit: "Hz", optional: false, range: "positive" },
  { name: "mainsVrms", label: "Mains RMS voltage", unit: "V", optional: false, range: "positive" },
];

// Public mains are 50 or 60 Hz; 16.7 Hz railway and 400 Hz aircraft supplies
// are the outer ends anyone meets (common practice, no source).
const MAINS_HZ = { min: 10, max: 1000 };
const MAINS_VRMS_MAX = 1000;

export function isSyncable(stage: Stage): stage is SyncableStage {
  return (SYNC_KINDS as readonly string[]).includes(stage.kind);
}

export function syncOf(stage: Stage): MainsSync | undefined {
  return isSyncable(stage) ? stage.sync : undefined;
}

/** Throws EngineError("invalid-stage") naming sync.<field> for a malformed sync block. */
export function checkSync(stage: Record<string, unknown>): void {
  const s = stage.sync;
  if (s === undefined || s === null) return;
  if (!(SYNC_KINDS as readonly unknown[]).includes(stage.kind)) {
    throw invalidStage(
      "sync",
      `sync (mains synchronisation) applies to threshold, UJT and PUT stages, not ${String(stage.kind)}.`,
    );
  }
  if (typeof s !== "object" || Array.isArray(s))
    throw invalidStage("sync", "sync must be an object { mainsHz, mainsVrms }.");
  const o = s as Record<string, unknown>;
  for (const key of Object.keys(o)) {
    if (key !== "mainsHz" && key !== "mainsVrms")
      throw invalidStage(`sync.${key}`, `sync.${key} is not a sync field; use mainsHz and mainsVrms.`);
  }
  const hz = o.mainsHz;
  if (typeof hz !== "number" || !Number.isFinite(hz) || hz < MAINS_HZ.min || hz > MAINS_HZ.max)
    throw invalidStage(
      "sync.mainsHz",
      `sync.mainsHz (mains frequency) must be a number from ${MAINS_HZ.min} to ${MAINS_HZ.max} Hz, got ${String(hz)}.`,
    );
  const v = o.mainsVrms;
  if (typeof v !== "number" || !Number.isFinite(v) || v <= 0 || v > MAINS_VRMS_MAX)
    throw invalidStage(
      "sync.mainsVrms",
      `sync.mainsVrms (mains RMS voltage) must be above 0 and at most ${MAINS_VRMS_MAX} V, got ${String(v)}.`,
    );
}

function relaxationInputOf(stage: SyncableStage): RelaxationInput {
  if (stage.kind === "ujt") return ujtInput(stage);
  if (stage.kind === "put") return putInput(stage);
  return {
    supplyV: stage.supplyV,
    r: stage.timingR,
    c: stage.timingC,
    peakV: stage.peakV,
    valleyV: stage.valleyV,
    dischargeR: stage.dischargeR,
  };
}

export function syncCircuitOf(stage: SyncableStage & { sync: MainsSync }): SyncCircuit {
  const x = relaxationInputOf(stage);
  return { ...stage.sync, clampV: x.supplyV, r: x.r, c: x.c, peakV: x.peakV };
}

export interface SyncedResult {
  result: ModelResult;
  sync: StageSync | null;
}

/**
 * The timing of a synchronised stage: periodS = half cycle, highS = the gate
 * pulse (discharge time of the static model), lowS = the rest. A stage that
 * cannot fire within the half cycle returns no timing and an error check
 * saying why and what to change.
 */
export function evaluateSynced(stage: SyncableStage & { sync: MainsSync }): SyncedResult {
  const base = modelOf(stage).evaluate(stage);
  if (!base.oscillates) return { result: base, sync: null };
  const circuit = syncCircuitOf(stage);
  const half = 1 / (2 * circuit.mainsHz);
  const delay = firingDelay(circuit);
  if (delay === null) return { result: stopped([neverFires(circuit)]), sync: null };
  if (delay + base.highS >= half)
    return {
      result: stopped([
        errorCheck(
          "pulse-past-zero-crossing",
          `The stage fires ${fmt(delay, "s")} after the zero crossing and its gate pulse lasts ${fmt(base.highS, "s")}, past the end of the ${fmt(half, "s")} half cycle: the thyristor gets no full gate pulse. Make the timing resistor or capacitor smaller.`,
          "timingR",
        ),
      ]),
      sync: null,
    };
  return { result: running(base.highS, half - base.highS), sync: syncFigures(stage.sync, delay) };
}

function neverFires(x: SyncCircuit): ReturnType<typeof errorCheck> {
  const half = 1 / (2 * x.mainsHz);
  const most = peakCapacitorV(x);
  const amp = Math.SQRT2 * x.mainsVrms;
  if (Math.min(amp, x.clampV) <= x.peakV) {
    return errorCheck(
      "never-fires",
      `The supply reaches at most ${fmt(Math.min(amp, x.clampV), "V")} (clamp ${fmt(x.clampV, "V")}, mains peak ${fmt(amp, "V")}), not above the trip voltage ${fmt(x.peakV, "V")}: the stage never fires. Raise the clamp voltage or lower the trip point.`,
      "supplyV",
    );
  }
  // A resistor that fires at 90 % of the half cycle, as a concrete hint.
  const hint = timingRForDelay(x, 0.9 * half);
  return errorCheck(
    "never-fires",
    `In the ${fmt(half, "s")} half cycle the capacitor charges only to ${fmt(most, "V")}, below the trip voltage ${fmt(x.peakV, "V")}: the stage never fires and the load stays off. Make R x C smaller${hint ? ` (timing resistor below ${fmt(hint, "Ω")} with this capacitor)` : ""}.`,
    "timingR",
  );
}

/** Warnings about a synchronised stage that runs. */
export function syncWarnings(
  stage: SyncableStage & { sync: MainsSync },
  sync: StageSync,
): ReturnType<typeof warningCheck>[] {
  const out: ReturnType<typeof warningCheck>[] = [];
  const amp = Math.SQRT2 * stage.sync.mainsVrms;
  if (amp <= stage.supplyV)
    out.push(
      warningCheck(
        "clamp-not-reached",
        `The mains peak (${fmt(amp, "V")}) never reaches the clamp voltage (${fmt(stage.supplyV, "V")}): the stage runs on the bare rectified sine. Check the clamp voltage and the mains voltage.`,
        "supplyV",
      ),
    );
  if (sync.firingAngleDeg > 170)
    out.push(
      warningCheck(
        "late-firing",
        `Firing at ${sync.firingAngleDeg.toFixed(1)}° leaves little mains voltage to latch the thyristor: below its holding current it may not turn on at all.`,
        "timingR",
      ),
    );
  return out;
}

/**
 * The inverse: the timing resistor that makes a synchronised stage fire
 * `delayS` after the zero crossing, the other parts kept. null when no
 * resistor from 1 Ω to 1 GΩ does.
 */
export function suggestTimingR(stage: SyncableStage & { sync: MainsSync }, delayS: number): number | null {
  const half = 1 / (2 * stage.sync.mainsHz);
  if (!(delayS > 0 && delayS < half)) return null;
  const { r: _r, ...rest } = syncCircuitOf(stage);
  void _r;
  return timingRForDelay(rest, delayS);
}
