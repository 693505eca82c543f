// Header lines that declare the vertical unit, a scale factor and an offset
// apply to the voltage columns (capture.md "Input" and "Ramps"); the user's
// channel and probe attenuation choices pick and rescale the measured column.
// Every expected value is worked out here from the synthetic trace: pulse
// state levels are the histogram modes (IEEE Std 181-2011, 5.2.1.3), ramp
// trip and release voltages the per-cycle extremes and the standoff ratio
// eta = (Vp - VD) / VBB (2N2646 data sheet, peak-point voltage). The scope
// settings and numbers are our own.
import { describe, expect, it } from "vitest";
import { CaptureError, measureCsv, standoffRatio } from "@/lib/capture";

const DT = 10e-6;

/** A square wave: `per` samples a period, `high` of them at hi, from sample 5. */
function square(lo: number, hi: number, per = 100, high = 30, periods = 5): number[] {
  return Array.from({ length: per * periods }, (_, i) => ((i + per - 5) % per < high ? hi : lo));
}

/** A sawtooth: `charge` samples rising linearly valley -> peak, `fall` samples back. */
function sawtooth(valley: number, peak: number, charge: number, fall: number, cycles: number): number[] {
  const out: number[] = [];
  for (let c = 0; c < cycles; c++) {
    for (let i = 0; i < charge; i++) out.push(valley + ((peak - valley) * i) / charge);
    for (let i = 0; i < fall; i++) out.push(peak - ((peak - valley) * i) / fall);
  }
  return out;
}

function csv(header: string[], names: string, columns: number[][]): string {
  const rows = [...header, names];
  for (let i = 0; i < columns[0].length; i++) rows.push([i * DT, ...columns.map((c) => c[i])].join(","));
  return rows.join("\n") + "\n";
}

describe("vertical unit, scale and offset from the header", () => {
  it("a file declaring mV is read as millivolts", async () => {
    const data = csv(["Vertical Units,mV"], "Time (s),CH1", [square(0, 5000)]);
    const m = await measureCsv(data);
    // 0 mV and 5000 mV are the two histogram modes: 0 V and 5 V.
    expect(m.lowLevelV).toBeCloseTo(0, 12);
    expect(m.highLevelV).toBeCloseTo(5, 12);
    expect(m.scaling).toMatchObject({ unit: "mV", unitFrom: "header", unitScale: 1e-3 });
    expect(m.columns[1]).toEqual({ name: "CH1", unit: "mV", role: "voltage" });
    // Negative case (the fault this guards against): without the line the
    // same numbers are volts.
    const bare = await measureCsv(csv([], "Time (s),CH1", [square(0, 5000)]));
    expect(bare.highLevelV).toBeCloseTo(5000, 9);
    expect(bare.scaling?.unitFrom).toBe("none");
  });

  it("a column's own unit wins over the header's", async () => {
    const m = await measureCsv(csv(["Vertical Units,mV"], "Time (s),CH1 (V)", [square(0, 5)]));
    expect(m.highLevelV).toBeCloseTo(5, 12);
    expect(m.scaling?.unitFrom).toBe("column");
  });

  it("raw counts with a scale factor and an offset: V = counts x 0.01 - 1 V", async () => {
    // 100 counts -> 0 V, 600 counts -> 5 V.
    const m = await measureCsv(
      csv(["Scale Factor,0.01", "Vertical Offset,-1 V"], "Time (s),CH1", [square(100, 600)]),
    );
    expect(m.lowLevelV).toBeCloseTo(0, 12);
    expect(m.highLevelV).toBeCloseTo(5, 12);
    expect(m.scaling).toMatchObject({ scale: 0.01, offsetV: -1 });
    // An offset without a unit is in the declared vertical unit: -1000 mV.
    const mv = await measureCsv(
      csv(["Vertical Units,mV", "Y Offset,-1000"], "Time (s),CH1", [square(1000, 6000)]),
    );
    expect(mv.lowLevelV).toBeCloseTo(0, 12);
    expect(mv.highLevelV).toBeCloseTo(5, 12);
  });

  it("a volts-per-division setting is a display setting, not a factor on the data", async () => {
    const m = await measureCsv(csv(["Vertical Scale,2 V/div"], "Time (s),CH1 (V)", [square(0, 5)]));
    expect(m.highLevelV).toBeCloseTo(5, 12);
    expect(m.scaling?.scale).toBe(1);
  });

  it("a header's probe line is what the scope already applied: recorded, not applied again", async () => {
    const m = await measureCsv(csv(["Probe,10X"], "Time (s),CH1 (V)", [square(0, 5)]));
    expect(m.highLevelV).toBeCloseTo(5, 12);
    expect(m.scaling).toMatchObject({ probe: 1, headerProbe: 10 });
  });
});

