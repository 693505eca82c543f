// Header key/value lines, the text row above the data, the time column found
// by its step, quoted fields and the plot envelope. The rules are capture.md
// "Input" (a sample interval in the header when there is no time column;
// header lines that declare units, scale, offset and probe); the key
// spellings, the 1 % step tolerance and the blank trimming inside quotes are
// our own (common practice, no source). Quoted fields follow RFC 4180
// section 2 rules 5 and 7 (a field may be enclosed in double quotes). Every
// expected value is worked out from the numbers written in each test's file.
import { describe, expect, it } from "vitest";
import { CaptureError, decimateEnvelope, parseCapture } from "@/lib/capture";
import { parseProbe } from "@/lib/capture/header-metadata";
import { unquote } from "@/lib/capture/units";

/** Ten samples of a 0 / 5 V square wave, one value a row. */
const ONE_COLUMN = ["0", "0", "5", "5", "5", "0", "0", "5", "5", "0"];

async function interval(headerLine: string): Promise<{ dt: number; t0: number }> {
  const trace = await parseCapture([headerLine, "CH1", ...ONE_COLUMN].join("\n") + "\n");
  return { dt: trace.t[1] - trace.t[0], t0: trace.t[0] };
}

describe("sample interval, rate and start time from the header", () => {
  // Every interval spelling the reader knows, each saying 2 us.
  const intervalKeys = [
    "Sample Interval",
    "Sampling Interval",
    "Sample Period",
    "Sampling Period",
    "Sample Time",
    "Time Step",
    "Time Increment",
    "Time Resolution",
    "dt",
  ];
  it.each(intervalKeys)("'%s,2E-06' gives 2 us between samples", async (key) => {
    const { dt, t0 } = await interval(`${key},2E-06`);
    expect(dt).toBeCloseTo(2e-6, 18);
    expect(t0).toBe(0);
  });

  // 500 kSa/s, 500 kHz, 0.5 MHz and 500000 (Hz assumed) are all 1 / 500e3 = 2 us.
  it.each([
    ["Sample Rate", "500000"],
    ["Sampling Rate", "500 kSa/s"],
    ["Sampling Frequency", "0.5 MHz"],
    ["Sample Frequency", "500 kHz"],
  ])("'%s,%s' gives 2 us between samples", async (key, value) => {
    const { dt } = await interval(`${key},${value}`);
    expect(dt).toBeCloseTo(2e-6, 18);
  });

  it.each([
    ["Start Time", "-0.001"],
    ["Time Offset", "-1 ms"],
    ["First Sample Time", "-1000 us"],
    ["tstart", "-1E-03"],
  ])("'%s,%s' puts the first sample at -1 ms", async (key, value) => {
    const trace = await parseCapture(
      [`${key},${value}`, "Sample Interval,2E-06", "CH1", ...ONE_COLUMN].join("\n") + "\n",
    );
    expect(trace.t[0]).toBeCloseTo(-1e-3, 15);
    expect(trace.t[1] - trace.t[0]).toBeCloseTo(2e-6, 15);
  });

  it("an unknown key gives no interval: a lone column is refused", async () => {
    // Negative case: the same file with a key the reader does not know.
    await expect(interval("Sample Gap,2E-06")).rejects.toThrow(CaptureError);
    await expect(interval("Sample Gap,2E-06")).rejects.toThrow(
      /only one column of numbers and no sample interval/,
    );
  });

  it("'key: value' and 'key = value' lines without the delimiter are split at the separator", async () => {
    const lines = ["Site: Ostberg pump house 3", "Sample Interval: 2 us", "CH1", ...ONE_COLUMN];
    const trace = await parseCapture(lines.join("\n") + "\n");
    expect(trace.header).toEqual([
      { key: "Site", value: "Ostberg pump house 3" },
      { key: "Sample Interval", value: "2 us" },
    ]);
    expect(trace.t[1] - trace.t[0]).toBeCloseTo(2e-6, 18);

    const eq = await parseCapture(
      ["Sample Interval = 5E-06", "Note", "CH1", ...ONE_COLUMN].join("\n") + "\n",
    );
    expect(eq.header).toEqual([
      { key: "Sample Interval", value: "5E-06" },
      { key: "Note", value: "" },
    ]);
    expect(eq.t[1] - eq.t[0]).toBeCloseTo(5e-6, 18);
  });
});

describe("which header line wins", () => {
  it("the first usable interval wins over a later interval or rate", async () => {
    // 2 us, then 1 MHz (1 us): the first line is kept (our rule, no source).
    const trace = await parseCapture(
      ["Sample Interval,2E-06", "Sample Rate,1 MHz", "CH1", ...ONE_COLUMN].join("\n") + "\n",
    );
    expect(trace.t[1] - trace.t[0]).toBeCloseTo(2e-6, 18);
    // an unreadable first line does not block a later one
    const later = await parseCapture(
      ["Sample Interval,unknown", "Sample Rate,1 MHz", "CH1", ...ONE_COLUMN].join("\n") + "\n",
    );
    expect(later.t[1] - later.t[0]).toBeCloseTo(1e-6, 18);
  });
});

