// Track laws of a potentiometer: the fraction of the track resistance between
// the wiper and the tied end at a rotation x in 0..1.
import type { Taper } from "./types";

/**
 * Logarithmic ("audio") taper as an exponential law with 10 % of the track at
 * half rotation (common practice, no source): f(x) = (B^x - 1)/(B - 1), and
 * f(0.5) = 0.1 gives sqrt(B) = 9, B = 81. It is exact at both ends (0 and 1).
 */
export const LOG_TAPER_BASE = 81;

export function taperFraction(taper: Taper, x: number): number {
  if (taper === "linear") return x;
  return (Math.pow(LOG_TAPER_BASE, x) - 1) / (LOG_TAPER_BASE - 1);
}

/** Inverse of taperFraction: the rotation that gives a track fraction f. */
export function taperRotation(taper: Taper, f: number): number {
  if (taper === "linear") return f;
  return Math.log(1 + f * (LOG_TAPER_BASE - 1)) / Math.log(LOG_TAPER_BASE);
}
