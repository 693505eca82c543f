// Divisors of the clock-cycle totals the interrupt search tries, with the
// work per call bounded by design.
//
// Only divisors that can be an interrupt interval matter, and an interval is
// (divider x counts): its prime factors are at most maxPrime (the largest
// divider or count of the timer). So a total is split into its part built from
// primes up to maxPrime and a cofactor the software divider absorbs.
//
// Cost per total below 2^53: trial division by the 6,542 primes below 2^16
// (stopping at the square root of what is left). Above 2^16 the cofactor left
// has at most two prime factors (the totals are below 2^48 = (2^16)^3); it is
// needed only when a count can exceed 2^16 (32-bit timers): one Miller-Rabin
// test and, for a composite, one Pollard-Brent split with an expected
// 2^12 steps (the smaller factor is below 2^24). No step scales with the
// size of the total itself.

const SMALL_PRIME_LIMIT = 65536;

function primesBelow(n: number): number[] {
  const sieve = new Uint8Array(n);
  const out: number[] = [];
  for (let i = 2; i < n; i++) {
    if (sieve[i]) continue;
    out.push(i);
    for (let j = i * i; j < n; j += i) sieve[j] = 1;
  }
  return out;
}

let smallPrimes: number[] | null = null;
function primes(): number[] {
  return (smallPrimes ??= primesBelow(SMALL_PRIME_LIMIT));
}

function powMod(b: bigint, e: bigint, m: bigint): bigint {
  let r = 1n;
  b %= m;
  while (e > 0n) {
    if (e & 1n) r = (r * b) % m;
    b = (b * b) % m;
    e >>= 1n;
  }
  return r;
}

/** Deterministic Miller-Rabin for n < 3.3e24 (bases 2..41). */
export function isPrime(n: number): boolean {
  if (n < 2) return false;
  for (const p of [2, 3, 5, 7, 11, 13, 17, 19, 23, 29, 31, 37, 41]) {
    if (n === p) return true;
    if (n % p === 0) return false;
  }
  const N = BigInt(n);
  let d = N - 1n;
  let r = 0;
  while ((d & 1n) === 0n) {
    d >>= 1n;
    r++;
  }
  outer: for (const a of [2n, 3n, 5n, 7n, 11n, 13n, 17n, 19n, 23n, 29n, 31n, 37n, 41n]) {
    let x = powMod(a, d, N);
    if (x === 1n || x === N - 1n) continue;
    for (let i = 1; i < r; i++) {
      x = (x * x) % N;
      if (x === N - 1n) continue outer;
    }
    return false;
  }
  return true;
}

function gcd(a: bigint, b: bigint): bigint {
  while (b) [a, b] = [b, a % b];
  return a;
}

/** A non-trivial factor of a composite n (Pollard-Brent, deterministic seeds). */
export function splitComposite(n: number): number {
  const N = BigInt(n);
  for (let c = 1n; ; c++) {
    let y = 2n;
    let g = 1n;
    let r = 1;
    let q = 1n;
    let x = y;
    let ys = y;
    const f = (v: bigint) => (v * v + c) % N;
    while (g === 1n) {
      x = y;
      for (let i = 0; i < r; i++) y = f(y);
      for (let k = 0; k < r && g === 1n; k += 64) {
        ys = y;
        for (let i = 0; i < Math.min(64, r - k); i++) {
          y = f(y);
          q = (q * (x > y ? x - y : y - x)) % N;
        }
        g = gcd(q, N);
      }
      r *= 2;
    }
    if (g === N) {
      do {
        ys = f(ys);
        g = gcd(x > ys ? x - ys : ys - x, N);
      } while (g === 1n);
    }
    if (g !== N) return Number(g);
  }
}

/** Prime factorisation of k restricted to primes <= maxPrime, ascending. */
export function smoothFactors(k: number, maxPrime: number): [number, number][] {
  const found = new Map<number, number>();
  let rest = k;
  let exhausted = true;
  for (const p of primes()) {
    if (p > maxPrime) return toList(found); // every factor left exceeds maxPrime
    if (p * p > rest) {
      exhausted = false;
      break;
    }
    while (rest % p === 0) {
      rest /= p;
      found.set(p, (found.get(p) ?? 0) + 1);
    }
  }
  if (rest > 1 && !exhausted) {
    // Nothing up to its square root divides it: rest is prime.
    if (rest <= maxPrime) found.set(rest, (found.get(rest) ?? 0) + 1);
  } else if (rest > 1) {
    // Only 32-bit counts get here: every factor of rest is above 2^16.
    for (const f of largeFactors(rest)) if (f <= maxPrime) found.set(f, (found.get(f) ?? 0) + 1);
  }
  return toList(found);
}

function largeFactors(n: number): number[] {
  if (isPrime(n)) return [n];
  const p = splitComposite(n);
  return [...largeFactors(p), ...largeFactors(n / p)];
}

function toList(m: Map<number, number>): [number, number][] {
  return [...m.entries()].sort((a, b) => a[0] - b[0]);
}

/** Divisors of k built from primes <= maxPrime (all divisors when maxPrime >= k), ascending. */
export function divisors(k: number, maxPrime = Infinity): number[] {
  let out = [1];
  for (const [p, e] of smoothFactors(k, maxPrime)) {
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
