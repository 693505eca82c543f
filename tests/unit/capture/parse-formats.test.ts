// Export shapes the reader must accept. The three fixture files hold the same
// trapezoid pulse train (10 us samples, 1 ms period, 0-100 % ramps of 40 us up
// and 20 us down, 50 % instants 290 us apart, 0 V / 5 V), written the three
// ways; the measurement must not depend on the way. Timing truth follows the
// IEEE Std 181-2011 definitions (see measure-pulses.test.ts).
import { readFileSync } from "node:fs";
import { describe, expect, it } from "vitest";
import { measureCsv, parseCapture, type CaptureMeasurement } from "@/lib/capture";
import { byteChunks, toCsv, trapezoid } from "./fixtures/synth";

const fixture = (name: string) => readFileSync(new URL(`./fixtures/${name}`, import.meta.url), "utf8");

function expectFixtureTruth(m: CaptureMeasurement, startS = 0) {
  expect(m.samples).toBe(400);
  expect(m.sampleIntervalS).toBeCloseTo(10e-6, 15);
  expect(m.startS).toBeCloseTo(startS, 15);
  expect(m.lowLevelV).toBeCloseTo(0, 12);
  expect(m.highLevelV).toBeCloseTo(5, 12);
  expect(m.periodS.count).toBe(3);
  expect(m.periodS.mean).toBeCloseTo(1e-3, 12);
  expect(m.highS.mean).toBeCloseTo(290e-6, 12);
  expect(m.duty).toBeCloseTo(0.29, 9);
  expect(m.riseS).toBeCloseTo(32e-6, 12);
  expect(m.fallS).toBeCloseTo(16e-6, 12);
  expect(m.edges[0].kind).toBe("rise");
  expect(m.edges[0].tS).toBeCloseTo(startS + 120e-6, 12);
}

describe("delimiters, headers and units", () => {
  it("reads comma-separated data under metadata lines, CRLF line ends", async () => {
    const m = await measureCsv(fixture("comma-with-header.csv"));
    expectFixtureTruth(m);
    expect(m.columns).toEqual([
      { name: "Time", unit: "s", role: "time" },
      { name: "CH1", unit: "V", role: "voltage" },
      { name: "CH2", unit: "V", role: "voltage" },
    ]);
    expect(m.measuredColumn).toBe(1);
    expect(m.header).toContainEqual({ key: "Instrument", value: "Bench scope (invented)" });
    expect(m.header).toContainEqual({ key: "Sample Interval", value: "1.0E-05" });
    expect(m.header).toHaveLength(6);
    // 20 us falls span 1.6 samples at 10-90 %.
    expect(m.warnings.map((w) => w.code)).toEqual(["fast-edges"]);
  });

  it("reads semicolons with decimal commas, time in ms and volts in mV", async () => {
    const m = await measureCsv(fixture("semicolon-decimal-comma.csv"));
    expectFixtureTruth(m);
    expect(m.columns.map((c) => c.unit)).toEqual(["ms", "mV"]);
  });

  it("reads tabs, a sample interval with a unit and a start time, no time column", async () => {
    const m = await measureCsv(fixture("interval-no-time.tsv"));
    expectFixtureTruth(m, -1e-3);
    expect(m.columns.map((c) => c.role)).toEqual(["voltage", "voltage"]);
    expect(m.columns[m.measuredColumn].name).toBe("CH1");
  });

  it("takes the second voltage column of the tab file when asked: the inverse pulse", async () => {
    const m = await measureCsv(fixture("interval-no-time.tsv"), { voltageColumn: 1 });
    expect(m.columns[m.measuredColumn].name).toBe("CH2");
    expect(m.highS.mean).toBeCloseTo(1e-3 - 290e-6, 12);
  });

  it("reads a separate row of units, the micro sign and trailing delimiters", async () => {
    const { t, v } = trapezoid({
      n: 400,
      dtS: 10e-6,
      period: 100,
      delay: 10,
      rise: 4,
      top: 26,
      fall: 2,
      lowV: 0,
      highV: 5,
    });
    const us = t.map((x) => x * 1e6);
    const csv = toCsv([us, v], { header: ["Time\tProbe A", "µs\tV"], delimiter: "\t" }).replace(
      /\n/g,
      "\t\n",
    );
    const m = await measureCsv(csv);
    expectFixtureTruth(m);
    expect(m.columns[0]).toEqual({ name: "Time", unit: "µs", role: "time" });
  });

  it("reads a sample rate and one column of decimal-comma values", async () => {
    const { v } = trapezoid({
      n: 400,
      dtS: 10e-6,
      period: 100,
      delay: 10,
      rise: 4,
      top: 26,
      fall: 2,
      lowV: 0,
      highV: 5,
    });
    const rows = Array.from(v, (x) => x.toFixed(3).replace(".", ","));
    const text = ["Sample Rate;100 kSa/s", "Channel;1", ...rows].join("\n");
    const m = await measureCsv(text);
    expectFixtureTruth(m);
  });

  it("reads headerless two-column data as time and voltage", async () => {
    const body = fixture("comma-with-header.csv").split("\r\n").slice(8).join("\n");
    const m = await measureCsv(body);
    expectFixtureTruth(m);
    expect(m.warnings.map((w) => w.code)).toContain("assumed-time-column");
  });
});