describe("channel and probe attenuation chosen by the user", () => {
  const twoChannels = csv(["Vertical Units,mV"], "Time (s),CH1,CH2", [
    square(0, 3300),
    square(0, 500, 200, 50),
  ]);

  it("measures the chosen channel", async () => {
    const first = await measureCsv(twoChannels);
    expect(first.highLevelV).toBeCloseTo(3.3, 12);
    expect(first.periodS.mean).toBeCloseTo(100 * DT, 12);
    const second = await measureCsv(twoChannels, { voltageColumn: 1 });
    expect(second.measuredColumn).toBe(2);
    expect(second.highLevelV).toBeCloseTo(0.5, 12);
    expect(second.periodS.mean).toBeCloseTo(200 * DT, 12);
    expect(second.scaling).toMatchObject({ voltageColumn: 1, voltageColumns: 2 });
  });

  it("a 10x probe on a channel set to 1x: values x 10", async () => {
    const m = await measureCsv(twoChannels, { voltageColumn: 1, probeAttenuation: 10 });
    expect(m.highLevelV).toBeCloseTo(5, 12);
    expect(m.scaling?.probe).toBe(10);
  });

  it("a ramp in mV through a 10x probe: trip 12.6 V, release 2 V, standoff ratio 0.6", async () => {
    // At the scope input 200 mV -> 1260 mV over 400 samples, back in 4:
    // x 10 at the probe tip, 2 V -> 12.6 V. With a 20 V supply and a 0.6 V
    // emitter drop, eta = (12.6 - 0.6) / 20 = 0.6.
    const data = csv(["Vertical Units,mV"], "Time (s),Emitter", [sawtooth(200, 1260, 400, 4, 6)]);
    const m = await measureCsv(data, { probeAttenuation: 10 });
    expect(m.waveform).toBe("ramp");
    expect(m.peakV?.mean).toBeCloseTo(12.6, 9);
    expect(m.valleyV?.mean).toBeCloseTo(2, 9);
    expect(m.periodS.mean).toBeCloseTo(404 * DT, 12);
    expect(m.riseS).toBeCloseTo(400 * DT, 12);
    expect(m.fallS).toBeCloseTo(4 * DT, 12);
    expect(standoffRatio(m.peakV!.mean, 20)).toBeCloseTo(0.6, 9);
    // Without the probe factor the trip reads ten times low.
    const raw = await measureCsv(data);
    expect(raw.peakV?.mean).toBeCloseTo(1.26, 9);
  });

  it("refuses a channel the file does not have and a probe factor out of range, naming them", async () => {
    await expect(measureCsv(twoChannels, { voltageColumn: 2 })).rejects.toThrow(
      /no channel 3: the capture has 2 voltage column\(s\) \(1 "CH1", 2 "CH2"\)/,
    );
    for (const bad of [0, 0.5, 5000, Number.NaN]) {
      const err = await measureCsv(twoChannels, { probeAttenuation: bad }).catch((e: unknown) => e);
      expect(err).toBeInstanceOf(CaptureError);
      expect((err as CaptureError).code).toBe("bad-choice");
      expect((err as CaptureError).message).toMatch(/probe attenuation/);
    }
  });
});
