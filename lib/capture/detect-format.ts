// Works out the shape of an export from its first lines: delimiter, decimal
// comma, where the numbers start, column names and units, which column is
// time (or the sample interval when there is none) and which is measured.

import { CaptureError } from "./errors";
import { type Delimiter, isNumberish, numericFieldCount, splitFields } from "./fields";
import { MAX_PROBE, readHeader } from "./header-metadata";
import type { CaptureColumn, CaptureScaling, CaptureWarning, HeaderEntry } from "./types";
import { isKnownUnit, splitNameUnit, timeScale, voltScale } from "./units";

export interface Layout {
  delimiter: Delimiter;
  decimalComma: boolean;
  fieldCount: number;
  /** Index into the window of the first data row. */
  dataStart: number;
  columns: CaptureColumn[];
  /** Multiplier to SI per column. */
  scales: number[];
  /** -1 when times come from the sample interval. */
  timeIndex: number;
  measuredIndex: number;
  /** Measured value = raw × measuredScale + measuredOffset (volts at the probe tip). */
  measuredScale: number;
  measuredOffset: number;
  scaling: CaptureScaling;
  sampleIntervalS: number | null;
  startS: number;
  header: HeaderEntry[];
  warnings: CaptureWarning[];
}

const DELIMITERS: Delimiter[] = ["\t", ";", ","];

interface Candidate {
  delimiter: Delimiter;
  counts: number[];
  score: [number, number, number];
}

function scoreDelimiter(lines: string[], delimiter: Delimiter): Candidate {
  const decimalComma = delimiter !== ",";
  const counts = lines.map((l) => numericFieldCount(l, delimiter, decimalComma));
  let numeric = 0;
  let inText = 0;
  let inNumbers = 0;
  lines.forEach((l, i) => {
    if (counts[i] > 0) {
      numeric++;
      if (l.includes(delimiter)) inNumbers++;
    } else if (l.includes(delimiter)) inText++;
  });
  // Most rows of numbers first; on a tie, the delimiter the header text uses
  // (a lone column of "1,5" is a decimal comma when the header uses ";"),
  // then the one the numbers contain.
  return { delimiter, counts, score: [numeric, inText, inNumbers] };
}

function better(a: Candidate, b: Candidate): boolean {
  for (let i = 0; i < 3; i++) {
    if (a.score[i] !== b.score[i]) return a.score[i] > b.score[i];
  }
  return false;
}

function nextNonBlank(lines: string[], from: number): number {
  for (let i = from; i < lines.length; i++) if (lines[i].trim() !== "") return i;
  return -1;
}

function prevNonBlank(lines: string[], from: number): number {
  for (let i = from; i >= 0; i--) if (lines[i].trim() !== "") return i;
  return -1;
}

/** First row of numbers followed by another with the same field count, so a
 *  lone numeric metadata line is not taken for data. */
function findDataStart(lines: string[], counts: number[]): number {
  let last = -1;
  for (let i = 0; i < lines.length; i++) {
    if (counts[i] === 0) continue;
    const next = nextNonBlank(lines, i + 1);
    if (next === -1 || counts[next] === counts[i]) return i;
    last = i;
  }
  return last;
}

/** A text row with one field per column: names, or a row of units. */
function textRow(line: string | undefined, delimiter: Delimiter, k: number): string[] | null {
  if (line === undefined) return null;
  const fields = splitFields(line, delimiter);
  if (fields.length !== k) return null;
  return fields.some((f) => isNumberish(f, delimiter !== ",")) ? null : fields;
}

/** True when values rise by `interval` (within 1 %) from row to row. */
function steps(values: number[], interval: number): boolean {
  if (values.length < 2) return false;
  for (let i = 1; i < values.length; i++) {
    if (Math.abs(values[i] - values[i - 1] - interval) > 0.01 * interval) return false;
  }
  return true;
}

const TIME_NAME = /^(time|t|x)$|^time\b/i;

export interface LayoutChoice {
  voltageColumn: number;
  probeAttenuation?: number;
}

