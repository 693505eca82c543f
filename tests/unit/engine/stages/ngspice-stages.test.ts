// Threshold, UJT-like and PUT-like stages simulated in ngspice (Debian package
// "ngspice", batch mode) as a voltage-controlled switch with hysteresis
// (ngspice manual, SW model: on above VT+VH, off below VT-VH), .tran with UIC,
// .meas period and pulse width. The simulator integrates the circuit itself,
// so it checks the closed forms, the discharge with R still feeding, and the
// peak-point dividers. Agreement required: 0.2 %, with steps of at most
// T/4000 for the period run and td/1000 for the pulse run (verification.md
// measured +0.009 % at 0.1 us on its 45 ms example). Device parameters (UJT
// emitter drop and valley voltage, PUT offset and valley voltage) are given
// in each stage explicitly, so the netlists read them from the stage and not
// from the engine's defaults.
import { describe, expect, it } from "vitest";
import { analyzeStage, type PutStage, type ThresholdStage, type UjtStage } from "@/lib/engine";
import { runNgspice } from "@/tests/tools/ngspice";

interface SwitchStage {
  supplyV: number;
  r: number;
  c: number;
  dischargeR: number;
  /** netlist lines that define node "ctl" and .param on/off thresholds of v(ctl) */
  control: string[];
  onV: number;
  offV: number;
  startV: number;
  midV: number;
}

function circuit(x: SwitchStage, capStartV: number, switchStart: "ON" | "OFF"): string[] {
  return [
    "relaxation stage",
    `V1 vs 0 DC ${x.supplyV}`,
    `R1 vs cap ${x.r}`,
    `C1 cap 0 ${x.c} IC=${capStartV}`,
    ...x.control,
    `S1 cap nd ctl 0 SWMOD ${switchStart}`,
    `Rd nd 0 ${x.dischargeR}`,
    `.model SWMOD SW(VT=${(x.onV + x.offV) / 2} VH=${(x.onV - x.offV) / 2} RON=1m ROFF=1G)`,
  ];
}

/**
 * Two runs: the period over three cycles from the valley (step T/4000 or less), and
 * the discharge pulse alone, starting at the peak with the switch on (step
 * td/1000), so neither run needs a tiny step over a long time.
 */
async function simulate(x: SwitchStage, expectPeriodS: number, expectHighS: number, peakV: number) {
  // The discharge needs ~60 steps of its own, or the switch-off instant slips.
  const periodStep = Math.min(expectPeriodS / 4000, expectHighS / 60);
  const periodRun = [
    ...circuit(x, x.startV, "OFF"),
    `.tran ${periodStep} ${3.5 * expectPeriodS} 0 ${periodStep} UIC`,
    `.meas tran tper TRIG v(cap) VAL=${x.midV} RISE=2 TARG v(cap) VAL=${x.midV} RISE=3`,
    ".end",
    "",
  ].join("\n");
  const highStep = expectHighS / 1000;
  const highRun = [
    ...circuit(x, peakV, "ON"),
    `.tran ${highStep} ${2 * expectHighS} 0 ${highStep} UIC`,
    // v(nd) is the voltage across the discharge resistor: near 0 once the switch is off.
    `.meas tran thigh WHEN v(nd)=${x.startV / 2} FALL=1`,
    ".end",
    "",
  ].join("\n");
  const [p, h] = await Promise.all([runNgspice(periodRun, ["tper"]), runNgspice(highRun, ["thigh"])]);
  return { periodS: p.tper, highS: h.thigh };
}

const thresholdSets: ThresholdStage[] = [
  // verification.md example: 12 V, 47 k, 1 uF, 8.16 V / 2 V, 100 ohm
  { kind: "threshold", supplyV: 12, timingR: 47e3, timingC: 1e-6, peakV: 8.16, valleyV: 2, dischargeR: 100 },
  // neon-lamp-like: 150 V supply, 90 V striking, 60 V extinction
  {
    kind: "threshold",
    supplyV: 150,
    timingR: 1e6,
    timingC: 100e-9,
    peakV: 90,
    valleyV: 60,
    dischargeR: 10e3,
  },
  // DIAC-like, discharge resistor large enough that R's feed matters
  { kind: "threshold", supplyV: 24, timingR: 100e3, timingC: 220e-9, peakV: 15, valleyV: 5, dischargeR: 1e3 },
];

const ujtSets: UjtStage[] = [
  // with interbase divider: RBB 6.8 k, R1 100, R2 330
  {
    kind: "ujt",
    supplyV: 15,
    timingR: 10e3,
    timingC: 1e-6,
    eta: 0.56,
    // 2N2646-class UJT: emitter drop and valley voltage typical values (from memory)
    diodeV: 0.5,
    valleyV: 2.5,
    interbaseR: 6.8e3,
    base1R: 100,
    base2R: 330,
  },
  // without RBB (VBB = supply), R1 390
  {
    kind: "ujt",
    supplyV: 24,
    timingR: 22e3,
    timingC: 470e-9,
    eta: 0.7,
    base1R: 390,
    diodeV: 0.65,
    valleyV: 1.5,
  },
];

