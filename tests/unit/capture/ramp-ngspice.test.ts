// Ramp captures (capture.md "Ramps") against an ngspice transient (Debian
// package "ngspice", batch mode, `wrdata`) of a UJT relaxation oscillator:
// the emitter capacitor charges through R from the supply and a switch with
// hysteresis (ngspice manual, SW model) stands for the UJT, on at the peak
// point Vp = eta * VBB + VD and off at the valley voltage. Textbook charge
// time: t = R C ln((VBB - Vv) / (VBB - Vp)) (first-order RC charge).
// Values (20 V, 47 kOhm, 100 nF, eta 0.6, 0.6 V drop, 2 V valley, 47 Ohm
// base-one resistor) are our own. Planted fault kept as a case: the same
// oscillator tripping at 10 V must not read as 12.6 V.
import { spawnSync } from "node:child_process";
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { measureCsv, standoffRatio } from "@/lib/capture";
import { requireNgspice } from "@/tests/tools/ngspice";

/** A square wave export, 5 V high, starting low (our own synthetic trace). */
function squareCsv(periodS: number, highS: number, dtS: number, periods: number): string {
  const per = Math.round(periodS / dtS);
  const high = Math.round(highS / dtS);
  const rows = ["Time (s),CH1 (V)"];
  for (let i = 0; i < per * periods; i++) rows.push(`${i * dtS},${(i + per - 5) % per < high ? 5 : 0}`);
  return rows.join("\n") + "\n";
}

const SUPPLY = 20;
const R = 47e3;
const C = 100e-9;
const VD = 0.6;
const VALLEY = 2;

/** Emitter voltage over `stopS` as CSV text (time in s, volts), from ngspice. */
function emitterCsv(peakV: number, stopS: number): string {
  requireNgspice();
  const dir = mkdtempSync(path.join(tmpdir(), "clockgraft-ramp-"));
  try {
    const netlist = [
      "ujt relaxation oscillator",
      `V1 vs 0 DC ${SUPPLY}`,
      `R1 vs cap ${R}`,
      `C1 cap 0 ${C} IC=${VALLEY}`,
      `S1 cap nd cap 0 SWMOD OFF`,
      "Rb1 nd 0 47",
      `.model SWMOD SW(VT=${(peakV + VALLEY) / 2} VH=${(peakV - VALLEY) / 2} RON=1m ROFF=1G)`,
      ".control",
      `tran 0.1u ${stopS} 0 0.1u uic`,
      "wrdata emitter.txt v(cap)",
      ".endc",
      ".end",
      "",
    ].join("\n");
    writeFileSync(path.join(dir, "ujt.cir"), netlist);
    // ngspice 4 in batch mode with a .control block exits 1 after a good run
    // ("no simulations run" refers to the netlist's own analyses); the data
    // file is the proof, and its absence fails the test below.
    spawnSync("ngspice", ["-b", "ujt.cir"], { cwd: dir, stdio: "pipe", timeout: 120_000 });
    const rows = readFileSync(path.join(dir, "emitter.txt"), "utf8")
      .trim()
      .split("\n")
      .map((l) => l.trim().split(/\s+/).slice(0, 2).map(Number));
    return ["Time (s),Emitter (V)", ...rows.map(([tS, v]) => `${tS},${v}`)].join("\n") + "\n";
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}

describe("ramp capture against ngspice", () => {
  const peak = 0.6 * SUPPLY + VD; // 12.6 V
  const chargeS = R * C * Math.log((SUPPLY - VALLEY) / (SUPPLY - peak));

  it("detects the ramp and reports trip, release, charge and discharge", async () => {
    const m = await measureCsv(emitterCsv(peak, 5.5 * chargeS));
    expect(m.waveform).toBe("ramp");
    expect(m.peakV!.mean).toBeCloseTo(peak, 1);
    expect(Math.abs(m.valleyV!.mean - VALLEY)).toBeLessThan(0.1);
    // The old pulse reading put the low state near 7.6 V; the release level is the valley.
    expect(Math.abs(m.lowLevelV - VALLEY)).toBeLessThan(0.1);
    expect(Math.abs(m.riseS / chargeS - 1)).toBeLessThan(0.01);
    expect(m.fallS).toBeLessThan(chargeS / 100);
    expect(Math.abs(m.periodS.mean / (chargeS + m.fallS) - 1)).toBeLessThan(0.01);
    expect(standoffRatio(m.peakV!.mean, SUPPLY, VD)).toBeCloseTo(0.6, 2);
  }, 240_000);

  it("planted fault: a stage tripping at 10 V does not read as 12.6 V", async () => {
    const m = await measureCsv(emitterCsv(10, 14e-3));
    expect(m.waveform).toBe("ramp");
    expect(Math.abs(m.peakV!.mean - peak)).toBeGreaterThan(1);
  }, 240_000);

  it("a 10 % duty pulse train stays a pulse (IEEE Std 181-2011 state levels)", async () => {
    const m = await measureCsv(squareCsv(10e-3, 1e-3, 10e-6, 6));
    expect(m.waveform).toBe("pulse");
    expect(m.highS.mean).toBeCloseTo(1e-3, 6);
  });
});
