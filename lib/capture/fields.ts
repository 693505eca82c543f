// Field-level reading shared by format detection and the row parser.

import { unquote } from "./units";

export type Delimiter = "," | ";" | "\t";

/** Splits a line, dropping trailing empty fields (exports often end rows
 *  with a delimiter). Used on the detection window only, never per sample. */
export function splitFields(line: string, delimiter: Delimiter): string[] {
  const fields = line.split(delimiter);
  while (fields.length > 0 && fields[fields.length - 1].trim() === "") fields.pop();
  return fields;
}

/** Reads one field as a number; NaN when it is not one. Empty -> NaN. */
export function readNumber(field: string, decimalComma: boolean): number {
  let s = unquote(field);
  if (s === "") return NaN;
  if (decimalComma && s.includes(",")) s = s.replace(",", ".");
  return Number(s);
}

const NOT_FINITE = /^[+-]?(nan|inf|infinity|-?1\.#(ind|inf|qnan))$/i;

/** True for numbers and for the non-finite tokens exports print in data rows,
 *  so a NaN sample is reported as a bad value, not taken for a header line. */
export function isNumberish(field: string, decimalComma: boolean): boolean {
  const s = unquote(field);
  return Number.isFinite(readNumber(s, decimalComma)) || NOT_FINITE.test(s);
}

/** Field count if every field of the line is number-like (an empty field
 *  among numbers counts, so the row parser can name it), else 0. */
export function numericFieldCount(line: string, delimiter: Delimiter, decimalComma: boolean): number {
  const fields = splitFields(line, delimiter);
  let numbers = 0;
  for (const f of fields) {
    if (isNumberish(f, decimalComma)) numbers++;
    else if (f.trim() !== "") return 0;
  }
  return numbers > 0 ? fields.length : 0;
}
