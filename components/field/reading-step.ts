// Default instrument resolution for a typed reading: one step in the third
// significant digit of the period (a scope cursor or counter read to three
// digits, "6.16 ms" -> 10 us). Common practice, no source.
export function defaultResolutionS(periodS: number): number {
  if (!(periodS > 0) || !Number.isFinite(periodS)) return 0;
  return Number((10 ** (Math.floor(Math.log10(periodS) + 1e-12) - 2)).toPrecision(3));
}
