// The hot-path number reader must return exactly the double that the
// ECMAScript StringToNumber algorithm (Number()) returns, or NaN to hand the
// field over to Number(). Reference: ECMA-262, StringToNumber.
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { fastNumber } from "@/lib/capture/fast-number";

const read = (s: string, mark = 46) => fastNumber(s, 0, s.length, mark);

describe("fastNumber", () => {
  it("matches Number() bit for bit on printed doubles", () => {
    fc.assert(
      fc.property(
        fc.double({ noNaN: true, noDefaultInfinity: true }),
        fc.integer({ min: 1, max: 15 }),
        (x, digits) => {
          for (const s of [String(x), x.toExponential(digits - 1), x.toPrecision(digits)]) {
            const got = read(s);
            if (!Number.isNaN(got)) expect(Object.is(got, Number(s))).toBe(true);
          }
        },
      ),
      { numRuns: 3000 },
    );
  });

  it("matches Number() on scope-sized values, and takes the fast path for them", () => {
    let fast = 0;
    fc.assert(
      fc.property(
        fc.integer({ min: -999_999_999, max: 999_999_999 }),
        fc.integer({ min: -20, max: 6 }),
        (m, e) => {
          const x = m * 10 ** e;
          for (const s of [`${m}e${e}`, x.toExponential(6), x.toFixed(Math.min(20, Math.max(0, -e)))]) {
            const got = read(s);
            if (Number.isNaN(got)) continue;
            fast++;
            expect(Object.is(got, Number(s))).toBe(true);
          }
        },
      ),
      { numRuns: 3000 },
    );
    expect(fast).toBeGreaterThan(6000);
  });

  it("reads the shapes scope exports print", () => {
    expect(read("1.000000e-05")).toBe(1e-5);
    expect(read("-3.3")).toBe(-3.3);
    expect(read("+.5")).toBe(0.5);
    expect(read("7.")).toBe(7);
    expect(read("2,5E-06", 44)).toBe(2.5e-6);
    expect(read("0.1E+2")).toBe(10);
  });

  it("hands everything else to the slow path", () => {
    for (const s of ["", " 1", "1 ", '"1"', "1,5", "e5", "1e", "1e+", ".", "-", "NaN", "0x10", "1.2.3"]) {
      expect(read(s)).toBeNaN();
    }
    expect(read("1234567890.1234567")).toBeNaN(); // 17 significant digits
    expect(read("1e-30")).toBeNaN(); // past the exact powers of ten
  });

  it("leading zeros are not significant digits: a zero-padded field stays on the fast path", () => {
    // Leading zeros only place the decimal point and are not significant (significant-figure rule,
    // from memory); the reader's own limit counts significant digits (15, fast-number.ts header).
    const padded = "0000000000000000012.5"; // 3 significant digits after 17 zeros
    expect(read(padded)).toBe(12.5);
    const small = "0.00000000000000000125"; // 1.25e-18: 3 significant digits, 10^-20 is an exact power
    expect(Object.is(read(small), Number(small))).toBe(true);
  });
});