describe("streamed input", () => {
  it("decodes byte chunks split inside lines and inside a UTF-8 character", async () => {
    const text = fixture("semicolon-decimal-comma.csv").replace("Time (ms)", "Time (µs)");
    // Same values in us: rescale the time column by 1000.
    const rescaled = text.replace(/^(\d+),(\d+);/gm, (_, a: string, b: string) => {
      const us = Number(`${a}.${b}`) * 1000;
      return `${us.toFixed(0)};`;
    });
    const bytes = new TextEncoder().encode(rescaled);
    const micro = bytes.indexOf(0xc2); // first byte of U+00B5 in UTF-8
    expect(bytes[micro + 1]).toBe(0xb5);
    async function* split() {
      yield bytes.subarray(0, micro + 1); // ends between the two bytes of "µ"
      yield* byteChunks(bytes.subarray(micro + 1), 7); // 7-byte chunks cut most lines
    }
    const m = await measureCsv(split());
    expect(m.columns[0].unit).toBe("µs");
    expectFixtureTruth(m);
  });

  it("decodes one-byte chunks and string chunks alike", async () => {
    const bytes = new TextEncoder().encode(fixture("comma-with-header.csv"));
    expectFixtureTruth(await measureCsv(byteChunks(bytes, 1)));
    async function* strings() {
      const s = fixture("comma-with-header.csv");
      for (let at = 0; at < s.length; at += 333) yield s.slice(at, at + 333);
    }
    expectFixtureTruth(await measureCsv(strings()));
  });

  it("decodes UTF-16 with a byte-order mark", async () => {
    const s = fixture("comma-with-header.csv");
    const bytes = new Uint8Array(2 + s.length * 2);
    bytes[0] = 0xff;
    bytes[1] = 0xfe;
    for (let i = 0; i < s.length; i++) {
      bytes[2 + 2 * i] = s.charCodeAt(i) & 0xff;
      bytes[3 + 2 * i] = s.charCodeAt(i) >> 8;
    }
    expectFixtureTruth(await measureCsv(byteChunks(bytes, 4096)));
  });

  it("keeps only time and the measured column, as Float64Arrays", async () => {
    const trace = await parseCapture(fixture("comma-with-header.csv"));
    expect(trace.t).toBeInstanceOf(Float64Array);
    expect(trace.v).toBeInstanceOf(Float64Array);
    expect(trace.t.length).toBe(400);
    expect(trace.firstDataLine).toBe(9);
    expect(trace.t[1]).toBeCloseTo(1e-5, 15);
  });
});