export function detectLayout(lines: string[], choice: LayoutChoice): Layout {
  const { voltageColumn, probeAttenuation } = choice;
  if (
    probeAttenuation !== undefined &&
    !(Number.isFinite(probeAttenuation) && probeAttenuation >= 1 && probeAttenuation <= MAX_PROBE)
  ) {
    throw new CaptureError(
      "bad-choice",
      null,
      `probe attenuation ${probeAttenuation} is not a factor from 1 to ${MAX_PROBE} (1x, 10x, 100x)`,
    );
  }
  if (nextNonBlank(lines, 0) === -1) {
    throw new CaptureError("empty", Math.max(1, lines.length), "the file is empty");
  }
  let best = scoreDelimiter(lines, DELIMITERS[0]);
  for (const d of DELIMITERS.slice(1)) {
    const c = scoreDelimiter(lines, d);
    if (better(c, best)) best = c;
  }
  const { delimiter, counts } = best;
  const decimalComma = delimiter !== ",";
  const dataStart = findDataStart(lines, counts);
  if (dataStart === -1) {
    throw new CaptureError(
      "no-numeric-data",
      lines.length,
      `no rows of numbers in the first ${lines.length} lines; expected a time column and voltage columns`,
    );
  }
  const k = counts[dataStart];
  const dataLine = dataStart + 1;

  // Header rows: names, optionally followed by a row of units.
  let headerEnd = dataStart;
  let names: string[] | null = null;
  let units: string[] | null = null;
  const above = prevNonBlank(lines, dataStart - 1);
  const row = above >= 0 ? textRow(lines[above], delimiter, k) : null;
  if (row) {
    headerEnd = above;
    if (row.every((f) => f.trim() === "" || isKnownUnit(f))) {
      units = row.map((f) => f.trim());
      const nameLine = prevNonBlank(lines, above - 1);
      const nameRow = nameLine >= 0 ? textRow(lines[nameLine], delimiter, k) : null;
      if (nameRow) {
        names = nameRow;
        headerEnd = nameLine;
      }
    } else names = row;
  }
  const info = readHeader(lines.slice(0, headerEnd), delimiter, decimalComma);
  const warnings: CaptureWarning[] = [];

  const columns: CaptureColumn[] = [];
  const scales: number[] = [];
  const headerUnit = info.vertical.unit;
  const ownUnits: string[] = [];
  let timeIndex = -1;
  for (let c = 0; c < k; c++) {
    const split = names ? splitNameUnit(names[c]) : { name: `column ${c + 1}`, unit: "" };
    const unit = units ? units[c] || split.unit : split.unit;
    const name = split.name || `column ${c + 1}`;
    ownUnits.push(unit);
    const ts = timeScale(unit);
    const vs = voltScale(unit);
    if (timeIndex === -1 && (ts !== undefined || (unit === "" && TIME_NAME.test(name)))) {
      timeIndex = c;
      columns.push({ name, unit, role: "time" });
      scales.push(ts ?? 1);
    } else if (vs !== undefined || (unit === "" && !TIME_NAME.test(name))) {
      // A column without its own unit takes the header's vertical unit.
      const applied = vs === undefined && headerUnit !== null ? headerUnit : unit;
      columns.push({ name, unit: applied, role: "voltage" });
      scales.push(voltScale(applied) ?? 1);
    } else {
      columns.push({ name, unit, role: "other" });
      scales.push(1);
    }
  }

  if (timeIndex === -1 && !names && k >= 2 && info.sampleIntervalS !== null) {
    // No header row: a first column stepping by the sample interval is time.
    const firstColumn = lines
      .slice(dataStart)
      .filter((l) => l.trim() !== "")
      .map((l) => Number(splitFields(l, delimiter)[0].replace(",", ".")));
    if (steps(firstColumn, info.sampleIntervalS)) {
      timeIndex = 0;
      columns[0] = { ...columns[0], role: "time" };
    }
  }
  if (timeIndex === -1 && info.sampleIntervalS === null) {
    if (k === 1) {
      throw new CaptureError(
        "one-column",
        dataLine,
        "only one column of numbers and no sample interval in the header; need a time column and a voltage column",
      );
    }
    if (columns[0].unit !== "") {
      throw new CaptureError(
        "one-column",
        dataLine,
        `no time column and no sample interval in the header; column 1 is "${columns[0].name}" in ${columns[0].unit}`,
      );
    }
    timeIndex = 0;
    columns[0] = { ...columns[0], role: "time" };
    warnings.push({
      code: "assumed-time-column",
      message: `no column is named as time and the header gives no sample interval: column 1 ("${columns[0].name}") read as time in seconds`,
    });
  }

  let candidates = columns.flatMap((col, i) => (col.role === "voltage" ? [i] : []));
  if (candidates.length === 0) {
    candidates = columns.flatMap((col, i) => (col.role === "other" ? [i] : []));
    if (candidates.length > 0) {
      warnings.push({
        code: "no-voltage-unit",
        message: `no column is in volts; measuring "${columns[candidates[0]].name}" as it is`,
      });
    }
  }
  if (candidates.length === 0) {
    throw new CaptureError(
      "one-column",
      dataLine,
      "only a time column; need at least one voltage column beside it",
    );
  }
  if (!Number.isInteger(voltageColumn) || voltageColumn < 0 || voltageColumn >= candidates.length) {
    const names = candidates.map((i, n) => `${n + 1} "${columns[i].name}"`).join(", ");
    throw new CaptureError(
      "bad-choice",
      null,
      `there is no channel ${voltageColumn + 1}: the capture has ${candidates.length} voltage column(s) (${names})`,
    );
  }
  const measuredIndex = candidates[voltageColumn];
  const measured = columns[measuredIndex];
  const ownUnit = ownUnits[measuredIndex];
  const unitScale = scales[measuredIndex];
  const scale = info.vertical.scale ?? 1;
  const offsetV = info.vertical.offsetV ?? 0;
  const probe = probeAttenuation ?? 1;
  const scaling: CaptureScaling = {
    voltageColumn,
    voltageColumns: candidates.length,
    unit: measured.unit,
    unitFrom: voltScale(ownUnit) !== undefined ? "column" : measured.unit !== "" ? "header" : "none",
    unitScale,
    scale,
    offsetV,
    probe,
    headerProbe: info.vertical.probe,
  };
  return {
    delimiter,
    decimalComma,
    fieldCount: k,
    dataStart,
    columns,
    scales,
    timeIndex,
    measuredIndex,
    measuredScale: unitScale * scale * probe,
    measuredOffset: offsetV * probe,
    scaling,
    sampleIntervalS: timeIndex === -1 ? info.sampleIntervalS : null,
    startS: info.startS,
    header: info.entries,
    warnings,
  };
}
