// Key/value lines above the data ("Sample Interval,1.0E-06"): kept for
// display, and read for the sample interval and start time when the export
// has no time column, and for the vertical unit, scale, offset and probe
// attenuation that apply to the voltage columns (capture.md "Ramps").

import type { HeaderEntry } from "./types";
import { type Delimiter, splitFields } from "./fields";
import { intervalFromQuantity, parseQuantity, splitNameUnit, unquote, voltScale } from "./units";

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
const VUNIT_KEYS = new Set([
  "verticalunit",
  "verticalunits",
  "yunit",
  "yunits",
  "voltageunit",
  "voltageunits",
  "amplitudeunit",
  "amplitudeunits",
]);
const VSCALE_KEYS = new Set(["verticalscale", "verticalgain", "yscale", "yincrement", "scalefactor"]);
const VOFFSET_KEYS = new Set(["verticaloffset", "yoffset", "yorigin", "voltageoffset"]);
const PROBE_KEYS = new Set(["probe", "probeattenuation", "attenuation", "probefactor", "proberatio"]);

/** Probe factors read from a header or chosen by the user. */
export const MAX_PROBE = 1000;

/** "10", "10x", "x10", "10:1", "10X" -> 10; anything else -> null. */
export function parseProbe(text: string): number | null {
  const m = /^\s*[xX]?\s*(\d+(?:\.\d+)?)\s*(?:[xX]|:\s*1)?\s*$/.exec(unquote(text));
  if (!m) return null;
  const x = Number(m[1]);
  return x >= 1 && x <= MAX_PROBE ? x : null;
}

/** Vertical settings a header declares; null where it says nothing. */
export interface VerticalHeader {
  /** Unit for voltage columns that carry none ("mV"). */
  unit: string | null;
  /** Multiplier on each raw value (a dimensionless scale factor). */
  scale: number | null;
  /** Added after scaling, in volts. */
  offsetV: number | null;
  probe: number | null;
}

export interface HeaderInfo {
  entries: HeaderEntry[];
  sampleIntervalS: number | null;
  startS: number;
  vertical: VerticalHeader;
}

function splitKeyValue(line: string, delimiter: Delimiter): [string, string] {
  const fields = splitFields(line, delimiter);
  if (fields.length >= 2) return [unquote(fields[0]), unquote(fields.slice(1).join(delimiter))];
  const sep = /[:=]/.exec(line);
  if (sep) return [unquote(line.slice(0, sep.index)), unquote(line.slice(sep.index + 1))];
  return [unquote(line), ""];
}

export function readHeader(lines: string[], delimiter: Delimiter, decimalComma: boolean): HeaderInfo {
  const info: HeaderInfo = {
    entries: [],
    sampleIntervalS: null,
    startS: 0,
    vertical: { unit: null, scale: null, offsetV: null, probe: null },
  };
  let offset: { value: number; unit: string } | null = null;
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
    } else readVertical(info.vertical, key, value, unit, decimalComma, (q) => (offset ??= q));
  }
  if (offset !== null) info.vertical.offsetV = offsetVolts(offset, info.vertical.unit);
  return info;
}

function readVertical(
  v: VerticalHeader,
  key: string,
  value: string,
  keyUnit: string,
  decimalComma: boolean,
  setOffset: (q: { value: number; unit: string }) => void,
): void {
  if (VUNIT_KEYS.has(key)) {
    const unit = unquote(value);
    if (v.unit === null && voltScale(unit) !== undefined) v.unit = unit;
  } else if (VSCALE_KEYS.has(key)) {
    // "1 V/div" is a display setting, not a factor on the data: only a
    // plain number is applied.
    const q = parseQuantity(value, decimalComma);
    if (v.scale === null && q && q.unit === "" && keyUnit === "" && q.value !== 0) v.scale = q.value;
  } else if (VOFFSET_KEYS.has(key)) {
    const q = parseQuantity(value, decimalComma);
    if (q) setOffset({ value: q.value, unit: q.unit || keyUnit });
  } else if (PROBE_KEYS.has(key)) {
    const p = parseProbe(value);
    if (v.probe === null && p !== null) v.probe = p;
  }
}

/** An offset in its own unit, else in the declared vertical unit, else volts. */
function offsetVolts(q: { value: number; unit: string }, verticalUnit: string | null): number | null {
  const scale = voltScale(q.unit || verticalUnit || "V");
  return scale === undefined ? null : q.value * scale;
}