describe("probe factor read from a header line", () => {
  it.each([
    ["10", 10],
    ["10x", 10],
    ["X10", 10],
    ["10:1", 10],
    ['"100 X"', 100],
    ["1", 1],
    ["1000", 1000],
    ["2.5x", 2.5],
    ["0.5x", null],
    ["1001", null],
    ["0", null],
    ["ten", null],
    ["10 V", null],
  ])("parseProbe(%j) is %j", (text, expected) => {
    expect(parseProbe(text)).toBe(expected);
  });

  it("a header probe outside 1..1000 is ignored in a file", async () => {
    const rows = ONE_COLUMN.map((x, i) => `${i * 1e-6},${x}`);
    const low = await parseCapture(["Probe,0.5x", "Time (s),CH1", ...rows].join("\n"));
    expect(low.scaling?.headerProbe).toBeNull();
    const high = await parseCapture(["Probe,5000", "Time (s),CH1", ...rows].join("\n"));
    expect(high.scaling?.headerProbe).toBeNull();
    const ok = await parseCapture(["Probe,1000", "Time (s),CH1", ...rows].join("\n"));
    expect(ok.scaling?.headerProbe).toBe(1000);
  });
});

describe("vertical header keys", () => {
  /** A time column and CH1 with values lo / hi, after the given header lines. */
  async function vertical(header: string[], lo: number, hi: number) {
    const rows = ONE_COLUMN.map((x, i) => `${i * 1e-6},${x === "0" ? lo : hi}`);
    return parseCapture([...header, "Time (s),CH1", ...rows].join("\n") + "\n");
  }

  it.each([
    "Vertical Unit",
    "Vertical Units",
    "Y Unit",
    "Y Units",
    "Voltage Unit",
    "Voltage Units",
    "Amplitude Unit",
    "Amplitude Units",
  ])("'%s,mV' reads 0 / 5000 as 0 / 5 V", async (key) => {
    const trace = await vertical([`${key},mV`], 0, 5000);
    expect(trace.scaling).toMatchObject({ unit: "mV", unitFrom: "header", unitScale: 1e-3 });
    expect(Math.max(...trace.v)).toBeCloseTo(5, 12);
  });

  it.each(["Vertical Scale", "Vertical Gain", "Y Scale", "Y Increment", "Scale Factor"])(
    "'%s,0.01' reads 0 / 500 counts as 0 / 5 V",
    async (key) => {
      const trace = await vertical([`${key},0.01`], 0, 500);
      expect(trace.scaling?.scale).toBe(0.01);
      expect(Math.max(...trace.v)).toBeCloseTo(5, 12);
    },
  );

  it.each(["Vertical Offset", "Y Offset", "Y Origin", "Voltage Offset"])(
    "'%s,-1 V' moves 1 / 6 V to 0 / 5 V",
    async (key) => {
      const trace = await vertical([`${key},-1 V`], 1, 6);
      expect(trace.scaling?.offsetV).toBe(-1);
      expect(Math.min(...trace.v)).toBeCloseTo(0, 12);
      expect(Math.max(...trace.v)).toBeCloseTo(5, 12);
    },
  );

  it.each(["Probe", "Probe Attenuation", "Attenuation", "Probe Factor", "Probe Ratio"])(
    "'%s,10x' is the probe the scope already applied: recorded, not applied again",
    async (key) => {
      const trace = await vertical([`${key},10x`], 0, 5);
      expect(trace.scaling).toMatchObject({ headerProbe: 10, probe: 1 });
      expect(Math.max(...trace.v)).toBe(5);
    },
  );

  it("an unknown vertical key changes nothing", async () => {
    // Negative case for the tables above.
    const trace = await vertical(["Vertical Stretch,0.01", "Y Shift,-1 V"], 0, 500);
    expect(trace.scaling).toMatchObject({ scale: 1, offsetV: 0, unitFrom: "none" });
    expect(Math.max(...trace.v)).toBe(500);
  });
});