const putSets: PutStage[] = [
  {
    kind: "put",
    supplyV: 24,
    timingR: 470e3,
    timingC: 100e-9,
    gateUpperR: 27e3,
    gateLowerR: 15e3,
    dischargeR: 1e3,
    // 2N6027-class PUT: offset voltage and valley voltage, typical (from memory)
    offsetV: 0.7,
    valleyV: 1.2,
  },
  {
    kind: "put",
    supplyV: 12,
    timingR: 220e3,
    timingC: 1e-6,
    gateUpperR: 10e3,
    gateLowerR: 22e3,
    dischargeR: 2.2e3,
    offsetV: 0.45,
    valleyV: 0.8,
  },
];

const TOLERANCE = 0.002;

function expectWithin(actual: number, expected: number, rel: number) {
  expect(expected).toBeGreaterThan(0);
  expect(Math.abs(actual - expected) / expected).toBeLessThan(rel);
}

describe.concurrent("ngspice agrees with the relaxation closed forms within 0.2 %", () => {
  it("generic threshold stages", async () => {
    const runs = thresholdSets.map(async (s) => {
      const a = analyzeStage(s);
      expect(a.oscillates).toBe(true);
      const sim = await simulate(
        {
          supplyV: s.supplyV,
          r: s.timingR,
          c: s.timingC,
          dischargeR: s.dischargeR,
          control: ["Ectl ctl 0 cap 0 1"],
          onV: s.peakV,
          offV: s.valleyV,
          startV: s.valleyV,
          midV: (s.peakV + s.valleyV) / 2,
        },
        a.periodS,
        a.highS,
        s.peakV,
      );
      expectWithin(a.periodS, sim.periodS, TOLERANCE);
      expectWithin(a.highS, sim.highS, TOLERANCE);
    });
    await Promise.all(runs);
  });

  it("UJT-like stages: the switch fires when the emitter is VD above the base divider tap", async () => {
    const runs = ujtSets.map(async (s) => {
      const a = analyzeStage(s);
      expect(a.oscillates).toBe(true);
      const rbb = s.interbaseR ?? 10e3;
      const r1 = s.interbaseR ? (s.base1R ?? 47) : 0;
      const r2 = s.interbaseR ? (s.base2R ?? 470) : 0;
      // Base-2 to base-1 divider drawn as resistors; the tap is node "tap".
      const tapV = (s.supplyV * (r1 + s.eta * rbb)) / (rbb + r1 + r2);
      const control = [
        `Rb2 vs b2 ${r2 || 1e-3}`,
        `Rbb2 b2 tap ${(1 - s.eta) * rbb}`,
        `Rbb1 tap b1 ${s.eta * rbb}`,
        `Rb1 b1 0 ${r1 || 1e-3}`,
        "Ectl ctl 0 cap tap 1",
      ];
      const vd = s.diodeV!;
      const valleyV = s.valleyV!;
      const sim = await simulate(
        {
          supplyV: s.supplyV,
          r: s.timingR,
          c: s.timingC,
          // base-1 resistor plus the on-state rB1 of 5 ohm the contract fixes (engine.md section 4, common practice)
          dischargeR: (s.base1R ?? 47) + 5,
          control,
          onV: vd,
          offV: valleyV - tapV,
          startV: valleyV,
          midV: (tapV + vd + valleyV) / 2,
        },
        a.periodS,
        a.highS,
        tapV + vd,
      );
      expectWithin(a.periodS, sim.periodS, TOLERANCE);
      expectWithin(a.highS, sim.highS, TOLERANCE);
    });
    await Promise.all(runs);
  });

  it("PUT-like stages: the switch fires when the anode is VAK above the gate divider", async () => {
    const runs = putSets.map(async (s) => {
      const a = analyzeStage(s);
      expect(a.oscillates).toBe(true);
      const gateV = (s.supplyV * s.gateLowerR) / (s.gateUpperR + s.gateLowerR);
      const vak = s.offsetV!;
      const valleyV = s.valleyV!;
      const sim = await simulate(
        {
          supplyV: s.supplyV,
          r: s.timingR,
          c: s.timingC,
          dischargeR: s.dischargeR ?? 47,
          control: [`Rg1 vs g ${s.gateUpperR}`, `Rg2 g 0 ${s.gateLowerR}`, "Ectl ctl 0 cap g 1"],
          onV: vak,
          offV: valleyV - gateV,
          startV: valleyV,
          midV: (gateV + vak + valleyV) / 2,
        },
        a.periodS,
        a.highS,
        gateV + vak,
      );
      expectWithin(a.periodS, sim.periodS, TOLERANCE);
      expectWithin(a.highS, sim.highS, TOLERANCE);
    });
    await Promise.all(runs);
  });
});
