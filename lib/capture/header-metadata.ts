// Key/value lines above the data ("Sample Interval,1.0E-06"): kept for
// display, and read for the sample interval and start time when the export
// has no time column.

import type { HeaderEntry } from "./types";
import { type Delimiter, splitFields } from "./fields";
import { intervalFromQuantity, parseQuantity, splitNameUnit, unquote } from "./units";

const MAX_ENTRIES = 64;
const MAX_TEXT = 200;

// Keys compared after lower-casing and dropping everything but letters.
const INTERVAL_KEYS = new Set([
  "sampleinterval",
  "samplinginterval",
  "sampleperiod",
  "samplingperiod",
  "sampletime",
  "timestep",
  "timeincrement",
  "timeresolution",
  "dt",
]);
const RATE_KEYS = new Set(["samplerate", "samplingrate", "samplingfrequency", "samplefrequency"]);
const START_KEYS = new Set(["starttime", "timeoffset", "firstsampletime", "tstart"]);

export interface HeaderInfo {
  entries: HeaderEntry[];
  sampleIntervalS: number | null;
  startS: number;
}

function splitKeyValue(line: string, delimiter: Delimiter): [string, string] {
  const fields = splitFields(line, delimiter);
  if (fields.length >= 2) return [unquote(fields[0]), unquote(fields.slice(1).join(delimiter))];
  const sep = /[:=]/.exec(line);
  if (sep) return [unquote(line.slice(0, sep.index)), unquote(line.slice(sep.index + 1))];
  return [unquote(line), ""];
}

export function readHeader(lines: string[], delimiter: Delimiter, decimalComma: boolean): HeaderInfo {
  const info: HeaderInfo = { entries: [], sampleIntervalS: null, startS: 0 };
  for (const line of lines) {
    if (line.trim() === "") continue;
    const [rawKey, value] = splitKeyValue(line, delimiter);
    if (info.entries.length < MAX_ENTRIES) {
      info.entries.push({ key: rawKey.slice(0, MAX_TEXT), value: value.slice(0, MAX_TEXT) });
    }
    const { name, unit } = splitNameUnit(rawKey);
    const key = name.toLowerCase().replace(/[^a-z]/g, "");
    const isInterval = INTERVAL_KEYS.has(key);
    const isRate = RATE_KEYS.has(key);
    if (isInterval || isRate) {
      const q = parseQuantity(value, decimalComma);
      const dt = q ? intervalFromQuantity(q, unit, isRate) : null;
      if (dt !== null && info.sampleIntervalS === null) info.sampleIntervalS = dt;
    } else if (START_KEYS.has(key)) {
      const q = parseQuantity(value, decimalComma);
      const t0 = q ? intervalFromQuantity({ value: 1, unit: q.unit }, unit, false) : null;
      if (q && t0 !== null) info.startS = q.value * t0;
    }
  }
  return info;
}