describe("the text row right above the data", () => {
  it("a decimal-comma 'key;value' line above the data is metadata, not column names", async () => {
    // "0,000002" is a number in a semicolon file (decimal comma), so the row
    // is not a row of names: it gives the interval, and the two columns are
    // voltages with time from the interval.
    const text = ["Sample Interval;0,000002", "0,5;1,25", "4,5;3,75", "0,5;1,25", "4,5;3,75"].join("\n");
    const trace = await parseCapture(text + "\n");
    expect(trace.header).toEqual([{ key: "Sample Interval", value: "0,000002" }]);
    expect(trace.columns.map((c) => [c.name, c.role])).toEqual([
      ["column 1", "voltage"],
      ["column 2", "voltage"],
    ]);
    expect(trace.t[3] - trace.t[0]).toBeCloseTo(6e-6, 18);
    expect(Array.from(trace.v)).toEqual([0.5, 4.5, 0.5, 4.5]);
    expect(trace.warnings).toEqual([]);
  });

  it("the same line in a comma file is metadata too; a row of text is names", async () => {
    const meta = await parseCapture(["Sample Interval,2E-06", "0.5,1.25", "4.5,3.75", "0.5,1.25"].join("\n"));
    expect(meta.header).toEqual([{ key: "Sample Interval", value: "2E-06" }]);
    expect(meta.columns[0].name).toBe("column 1");
    // Negative case: a row without numbers is the names row.
    const named = await parseCapture(["Time (s),Pump A", "0,1.25", "1E-06,3.75", "2E-06,1.25"].join("\n"));
    expect(named.header).toEqual([]);
    expect(named.columns.map((c) => c.name)).toEqual(["Time", "Pump A"]);
  });
});

describe("a first column that steps by the header's interval is time", () => {
  async function layout(interval: string, first: number[]) {
    const rows = first.map((x, i) => `${x},${i % 2 === 0 ? 0 : 5}`);
    return parseCapture([`Sample Interval,${interval}`, ...rows].join("\n") + "\n");
  }

  it("steps 0.9 % off the interval: time; 1.1 % off: a voltage column", async () => {
    const near = await layout("1E-04", [0, 1.009e-4, 2.018e-4, 3.027e-4]);
    expect(near.columns.map((c) => c.role)).toEqual(["time", "voltage"]);
    expect(Array.from(near.t)).toEqual([0, 1.009e-4, 2.018e-4, 3.027e-4]);
    expect(Array.from(near.v)).toEqual([0, 5, 0, 5]);

    const far = await layout("1E-04", [0, 1.011e-4, 2.022e-4, 3.033e-4]);
    expect(far.columns.map((c) => c.role)).toEqual(["voltage", "voltage"]);
    // time from the interval, the first column measured
    expect(far.t[3]).toBeCloseTo(3e-4, 18);
    expect(Array.from(far.v)).toEqual([0, 1.011e-4, 2.022e-4, 3.033e-4]);
  });

  it("exactly 1 % off is still within the tolerance", async () => {
    // A logger writing every 100 s: 101 - 0 - 100 = 1 = 0.01 x 100, exact in
    // binary floating point, so this sits on the boundary itself.
    const edge = await layout("100", [0, 101, 202, 303]);
    expect(edge.columns.map((c) => c.role)).toEqual(["time", "voltage"]);
  });

  it("steps backwards or not at all are not time", async () => {
    const back = await layout("1E-04", [3e-4, 2e-4, 1e-4, 0]);
    expect(back.columns[0].role).toBe("voltage");
    const flat = await layout("1E-04", [1e-4, 1e-4, 1e-4, 1e-4]);
    expect(flat.columns[0].role).toBe("voltage");
  });

  it("every step counts, the first and the last as well", async () => {
    // only the first step is 5x the interval; then only the last one
    const first = await layout("1E-04", [0, 5e-4, 6e-4, 7e-4]);
    expect(first.columns[0].role).toBe("voltage");
    const last = await layout("1E-04", [0, 1e-4, 2e-4, 7e-4]);
    expect(last.columns[0].role).toBe("voltage");
    // Negative case: the same rows stepping evenly are time.
    const even = await layout("1E-04", [0, 1e-4, 2e-4, 3e-4]);
    expect(even.columns[0].role).toBe("time");
  });
});

describe("a named first column is never re-read as time by its step", () => {
  it("'Count' stepping 0, 1, 2 with a 1 s interval stays a column of its own", async () => {
    // The step test is for files without a names row only (capture.md
    // "Input": time from the header's interval when there is no time column).
    const text = ["Sample Interval,1", "Count,CH1", "0,0", "1,5", "2,0", "3,5"].join("\n");
    const trace = await parseCapture(text);
    expect(trace.columns.map((c) => [c.name, c.role])).toEqual([
      ["Count", "voltage"],
      ["CH1", "voltage"],
    ]);
    expect(Array.from(trace.v)).toEqual([0, 1, 2, 3]);
    expect(Array.from(trace.t)).toEqual([0, 1, 2, 3]);
    // Negative case: the same rows without the names row: column 1 is time.
    const bare = await parseCapture(["Sample Interval,1", "0,0", "1,5", "2,0", "3,5"].join("\n"));
    expect(bare.columns.map((c) => c.role)).toEqual(["time", "voltage"]);
    expect(Array.from(bare.v)).toEqual([0, 5, 0, 5]);
  });

  it("a time column found by name is kept when column 1 also steps by the interval", async () => {
    const text = ["Sample Interval,1", "Step,Time (ms),CH1 (V)", "0,0,0", "1,1,5", "2,2,0", "3,3,5"].join(
      "\n",
    );
    const trace = await parseCapture(text);
    expect(trace.columns.map((c) => c.role)).toEqual(["voltage", "time", "voltage"]);
    // time from the named column in ms, not from the steps of column 1
    expect(Array.from(trace.t)).toEqual([0, 1e-3, 2e-3, 3e-3]);
  });
});

