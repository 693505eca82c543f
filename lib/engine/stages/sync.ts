// Mains-synchronised relaxation stage (engine.md section 6): the stage's
// supply is the full-wave rectified mains clipped by a zener at `supplyV`,
//   supply(t) = min(sqrt(2)*Vrms*|sin(2*pi*f*t)|, supplyV),
// the timing capacitor starts from 0 V at every zero crossing and charges
// through timingR; the first time it reaches the peak point (computed from
// supplyV, as for the free-running stage) the element fires the gate.
//
// The RC equation dv/dt = (supply(t) - v)/(R C) has a closed form on each
// piece of the half cycle (first-order RC driven by a sine: steady-state
// phasor part plus the decaying homogeneous part; any circuit-analysis
// textbook, first-order circuits with sinusoidal sources), so the firing
// delay is found by bisection on exact values, far inside 0.1 %.
//
// Load figures: resistive load behind a full-wave AC controller (triac or
// antiparallel thyristors) fired at angle a:
//   Vrms/Vs = sqrt(1 - a/pi + sin(2a)/(2 pi)), power fraction = its square.
// Source: the standard AC voltage-controller result, e.g. Mohan, Undeland,
// Robbins, Power Electronics, chapter "AC voltage controllers" (from memory).
import type { MainsSync, StageSync } from "../stage-types";

export interface SyncCircuit {
  mainsHz: number;
  mainsVrms: number;
  /** zener clamp voltage (the stage's supplyV) */
  clampV: number;
  r: number;
  c: number;
  /** trip voltage of the element (peak point from the clamp voltage) */
  peakV: number;
}

interface Piece {
  from: number;
  to: number;
  /** capacitor voltage at `from` is given by the piece, v(t) for t in [from, to] */
  v: (t: number) => number;
  /** true where v can only rise (clamped plateau, rising sine before the clamp) */
  monotonic: boolean;
}

/**
 * The capacitor voltage over one half cycle as closed-form pieces: rising
 * sine up to the clamp, the clamped plateau, falling sine after it (or one
 * sine piece when the mains peak never reaches the clamp).
 */
export function syncPieces(x: SyncCircuit): Piece[] {
  const w = 2 * Math.PI * x.mainsHz;
  const tau = x.r * x.c;
  const half = 1 / (2 * x.mainsHz);
  const amp = Math.SQRT2 * x.mainsVrms;
  const wt = w * tau;
  // Steady-state response to amp*sin(w t) through R into C.
  const k = amp / (1 + wt * wt);
  const steady = (t: number) => k * (Math.sin(w * t) - wt * Math.cos(w * t));
  const sinePiece = (from: number, to: number, v0: number, monotonic: boolean): Piece => {
    const c0 = v0 - steady(from);
    return { from, to, monotonic, v: (t) => steady(t) + c0 * Math.exp(-(t - from) / tau) };
  };
  if (amp <= x.clampV) return [sinePiece(0, half, 0, false)];
  const t1 = Math.asin(x.clampV / amp) / w;
  const t2 = half - t1;
  const rise = sinePiece(0, t1, 0, true);
  const v1 = rise.v(t1);
  const plateau: Piece = {
    from: t1,
    to: t2,
    monotonic: true,
    v: (t) => x.clampV + (v1 - x.clampV) * Math.exp(-(t - t1) / tau),
  };
  return [rise, plateau, sinePiece(t2, half, plateau.v(t2), false)];
}

const SCAN_STEPS = 128;
const BISECTIONS = 64;

function bisect(v: (t: number) => number, lo: number, hi: number, level: number): number {
  for (let i = 0; i < BISECTIONS && hi - lo > 1e-15 * hi; i++) {
    const mid = (lo + hi) / 2;
    if (v(mid) >= level) hi = mid;
    else lo = mid;
  }
  return (lo + hi) / 2;
}

