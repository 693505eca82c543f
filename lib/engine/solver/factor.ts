// Divisors of a positive integer by trial-division factorisation (exact for
// integers below 2^53; cost grows with the square root of the largest
// cofactor, fine for the clock-cycle counts of practical periods).

export function divisors(k: number): number[] {
  const primes: [number, number][] = [];
  let rest = k;
  for (let p = 2; p * p <= rest; p += p === 2 ? 1 : 2) {
    if (rest % p !== 0) continue;
    let e = 0;
    while (rest % p === 0) {
      rest /= p;
      e++;
    }
    primes.push([p, e]);
  }
  if (rest > 1) primes.push([rest, 1]);
  let out = [1];
  for (const [p, e] of primes) {
    const next: number[] = [];
    for (const v of out) {
      let f = v;
      for (let i = 0; i <= e; i++) {
        next.push(f);
        f *= p;
      }
    }
    out = next;
  }
  return out.sort((a, b) => a - b);
}