describe("a units row without names", () => {
  it("the column in s is time even when column 1 also steps by the interval", async () => {
    // The units row names no columns, so the step test could apply; it must
    // not move time off the column whose unit says seconds.
    const text = ["Sample Interval,1", ",s,V", "0,0,0", "1,0.001,5", "2,0.002,0", "3,0.003,5"].join("\n");
    const trace = await parseCapture(text);
    expect(trace.columns.map((c) => [c.unit, c.role])).toEqual([
      ["", "voltage"],
      ["s", "time"],
      ["V", "voltage"],
    ]);
    expect(Array.from(trace.t)).toEqual([0, 0.001, 0.002, 0.003]);
  });
});

describe("names that begin or end like a non-finite token", () => {
  it.each(["Infeed", "Vinf", "Nanny", "Pump nan", "Infinity loop"])(
    "'%s' is a column name, not a number",
    async (name) => {
      const trace = await parseCapture(["Time (s)," + name, "0,0", "1E-06,5", "2E-06,0"].join("\n"));
      expect(trace.columns.map((c) => c.name)).toEqual(["Time", name]);
      expect(trace.warnings).toEqual([]);
    },
  );
});

describe("quoted fields", () => {
  it.each([
    ['"Time (s)"', "Time (s)"],
    ['  " CH1 "  ', "CH1"],
    ['""', ""],
    ['"', '"'],
    ['"abc', '"abc'],
    ['abc"', 'abc"'],
    ["plain", "plain"],
    ["  padded  ", "padded"],
  ])("unquote(%j) is %j", (field, expected) => {
    expect(unquote(field)).toBe(expected);
  });

  it("quoted names and values in a file read as unquoted", async () => {
    const trace = await parseCapture(
      ['"Sample Interval","2E-06"', '"CH1"', ...ONE_COLUMN.map((x) => `"${x}"`)].join("\n") + "\n",
    );
    expect(trace.header).toEqual([{ key: "Sample Interval", value: "2E-06" }]);
    expect(trace.columns.map((c) => c.name)).toContain("CH1");
    expect(Array.from(trace.v)).toEqual(ONE_COLUMN.map(Number));
  });
});

describe("plot envelope", () => {
  const t = Float64Array.from([0, 1, 2, 3, 4, 5, 6, 7, 8]);

  it("each point keeps the lowest and highest sample of its bucket, spikes either way", () => {
    // Buckets of three: [1, 3, -2] -> -2..3, [2, 0, 5] -> 0..5, [4, 4, 4] -> 4..4.
    const v = Float64Array.from([1, 3, -2, 2, 0, 5, 4, 4, 4]);
    expect(decimateEnvelope(t, v, 3)).toEqual([
      { tS: 0, minV: -2, maxV: 3 },
      { tS: 3, minV: 0, maxV: 5 },
      { tS: 6, minV: 4, maxV: 4 },
    ]);
  });

  it("a falling run and a rising run inside one bucket", () => {
    const v = Float64Array.from([5, 4, 3, 2, 1, 2, 3, 4, 6]);
    expect(decimateEnvelope(t, v, 1)).toEqual([{ tS: 0, minV: 1, maxV: 6 }]);
    // a one-sample low spike survives decimation, as a one-sample high spike does
    const dip = Float64Array.from([2, 2, 2, 2, -7, 2, 2, 2, 2]);
    expect(decimateEnvelope(t, dip, 2)).toEqual([
      { tS: 0, minV: 2, maxV: 2 },
      { tS: 4, minV: -7, maxV: 2 },
    ]);
  });

  it("more points than samples gives one point a sample; a range is honoured", () => {
    const v = Float64Array.from([1, 3, -2, 2, 0, 5, 4, 4, 4]);
    expect(decimateEnvelope(t, v, 100, 2, 5)).toEqual([
      { tS: 2, minV: -2, maxV: -2 },
      { tS: 3, minV: 2, maxV: 2 },
      { tS: 4, minV: 0, maxV: 0 },
    ]);
    expect(decimateEnvelope(t, v, 10, 5, 5)).toEqual([]);
  });
});
