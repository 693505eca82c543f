// 555 astable and Schmitt RC stages simulated in ngspice (Debian package
// "ngspice", batch mode) with ideal switches with hysteresis (ngspice manual,
// SW model: on above VT+VH, off below VT-VH) standing in for the comparators.
// Checks the charge / discharge paths and thresholds of the closed forms
// (TI SLFS022 for the 555; first-order RC for the Schmitt gate) within 1 %.
import { describe, expect, it } from "vitest";
import { analyzeStage, type SchmittRcStage, type Timer555AstableStage } from "@/lib/engine";
import { runNgspice } from "@/tests/tools/ngspice";

const within = (a: number, b: number) => {
  expect(b).toBeGreaterThan(0);
  expect(Math.abs(a - b) / b).toBeLessThan(0.01);
};

function sw(name: string, lo: number, hi: number) {
  return `.model ${name} SW(VT=${(lo + hi) / 2} VH=${(hi - lo) / 2} RON=1m ROFF=1G)`;
}

// The 555's discharge transistor shorts the Ra-Rb junction to ground between
// 2/3 and 1/3 of Vcc (or the control voltage and half of it).
async function sim555(s: Timer555AstableStage, periodS: number) {
  const vctl = s.controlV ?? (2 * s.supplyV) / 3;
  const step = periodS / 5000;
  const net = [
    "555 astable",
    `V1 vcc 0 DC ${s.supplyV}`,
    `Ra vcc dis ${s.ra}`,
    `Rb dis cap ${s.rb}`,
    `C1 cap 0 ${s.c} IC=${vctl / 2}`,
    `S1 dis 0 cap 0 DISCH OFF`,
    sw("DISCH", vctl / 2, vctl),
    `.tran ${step} ${3.5 * periodS} 0 ${step} UIC`,
    `.meas tran tper TRIG v(cap) VAL=${(3 * vctl) / 4} RISE=2 TARG v(cap) VAL=${(3 * vctl) / 4} RISE=3`,
    // output high = discharge off = v(dis) well above ground; it starts high,
    // so the edges run fall 1, rise 1, fall 2, rise 2, fall 3.
    `.meas tran thigh TRIG v(dis) VAL=${vctl / 4} RISE=2 TARG v(dis) VAL=${vctl / 4} FALL=3`,
    ".end",
    "",
  ].join("\n");
  const m = await runNgspice(net, ["tper", "thigh"]);
  return { periodS: m.tper, highS: m.thigh };
}

// One inverting Schmitt gate: a switch to VDD while the input is below VT-
// (until it passes VT+), a switch to ground the other way round.
async function simSchmitt(s: SchmittRcStage, periodS: number) {
  const step = periodS / 5000;
  const net = [
    "schmitt rc",
    `V1 vdd 0 DC ${s.supplyV}`,
    "Einv ninv 0 cap 0 -1",
    "Shi vdd out ninv 0 UPPER ON",
    "Slo out 0 cap 0 LOWER OFF",
    sw("UPPER", -s.vtPlus, -s.vtMinus),
    sw("LOWER", s.vtMinus, s.vtPlus),
    `R1 out cap ${s.r}`,
    `C1 cap 0 ${s.c} IC=${s.vtMinus}`,
    `.tran ${step} ${3.5 * periodS} 0 ${step} UIC`,
    `.meas tran tper TRIG v(out) VAL=${s.supplyV / 2} RISE=2 TARG v(out) VAL=${s.supplyV / 2} RISE=3`,
    `.meas tran thigh TRIG v(out) VAL=${s.supplyV / 2} RISE=2 TARG v(out) VAL=${s.supplyV / 2} FALL=3`,
    ".end",
    "",
  ].join("\n");
  const m = await runNgspice(net, ["tper", "thigh"]);
  return { periodS: m.tper, highS: m.thigh };
}

describe.concurrent("ngspice agrees with the rectangular-output closed forms within 1 %", () => {
  it("555 astable, default and driven control pin", async () => {
    const sets: Timer555AstableStage[] = [
      { kind: "timer555-astable", supplyV: 5, ra: 1e3, rb: 10e3, c: 10e-9 },
      { kind: "timer555-astable", supplyV: 12, ra: 10e3, rb: 4.7e3, c: 1e-6 },
      { kind: "timer555-astable", supplyV: 12, ra: 2.2e3, rb: 6.8e3, c: 220e-9, controlV: 6 },
    ];
    await Promise.all(
      sets.map(async (s) => {
        const a = analyzeStage(s);
        const sim = await sim555(s, a.periodS);
        within(a.periodS, sim.periodS);
        within(a.highS, sim.highS);
      }),
    );
  });

  it("Schmitt RC, several threshold pairs", async () => {
    const sets: SchmittRcStage[] = [
      { kind: "schmitt-rc", supplyV: 5, r: 100e3, c: 10e-9, vtPlus: 2.7, vtMinus: 1.6 },
      { kind: "schmitt-rc", supplyV: 10, r: 22e3, c: 1e-6, vtPlus: 6, vtMinus: 3 },
      { kind: "schmitt-rc", supplyV: 3.3, r: 470e3, c: 100e-9, vtPlus: 2.2, vtMinus: 0.9 },
    ];
    await Promise.all(
      sets.map(async (s) => {
        const a = analyzeStage(s);
        const sim = await simSchmitt(s, a.periodS);
        within(a.periodS, sim.periodS);
        within(a.highS, sim.highS);
      }),
    );
  });
});