/** Seconds from the zero crossing to the first time the capacitor reaches peakV; null when it never does. */
export function firingDelay(x: SyncCircuit): number | null {
  for (const p of syncPieces(x)) {
    if (p.monotonic) {
      if (p.v(p.to) >= x.peakV) return bisect(p.v, p.from, p.to, x.peakV);
      continue;
    }
    // Rises while the supply is above the capacitor, then falls: scan for the first sample at or above.
    let prev = p.from;
    for (let i = 1; i <= SCAN_STEPS; i++) {
      const t = p.from + ((p.to - p.from) * i) / SCAN_STEPS;
      if (p.v(t) >= x.peakV) return bisect(p.v, prev, t, x.peakV);
      prev = t;
    }
  }
  return null;
}

/** Highest capacitor voltage within the half cycle (for the message when the stage never fires). */
export function peakCapacitorV(x: SyncCircuit): number {
  let best = 0;
  for (const p of syncPieces(x)) {
    for (let i = 0; i <= SCAN_STEPS; i++)
      best = Math.max(best, p.v(p.from + ((p.to - p.from) * i) / SCAN_STEPS));
  }
  return best;
}

/** Capacitor voltage at time t (0..half cycle) after the zero crossing, the element not yet fired. */
export function syncCapacitorV(x: SyncCircuit, t: number): number {
  for (const p of syncPieces(x)) if (t <= p.to) return p.v(t);
  return NaN;
}

/** Load RMS voltage as a fraction of the full sine's, for firing angle a (rad). */
export function loadRmsFraction(angleRad: number): number {
  const a = Math.min(Math.PI, Math.max(0, angleRad));
  return Math.sqrt(Math.max(0, 1 - a / Math.PI + Math.sin(2 * a) / (2 * Math.PI)));
}

/** The sync block of the analysis for a firing delay within the half cycle. */
export function syncFigures(mains: MainsSync, firingDelayS: number): StageSync {
  const halfCycleS = 1 / (2 * mains.mainsHz);
  const firingAngleDeg = (180 * firingDelayS) / halfCycleS;
  const rms = loadRmsFraction((firingAngleDeg * Math.PI) / 180);
  return {
    halfCycleS,
    firingDelayS,
    firingAngleDeg,
    conductionAngleDeg: 180 - firingAngleDeg,
    loadRmsFraction: rms,
    loadPowerFraction: rms * rms,
  };
}

/**
 * Firing angle (degrees) that gives a wanted load power fraction (0..1):
 * the power fraction falls monotonically from 1 at 0 deg to 0 at 180 deg,
 * so bisection on the formula above reads it the other way.
 */
export function angleForPowerFraction(fraction: number): number {
  let lo = 0;
  let hi = Math.PI;
  for (let i = 0; i < 80; i++) {
    const mid = (lo + hi) / 2;
    if (loadRmsFraction(mid) ** 2 > fraction) lo = mid;
    else hi = mid;
  }
  return (((lo + hi) / 2) * 180) / Math.PI;
}

/** Delay after the zero crossing for a firing angle (degrees). */
export function delayForAngle(angleDeg: number, mainsHz: number): number {
  return (angleDeg / 180) * (1 / (2 * mainsHz));
}

/**
 * Timing resistor that fires at `delayS` with everything else kept: the
 * delay grows monotonically with R, so bisect R on a log scale between
 * 1 ohm and 1 Gohm. null when no R in that range gets there.
 */
export function timingRForDelay(x: Omit<SyncCircuit, "r">, delayS: number): number | null {
  const at = (r: number) => firingDelay({ ...x, r });
  let lo = Math.log(1);
  let hi = Math.log(1e9);
  const dLo = at(Math.exp(lo));
  if (dLo === null || dLo > delayS) return null;
  if ((at(Math.exp(hi)) ?? Infinity) < delayS) return null;
  for (let i = 0; i < 80; i++) {
    const mid = (lo + hi) / 2;
    const d = at(Math.exp(mid));
    if (d !== null && d <= delayS) lo = mid;
    else hi = mid;
  }
  return Math.exp((lo + hi) / 2);
}
