// Reads plain decimal numbers ("-1.25", "3,3", "1.000000e-05") straight from
// the line text without slicing it: the per-sample hot path. Anything else
// (blanks, quotes, more than 15 significant digits, exponents past 1e22)
// returns NaN and the caller falls back to Number().
//
// Exactness: with at most 15 significant digits the mantissa is an exact
// integer and 10^k (k <= 22) an exact double, so one multiply or divide gives
// the correctly rounded result, the same double Number() returns (Clinger's
// fast path, "How to Read Floating Point Numbers Accurately", PLDI 1990).

const POW10 = Array.from({ length: 23 }, (_, k) => Number(`1e${k}`));

export function fastNumber(s: string, start: number, end: number, decimalMark: number): number {
  let i = start;
  let negative = false;
  let c = s.charCodeAt(i);
  if (c === 45 || c === 43) {
    negative = c === 45;
    i++;
  }
  let mantissa = 0;
  let digits = 0;
  let exponent = 0;
  let any = false;
  for (; i < end; i++) {
    c = s.charCodeAt(i) - 48;
    if (c < 0 || c > 9) break;
    any = true;
    if (digits > 0 || c !== 0) {
      mantissa = mantissa * 10 + c;
      digits++;
    }
  }
  if (i < end && s.charCodeAt(i) === decimalMark) {
    for (i++; i < end; i++) {
      c = s.charCodeAt(i) - 48;
      if (c < 0 || c > 9) break;
      any = true;
      if (digits > 0 || c !== 0) {
        mantissa = mantissa * 10 + c;
        digits++;
      }
      exponent--;
    }
  }
  if (!any || digits > 15) return NaN;
  if (i < end) {
    c = s.charCodeAt(i);
    if (c !== 101 && c !== 69) return NaN; // e, E
    i++;
    let expNegative = false;
    c = s.charCodeAt(i);
    if (c === 45 || c === 43) {
      expNegative = c === 45;
      i++;
    }
    let e = 0;
    const first = i;
    for (; i < end; i++) {
      c = s.charCodeAt(i) - 48;
      if (c < 0 || c > 9 || e > 1000) return NaN;
      e = e * 10 + c;
    }
    if (i === first) return NaN;
    exponent += expNegative ? -e : e;
  }
  let x: number;
  if (mantissa === 0) x = 0;
  else if (exponent >= 0 && exponent <= 22) x = mantissa * POW10[exponent];
  else if (exponent < 0 && exponent >= -22) x = mantissa / POW10[-exponent];
  else return NaN;
  return negative ? -x : x;
}
